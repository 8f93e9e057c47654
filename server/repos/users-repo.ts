/** Drizzle queries for users, memberships and roles. No rules here: services hold those. */
import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { membershipRoles, memberships, organisations, users } from '../../db/schema';
import { sortRoles, type Role } from '../../constants/schemas/roles';

export type UserRow = typeof users.$inferSelect;

export function findUserByEmail(db: Db, email: string): UserRow | undefined {
  return db.select().from(users).where(eq(users.email, email)).get();
}

export function findUserById(db: Db, id: number): UserRow | undefined {
  return db.select().from(users).where(eq(users.id, id)).get();
}

export function findMembership(db: Db, userId: number, organisationId: number) {
  return db
    .select()
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.organisationId, organisationId)))
    .get();
}

/** The user's organisations with their roles there, oldest membership first. */
export function listMembershipsWithRoles(db: Db, userId: number) {
  const rows = db
    .select({
      membershipId: memberships.id,
      organisationId: organisations.id,
      organisationName: organisations.name,
      role: membershipRoles.role,
    })
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .leftJoin(membershipRoles, eq(membershipRoles.membershipId, memberships.id))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.id))
    .all();
  const byOrg = new Map<number, { organisationId: number; organisationName: string; roles: Role[] }>();
  for (const r of rows) {
    const m = byOrg.get(r.organisationId) ?? { organisationId: r.organisationId, organisationName: r.organisationName, roles: [] };
    if (r.role) m.roles.push(r.role);
    byOrg.set(r.organisationId, m);
  }
  return [...byOrg.values()].map((m) => ({ ...m, roles: sortRoles(m.roles) }));
}

/** Members of one organisation with their roles there. */
export function listOrganisationUsers(db: Db, organisationId: number) {
  const rows = db
    .select({ user: users, membershipId: memberships.id, role: membershipRoles.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(membershipRoles, eq(membershipRoles.membershipId, memberships.id))
    .where(eq(memberships.organisationId, organisationId))
    .orderBy(asc(users.name), asc(users.id))
    .all();
  const byUser = new Map<number, { user: UserRow; roles: Role[] }>();
  for (const r of rows) {
    const entry = byUser.get(r.user.id) ?? { user: r.user, roles: [] };
    if (r.role) entry.roles.push(r.role);
    byUser.set(r.user.id, entry);
  }
  return [...byUser.values()].map((u) => ({ ...u, roles: sortRoles(u.roles) }));
}

export function replaceRoles(db: Db, membershipId: number, roles: readonly Role[]): void {
  db.delete(membershipRoles).where(eq(membershipRoles.membershipId, membershipId)).run();
  if (roles.length) {
    db.insert(membershipRoles)
      .values(roles.map((role) => ({ membershipId, role })))
      .run();
  }
}
