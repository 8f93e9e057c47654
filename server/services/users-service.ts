/**
 * Users of an organisation: sign-in checks, invitations, role changes, deactivation and
 * setting a password from a one-time link. Every change is written to the audit trail in the
 * same transaction, so a change never lands without its record.
 *
 * Organisations are sealed from each other: a person's name, active state and roles live on the
 * membership, so an admin changes only their own organisation's view of someone. Inviting an
 * e-mail that already has an account answers exactly as for a new one (nothing about the account
 * is revealed) and mails an invitation that the person accepts with their own password.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { Db } from '../../db/client';
import type { SessionUser } from '../../constants/schemas/auth';
import type { UserDto } from '../../constants/schemas/users';
import type { Role } from '../../constants/schemas/roles';
import { ROLE_LABELS, sortRoles } from '../../constants/schemas/roles';
import { renderInvitationMail } from '../../templates/mail/invitation';
import { conflict, forbidden, notFound, unprocessable } from '../http-error';
import * as repo from '../repos/users-repo';
import { recordAudit, type AuditEntry } from './audit';
import type { Mailer } from './mailer';
import { decoyPasswordHash, hashPassword, verifyPassword } from './passwords';
import { passwordUserInputs } from '../../constants/schemas/password-policy';
import { passwordStrengthProblem } from '../../constants/schemas/password-strength';

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;
/** A password-reset link works for an hour (and once). */
export const RESET_TTL_MS = 3600 * 1000;

/** What a dead link (expired, used, unknown) is answered with, whichever kind it was. */
export const DEAD_LINK_MESSAGE = 'This link has expired or was already used. For a new password link, use “Forgot your password?” on the sign-in page; for a new invitation, ask your admin.';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export interface Actor {
  id: number;
  name: string;
  organisationId: number;
}

function toDto(user: repo.UserRow, membership: repo.MembershipRow, roles: Role[]): UserDto {
  const pending = membership.acceptedAt === null;
  return {
    id: user.id,
    email: user.email,
    name: membership.name,
    roles,
    active: membership.active,
    invitationPending: pending,
    createdAt: membership.createdAt,
    // Until the person joins, nothing about their account shows.
    lastSignInAt: pending ? null : user.lastSignInAt,
  };
}

/** The session's view of a user in one organisation, or undefined if they may not sign in there. */
export function loadSessionUser(db: Db, userId: number, organisationId?: number): SessionUser | undefined {
  const user = repo.findUserById(db, userId);
  if (!user || !user.active) return undefined;
  const usable = repo.listMembershipsWithRoles(db, userId).filter((m) => m.active && m.acceptedAt !== null);
  const m = organisationId === undefined ? usable[0] : usable.find((x) => x.organisationId === organisationId);
  if (!m) return undefined;
  return {
    id: user.id,
    email: user.email,
    name: m.name,
    roles: m.roles,
    organisation: { id: m.organisationId, name: m.organisationName },
  };
}

export type CredentialCheck = { ok: true; user: SessionUser } | { ok: false };

/**
 * Writes one audit entry into the trail of every organisation the account has joined: what
 * happens to an account (a failed sign-in, a new password) concerns each of them.
 */
export function recordForAccount(db: Db, userId: number, entry: Omit<AuditEntry, 'organisationId'>): void {
  const organisations = repo.listMembershipsWithRoles(db, userId).filter((m) => m.acceptedAt !== null);
  for (const m of organisations) recordAudit(db, { ...entry, organisationId: m.organisationId });
}

/**
 * Checks an e-mail and password; the same answer and similar timing whichever part is wrong. A
 * failed sign-in of a known account goes into its organisations' audit trails (the caller learns
 * nothing from that: the answer is the same).
 */
export async function checkCredentials(db: Db, email: string, password: string, context: { address?: string } = {}): Promise<CredentialCheck> {
  const user = repo.findUserByEmail(db, email.trim().toLowerCase());
  const hash = user?.passwordHash ?? (await decoyPasswordHash());
  const matches = await verifyPassword(password, hash);
  const sessionUser = user && user.passwordHash && matches ? loadSessionUser(db, user.id) : undefined;
  if (!user || !sessionUser) {
    if (user) {
      recordForAccount(db, user.id, {
        actorUserId: user.id,
        action: 'auth.sign-in-failed',
        targetType: 'user',
        targetId: user.id,
        details: { email: user.email, address: context.address ?? null, reason: matches && user.passwordHash ? 'no-access' : 'wrong-password' },
      });
    }
    return { ok: false };
  }
  repo.touchLastSignIn(db, user.id);
  recordAudit(db, { organisationId: sessionUser.organisation.id, actorUserId: user.id, action: 'auth.sign-in' });
  return { ok: true, user: sessionUser };
}

