/**
 * Sign-in (within the sign-in guard's limits), sign-out, the current user, and setting a password
 * from an invitation link.
 */
import { Router, type Request, type Response } from 'express';
import { zAcceptInvitation, zLogin, zSetPassword, type LoginOutput } from '../../constants/schemas/auth';
import { createSignInGuard, type Admission } from '../auth/sign-in-guard';
import type { AppContext } from '../context';
import { notFound, unauthorized } from '../http-error';
import { requireAuth } from '../middleware/auth';
import { parseWith, validateBody } from '../middleware/validate';
import { acceptInvitation, checkCredentials, describePasswordToken, recordSignInBlocked, setPasswordWithToken } from '../services/users-service';
import { recordAudit } from '../services/audit';

const loginAsync = (req: Request, user: Express.User) =>
  new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));

/**
 * `gate` is mounted before the session middleware: a sign-in refused by the guard (busy, too
 * many) is answered without session work, so a flood of them costs as little as it can.
 * `routes` is the rest, after the session.
 */
export function authRoutes({ db }: AppContext): { gate: Router; routes: Router } {
  const guard = createSignInGuard({
    onAccountBlocked: (attempt, scope) => recordSignInBlocked(db, attempt.email, { address: attempt.address, scope }),
  });
  const admissionOf = (res: Response): Admission | undefined => res.locals.signInAdmission as Admission | undefined;

  const gate = Router();
  gate.post('/login', validateBody(zLogin), async (req, res, next) => {
    const admission = await guard.admit({ email: (req.body as LoginOutput).email, address: req.ip });
    res.locals.signInAdmission = admission;
    // Released by the sign-in route once its check is over (a client that goes away does not cut
    // the line: its check still runs); this covers an answer sent before that route.
    res.once('close', () => {
      if (!res.locals.signInAdmissionTaken) admission.release();
    });
    next();
  });

  const router = Router();
  router.post('/login', validateBody(zLogin), async (req, res) => {
    const { email, password } = req.body as LoginOutput;
    const admission = admissionOf(res);
    if (!admission) throw new Error('the sign-in gate is not mounted before the session');
    res.locals.signInAdmissionTaken = true;
    let result;
    try {
      await admission.turn;
      result = await checkCredentials(db, email, password, { address: req.ip });
      if (result.ok) await admission.succeeded();
    } finally {
      admission.release();
    }
    if (!result.ok) throw unauthorized('The e-mail or password is not right.');
    // passport ≥ 0.6 regenerates the session inside req.login (no session fixation).
    await loginAsync(req, result.user);
    req.session.signedInAt = Date.now();
    res.json({ user: result.user });
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

  return { gate, routes: router };
}
