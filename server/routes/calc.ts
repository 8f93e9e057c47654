/**
 * The calculation registry over HTTP: the same names, schemas and errors as calc/cli.ts. Each
 * calculation runs in the worker pool (ctx.calcPool), never on the event loop.
 */
import { Router } from 'express';
import { getCalculation, listCalculations } from '../../calc/registry';
import { MAX_CALC_RESULT_BYTES } from '../calc-pool';
import type { AppContext } from '../context';
import { HttpError, notFound } from '../http-error';
import { requireAuth } from '../middleware/auth';

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

export function calcRoutes({ calcPool }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  router.get('/', (_req, res) => {
    res.json({ calculations: listCalculations() });
  });
  router.post('/:name', async (req, res) => {
    const name = String(req.params.name);
    if (!getCalculation(name)) throw notFound(`No calculation named "${name}". GET /api/calc lists them.`);
    const outcome = await calcPool.run(name, req.body ?? {}, { gzip: req.acceptsEncodings('gzip') === 'gzip' });
    if (outcome.ok) {
      res.vary('Accept-Encoding').type('application/json');
      if (outcome.encoding === 'gzip') res.set('Content-Encoding', 'gzip');
      res.send(outcome.body);
      return;
    }
    if ('timedOut' in outcome) {
      res.set('Retry-After', '30');
      throw new HttpError(
        503,
        'calc_time_limit',
        `The calculation ran longer than ${outcome.limitMs / 1000} s and was stopped. Split the input into smaller parts, or try again when the server is less busy.`,
      );
    }
    if ('shuttingDown' in outcome) {
      res.set('Retry-After', '5');
      throw new HttpError(503, 'shutting_down', 'The server is restarting. Send the calculation again in a few seconds.');
    }
    if ('tooLarge' in outcome) {
      throw new HttpError(413, 'result_too_large', `The result would be ${mb(outcome.tooLarge)}, more than the ${mb(MAX_CALC_RESULT_BYTES)} an answer may carry. Split the input into smaller parts.`);
    }
    res.status(422).json({ error: { code: 'invalid_input', ...outcome.error } });
  });
  return router;
}
