/** The calculation registry over HTTP: the same names, schemas and errors as calc/cli.ts. */
import { Router } from 'express';
import { getCalculation, listCalculations, runCalculation } from '../../calc/registry';
import { notFound } from '../http-error';
import { requireAuth } from '../middleware/auth';

export function calcRoutes(): Router {
  const router = Router();
  router.use(requireAuth);
  router.get('/', (_req, res) => {
    res.json({ calculations: listCalculations() });
  });
  router.post('/:name', (req, res) => {
    const name = String(req.params.name);
    if (!getCalculation(name)) throw notFound(`No calculation named "${name}". GET /api/calc lists them.`);
    const outcome = runCalculation(name, req.body ?? {});
    if (outcome.ok) {
      res.json(outcome.result);
      return;
    }
    res.status(422).json({ error: { code: 'invalid_input', ...outcome.error } });
  });
  return router;
}
