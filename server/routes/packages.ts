/**
 * Submission packages: status and build of a version's package, its download (SHA-256 in the
 * response headers), progress of a build as Server-Sent Events, and verification of a zip or a
 * hash. Role checks are in the service.
 */
import fs from 'node:fs';
import os from 'node:os';
import { pipeline } from 'node:stream/promises';
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { requireAuth } from '../middleware/auth';
import { parseWith } from '../middleware/validate';
import { HttpError, unprocessable } from '../http-error';
import * as service from '../services/package-service';
import type { JobStatus } from '../jobs/queue';

const zId = z.coerce.number({ error: 'The filing id must be a number.' }).int().positive();
const zVersion = z.coerce.number({ error: 'The version must be a number.' }).int().positive();
const zJobId = z.coerce.number({ error: 'The job id must be a number.' }).int().positive();
const zHashBody = z.strictObject({
  sha256: z
    .string()
    .trim()
    .toLowerCase()
    .regex(/^[0-9a-f]{64}$/, 'Give the SHA-256 as 64 hexadecimal characters.'),
});
const HEARTBEAT_MS = 15_000;

const actorOf = (user: Express.User): service.PackageActor => ({ id: user.id, organisationId: user.organisation.id, roles: user.roles });
const target = (params: Record<string, unknown>) => [parseWith(zId, params.id), parseWith(zVersion, params.n)] as const;

export function packageRoutes(deps: service.PackageDeps): Router {
  const router = Router();
  const upload = multer({ dest: os.tmpdir(), limits: { fileSize: service.VERIFY_MAX_BYTES, files: 1 } });
  const receiveZip: RequestHandler = (req, res, next) => {
    if (!req.is('multipart/form-data')) return next();
    upload.single('file')(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
        return next(new HttpError(413, 'too_large', `The zip is larger than ${service.VERIFY_MAX_BYTES / 1024 / 1024} MB; verify it by its SHA-256 instead.`));
      }
      next(err);
    });
  };

  router.get('/filings/:id/versions/:n/package/status', requireAuth, (req, res) => {
    res.json(service.packageStatus(deps, actorOf(req.user!), ...target(req.params)));
  });

  router.post('/filings/:id/versions/:n/package', requireAuth, (req, res) => {
    res.status(202).json({ job: service.startBuild(deps, actorOf(req.user!), ...target(req.params)) });
  });

  router.get('/filings/:id/versions/:n/package', requireAuth, async (req, res) => {
    const { row, stream } = await service.openDownload(deps, actorOf(req.user!), ...target(req.params));
    res.set({
      'Content-Type': 'application/zip',
      'Content-Length': String(row.sizeBytes),
      'Content-Disposition': `attachment; filename="${row.fileName}"`,
      'X-Content-SHA256': row.sha256,
      'Repr-Digest': `sha-256=:${Buffer.from(row.sha256, 'hex').toString('base64')}:`,
      'Cache-Control': 'private, no-store',
    });
    try {
      await pipeline(stream, res);
    } catch (e) {
      // The client went away mid-download: nothing more can be sent.
      if (!res.headersSent) throw e;
    }
  });

  router.get('/jobs/:id/events', requireAuth, (req, res) => {
    const id = parseWith(zJobId, req.params.id);
    service.requireOrganisationJob(deps, actorOf(req.user!), id);
    res.set({ 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-store', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
    res.flushHeaders();
    const send = (s: JobStatus) => {
      res.write(`event: progress\ndata: ${JSON.stringify(s)}\n\n`);
      if (s.state === 'done' || s.state === 'failed') finish();
    };
    const heartbeat = setInterval(() => res.write(': still here\n\n'), HEARTBEAT_MS);
    const off = deps.queue.subscribe(id, send);
    const finish = () => {
      clearInterval(heartbeat);
      off();
      res.end();
    };
    req.on('close', finish);
    send(deps.queue.get(id)!);
  });

  router.post('/packages/verify', requireAuth, receiveZip, async (req, res) => {
    const actor = actorOf(req.user!);
    if (req.file) {
      try {
        res.json(await service.verifyZip(deps, actor, req.file.path));
      } finally {
        fs.rmSync(req.file.path, { force: true });
      }
      return;
    }
    if (req.is('multipart/form-data')) throw unprocessable('Attach the package zip in the “file” field, or send its SHA-256.', { file: 'Choose the package .zip.' });
    const { sha256 } = parseWith(zHashBody, req.body ?? {});
    res.json(service.verifyHash(deps, actor, sha256));
  });

  return router;
}
