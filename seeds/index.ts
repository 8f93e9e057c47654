/**
 * Demo data for a first start: the organisation and its four users. Idempotent: anything that
 * already exists is left as it is (a changed password stays changed).
 */
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { hashPassword } from '../server/services/passwords';
import { passwordUserInputs, zNewPassword } from '../constants/schemas/password-policy';
import { passwordStrengthProblem } from '../constants/schemas/password-strength';
import * as usersRepo from '../server/repos/users-repo';
import { recordAudit } from '../server/services/audit';
import { DEMO_ORGANISATION, DEMO_USERS } from './demo-people';
import { filings } from '../db/schema';
import { zDeviceFile } from '../constants/schemas/device-file';
import { createFiling, importDeviceFile } from '../server/services/filings-service';
import { DEMO_DOCK_DEVICE, DEMO_TRACKER } from './demo-filing';
import { DEMO_BUDGET, DEMO_INSTRUMENTS, DEMO_LIQUID_CHECKS, DEMO_MEASUREMENTS, DEMO_SYSTEM_CHECKS } from './demo-lab';
import { zMeasurementsBody } from '../constants/schemas/lab';
import * as labRepo from '../server/repos/lab-repo';
import { seedDemoEvidence } from './demo-evidence';
import { seedReviewDemo } from './demo-review';
import type { ByteStorage } from '../server/storage';

export interface SeedResult {
  organisationId: number;
  createdUsers: string[];
  createdFilings: number;
}

/**
 * With `storage`, the demo tracker also gets its evidence files, and the review demo is added (a
 * badge in review with a comment thread, a gateway signed as version 1 with a version 2 in draft):
 * its filings need their evidence files to be ready for review. Only when the filings are new.
 */
export async function seedDemo(db: Db, demoPassword: string, storage?: ByteStorage): Promise<SeedResult> {
  const people = await seedPeople(db, demoPassword);
  let createdFilings = seedFilings(db, people.organisationId);
  if (createdFilings && storage) {
    await seedDemoEvidence(db, storage, people.organisationId);
    const specialist = usersRepo.findUserByEmail(db, 'specialist@fieldfile.test')!;
    const approver = usersRepo.findUserByEmail(db, 'approver@fieldfile.test')!;
    createdFilings += await seedReviewDemo(db, storage, people.organisationId, specialist, approver, demoPassword);
  }
  return { ...people, createdFilings };
}

/**
 * The demo tracker and dock, created by the demo specialist, only into an organisation that has
 * none. The tracker comes first, so it is filing 1 on a fresh install (the browser tests open it by
 * that number).
 */
function seedFilings(db: Db, organisationId: number): number {
  if (db.select({ id: filings.id }).from(filings).where(eq(filings.organisationId, organisationId)).get()) return 0;
  const specialist = usersRepo.findUserByEmail(db, 'specialist@fieldfile.test')!;
  const actor = { id: specialist.id, organisationId, roles: ['specialist' as const] };
  const tracker = importDeviceFile(db, actor, zDeviceFile.parse(DEMO_TRACKER));
  seedLab(db, tracker.version.id);
  createFiling(db, actor, DEMO_DOCK_DEVICE);
  return 2;
}

/** The demo tracker's lab results (one liquid check out of tolerance), as the engineer would import them. */
function seedLab(db: Db, versionId: number) {
  db.transaction((tx) => {
    labRepo.writeLiquidChecks(tx, versionId, DEMO_LIQUID_CHECKS);
    labRepo.writeSystemChecks(tx, versionId, DEMO_SYSTEM_CHECKS);
    labRepo.writeInstruments(tx, versionId, DEMO_INSTRUMENTS);
    labRepo.writeBudget(tx, versionId, DEMO_BUDGET);
    labRepo.writeMeasurements(tx, versionId, zMeasurementsBody.parse({ measurements: DEMO_MEASUREMENTS }).measurements);
  });
}

/** Why the demo password would be refused to a person choosing it, or null (the policy in constants/schemas/password-policy.ts). */
export function demoPasswordProblem(demoPassword: string): string | null {
  const length = zNewPassword.safeParse(demoPassword);
  if (!length.success) return length.error.issues[0].message;
  for (const person of DEMO_USERS) {
    const problem = passwordStrengthProblem(demoPassword, passwordUserInputs(person));
    if (problem) return `${problem} (for ${person.email})`;
  }
  return null;
}

async function seedPeople(db: Db, demoPassword: string) {
  const problem = demoPasswordProblem(demoPassword);
  if (problem) throw new Error(`The demo password does not meet the password policy: ${problem} Choose another FIELDFILE_DEMO_PASSWORD.`);
  const passwordHash = await hashPassword(demoPassword);
  return db.transaction((tx) => {
    const org = usersRepo.findOrganisationBySlug(tx, DEMO_ORGANISATION.slug) ?? usersRepo.insertOrganisation(tx, DEMO_ORGANISATION);
    const createdUsers: string[] = [];
    for (const person of DEMO_USERS) {
      let user = usersRepo.findUserByEmail(tx, person.email);
      if (!user) {
        user = usersRepo.insertUser(tx, { email: person.email, name: person.name, passwordHash });
        createdUsers.push(person.email);
      }
      if (!usersRepo.findMembership(tx, user.id, org.id)) {
        const m = usersRepo.insertMembership(tx, { userId: user.id, organisationId: org.id, name: person.name, acceptedAt: new Date().toISOString() });
        usersRepo.replaceRoles(tx, m.id, [person.role]);
      }
    }
    if (createdUsers.length) {
      recordAudit(tx, { organisationId: org.id, action: 'seed.demo', details: { createdUsers } });
    }
    return { organisationId: org.id, createdUsers };
  });
}
