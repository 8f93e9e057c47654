/**
 * Users of an organisation: sign-in checks, invitations, role changes, deactivation and
 * setting a password from a one-time link. Every change is written to the audit trail in the
 * same transaction, so a change never lands without its record.
 */
import { createHash, randomBytes } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { memberships, organisations, passwordTokens, users } from '../../db/schema';
import type { SessionUser } from '../../constants/schemas/auth';
import type { CreateUserInput, UserDto } from '../../constants/schemas/users';
import type { Role } from '../../constants/schemas/roles';
import { ROLE_LABELS, sortRoles } from '../../constants/schemas/roles';
import { renderInvitationMail } from '../../templates/mail/invitation';
import { conflict, forbidden, notFound, unprocessable } from '../http-error';
import * as repo from '../repos/users-repo';
import { recordAudit } from './audit';
import type { Mailer } from './mailer';
import { decoyPasswordHash, hashPassword, verifyPassword } from './passwords';

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

const nowIso = () => new Date().toISOString();
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export interface Actor {
  id: number;
  name: string;
  organisationId: number;
}

function toDto(user: repo.UserRow, roles: Role[]): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    roles,
    active: user.active,
    invitationPending: user.passwordHash === null,
    createdAt: user.createdAt,
    lastSignInAt: user.lastSignInAt,
  };
}

/** The session's view of a user in one organisation, or undefined if they may not sign in there. */
export function loadSessionUser(db: Db, userId: number, organisationId?: number): SessionUser | undefined {
  const user = repo.findUserById(db, userId);
  if (!user || !user.active) return undefined;
  const all = repo.listMembershipsWithRoles(db, userId);
  const m = organisationId === undefined ? all[0] : all.find((x) => x.organisationId === organisationId);
  if (!m) return undefined;
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    roles: m.roles,
    organisation: { id: m.organisationId, name: m.organisationName },
  };
}

export type CredentialCheck = { ok: true; user: SessionUser } | { ok: false };

/** Checks an e-mail and password; the same answer and similar timing whichever part is wrong. */
export async function checkCredentials(db: Db, email: string, password: string): Promise<CredentialCheck> {
  const user = repo.findUserByEmail(db, email.trim().toLowerCase());
  const hash = user?.passwordHash ?? (await decoyPasswordHash());
  const matches = await verifyPassword(password, hash);
  if (!user || !user.passwordHash || !matches || !user.active) {
    recordAudit(db, { actorUserId: user?.id ?? null, action: 'auth.sign-in-failed', details: { email: email.slice(0, 254) } });
    return { ok: false };
  }
  const sessionUser = loadSessionUser(db, user.id);
  if (!sessionUser) return { ok: false };
  db.update(users).set({ lastSignInAt: nowIso() }).where(eq(users.id, user.id)).run();
  recordAudit(db, { organisationId: sessionUser.organisation.id, actorUserId: user.id, action: 'auth.sign-in' });
  return { ok: true, user: sessionUser };
}

export function listUsers(db: Db, organisationId: number): UserDto[] {
  return repo.listOrganisationUsers(db, organisationId).map((u) => toDto(u.user, u.roles));
}

function issueToken(db: Db, userId: number, purpose: 'invitation' | 'reset'): { token: string; expiresAt: Date } {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  db.insert(passwordTokens).values({ userId, tokenSha256: sha256(token), purpose, expiresAt: expiresAt.toISOString() }).run();
  return { token, expiresAt };
}

export interface CreatedUser {
  user: UserDto;
  invitation: { sent: boolean; error?: string };
}

/**
 * Adds a user to the actor's organisation and e-mails an invitation link. An e-mail already in
 * the organisation is a conflict; an existing account from another organisation gets a membership.
 */
interface AddedMember {
  user: repo.UserRow;
  token?: string;
  expiresAt?: Date;
  organisationName: string;
}

/** Adds a member with roles in one transaction (with its audit record) and issues a link if needed. */
function addMember(
  db: Db,
  organisationId: number,
  actorUserId: number | null,
  input: { email: string; name: string; roles: Role[] },
): AddedMember {
  return db.transaction((tx) => {
    let existing = repo.findUserByEmail(tx, input.email);
    if (existing && repo.findMembership(tx, existing.id, organisationId)) {
      throw conflict('Someone with this e-mail is already a member.', { email: 'Someone with this e-mail is already a member.' });
    }
    if (!existing) {
      existing = tx.insert(users).values({ email: input.email, name: input.name }).returning().get();
    }
    const membership = tx.insert(memberships).values({ userId: existing.id, organisationId }).returning().get();
    repo.replaceRoles(tx, membership.id, input.roles);
    const org = tx.select().from(organisations).where(eq(organisations.id, organisationId)).get()!;
    const issued = existing.passwordHash === null ? issueToken(tx, existing.id, 'invitation') : undefined;
    recordAudit(tx, {
      organisationId,
      actorUserId,
      action: 'user.invite',
      targetType: 'user',
      targetId: existing.id,
      details: { email: input.email, name: input.name, roles: input.roles },
    });
    return { user: existing, token: issued?.token, expiresAt: issued?.expiresAt, organisationName: org.name };
  });
}