/** A sign-in limit closed for an e-mail: if it is an account, its organisations learn of it. */
export function recordSignInBlocked(db: Db, email: string, context: { address?: string; scope: string }): void {
  const user = repo.findUserByEmail(db, email);
  if (!user) return;
  recordForAccount(db, user.id, {
    actorUserId: user.id,
    action: 'auth.sign-in-blocked',
    targetType: 'user',
    targetId: user.id,
    details: { email: user.email, address: context.address ?? null, limit: context.scope },
  });
}

export function listUsers(db: Db, organisationId: number): UserDto[] {
  return repo.listOrganisationUsers(db, organisationId).map((u) => toDto(u.user, u.membership, u.roles));
}

/** A one-time link's token: only its SHA-256 is stored. */
export function issueToken(db: Db, userId: number, purpose: 'invitation' | 'reset', organisationId: number | null): { token: string; expiresAt: Date } {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + (purpose === 'reset' ? RESET_TTL_MS : INVITATION_TTL_MS));
  repo.insertPasswordToken(db, { userId, tokenSha256: sha256(token), purpose, organisationId, expiresAt: expiresAt.toISOString() });
  return { token, expiresAt };
}

export interface CreatedUser {
  user: UserDto;
  invitation: { sent: boolean; error?: string };
}

interface Invitation {
  dto: UserDto;
  token: string;
  expiresAt: Date;
  organisationName: string;
  /** The account already had a password: the link accepts the invitation instead of setting one. */
  existingAccount: boolean;
}

/** Adds a pending member with roles in one transaction (with its audit record) and issues a link. */
function addMember(db: Db, organisationId: number, actorUserId: number | null, input: { email: string; name: string; roles: Role[] }): Invitation {
  return db.transaction((tx) => {
    let user = repo.findUserByEmail(tx, input.email);
    if (user && repo.findMembership(tx, user.id, organisationId)) {
      throw conflict('Someone with this e-mail is already a member.', { email: 'Someone with this e-mail is already a member.' });
    }
    user ??= repo.insertUser(tx, { email: input.email, name: input.name });
    const membership = repo.insertMembership(tx, { userId: user.id, organisationId, name: input.name });
    repo.replaceRoles(tx, membership.id, input.roles);
    const org = repo.findOrganisation(tx, organisationId)!;
    const { token, expiresAt } = issueToken(tx, user.id, 'invitation', organisationId);
    recordAudit(tx, {
      organisationId,
      actorUserId,
      action: 'user.invite',
      targetType: 'user',
      targetId: user.id,
      details: { email: input.email, name: input.name, roles: input.roles },
    });
    return { dto: toDto(user, membership, sortRoles(input.roles)), token, expiresAt, organisationName: org.name, existingAccount: user.passwordHash !== null };
  });
}

const invitationLink = (publicUrl: string, token: string) => `${publicUrl}/set-password?token=${encodeURIComponent(token)}`;

/** For `npm run create-admin`: adds the member and returns the set-password link instead of mailing it. */
export function issueInvitationLink(db: Db, publicUrl: string, organisationId: number, input: { email: string; name: string; roles: Role[] }): string {
  return invitationLink(publicUrl, addMember(db, organisationId, null, input).token);
}

async function mailInvitation(mailer: Mailer, publicUrl: string, actor: Actor, email: string, roles: Role[], inv: Invitation): Promise<CreatedUser['invitation']> {
  const mail = renderInvitationMail({
    inviteeName: inv.dto.name,
    organisationName: inv.organisationName,
    inviterName: actor.name,
    roles: roles.map((r) => ROLE_LABELS[r]),
    link: invitationLink(publicUrl, inv.token),
    expiresAt: inv.expiresAt,
    existingAccount: inv.existingAccount,
  });
  try {
    await mailer.send({ to: email, organisationId: actor.organisationId, ...mail });
    return { sent: true };
  } catch (err) {
    console.error('[fieldfile] invitation mail failed', err);
    return { sent: false, error: 'The user was added but the invitation mail could not be sent. Check the mail settings, then resend it.' };
  }
}

