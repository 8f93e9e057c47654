/** The audit trail of the admin's organisation, newest first, filtered by filing, person and kind. */
import { Router } from 'express';
import { zAuditQuery } from '../../constants/schemas/audit';
import type { AppContext } from '../context';
import { badRequest } from '../http-error';
import { requireRole } from '../middleware/auth';
import { zodFieldErrors } from '../middleware/validate';
import { listActivity } from '../services/audit';

export function auditRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (req, res) => {
    // A filter that is not well-formed is a bad request (400); one that names nothing in the
    // organisation is answered by the service (422).
    const parsed = zAuditQuery.safeParse(req.query);
    if (!parsed.success) {
      const fields = zodFieldErrors(parsed.error);
      throw badRequest(`The filters are not valid: ${Object.values(fields).join(' ')}`, fields);
    }
    res.json(listActivity(db, req.user!.organisation.id, parsed.data));
  });
  return router;
}