const setPasswordLink = (publicUrl: string, token: string) => `${publicUrl}/set-password?token=${encodeURIComponent(token)}`;

/** For `npm run create-admin`: adds the member and returns the set-password link instead of mailing it. */
export function issueInvitationLink(
  db: Db,
  publicUrl: string,
  organisationId: number,
  input: { email: string; name: string; roles: Role[] },
): string {
  const added = addMember(db, organisationId, null, input);
  if (!added.token) throw conflict('This account already has a password; sign in with it.');
  return setPasswordLink(publicUrl, added.token);
}

/**
 * Adds a user to the actor's organisation and e-mails an invitation link. An e-mail already in
 * the organisation is a conflict; an existing account from another organisation gets a membership.
 */
export async function inviteUser(
  db: Db,
  mailer: Mailer,
  publicUrl: string,
  actor: Actor,
  input: { email: string; name: string; roles: Role[] },
): Promise<CreatedUser> {
  const { user, token, expiresAt, organisationName } = addMember(db, actor.organisationId, actor.id, input);
  const dto = toDto(user, sortRoles(input.roles));
  if (!token || !expiresAt) return { user: dto, invitation: { sent: false, error: 'The account already has a password; no invitation needed.' } };
  const mail = renderInvitationMail({
    inviteeName: input.name,
    organisationName,
    inviterName: actor.name,
    roles: input.roles.map((r) => ROLE_LABELS[r]),
    link: setPasswordLink(publicUrl, token),
    expiresAt,
  });
  try {
    await mailer.send({ to: input.email, ...mail });
    return { user: dto, invitation: { sent: true } };
  } catch (err) {
    console.error('[fieldfile] invitation mail failed', err);
    return { user: dto, invitation: { sent: false, error: 'The user was added but the invitation mail could not be sent. Check the mail settings.' } };
  }
}

export function updateUser(
  db: Db,
  actor: Actor,
  userId: number,
  changes: { name?: string; roles?: Role[]; active?: boolean },
): UserDto {
  return db.transaction((tx) => {
    const user = repo.findUserById(tx, userId);
    const membership = user && repo.findMembership(tx, userId, actor.organisationId);
    if (!user || !membership) throw notFound('No such user in your organisation.');
    if (userId === actor.id && (changes.active === false || (changes.roles && !changes.roles.includes('admin')))) {
      throw forbidden('You cannot deactivate yourself or remove your own admin role; ask another admin.');
    }
    const patch: Partial<typeof users.$inferInsert> = { updatedAt: nowIso() };
    if (changes.name !== undefined) patch.name = changes.name;
    if (changes.active !== undefined) patch.active = changes.active;
    tx.update(users).set(patch).where(eq(users.id, userId)).run();
    if (changes.roles) repo.replaceRoles(tx, membership.id, changes.roles);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: changes.active === false ? 'user.deactivate' : changes.active === true ? 'user.reactivate' : 'user.update',
      targetType: 'user',
      targetId: userId,
      details: changes,
    });
    const roles = repo.listMembershipsWithRoles(tx, userId).find((m) => m.organisationId === actor.organisationId)?.roles ?? [];
    return toDto(repo.findUserById(tx, userId)!, roles);
  });
}

function findLiveToken(db: Db, token: string) {
  const row = db
    .select()
    .from(passwordTokens)
    .where(and(eq(passwordTokens.tokenSha256, sha256(token)), isNull(passwordTokens.usedAt)))
    .get();
  if (!row || new Date(row.expiresAt).getTime() < Date.now()) return undefined;
  return row;
}

/** Who a set-password link is for, so the screen can greet them; undefined if used or expired. */
export function describePasswordToken(db: Db, token: string): { email: string; name: string } | undefined {
  const row = findLiveToken(db, token);
  const user = row && repo.findUserById(db, row.userId);
  return user && user.active ? { email: user.email, name: user.name } : undefined;
}

export async function setPasswordWithToken(db: Db, token: string, password: string): Promise<{ email: string }> {
  const hash = await hashPassword(password);
  return db.transaction((tx) => {
    const row = findLiveToken(tx, token);
    const user = row && repo.findUserById(tx, row.userId);
    if (!row || !user || !user.active) {
      throw unprocessable('This link has expired or was already used. Ask your admin for a new invitation.', {
        token: 'This link has expired or was already used.',
      });
    }
    tx.update(users).set({ passwordHash: hash, updatedAt: nowIso() }).where(eq(users.id, user.id)).run();
    tx.update(passwordTokens).set({ usedAt: nowIso() }).where(eq(passwordTokens.id, row.id)).run();
    recordAudit(tx, { actorUserId: user.id, action: 'auth.set-password', targetType: 'user', targetId: user.id, details: { purpose: row.purpose } });
    return { email: user.email };
  });
}
