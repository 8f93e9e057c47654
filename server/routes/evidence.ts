/**
 * Evidence of a filing: upload (multipart, one file a request, streamed into the byte storage
 * while hashed), list with the required categories and read-back findings, download, remove,
 * and explain a finding. Engineers and specialists change; every member reads.
 */
import { Router, type Request } from 'express';
import multer, { type StorageEngine } from 'multer';
import { z } from 'zod';
import { EVIDENCE_CATEGORIES, MEDIA_LABELS, zEvidenceFields, zExplainFinding } from '../../constants/schemas/evidence';
import type { AppContext } from '../context';
import { requireAuth, requireRole } from '../middleware/auth';
import { parseWith } from '../middleware/validate';
import { ObjectTooLargeError, type StoredObject } from '../storage';
import * as evidence from '../services/evidence-service';
import type { FilingActor } from '../services/filings-service';

const zId = z.coerce.number({ error: 'The id must be a number.' }).int().positive();
const actorOf = (user: Express.User): FilingActor => ({ id: user.id, organisationId: user.organisation.id, roles: user.roles });
const mb = (bytes: number) => `${Number((bytes / 1024 / 1024).toFixed(1))} MB`;

/** The filing id from the parent route (/filings/:id/evidence). */
const filingIdOf = (req: Request) => parseWith(zId, (req.params as Record<string, string>).id);

type StoredFile = Express.Multer.File & { stored: StoredObject };

export function evidenceRoutes({ db, config, storage }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const uploader = requireRole('engineer', 'specialist');
  const maxFileBytes = config.evidence.maxFileBytes;

  /** Multer storage engine: the file stream goes straight into the byte storage. */
  const engine: StorageEngine = {
    _handleFile(req: Request, file, cb) {
      // A dropped connection must fail the put (busboy may simply stop feeding the stream).
      const onClose = () => {
        if (!req.complete) file.stream.destroy(new Error('The upload was interrupted.'));
      };
      req.once('close', onClose);
      storage.uploads
        .put(file.stream, { maxBytes: maxFileBytes })
        .then((stored) => cb(null, { size: stored.sizeBytes, stored } as Partial<StoredFile>))
        .catch((err: unknown) => cb(err as Error))
        .finally(() => req.off('close', onClose));
    },
    _removeFile(_req, file, cb) {
      const { stored } = file as StoredFile;
      if (!stored || stored.alreadyStored) return cb(null);
      evidence.discardIfUnreferenced(db, storage.uploads, stored.sha256).then(() => cb(null), cb);
    },
  };
  const upload = multer({
    storage: engine,
    defParamCharset: 'utf8',
    limits: { fileSize: maxFileBytes + 1, files: 1, fields: 10, fieldSize: 16 * 1024, parts: 12 },
  }).single('file');

  router.post('/', uploader, (req, res, next) => {
    const filingId = filingIdOf(req);
    evidence.requireEvidenceEditable(db, actorOf(req.user!), filingId);
    upload(req, res, (err: unknown) => {
      const file = req.file as StoredFile | undefined;
      if (err) {
        const tooLarge = err instanceof ObjectTooLargeError || (err as multer.MulterError).code === 'LIMIT_FILE_SIZE';
        if (tooLarge) return next(evidence.payloadTooLarge(`The file is larger than the limit of ${mb(maxFileBytes)} a file.`));
        if (err instanceof multer.MulterError) return next(evidence.badUpload(`The upload could not be read: ${err.message}. Send one file in the “file” field.`));
        if (req.destroyed) return; // the client went away: nothing to answer, nothing was kept
        // Anything else busboy or the storage raised is a malformed or broken request body.
        return next(evidence.badUpload(`The upload could not be read (${(err as Error).message}). Send multipart/form-data with one file in the “file” field.`));
      }
      if (!file) return next(evidence.badUpload('Attach the file in the “file” field (multipart/form-data).'));
      const done = async () => {
        const fields = parseWith(zEvidenceFields, { ...req.body });
        const result = await evidence.recordUpload(db, storage.uploads, config, actorOf(req.user!), filingId, { stored: file.stored, originalName: file.originalname, fields });
        res.status(201).json(result);
      };
      done().catch(async (e: unknown) => {
        if (!file.stored.alreadyStored) await evidence.discardIfUnreferenced(db, storage.uploads, file.stored.sha256);
        next(e);
      });
    });
  });

  router.get('/', (req, res) => {
    res.json(evidence.listEvidence(db, config, actorOf(req.user!), filingIdOf(req)));
  });

  router.get('/:evidenceId/file', async (req, res) => {
    const { row, stream } = await evidence.openEvidenceFile(db, storage.uploads, actorOf(req.user!), filingIdOf(req), parseWith(zId, req.params.evidenceId));
    // Always a download, never rendered inline; the browser must not guess another type.
    res.set({
      'Content-Type': row.mediaType,
      'Content-Length': String(row.sizeBytes),
      'X-Content-Type-Options': 'nosniff',
      'Content-Security-Policy': "default-src 'none'; sandbox",
      'Cache-Control': 'private, no-store',
      ETag: `"${row.sha256}"`,
    });
    res.attachment(row.fileName);
    stream.on('error', () => res.destroy());
    stream.pipe(res);
  });

  router.delete('/:evidenceId', uploader, async (req, res) => {
    await evidence.removeEvidence(db, storage.uploads, actorOf(req.user!), filingIdOf(req), parseWith(zId, req.params.evidenceId));
    res.status(204).end();
  });

  router.post('/:evidenceId/findings/explain', uploader, (req, res) => {
    const filingId = filingIdOf(req);
    // Who and which filing first (403/404), then what was sent (422).
    evidence.requireEvidenceEditable(db, actorOf(req.user!), filingId);
    const body = parseWith(zExplainFinding.extend({ key: z.string().min(1).max(300) }), req.body);
    res.json(evidence.explainFinding(db, config, actorOf(req.user!), filingId, parseWith(zId, req.params.evidenceId), body.key, body.reason));
  });

  return router;
}

/** GET /api/schema/evidence-categories.json: every category with the types it takes. */
export const evidenceCategoriesDocument = () => ({
  categories: EVIDENCE_CATEGORIES.map((c) => ({
    id: c.id,
    label: c.label,
    description: c.description,
    accepts: c.accepts.map((m) => ({ mediaType: m, label: MEDIA_LABELS[m] })),
    multiple: c.multiple,
    dateLabel: c.dateLabel ?? null,
    writtenByFieldfile: !!c.writtenByFieldfile,
  })),
});
