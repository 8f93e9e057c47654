/** Sign-in, sign-out, the current user, and setting a password from an invitation link. */
import { Router, type Request } from 'express';
import type { Passport } from '../auth/passport';
import { zAcceptInvitation, zLogin, zSetPassword } from '../../constants/schemas/auth';
import type { AppContext } from '../context';
import { notFound, unauthorized } from '../http-error';
import { requireAuth } from '../middleware/auth';
import { parseWith, validateBody } from '../middleware/validate';
import { acceptInvitation, describePasswordToken, setPasswordWithToken } from '../services/users-service';
import { recordAudit } from '../services/audit';

const loginAsync = (req: Request, user: Express.User) =>
  new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));

export function authRoutes({ db }: AppContext, passport: Passport): Router {
  const router = Router();

  router.post('/login', validateBody(zLogin), (req, res, next) => {
    passport.authenticate('local', (err: unknown, user: Express.User | false) => {
      if (err) return next(err);
      if (!user) return next(unauthorized('The e-mail or password is not right.'));
      // passport ≥ 0.6 regenerates the session inside req.login (no session fixation).
      loginAsync(req, user).then(() => {
        req.session.signedInAt = Date.now();
        res.json({ user });
      }, next);
    })(req, res, next);
  });

  router.post('/logout', (req, res, next) => {
    const user = req.user;
    req.logout((err) => {
      if (err) return next(err);
      if (user) recordAudit(db, { organisationId: user.organisation.id, actorUserId: user.id, action: 'auth.sign-out' });
      req.session.destroy(() => {
        res.clearCookie('fieldfile.sid');
        res.status(204).end();
      });
    });
  });

  router.get('/me', requireAuth, (req, res) => {
    res.json({ user: req.user });
  });

  router.get('/password-token/:token', (req, res) => {
    const who = describePasswordToken(db, String(req.params.token).slice(0, 200));
    if (!who) throw notFound('This link has expired or was already used. Ask your admin for a new invitation.');
    res.json(who);
  });

  router.post('/set-password', async (req, res) => {
    const input = parseWith(zSetPassword, req.body);
    const { email } = await setPasswordWithToken(db, input.token, input.password);
    res.json({ email });
  });

  router.post('/accept-invitation', async (req, res) => {
    const input = parseWith(zAcceptInvitation, req.body);
    res.json(await acceptInvitation(db, input.token, input.password));
  });

  return router;
}
