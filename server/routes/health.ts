import { Router } from 'express';
import type { AppContext } from '../context';
import { ENGINE_VERSION } from '../../calc/registry';
import { checkHealth } from '../services/health-service';

export function healthRoutes({ db }: AppContext): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    checkHealth(db);
    res.json({ status: 'ok', engineVersion: ENGINE_VERSION, time: new Date().toISOString() });
  });
  return router;
}
