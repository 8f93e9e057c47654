/**
 * Archiving a filing: its owner (who created it) or an admin archives and restores it; an archived
 * filing leaves the default list (shown again with archived=1) and every change to it is a 409
 * that says to restore it first, while reading still works; both actions are audited. A device
 * file imported a second time warns, or is refused when the app asks first (duplicate=refuse).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exemptBadgeNamed } from '../fixtures/exempt-badge';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let specialist: Awaited<ReturnType<typeof signIn>>;
let engineer: Awaited<ReturnType<typeof signIn>>;
let admin: Awaited<ReturnType<typeof signIn>>;
let id: number;

const listed = async (query = '') =>
  (
    (await specialist.get(`/api/filings${query}`)).body.filings as {
      id: number;
      archivedAt: string | null;
    }[]
  ).find((f) => f.id === id);

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  [specialist, engineer, admin] = await Promise.all([signIn(t, 'specialist@fieldfile.test'), signIn(t, 'engineer@fieldfile.test'), signIn(t, 'admin@fieldfile.test')]);
  id = (await specialist.post('/api/filings/import').send(exemptBadgeNamed('Archive badge'))).body.filing.id;
}, 120_000);
afterAll(() => t.close());

describe('archive and restore', () => {
  it('only the owner or an admin may archive: the engineer gets 403 and nothing changes', async () => {
    const res = await engineer.post(`/api/filings/${id}/archive`).send({});
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/owner .* or an admin/);
    expect((await listed())?.archivedAt).toBeNull();
  });

  it('the owner archives: hidden from the default list, shown with archived=1, read-only but readable', async () => {
    const res = await specialist.post(`/api/filings/${id}/archive`).send({});
    expect(res.status).toBe(200);
    expect(res.body.filing.archivedAt).toEqual(expect.any(String));
    expect(res.body.filing.editable).toBe(false);
    expect(await listed()).toBeUndefined();
    expect((await listed('?archived=1'))?.archivedAt).toEqual(res.body.filing.archivedAt);
    expect((await specialist.get(`/api/filings/${id}`)).status).toBe(200);
    expect((await specialist.get(`/api/filings/${id}/screening`)).status).toBe(200);
    expect((await specialist.post(`/api/filings/${id}/archive`).send({})).body.error.message).toMatch(/already archived/);
  });

  it('every change is a 409 that says to restore it first, whatever the route', async () => {
    const before = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const writes = [
      specialist.put(`/api/filings/${id}/steps/device`).send({ ...before.data.device, hardwareVersion: 'changed' }),
      engineer.put(`/api/filings/${id}/measurements`).send({ rows: [] }),
      specialist.post(`/api/filings/${id}/evidence`).field('category', 'photos').attach('file', Buffer.from('x'), 'x.jpg'),
      specialist.post(`/api/filings/${id}/review/request`).send({}),
      specialist.post(`/api/filings/${id}/versions`).send({}),
    ];
    for (const res of await Promise.all(writes)) {
      expect(res.status).toBe(409);
      expect(res.body.error.message).toBe('This filing is archived and read-only. Its owner or an admin can restore it to make changes.');
    }
    expect((await specialist.get(`/api/filings/${id}`)).body.filing.data.device).toEqual(before.data.device);
  });

  it('the list query says what to fix when archived is not 0 or 1', async () => {
    const res = await specialist.get('/api/filings?archived=yes');
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body.error)).toMatch(/archived must be 1/);
  });

  it('an admin restores it: back in the list and writable; both actions are in the audit trail', async () => {
    const res = await admin.post(`/api/filings/${id}/restore`).send({});
    expect(res.status).toBe(200);
    expect(res.body.filing.archivedAt).toBeNull();
    expect((await listed())?.id).toBe(id);
    const device = (await specialist.get(`/api/filings/${id}`)).body.filing.data.device;
    expect((await specialist.put(`/api/filings/${id}/steps/device`).send({ ...device, hardwareVersion: 'rev C' })).status).toBe(200);
    expect((await specialist.post(`/api/filings/${id}/restore`).send({})).status).toBe(409);
    const audit = (await admin.get('/api/audit').query({ filing: String(id) })).body.entries as { action: string }[];
    const actions = audit.map((e) => e.action);
    expect(actions).toContain('filing.archive');
    expect(actions).toContain('filing.restore');
  });
});

describe('a duplicate import', () => {
  const file = exemptBadgeNamed('Duplicate badge');

  it('warns on the second import of the same file and still creates the filing (scripts)', async () => {
    const first = await specialist.post('/api/filings/import').send(file);
    expect(first.status).toBe(201);
    expect(first.body.warnings).toEqual([]);
    const second = await specialist.post('/api/filings/import').send(file);
    expect(second.status).toBe(201);
    expect(second.body.warnings[0]).toMatch(/already imported as “Duplicate badge .*” on \d{4}-\d{2}-\d{2}/);
    expect(second.body.filing.id).not.toBe(first.body.filing.id);
  });

  it('with duplicate=refuse (the app) it is a 409 and nothing is created; a changed file imports', async () => {
    const count = async () => (await specialist.get('/api/filings?archived=1')).body.filings.length;
    const before = await count();
    const res = await specialist.post('/api/filings/import?duplicate=refuse').send(file);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('duplicate_import');
    expect(res.body.error.message).toMatch(/already imported .* import again to start a second one/);
    expect(await count()).toBe(before);
    expect((await specialist.post('/api/filings/import?duplicate=refuse').send(exemptBadgeNamed('Another badge'))).status).toBe(201);
  });
});
