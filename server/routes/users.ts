/** Organisation users, for admins: list, invite, resend an invitation, change roles or name, deactivate. */
import { Router } from 'express';
import { zCreateUser, zUpdateUser } from '../../constants/schemas/users';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/auth';
import { parseIdParam, strictId, validateBody } from '../middleware/validate';
import { inviteUser, listUsers, resendInvitation, updateUser, type Actor } from '../services/users-service';

const actorOf = (user: Express.User): Actor => ({ id: user.id, name: user.name, organisationId: user.organisation.id });

export function userRoutes({ db, mailer, config }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.param('id', strictId);

  router.get('/', (req, res) => {
    res.json({ users: listUsers(db, req.user!.organisation.id) });
  });

  router.post('/', validateBody(zCreateUser), async (req, res) => {
    const created = await inviteUser(db, mailer, config.publicUrl, actorOf(req.user!), req.body);
    res.status(201).json(created);
  });

  router.post('/:id/invitation', async (req, res) => {
    res.json(await resendInvitation(db, mailer, config.publicUrl, actorOf(req.user!), parseIdParam(req.params.id)));
  });

  router.patch('/:id', validateBody(zUpdateUser), (req, res) => {
    res.json({ user: updateUser(db, actorOf(req.user!), parseIdParam(req.params.id), req.body) });
  });

  return router;
}
