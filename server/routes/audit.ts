/** The audit trail of the admin's organisation, newest first. */
import { Router } from 'express';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/auth';
import { listOrganisationAudit } from '../repos/audit-repo';

const LIST_LIMIT = 500;

export function auditRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (req, res) => {
    res.json({ entries: listOrganisationAudit(db, req.user!.organisation.id, LIST_LIMIT) });
  });
  return router;
}
