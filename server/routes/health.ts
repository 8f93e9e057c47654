import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { AppContext } from '../context';
import { ENGINE_VERSION } from '../../calc/registry';

export function healthRoutes({ db }: AppContext): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    db.get(sql`select 1`);
    res.json({ status: 'ok', engineVersion: ENGINE_VERSION, time: new Date().toISOString() });
  });
  return router;
}
