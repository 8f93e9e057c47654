/**
 * Lab results of a filing: the engineer's data sets (GET for every role that reads filings, PUT
 * for the engineer), the spreadsheet import (multipart, with a dry run) and the computed results.
 */
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { LAB_SET_NAMES, type LabSet } from '../../constants/schemas/lab';
import type { AppContext } from '../context';
import { HttpError } from '../http-error';
import { requireAuth, requireRole } from '../middleware/auth';
import { parseWith } from '../middleware/validate';
import * as labService from '../services/lab-service';
import { ImportRefused, importMeasurements } from '../services/lab-import';
import type { FilingActor } from '../services/filings-service';

const zId = z.coerce.number({ error: 'The filing id must be a number.' }).int().positive();
const actorOf = (user: Express.User): FilingActor => ({ id: user.id, organisationId: user.organisation.id, roles: user.roles });

export function labRoutes({ db, config }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  const readers: RequestHandler = requireRole('engineer', 'specialist', 'approver', 'admin');
  const engineerOnly: RequestHandler = requireRole('engineer');

  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: config.importMaxBytes, files: 1, fields: 4 } }).single('file');
  const receiveFile: RequestHandler = (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(
            new HttpError(
              413,
              'too_large',
              `The file is larger than the ${Math.round(config.importMaxBytes / 1024 / 1024)} MB import limit; split it or ask your admin to raise FIELDFILE_IMPORT_MAX_BYTES.`,
            ),
          );
        }
        return next(new HttpError(400, 'bad_request', `The upload is not valid (${err.message}); send one file in the “file” field.`));
      }
      next(err);
    });
  };

  router.post('/:id/measurements/import', engineerOnly, receiveFile, async (req, res) => {
    const id = parseWith(zId, req.params.id);
    if (!req.file) throw new HttpError(400, 'bad_request', 'Attach the CSV or XLSX file in the “file” field.');
    const dryRun = ['true', '1', 'yes'].includes(String(req.body?.dryRun ?? req.query.dryRun ?? '').toLowerCase());
    try {
      const preview = await importMeasurements(db, actorOf(req.user!), id, req.file.buffer, req.body?.mapping, dryRun);
      res.status(dryRun ? 200 : 201).json({ import: preview });
    } catch (err) {
      if (err instanceof ImportRefused) {
        res.status(422).json({ error: { code: err.code, message: err.message }, import: err.preview });
        return;
      }
      throw err;
    }
  });

  for (const set of LAB_SET_NAMES) {
    router.get(`/:id/${set}`, readers, (req, res) => {
      res.json(labService.readLabSet(db, actorOf(req.user!), parseWith(zId, req.params.id), set as LabSet));
    });
    router.put(`/:id/${set}`, engineerOnly, (req, res) => {
      try {
        res.json(labService.replaceLabSet(db, actorOf(req.user!), parseWith(zId, req.params.id), set as LabSet, req.body, req.get('If-Match')));
      } catch (err) {
        if (!(err instanceof labService.StaleLabSet)) throw err;
        res
          .status(409)
          .set('ETag', `"${String(err.current.revision)}"`)
          .json({ error: { code: 'stale_lab_set', message: 'Someone saved this table after you opened it; nothing of yours was saved. Load theirs or keep yours.' }, current: err.current });
      }
    });
  }

  router.get('/:id/lab-results', readers, (req, res) => {
    const [head, rest] = labService.labResultsForFiling(db, actorOf(req.user!), parseWith(zId, req.params.id));
    res.type('application/json');
    res.write(head);
    res.end(rest);
  });

  return router;
}
