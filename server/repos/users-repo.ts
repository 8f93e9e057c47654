/** Drizzle queries for users, memberships, roles and one-time password links. No rules here. */
import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { membershipRoles, memberships, organisations, passwordTokens, users } from '../../db/schema';
import { sortRoles, type Role } from '../../constants/schemas/roles';

export type UserRow = typeof users.$inferSelect;
export type MembershipRow = typeof memberships.$inferSelect;
export type PasswordTokenRow = typeof passwordTokens.$inferSelect;

const nowIso = () => new Date().toISOString();

export function findUserByEmail(db: Db, email: string): UserRow | undefined {
  return db.select().from(users).where(eq(users.email, email)).get();
}

export function findUserById(db: Db, id: number): UserRow | undefined {
  return db.select().from(users).where(eq(users.id, id)).get();
}

export function insertUser(db: Db, values: { email: string; name: string; passwordHash?: string }): UserRow {
  return db.insert(users).values(values).returning().get();
}

export function setPasswordHash(db: Db, userId: number, passwordHash: string): void {
  db.update(users).set({ passwordHash, updatedAt: nowIso() }).where(eq(users.id, userId)).run();
}

export function touchLastSignIn(db: Db, userId: number): void {
  db.update(users).set({ lastSignInAt: nowIso() }).where(eq(users.id, userId)).run();
}

export function findOrganisation(db: Db, id: number) {
  return db.select().from(organisations).where(eq(organisations.id, id)).get();
}

export function findOrganisationBySlug(db: Db, slug: string) {
  return db.select().from(organisations).where(eq(organisations.slug, slug)).get();
}

export function insertOrganisation(db: Db, values: { name: string; slug: string }) {
  return db.insert(organisations).values(values).returning().get();
}

export function findMembership(db: Db, userId: number, organisationId: number): MembershipRow | undefined {
  return db
    .select()
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.organisationId, organisationId)))
    .get();
}

export function insertMembership(db: Db, values: { userId: number; organisationId: number; name: string; acceptedAt?: string | null }): MembershipRow {
  return db.insert(memberships).values(values).returning().get();
}

export function updateMembership(db: Db, membershipId: number, patch: { name?: string; active?: boolean; acceptedAt?: string }): void {
  const set = Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined));
  if (Object.keys(set).length) db.update(memberships).set(set).where(eq(memberships.id, membershipId)).run();
}

/** Marks the user's pending memberships accepted: one organisation's, or all when null. */
export function acceptPendingMemberships(db: Db, userId: number, organisationId: number | null): void {
  const where = [eq(memberships.userId, userId), isNull(memberships.acceptedAt)];
  if (organisationId !== null) where.push(eq(memberships.organisationId, organisationId));
  db.update(memberships)
    .set({ acceptedAt: nowIso() })
    .where(and(...where))
    .run();
}

/**
 * The user's organisations with their roles, name and state there, oldest membership first.
 * Only accepted, active memberships count for signing in.
 */
export function listMembershipsWithRoles(db: Db, userId: number) {
  const rows = db
    .select({
      membershipId: memberships.id,
      organisationId: organisations.id,
      organisationName: organisations.name,
      name: memberships.name,
      active: memberships.active,
      acceptedAt: memberships.acceptedAt,
      role: membershipRoles.role,
    })
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .leftJoin(membershipRoles, eq(membershipRoles.membershipId, memberships.id))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.id))
    .all();
  type Entry = Omit<(typeof rows)[number], 'role'> & { roles: Role[] };
  const byOrg = new Map<number, Entry>();
  for (const { role, ...r } of rows) {
    const m = byOrg.get(r.organisationId) ?? { ...r, roles: [] };
    if (role) m.roles.push(role);
    byOrg.set(r.organisationId, m);
  }
  return [...byOrg.values()].map((m) => ({ ...m, roles: sortRoles(m.roles) }));
}

/** Members of one organisation with their membership and roles there. */
export function listOrganisationUsers(db: Db, organisationId: number) {
  const rows = db
    .select({ user: users, membership: memberships, role: membershipRoles.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(membershipRoles, eq(membershipRoles.membershipId, memberships.id))
    .where(eq(memberships.organisationId, organisationId))
    .orderBy(asc(memberships.name), asc(users.id))
    .all();
  const byUser = new Map<number, { user: UserRow; membership: MembershipRow; roles: Role[] }>();
  for (const r of rows) {
    const entry = byUser.get(r.user.id) ?? { user: r.user, membership: r.membership, roles: [] };
    if (r.role) entry.roles.push(r.role);
    byUser.set(r.user.id, entry);
  }
  return [...byUser.values()].map((u) => ({ ...u, roles: sortRoles(u.roles) }));
}

export function listRoles(db: Db, membershipId: number): Role[] {
  return sortRoles(
    db
      .select({ role: membershipRoles.role })
      .from(membershipRoles)
      .where(eq(membershipRoles.membershipId, membershipId))
      .all()
      .map((r) => r.role),
  );
}

export function replaceRoles(db: Db, membershipId: number, roles: readonly Role[]): void {
  db.delete(membershipRoles).where(eq(membershipRoles.membershipId, membershipId)).run();
  if (roles.length) {
    db.insert(membershipRoles)
      .values(roles.map((role) => ({ membershipId, role })))
      .run();
  }
}

export function insertPasswordToken(db: Db, values: { userId: number; tokenSha256: string; purpose: PasswordTokenRow['purpose']; organisationId: number | null; expiresAt: string }): void {
  db.insert(passwordTokens).values(values).run();
}

export function findUnusedPasswordToken(db: Db, tokenSha256: string): PasswordTokenRow | undefined {
  return db
    .select()
    .from(passwordTokens)
    .where(and(eq(passwordTokens.tokenSha256, tokenSha256), isNull(passwordTokens.usedAt)))
    .get();
}

export function markPasswordTokenUsed(db: Db, id: number): void {
  db.update(passwordTokens).set({ usedAt: nowIso() }).where(eq(passwordTokens.id, id)).run();
}

/** Retires the user's earlier unused links of one purpose (a resent invitation replaces the old one). */
export function retirePasswordTokens(db: Db, userId: number, purpose: PasswordTokenRow['purpose'], organisationId: number | null): void {
  const where = [eq(passwordTokens.userId, userId), eq(passwordTokens.purpose, purpose), isNull(passwordTokens.usedAt)];
  if (organisationId !== null) where.push(eq(passwordTokens.organisationId, organisationId));
  db.update(passwordTokens)
    .set({ usedAt: nowIso() })
    .where(and(...where))
    .run();
}

/**
 * Ends the user's sessions (all, or all but `keepSid`). Sessions live in the session store's own
 * `sessions` table (server/auth/session-store.ts), its `sess` column the JSON express-session
 * keeps, with passport's user under `passport.user`. Returns how many ended.
 */
export function endUserSessions(db: Db, userId: number, keepSid?: string): number {
  const keep = keepSid === undefined ? sql`` : sql` AND sid <> ${keepSid}`;
  return db.run(sql`DELETE FROM sessions WHERE json_extract(sess, '$.passport.user.id') = ${userId}${keep}`).changes;
}
