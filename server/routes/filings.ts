/**
 * Filings and the wizard: list, create, import, read, save a step (autosave), export the device
 * file, and the screening table. Reading is open to every member; changes need the specialist role.
 */
import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { DATA_STEPS, zFilingListQuery, zImportQuery, zNewFiling } from '../../constants/schemas/filings';
import { zDeviceFile } from '../../constants/schemas/device-file';
import { SCREENING_REGIMES } from '../../calc/screening/input';
import type { AppContext } from '../context';
import { requireAuth, requireRole } from '../middleware/auth';
import { parseWith, strictId } from '../middleware/validate';
import * as archiveService from '../services/filing-archive-service';
import * as filingsService from '../services/filings-service';
import * as screeningService from '../services/screening-service';
import { evidenceCategoriesDocument } from './evidence';

const zId = z.coerce.number({ error: 'The filing id must be a number.' }).int().positive();
const zStep = z.enum(DATA_STEPS, { error: `The step must be one of ${DATA_STEPS.join(', ')}.` });

const actorOf = (user: Express.User): filingsService.FilingActor => ({ id: user.id, organisationId: user.organisation.id, roles: user.roles });

/** Assembled filing answers kept at once, in characters of JSON (a filing's answer is tens of KB). */
const FILING_ANSWER_CACHE_CHARS = 32 * 1024 * 1024;

const slug = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '') || 'device';

export function filingRoutes({ db, readCaches }: AppContext): Router {
  const router = Router();
  // Per app instance: two apps in one process never answer from each other's results.
  const screeningCache = screeningService.createScreeningCache();
  // The JSON of GET /:id, per organisation, filing and whether the reader may edit (the only
  // part of the answer that depends on who asks); any database write empties it.
  const filingAnswers = readCaches.create<string>(FILING_ANSWER_CACHE_CHARS, (json) => json.length);
  router.use(requireAuth);
  router.param('id', strictId);
  const specialistOnly: RequestHandler = requireRole('specialist');

  router.get('/', (req, res) => {
    const { q, sort, archived } = parseWith(zFilingListQuery, req.query);
    res.json({ filings: filingsService.listFilings(db, actorOf(req.user!), q, sort, archived === '1') });
  });

  router.post('/', specialistOnly, (req, res) => {
    const { device } = parseWith(zNewFiling, req.body);
    res.status(201).json({ filing: filingsService.createFiling(db, actorOf(req.user!), device) });
  });

  router.post('/import', specialistOnly, (req, res) => {
    const { duplicate } = parseWith(zImportQuery, req.query);
    const parsed = zDeviceFile.safeParse(req.body);
    if (!parsed.success) throw filingsService.deviceFileProblems(parsed.error);
    const { warnings, ...filing } = filingsService.importDeviceFile(db, actorOf(req.user!), parsed.data, { refuseDuplicate: duplicate === 'refuse' });
    res.status(201).json({ filing, warnings });
  });

  router.get('/:id', (req, res) => {
    const actor = actorOf(req.user!);
    const filingId = parseWith(zId, req.params.id);
    const key = `${actor.organisationId}:${filingId}:${filingsService.canEdit(actor) ? 'edit' : 'read'}`;
    res.type('json').send(filingAnswers.get(key, () => JSON.stringify({ filing: filingsService.getFiling(db, actor, filingId) })));
  });

  // Owner or admin (checked in the service after the lookup, so another organisation gets 404).
  router.post('/:id/archive', (req, res) => {
    archiveService.archiveFiling(db, actorOf(req.user!), parseWith(zId, req.params.id));
    res.json({ filing: filingsService.getFiling(db, actorOf(req.user!), parseWith(zId, req.params.id)) });
  });

  router.post('/:id/restore', (req, res) => {
    archiveService.restoreFiling(db, actorOf(req.user!), parseWith(zId, req.params.id));
    res.json({ filing: filingsService.getFiling(db, actorOf(req.user!), parseWith(zId, req.params.id)) });
  });

  router.put('/:id/steps/:step', specialistOnly, (req, res) => {
    const result = filingsService.saveStep(db, actorOf(req.user!), parseWith(zId, req.params.id), parseWith(zStep, req.params.step), req.body, req.get('If-Match'));
    if (result.saved) {
      res.json(result);
      return;
    }
    if ('stale' in result) {
      res
        .status(409)
        .set('ETag', `"${result.current.revision}"`)
        .json({
          error: { code: 'stale_step', message: 'Someone saved this step after you opened it; nothing of yours was saved. Load their version or keep yours.' },
          current: result.current,
        });
      return;
    }
    res.status(422).json({
      error: { code: 'invalid_input', message: 'Some fields need fixing; your input is kept as a draft until they do.', fields: result.fields },
      draftSavedAt: result.draftSavedAt,
    });
  });

  router.get('/:id/device.json', (req, res) => {
    const file = filingsService.exportDeviceFile(db, actorOf(req.user!), parseWith(zId, req.params.id));
    res.attachment(`${slug(file.device.name)}-${slug(file.device.model)}.device.json`);
    res.type('application/json').send(`${JSON.stringify(file, null, 2)}\n`);
  });

  router.get('/:id/screening', (req, res) => {
    const acceptsGzip = req.acceptsEncodings('gzip') === 'gzip';
    const response = screeningService.screeningResponseForFiling(db, screeningCache, actorOf(req.user!), parseWith(zId, req.params.id), acceptsGzip);
    res.vary('Accept-Encoding').type('application/json');
    if (response.encoding === 'gzip') res.set('Content-Encoding', 'gzip');
    res.send(response.body);
  });

  router.get('/:id/screening/depth-profile', (req, res) => {
    const query = parseWith(z.object({ transmitterId: z.string().min(1).max(40), usePositionId: z.string().min(1).max(40), regime: z.enum(SCREENING_REGIMES).optional() }), req.query);
    res.json(screeningService.depthProfileForFiling(db, actorOf(req.user!), parseWith(zId, req.params.id), query));
  });

  return router;
}

/** GET /api/schema/device.json: the device description file's JSON Schema, from its zod schema. */
export function schemaRoutes(): Router {
  const router = Router();
  const deviceSchema = {
    $id: 'https://fieldfile.test/schema/device.json',
    title: 'Fieldfile device description (fieldfile.device/1)',
    ...z.toJSONSchema(zDeviceFile, { io: 'input', unrepresentable: 'any' }),
  };
  router.get('/device.json', (_req, res) => {
    res.json(deviceSchema);
  });
  const evidenceCategories = evidenceCategoriesDocument();
  router.get('/evidence-categories.json', (_req, res) => {
    res.json(evidenceCategories);
  });
  return router;
}
