/**
 * The defaults a careful operator expects: demo data only where it cannot be reached from the
 * network, a Content-Security-Policy, no caching of API answers, Secure cookies behind a TLS
 * proxy, an absolute session lifetime, strict ids, and bodies that are JSON, shallow and
 * well-formed text.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, SESSION_ABSOLUTE_MS } from '../../server/app';
import { loadConfig } from '../../server/env';
import { MAX_JSON_DEPTH } from '../../server/middleware/body-guards';
import { createMailer } from '../../server/services/mailer';
import { createTestApp, seedUsers, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

let t: TestApp;
let specialist: Awaited<ReturnType<typeof signIn>>;
let filingId: number;
beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  specialist = await signIn(t, 'specialist@fieldfile.test');
  filingId = (await specialist.get('/api/filings')).body.filings[0].id;
});
afterAll(() => t.close());

describe('demo data', () => {
  it('is seeded only on a loopback bind or with FIELDFILE_DEMO=1, never by forgetting NODE_ENV', () => {
    expect(loadConfig({}).demo.seed).toBe(true); // default bind is 127.0.0.1
    expect(loadConfig({}).host).toBe('127.0.0.1');
    expect(loadConfig({ HOST: '0.0.0.0' }).demo).toMatchObject({ seed: false, reason: expect.stringMatching(/reachable from the network/) });
    expect(loadConfig({ HOST: '0.0.0.0', FIELDFILE_DEMO: '1' }).demo.seed).toBe(true);
    expect(loadConfig({ HOST: '127.0.0.1', FIELDFILE_DEMO: '0' }).demo.seed).toBe(false);
    expect(loadConfig({ HOST: '127.0.0.1', NODE_ENV: 'production' }).demo.seed).toBe(false);
  });
});

describe('headers', () => {
  it('sends a Content-Security-Policy that allows only our own scripts', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toMatch(/default-src 'self'/);
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).toMatch(/object-src 'none'/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
  });

  it('marks every API answer Cache-Control: no-store, errors included', async () => {
    expect((await request(t.app).get('/api/health')).headers['cache-control']).toBe('no-store');
    expect((await specialist.get(`/api/filings/${filingId}`)).headers['cache-control']).toBe('no-store');
    expect((await request(t.app).get('/api/filings')).headers['cache-control']).toBe('no-store');
  });

  it('sets Secure cookies behind a trusted TLS proxy (FIELDFILE_TRUST_PROXY)', async () => {
    const login = () => ({ email: 'specialist@fieldfile.test', password: TEST_PASSWORD });
    // Default "loopback": a proxy on this machine (supertest's peer) is trusted.
    const viaLocalProxy = await request(t.app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send(login());
    expect(String(viaLocalProxy.headers['set-cookie'])).toMatch(/Secure/i);
    const config = loadConfig({ ...process.env, FIELDFILE_TRUST_PROXY: 'false', FIELDFILE_DATA_DIR: t.config.dataDir });
    expect(config.trustProxy).toBe(false);
    expect(loadConfig({ FIELDFILE_TRUST_PROXY: '2' }).trustProxy).toBe(2);
    const { app, close } = createApp({ handle: t.handle, config, mailer: createMailer(config, () => t.catcher.port), serveWeb: false });
    try {
      // No proxy trusted: a forged header does not make the plain-HTTP connection count as TLS.
      const forged = await request(app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send(login());
      expect(forged.status).toBe(200);
      expect(String(forged.headers['set-cookie'])).not.toMatch(/Secure/i);
    } finally {
      close();
    }
  });
});

describe('sessions', () => {
  it('end after the absolute lifetime even when used all along', async () => {
    const agent = await signIn(t, 'engineer@fieldfile.test');
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    // Age every stored session's sign-in time past the absolute lifetime.
    const rows = t.handle.sqlite.prepare('select sid, sess from sessions').all() as { sid: string; sess: string }[];
    for (const r of rows) {
      const sess = JSON.parse(r.sess) as { signedInAt?: number };
      if (sess.signedInAt) sess.signedInAt -= SESSION_ABSOLUTE_MS + 1000;
      t.handle.sqlite.prepare('update sessions set sess = ? where sid = ?').run(JSON.stringify(sess), r.sid);
    }
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    expect((await agent.get('/api/health')).status).toBe(200);
    specialist = await signIn(t, 'specialist@fieldfile.test');
  });
});

describe('ids in paths', () => {
  it('are plain decimal numbers: /api/filings/0x1 is 404, not filing 1', async () => {
    expect((await specialist.get(`/api/filings/${filingId}`)).status).toBe(200);
    for (const bad of [`0x${filingId.toString(16)}`, `${filingId}.0`, `0${filingId}`, `${filingId}e0`, ` ${filingId}`, '-1']) {
      expect((await specialist.get(`/api/filings/${encodeURIComponent(bad)}`)).status, bad).toBe(404);
    }
  });
});

describe('request bodies', () => {
  const save = (body: string, type = 'application/json') => specialist.put(`/api/filings/${filingId}/steps/device`).set('Content-Type', type).send(body);

  it('that are not JSON get 415 and store nothing', async () => {
    const before = (await specialist.get(`/api/filings/${filingId}`)).body.filing;
    const res = await save('name=Tracker', 'text/plain');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/application\/json/);
    expect((await save('name=Tracker', 'application/x-www-form-urlencoded')).status).toBe(415);
    expect((await specialist.get(`/api/filings/${filingId}`)).body.filing).toEqual(before);
  });

  it(`nested deeper than ${MAX_JSON_DEPTH} levels are refused, so no such draft can make a filing unreadable`, async () => {
    const deep = `${'['.repeat(4000)}${']'.repeat(4000)}`;
    const res = await save(deep);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/nested more than/);
    expect((await save(JSON.stringify({ device: { nested: JSON.parse(`${'['.repeat(40)}1${']'.repeat(40)}`) } }))).status).toBe(422);
    expect((await specialist.get(`/api/filings/${filingId}`)).status).toBe(200);
  });

  it('with a lone surrogate are refused, not silently changed', async () => {
    const res = await specialist.post('/api/filings').set('Content-Type', 'application/json').send('{"device":{"name":"Tag \\ud800","model":"M","applicant":"A","productType":"wearable"}}');
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/lone UTF-16 surrogate/);
    const bytes = Buffer.concat([Buffer.from('{"device":{"name":"Tag '), Buffer.from([0xed, 0xa0, 0x80]), Buffer.from('","model":"M","applicant":"A","productType":"wearable"}}')]);
    const raw = await specialist
      .post('/api/filings')
      .set('Content-Type', 'application/json')
      .serialize(() => bytes as unknown as string)
      .send({});
    expect(raw.status).toBe(422);
    expect(raw.body.error.message).toMatch(/not valid UTF-8/);
    const ok = await specialist.post('/api/filings').send({ device: { name: 'Tag 📡 ok', model: 'M', applicant: 'A', productType: 'wearable' } });
    expect(ok.status).toBe(201);
  });
});