/**
 * Adds a person to the actor's organisation and e-mails an invitation link. An e-mail already in
 * the organisation is a conflict; for anyone else the answer is the same whether or not they
 * already have an account.
 */
export async function inviteUser(db: Db, mailer: Mailer, publicUrl: string, actor: Actor, input: { email: string; name: string; roles: Role[] }): Promise<CreatedUser> {
  const inv = addMember(db, actor.organisationId, actor.id, input);
  return { user: inv.dto, invitation: await mailInvitation(mailer, publicUrl, actor, input.email, input.roles, inv) };
}

/** Sends a fresh invitation to a member who has not joined yet (expired link, failed mail); the old link stops working. */
export async function resendInvitation(db: Db, mailer: Mailer, publicUrl: string, actor: Actor, userId: number): Promise<CreatedUser> {
  const inv = db.transaction((tx): Invitation & { email: string; roles: Role[] } => {
    const user = repo.findUserById(tx, userId);
    const membership = user && repo.findMembership(tx, userId, actor.organisationId);
    if (!user || !membership) throw notFound('No such user in your organisation.');
    if (membership.acceptedAt !== null) throw conflict('This person has already joined; there is no invitation to resend.');
    repo.retirePasswordTokens(tx, userId, 'invitation', actor.organisationId);
    const { token, expiresAt } = issueToken(tx, userId, 'invitation', actor.organisationId);
    const roles = repo.listRoles(tx, membership.id);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'user.invite-resend',
      targetType: 'user',
      targetId: userId,
      details: { email: user.email, targetName: membership.name },
    });
    const org = repo.findOrganisation(tx, actor.organisationId)!;
    return { dto: toDto(user, membership, roles), token, expiresAt, organisationName: org.name, existingAccount: user.passwordHash !== null, email: user.email, roles };
  });
  return { user: inv.dto, invitation: await mailInvitation(mailer, publicUrl, actor, inv.email, inv.roles, inv) };
}

export function updateUser(db: Db, actor: Actor, userId: number, changes: { name?: string; roles?: Role[]; active?: boolean }): UserDto {
  return db.transaction((tx) => {
    const user = repo.findUserById(tx, userId);
    const membership = user && repo.findMembership(tx, userId, actor.organisationId);
    if (!user || !membership) throw notFound('No such user in your organisation.');
    if (userId === actor.id && (changes.active === false || (changes.roles && !changes.roles.includes('admin')))) {
      throw forbidden('You cannot deactivate yourself or remove your own admin role; ask another admin.');
    }
    const rolesBefore = repo.listRoles(tx, membership.id);
    // Only this organisation's membership changes: the account and other memberships are untouched.
    repo.updateMembership(tx, membership.id, { name: changes.name, active: changes.active });
    if (changes.roles) repo.replaceRoles(tx, membership.id, changes.roles);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: changes.active === false ? 'user.deactivate' : changes.active === true ? 'user.reactivate' : 'user.update',
      targetType: 'user',
      targetId: userId,
      // Who was changed and what changed, before → after, so the trail reads without a lookup.
      details: { ...changes, ...changeDetails(user.email, membership, rolesBefore, changes) },
    });
    return toDto(user, repo.findMembership(tx, userId, actor.organisationId)!, repo.listRoles(tx, membership.id));
  });
}

/** The audit details of a change to a member: the person (e-mail, name as it was) and each changed field's before → after. */
function changeDetails(email: string, before: { name: string; active: boolean }, rolesBefore: Role[], changes: { name?: string; roles?: Role[]; active?: boolean }) {
  const details: Record<string, unknown> = { email, targetName: before.name };
  if (changes.roles) details.rolesBefore = rolesBefore;
  if (changes.name !== undefined && changes.name !== before.name) details.nameBefore = before.name;
  if (changes.active !== undefined) details.activeBefore = before.active;
  return details;
}

function findLiveToken(db: Db, token: string) {
  const row = repo.findUnusedPasswordToken(db, sha256(token));
  if (!row || new Date(row.expiresAt).getTime() < Date.now()) return undefined;
  return row;
}

export interface TokenOwner {
  /** An invitation (set a first password or join) or a reset (choose a new password). */
  purpose: 'invitation' | 'reset';
  email: string;
  name: string;
  /** True when the link accepts an invitation into an existing account (no new password). */
  existingAccount: boolean;
  organisationName?: string;
}

