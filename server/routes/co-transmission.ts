/**
 * Co-transmission groups of a filing (which transmitters can be on together, per use position):
 * every member of the organisation reads them; the specialist replaces them (If-Match optional).
 */
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context';
import { requireAuth, requireRole } from '../middleware/auth';
import { parseWith, strictId } from '../middleware/validate';
import * as service from '../services/co-transmission-service';
import type { FilingActor } from '../services/filings-service';

const zId = z.coerce.number({ error: 'The filing id must be a number.' }).int().positive();
const actorOf = (user: Express.User): FilingActor => ({ id: user.id, organisationId: user.organisation.id, roles: user.roles });

export function coTransmissionRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  router.param('id', strictId);

  router.get('/:id/co-transmission', (req, res) => {
    res.json(service.readCoTransmission(db, actorOf(req.user!), parseWith(zId, req.params.id)));
  });

  router.put('/:id/co-transmission', requireRole('specialist'), (req, res) => {
    const result = service.replaceCoTransmission(db, actorOf(req.user!), parseWith(zId, req.params.id), req.body, req.get('If-Match'));
    if (result.stale) {
      res
        .status(409)
        .set('ETag', `"${result.current.revision}"`)
        .json({
          error: { code: 'stale_co_transmission', message: 'Someone saved the co-transmission groups after you opened them; nothing of yours was saved. Load theirs or keep yours.' },
          current: result.current,
        });
      return;
    }
    res.json(result.saved);
  });

  return router;
}
