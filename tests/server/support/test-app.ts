/**
 * A fresh app on a fresh temporary database with migrations applied, a real SMTP catcher on a
 * free port, and named seed helpers. Each test file gets its own.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { openDatabase, type DbHandle } from '../../../db/client';
import { applyMigrations } from '../../../db/migrate';
import { createApp, type CreateAppOptions } from '../../../server/app';
import { loadConfig, type Config } from '../../../server/env';
import { createMailer } from '../../../server/services/mailer';
import { startMailCatcher, type MailCatcher } from '../../../server/services/mail-catcher';
import { seedDemo } from '../../../seeds';
import { DEMO_DOCK_DEVICE } from '../../../seeds/demo-filing';
import * as usersRepo from '../../../server/repos/users-repo';
import { createFiling } from '../../../server/services/filings-service';
import { hashPassword } from '../../../server/services/passwords';

export const TEST_PASSWORD = 'test-password-123';

export interface TestApp {
  app: ReturnType<typeof createApp>['app'];
  handle: DbHandle;
  config: Config;
  catcher: MailCatcher;
  packages: ReturnType<typeof createApp>['packages'];
  close(): Promise<void>;
}

export interface TestAppOptions {
  /** Stand-ins for what other modules record (lab results, signature, evidence) in the exhibit. */
  exhibitSources?: CreateAppOptions['exhibitSources'];
  /** An existing data folder (e.g. one a killed process left behind) instead of a fresh one. */
  dataDir?: string;
  /** Adds or overrides environment variables (e.g. a small import limit). */
  env?: Record<string, string>;
}

export async function createTestApp(opts: TestAppOptions = {}): Promise<TestApp> {
  const dataDir = opts.dataDir ?? fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-test-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    FIELDFILE_DATA_DIR: dataDir,
    FIELDFILE_DEMO_PASSWORD: TEST_PASSWORD,
    FIELDFILE_PUBLIC_URL: 'http://fieldfile.test:8080',
    FIELDFILE_SCRYPT_LOG2N: '14',
    ...opts.env,
  });
  const handle = openDatabase(path.join(dataDir, 'fieldfile.db'));
  applyMigrations(handle.db);
  const catcher = await startMailCatcher(handle.db, 0);
  const mailer = createMailer(config, () => catcher.port);
  const { app, close, packages } = createApp({ handle, config, mailer, serveWeb: false, exhibitSources: opts.exhibitSources });
  return {
    app,
    packages,
    handle,
    config,
    catcher,
    async close() {
      close();
      await catcher.close();
      handle.sqlite.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** The demo organisation and its four users (admin@, specialist@, engineer@, approver@fieldfile.test). */
export function seedUsers(t: TestApp) {
  return seedDemo(t.handle.db, TEST_PASSWORD);
}

/**
 * A supertest agent (keeps cookies) signed in as the given user. Tests sign several people in at
 * once from one address; the sign-in guard queues only a few per address and answers the rest
 * 429 "busy" with Retry-After, so this waits and tries again, as a browser's user would.
 */
export async function signIn(t: TestApp, email: string, password = TEST_PASSWORD) {
  const agent = request.agent(t.app);
  for (let attempt = 0; ; attempt++) {
    const res = await agent.post('/api/auth/login').send({ email, password });
    if (res.status === 200) return agent;
    if (res.status !== 429 || res.body?.error?.code !== 'busy' || attempt >= 20) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    await new Promise((r) => setTimeout(r, 100 * (attempt + 1)));
  }
}

/** A second, fictional organisation with its own admin and specialist and one filing, to prove organisations are sealed. */
export const OTHER_ORG = {
  name: 'Kestrel Bay Radio',
  slug: 'kestrel-bay',
  admin: { email: 'admin@kestrel.test', name: 'Ines Duarte' },
  specialist: { email: 'specialist@kestrel.test', name: 'Olu Bakare' },
};

export async function seedOtherOrganisation(t: TestApp): Promise<{ organisationId: number; filingId: number }> {
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const db = t.handle.db;
  const org = usersRepo.insertOrganisation(db, { name: OTHER_ORG.name, slug: OTHER_ORG.slug });
  const ids: Record<'admin' | 'specialist', number> = { admin: 0, specialist: 0 };
  for (const role of ['admin', 'specialist'] as const) {
    const person = OTHER_ORG[role];
    const user = usersRepo.insertUser(db, { ...person, passwordHash });
    const m = usersRepo.insertMembership(db, { userId: user.id, organisationId: org.id, name: person.name, acceptedAt: new Date().toISOString() });
    usersRepo.replaceRoles(db, m.id, [role]);
    ids[role] = user.id;
  }
  const filing = createFiling(db, { id: ids.specialist, organisationId: org.id, roles: ['specialist'] }, DEMO_DOCK_DEVICE);
  return { organisationId: org.id, filingId: filing.id };
}
