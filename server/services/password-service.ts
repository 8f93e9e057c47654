/**
 * A person's own password: asking for a reset link by mail when it is forgotten, and changing it
 * from the profile. (Setting it from the link is setPasswordWithToken in users-service.)
 *
 * The reset request answers the same whether or not the address has an account, and the mail is
 * sent after the answer, so neither the words nor the time tell. Without SMTP the mail lands in
 * the local catcher, where no organisation sees it (it is about an account, not an
 * organisation), so the server prints one line with the link for whoever runs it.
 */
import type { Db } from '../../db/client';
import { renderPasswordChangedMail, renderPasswordResetMail } from '../../templates/mail/password-reset';
import { unprocessable } from '../http-error';
import * as repo from '../repos/users-repo';
import type { Mailer } from './mailer';
import { hashPassword, verifyPassword } from './passwords';
import { accountNames, issueToken, loadSessionUser, recordForAccount, refuseGuessablePassword } from './users-service';
import { normalisePassword } from '../../constants/schemas/password-policy';

export const resetLink = (publicUrl: string, token: string) => `${publicUrl}/reset-password?token=${encodeURIComponent(token)}`;

export interface ResetMailing {
  mailer: Mailer;
  publicUrl: string;
  /** No SMTP server: print the link (the local catcher keeps the mail where no one reads it). */
  printLink: boolean;
}

/**
 * Issues a reset link for the address if it belongs to an account that may sign in somewhere,
 * and returns the mail to send (undefined otherwise). Earlier unused reset links stop working.
 */
export interface IssuedReset {
  to: string;
  token: string;
  expiresAt: Date;
}

export function issuePasswordReset(db: Db, email: string, context: { address?: string }): IssuedReset | undefined {
  return db.transaction((tx): IssuedReset | undefined => {
    const user = repo.findUserByEmail(tx, email);
    if (!user || !user.passwordHash || !loadSessionUser(tx, user.id)) return undefined;
    repo.retirePasswordTokens(tx, user.id, 'reset', null);
    const { token, expiresAt } = issueToken(tx, user.id, 'reset', null);
    recordForAccount(tx, user.id, {
      actorUserId: user.id,
      action: 'auth.password-reset-requested',
      targetType: 'user',
      targetId: user.id,
      details: { email: user.email, address: context.address ?? null },
    });
    return { to: user.email, token, expiresAt };
  });
}

/** Sends the reset mail (after the answer has gone); a failure is logged, never shown to the asker. */
export async function mailPasswordReset(m: ResetMailing, reset: IssuedReset): Promise<void> {
  const link = resetLink(m.publicUrl, reset.token);
  try {
    await m.mailer.send({ to: reset.to, ...renderPasswordResetMail({ link, expiresAt: reset.expiresAt }) });
  } catch (err) {
    console.error('[fieldfile] password reset mail failed', err);
  }
  if (m.printLink) console.log(`[fieldfile] password reset link for ${reset.to} (no SMTP configured): ${link}`);
}

/** Tells the account that its password changed (no answer waits for it). */
export async function mailPasswordChanged(mailer: Mailer, to: string, how: 'changed' | 'reset'): Promise<void> {
  try {
    await mailer.send({ to, ...renderPasswordChangedMail({ how, at: new Date() }) });
  } catch (err) {
    console.error('[fieldfile] password-changed notice failed', err);
  }
}

/**
 * Replaces the signed-in person's password after checking the current one; ends every other
 * session of the account (this one stays signed in).
 */
export async function changePassword(db: Db, who: { userId: number; sessionId: string }, input: { currentPassword: string; newPassword: string }): Promise<{ email: string; sessionsEnded: number }> {
  const user = repo.findUserById(db, who.userId);
  if (!user?.passwordHash || !(await verifyPassword(input.currentPassword, user.passwordHash))) {
    throw unprocessable('That is not your current password.', { currentPassword: 'That is not your current password.' });
  }
  if (normalisePassword(input.newPassword) === normalisePassword(input.currentPassword)) {
    throw unprocessable('Choose a password other than your current one.', { newPassword: 'Choose a password other than your current one.' });
  }
  refuseGuessablePassword(input.newPassword, { email: user.email, name: accountNames(db, user) }, 'newPassword');
  const hash = await hashPassword(input.newPassword);
  return db.transaction((tx) => {
    repo.setPasswordHash(tx, user.id, hash);
    // A reset link asked for earlier would undo this change: it stops working.
    repo.retirePasswordTokens(tx, user.id, 'reset', null);
    const sessionsEnded = repo.endUserSessions(tx, user.id, who.sessionId);
    recordForAccount(tx, user.id, { actorUserId: user.id, action: 'auth.password-change', targetType: 'user', targetId: user.id, details: { sessionsEnded } });
    return { email: user.email, sessionsEnded };
  });
}
