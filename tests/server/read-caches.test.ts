/**
 * The read caches (server/read-caches.ts) never serve a stale answer: the assembled filing of
 * GET /api/filings/:id and the session's user are kept only until the next database write,
 * whoever makes it (a route, raw SQL on the app's connection, another connection), and a cached
 * answer never crosses organisations or the reader's edit right.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createReadCaches } from '../../server/read-caches';
import { createTestApp, OTHER_ORG, seedOtherOrganisation, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let specialist: Awaited<ReturnType<typeof signIn>>;
let engineer: Awaited<ReturnType<typeof signIn>>;
let otherAdmin: Awaited<ReturnType<typeof signIn>>;
let filingId: number;
let otherFilingId: number;

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  otherFilingId = (await seedOtherOrganisation(t)).filingId;
  specialist = await signIn(t, 'specialist@fieldfile.test');
  engineer = await signIn(t, 'engineer@fieldfile.test');
  otherAdmin = await signIn(t, OTHER_ORG.admin.email);
  filingId = (await specialist.get('/api/filings')).body.filings[0].id;
});
afterAll(() => t.close());

const deviceName = async (agent: typeof specialist, id = filingId) => {
  const res = await agent.get(`/api/filings/${id}`);
  expect(res.status).toBe(200);
  return res.body.filing.device.name as string;
};

describe('the assembled filing answer', () => {
  it('after a step save, the next read shows the saved value (to every reader)', async () => {
    const before = await specialist.get(`/api/filings/${filingId}`);
    await deviceName(specialist);
    await deviceName(engineer);
    const saved = await specialist.put(`/api/filings/${filingId}/steps/device`).send({ ...before.body.filing.data.device, name: 'Cached-then-changed tracker' });
    expect(saved.status).toBe(200);
    expect(await deviceName(specialist)).toBe('Cached-then-changed tracker');
    expect(await deviceName(engineer)).toBe('Cached-then-changed tracker');
    const after = (await specialist.get(`/api/filings/${filingId}`)).body.filing;
    expect(after.revisions.device).not.toBe(before.body.filing.revisions.device);
  });

  it('a write that bypasses the services (raw SQL on the app connection) is seen at once', async () => {
    await deviceName(specialist);
    t.handle.sqlite.prepare('update devices set name = ? where id = (select device_id from filings where id = ?)').run('Renamed by SQL', filingId);
    expect(await deviceName(specialist)).toBe('Renamed by SQL');
  });

  it('a commit from another connection (another process, the sqlite3 shell) is seen at once', async () => {
    await deviceName(specialist);
    const other = new Database(t.handle.sqlite.name);
    try {
      other.prepare('update devices set name = ? where id = (select device_id from filings where id = ?)').run('Renamed elsewhere', filingId);
    } finally {
      other.close();
    }
    expect(await deviceName(specialist)).toBe('Renamed elsewhere');
  });

  it('another organisation never gets it, cached or not', async () => {
    await deviceName(specialist);
    expect((await otherAdmin.get(`/api/filings/${filingId}`)).status).toBe(404);
    expect(await deviceName(otherAdmin, otherFilingId)).not.toBe('Renamed elsewhere');
    expect((await specialist.get(`/api/filings/${otherFilingId}`)).status).toBe(404);
    // And the same filing id read first by the other organisation does not answer for ours.
    expect((await otherAdmin.get(`/api/filings/${filingId}`)).status).toBe(404);
    expect(await deviceName(specialist)).toBe('Renamed elsewhere');
  });

  it('says editable only to a reader who may edit, whoever read it first', async () => {
    expect((await engineer.get(`/api/filings/${filingId}`)).body.filing.editable).toBe(false);
    expect((await specialist.get(`/api/filings/${filingId}`)).body.filing.editable).toBe(true);
    expect((await engineer.get(`/api/filings/${filingId}`)).body.filing.editable).toBe(false);
  });

  it('is the same JSON whether it came from the cache or not', async () => {
    const first = await specialist.get(`/api/filings/${filingId}`);
    const second = await specialist.get(`/api/filings/${filingId}`);
    expect(second.text).toBe(first.text);
    expect(second.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(second.headers['cache-control']).toBe('no-store');
    expect(second.headers.etag).toBeUndefined();
  });
});

describe("the session's user", () => {
  it('a role taken away counts on the very next request', async () => {
    const admin = await signIn(t, 'admin@fieldfile.test');
    const me = (await specialist.get('/api/auth/me')).body.user;
    expect(me.roles).toContain('specialist');
    const device = (await specialist.get(`/api/filings/${filingId}`)).body.filing.data.device;
    expect((await admin.patch(`/api/users/${me.id}`).send({ roles: ['engineer'] })).status).toBe(200);
    expect((await specialist.get('/api/auth/me')).body.user.roles).toEqual(['engineer']);
    expect((await specialist.put(`/api/filings/${filingId}/steps/device`).send(device)).status).toBe(403);
    expect((await specialist.get(`/api/filings/${filingId}`)).body.filing.editable).toBe(false);
    expect((await admin.patch(`/api/users/${me.id}`).send({ roles: ['specialist'] })).status).toBe(200);
    expect((await specialist.get(`/api/filings/${filingId}`)).body.filing.editable).toBe(true);
  });

  it('a deactivation signs the person out on the very next request', async () => {
    const admin = await signIn(t, 'admin@fieldfile.test');
    const approver = await signIn(t, 'approver@fieldfile.test');
    const me = (await approver.get('/api/auth/me')).body.user;
    expect((await admin.patch(`/api/users/${me.id}`).send({ active: false })).status).toBe(200);
    expect((await approver.get('/api/auth/me')).status).toBe(401);
    expect((await approver.get(`/api/filings/${filingId}`)).status).toBe(401);
    expect((await admin.patch(`/api/users/${me.id}`).send({ active: true })).status).toBe(200);
  });
});

describe('createReadCaches', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-read-caches-'));
  const sqlite = new Database(path.join(dir, 'cache.db'));
  sqlite.exec("create table t (id integer primary key, v text); insert into t values (1, 'one')");
  const read = sqlite.prepare('select v from t where id = 1').pluck();
  afterAll(() => {
    sqlite.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('answers from the cache while nothing is written, and computes again after any write', () => {
    const caches = createReadCaches(sqlite);
    const cache = caches.create<string>(10);
    let computed = 0;
    const get = () => cache.get('k', () => (computed++, read.get() as string));
    expect(get()).toBe('one');
    expect(get()).toBe('one');
    expect(computed).toBe(1);
    sqlite.prepare('update t set v = ? where id = 1').run('two');
    expect(get()).toBe('two');
    expect(computed).toBe(2);
  });

  it('a write empties every cache of the app, not only the one it concerns', () => {
    const caches = createReadCaches(sqlite);
    const a = caches.create<string>(10);
    const b = caches.create<string>(10);
    a.get('k', () => 'a1');
    b.get('k', () => 'b1');
    sqlite.exec("insert into t (v) values ('row')");
    expect(a.get('k', () => 'a2')).toBe('a2');
    expect(b.get('k', () => 'b2')).toBe('b2');
  });

  it('inside a transaction neither reads from nor fills the cache, so a rollback leaves nothing behind', () => {
    const caches = createReadCaches(sqlite);
    const cache = caches.create<string>(10);
    sqlite.prepare('update t set v = ? where id = 1').run('committed');
    expect(cache.get('k', () => read.get() as string)).toBe('committed');
    const tx = sqlite.transaction(() => {
      sqlite.prepare('update t set v = ? where id = 1').run('rolled back');
      expect(cache.get('k', () => read.get() as string)).toBe('rolled back');
      throw new Error('roll back');
    });
    expect(() => tx()).toThrow('roll back');
    expect(cache.get('k', () => read.get() as string)).toBe('committed');
  });
});
