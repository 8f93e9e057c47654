/**
 * Sign-in (within the sign-in guard's limits), sign-out, the current user; setting a password
 * from an invitation or reset link, asking for a reset link, and changing the password.
 */
import { Router, type Request, type Response } from 'express';
import type { z } from 'zod';
import { RESET_REQUESTED_MESSAGE, zAcceptInvitation, zChangePassword, zForgotPassword, zLogin, zSetPassword, type LoginOutput } from '../../constants/schemas/auth';
import { createResetRequestLimits, createSignInGuard, type Admission } from '../auth/sign-in-guard';
import { changePassword, issuePasswordReset, mailPasswordChanged, mailPasswordReset } from '../services/password-service';
import type { AppContext } from '../context';
import { HttpError, notFound, unauthorized } from '../http-error';
import { requireAuth } from '../middleware/auth';
import { parseWith, validateBody } from '../middleware/validate';
import { acceptInvitation, checkCredentials, DEAD_LINK_MESSAGE, describePasswordToken, recordSignInBlocked, setPasswordWithToken } from '../services/users-service';
import { recordAudit } from '../services/audit';

const loginAsync = (req: Request, user: Express.User) => new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));

/**
 * `gate` is mounted before the session middleware: a sign-in refused by the guard (busy, too
 * many) is answered without session work, so a flood of them costs as little as it can.
 * `routes` is the rest, after the session.
 */
export function authRoutes({ db, mailer, config }: AppContext): { gate: Router; routes: Router } {
  const guard = createSignInGuard({
    onAccountBlocked: (attempt, scope) => recordSignInBlocked(db, attempt.email, { address: attempt.address, scope }),
  });
  const resetLimits = createResetRequestLimits();
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
    if (!who) throw notFound(DEAD_LINK_MESSAGE);
    res.json(who);
  });

  router.post('/set-password', async (req, res) => {
    const input = parseWith(zSetPassword, req.body);
    const { email, purpose } = await setPasswordWithToken(db, input.token, input.password);
    if (purpose === 'reset') {
      // The link proved who asks: the account's sign-in limits open again, and it hears of the change.
      await guard.forgetAccount(email);
      void mailPasswordChanged(mailer, email, 'reset');
    }
    res.json({ email });
  });

  // Always the same answer, sent before anything is looked up; the link goes out afterwards.
  router.post('/forgot-password', validateBody(zForgotPassword), async (req, res) => {
    const { email } = req.body as z.output<typeof zForgotPassword>;
    const address = req.ip;
    const mailThisOne = await resetLimits.admit(email, address);
    res.status(202).json({ message: RESET_REQUESTED_MESSAGE });
    if (!mailThisOne) return;
    setImmediate(() => {
      try {
        const reset = issuePasswordReset(db, email, { address });
        if (reset) void mailPasswordReset({ mailer, publicUrl: config.publicUrl, printLink: !config.mail.smtp }, reset);
      } catch (err) {
        console.error('[fieldfile] password reset request failed', err);
      }
    });
  });

  router.post('/change-password', requireAuth, validateBody(zChangePassword), async (req, res) => {
    const user = req.user!;
    // The current password is a guess like any other: the sign-in limits apply to it.
    const admission = await guard.admit({ email: user.email, address: req.ip });
    let changed;
    try {
      await admission.turn;
      changed = await changePassword(db, { userId: user.id, sessionId: req.sessionID }, req.body as z.output<typeof zChangePassword>);
      await admission.succeeded();
    } catch (err) {
      // Only a wrong current password counts against the limits.
      if (err instanceof HttpError && !err.fields?.currentPassword) await admission.succeeded();
      throw err;
    } finally {
      admission.release();
    }
    void mailPasswordChanged(mailer, user.email, 'changed');
    res.json({ sessionsEnded: changed.sessionsEnded });
  });

  router.post('/accept-invitation', async (req, res) => {
    const input = parseWith(zAcceptInvitation, req.body);
    res.json(await acceptInvitation(db, input.token, input.password));
  });

  return { gate, routes: router };
}
