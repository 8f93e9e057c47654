/** Organisation users, for admins: list, invite, change roles or name, deactivate. */
import { Router } from 'express';
import { z } from 'zod';
import { zCreateUser, zUpdateUser } from '../../constants/schemas/users';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/auth';
import { parseWith, validateBody } from '../middleware/validate';
import { inviteUser, listUsers, updateUser, type Actor } from '../services/users-service';

const zId = z.coerce.number().int().positive();

const actorOf = (user: Express.User): Actor => ({ id: user.id, name: user.name, organisationId: user.organisation.id });

export function userRoutes({ db, mailer, config }: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', (req, res) => {
    res.json({ users: listUsers(db, req.user!.organisation.id) });
  });

  router.post('/', validateBody(zCreateUser), async (req, res) => {
    const created = await inviteUser(db, mailer, config.publicUrl, actorOf(req.user!), req.body);
    res.status(201).json(created);
  });

  router.patch('/:id', validateBody(zUpdateUser), (req, res) => {
    const id = parseWith(zId, req.params.id);
    res.json({ user: updateUser(db, actorOf(req.user!), id, req.body) });
  });

  return router;
}
