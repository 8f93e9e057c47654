/**
 * Demo data for a first start: the organisation and its four users. Idempotent: anything that
 * already exists is left as it is (a changed password stays changed).
 */
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { memberships, organisations, users } from '../db/schema';
import { hashPassword } from '../server/services/passwords';
import { findMembership, replaceRoles } from '../server/repos/users-repo';
import { recordAudit } from '../server/services/audit';
import { DEMO_ORGANISATION, DEMO_USERS } from './demo-people';
import { filings } from '../db/schema';
import { zDeviceFile } from '../constants/schemas/device-file';
import { createFiling, importDeviceFile } from '../server/services/filings-service';
import { DEMO_DOCK_DEVICE, DEMO_TRACKER } from './demo-filing';

export interface SeedResult {
  organisationId: number;
  createdUsers: string[];
  createdFilings: number;
}

export async function seedDemo(db: Db, demoPassword: string): Promise<SeedResult> {
  const people = await seedPeople(db, demoPassword);
  return { ...people, createdFilings: seedFilings(db, people.organisationId) };
}

/** The demo filings, created by the demo specialist, only into an organisation that has none. */
function seedFilings(db: Db, organisationId: number): number {
  if (db.select({ id: filings.id }).from(filings).where(eq(filings.organisationId, organisationId)).get()) return 0;
  const specialist = db.select().from(users).where(eq(users.email, 'specialist@fieldfile.test')).get()!;
  const actor = { id: specialist.id, organisationId, roles: ['specialist' as const] };
  importDeviceFile(db, actor, zDeviceFile.parse(DEMO_TRACKER));
  createFiling(db, actor, DEMO_DOCK_DEVICE);
  return 2;
}

async function seedPeople(db: Db, demoPassword: string) {
  const passwordHash = await hashPassword(demoPassword);
  return db.transaction((tx) => {
    let org = tx.select().from(organisations).where(eq(organisations.slug, DEMO_ORGANISATION.slug)).get();
    org ??= tx.insert(organisations).values(DEMO_ORGANISATION).returning().get();
    const createdUsers: string[] = [];
    for (const person of DEMO_USERS) {
      let user = tx.select().from(users).where(eq(users.email, person.email)).get();
      if (!user) {
        user = tx.insert(users).values({ email: person.email, name: person.name, passwordHash }).returning().get();
        createdUsers.push(person.email);
      }
      if (!findMembership(tx, user.id, org.id)) {
        const m = tx.insert(memberships).values({ userId: user.id, organisationId: org.id }).returning().get();
        replaceRoles(tx, m.id, [person.role]);
      }
    }
    if (createdUsers.length) {
      recordAudit(tx, { organisationId: org.id, action: 'seed.demo', details: { createdUsers } });
    }
    return { organisationId: org.id, createdUsers };
  });
}
