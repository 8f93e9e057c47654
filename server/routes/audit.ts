/** The audit trail of the admin's organisation, newest first. */
import { Router } from 'express';
import { desc, eq } from 'drizzle-orm';
import { auditLog, users } from '../../db/schema';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/auth';

const LIST_LIMIT = 500;

export function auditRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (req, res) => {
    const rows = db
      .select({ entry: auditLog, actorName: users.name })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorUserId))
      .where(eq(auditLog.organisationId, req.user!.organisation.id))
      .orderBy(desc(auditLog.id))
      .limit(LIST_LIMIT)
      .all();
    res.json({ entries: rows.map((r) => ({ ...r.entry, actorName: r.actorName })) });
  });
  return router;
}