/** Who a link is for, so the screen can greet them; undefined if used or expired. */
export function describePasswordToken(db: Db, token: string): TokenOwner | undefined {
  const row = findLiveToken(db, token);
  const user = row && repo.findUserById(db, row.userId);
  if (!row || !user || !user.active) return undefined;
  const membership = row.organisationId !== null ? repo.findMembership(db, user.id, row.organisationId) : undefined;
  const org = row.organisationId !== null ? repo.findOrganisation(db, row.organisationId) : undefined;
  return {
    purpose: row.purpose,
    email: user.email,
    name: membership?.name ?? user.name,
    existingAccount: row.purpose === 'invitation' && user.passwordHash !== null,
    ...(org ? { organisationName: org.name } : {}),
  };
}

const deadLink = () => unprocessable(DEAD_LINK_MESSAGE, { token: 'This link has expired or was already used.' });

function liveTokenForNewPassword(db: Db, token: string) {
  const row = findLiveToken(db, token);
  const user = row && repo.findUserById(db, row.userId);
  if (!row || !user || !user.active) throw deadLink();
  // An invitation into an existing account never replaces its password (see acceptInvitation).
  if (row.purpose === 'invitation' && user.passwordHash !== null) throw deadLink();
  return { row, user };
}

/** Throws a 422 on `field` when the password is too easy to guess for this person. */
export function refuseGuessablePassword(password: string, person: { email: string; name: readonly string[] }, field = 'password'): void {
  const problem = passwordStrengthProblem(password, passwordUserInputs(person));
  if (problem) throw unprocessable(problem, { [field]: problem });
}

/** The names the account goes by: its own and each organisation's, for the guessability check. */
export function accountNames(db: Db, user: repo.UserRow): string[] {
  return [...new Set([user.name, ...repo.listMembershipsWithRoles(db, user.id).map((m) => m.name)])];
}

/**
 * Sets the password from a one-time link. An invitation also accepts the membership; a reset ends
 * every session of the account (whoever knew the old password is signed out) and is recorded in
 * each of its organisations' trails.
 */
export async function setPasswordWithToken(db: Db, token: string, password: string): Promise<{ email: string; purpose: 'invitation' | 'reset' }> {
  // Refuse a dead link before judging the password or spending a hash on it.
  const { user: owner } = liveTokenForNewPassword(db, token);
  refuseGuessablePassword(password, { email: owner.email, name: accountNames(db, owner) });
  const hash = await hashPassword(password);
  return db.transaction((tx) => {
    const { row, user } = liveTokenForNewPassword(tx, token);
    repo.setPasswordHash(tx, user.id, hash);
    repo.markPasswordTokenUsed(tx, row.id);
    if (row.purpose === 'invitation') {
      repo.acceptPendingMemberships(tx, user.id, row.organisationId);
      recordAudit(tx, {
        organisationId: row.organisationId,
        actorUserId: user.id,
        action: 'auth.set-password',
        targetType: 'user',
        targetId: user.id,
        details: { purpose: row.purpose },
      });
    } else {
      repo.retirePasswordTokens(tx, user.id, 'reset', null);
      const ended = repo.endUserSessions(tx, user.id);
      recordForAccount(tx, user.id, { actorUserId: user.id, action: 'auth.password-reset', targetType: 'user', targetId: user.id, details: { sessionsEnded: ended } });
    }
    return { email: user.email, purpose: row.purpose };
  });
}

/** An existing account joins the organisation that invited it, confirmed with its own password. */
export async function acceptInvitation(db: Db, token: string, password: string): Promise<{ email: string }> {
  const row = findLiveToken(db, token);
  const user = row && repo.findUserById(db, row.userId);
  if (!row || !user || !user.active || row.purpose !== 'invitation' || row.organisationId === null || !user.passwordHash) throw deadLink();
  if (!(await verifyPassword(password, user.passwordHash))) throw unprocessable('That is not the password of this account.', { password: 'That is not the password of this account.' });
  return db.transaction((tx) => {
    if (!findLiveToken(tx, token)) throw deadLink();
    repo.markPasswordTokenUsed(tx, row.id);
    repo.acceptPendingMemberships(tx, user.id, row.organisationId);
    recordAudit(tx, { organisationId: row.organisationId, actorUserId: user.id, action: 'user.join', targetType: 'user', targetId: user.id, details: { email: user.email, via: 'invitation' } });
    return { email: user.email };
  });
}
