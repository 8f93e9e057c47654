/** Sign-in, sessions, sign-out and the role guards, against the real app on a fresh database. */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createMailer } from '../../server/services/mailer';
import { createTestApp, seedUsers, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('answers without a session', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('ok');
  });
});

describe('POST /api/auth/login', () => {
  it('signs in with the right password and sets an httpOnly SameSite=Lax cookie', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'Specialist@Fieldfile.test', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'specialist@fieldfile.test', roles: ['specialist'] });
    expect(res.body.user.organisation.name).toBe('Halden Ridge Instruments');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/fieldfile\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(res.body.user).not.toHaveProperty('passwordHash');
  });

  it('answers 401 with the same message for a wrong password and an unknown e-mail', async () => {
    const wrong = await request(t.app).post('/api/auth/login').send({ email: 'admin@fieldfile.test', password: 'not-the-password' });
    const unknown = await request(t.app).post('/api/auth/login').send({ email: 'nobody@fieldfile.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect(wrong.body.error.message).toMatch(/e-mail or password/);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('answers 422 with field messages for missing or malformed fields', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'not-an-email' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields.email).toMatch(/valid e-mail/);
    expect(res.body.error.fields.password).toMatch(/password/i);
  });

  it('refuses unknown fields, wrong types and over-long strings', async () => {
    const extra = await request(t.app).post('/api/auth/login').send({ email: 'a@b.test', password: 'x', admin: true });
    expect(extra.status).toBe(422);
    expect(extra.body.error.fields.admin).toMatch(/Unknown field/);
    const types = await request(t.app)
      .post('/api/auth/login')
      .send({ email: 42, password: ['x'] });
    expect(types.status).toBe(422);
    const long = await request(t.app)
      .post('/api/auth/login')
      .send({ email: `${'a'.repeat(300)}@b.test`, password: 'x' });
    expect(long.status).toBe(422);
    expect(long.body.error.fields.email).toMatch(/at most 254/);
  });

  it('answers 400 for malformed JSON', async () => {
    const res = await request(t.app).post('/api/auth/login').set('content-type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js/);
  });

  it('refuses a write from another site', async () => {
    const res = await request(t.app).post('/api/auth/login').set('origin', 'https://evil.example').send({ email: 'admin@fieldfile.test', password: TEST_PASSWORD });
    expect(res.status).toBe(403);
  });

  it('gives a new session id at sign-in (no session fixation)', async () => {
    const agent = request.agent(t.app);
    await agent.post('/api/auth/login').send({ email: 'admin@fieldfile.test', password: 'wrong-password' });
    const first = await agent.post('/api/auth/login').send({ email: 'admin@fieldfile.test', password: TEST_PASSWORD });
    const second = await agent.post('/api/auth/login').send({ email: 'admin@fieldfile.test', password: TEST_PASSWORD });
    const sid = (r: request.Response) => String(r.headers['set-cookie']).match(/fieldfile\.sid=([^;]+)/)?.[1];
    expect(sid(first)).toBeTruthy();
    expect(sid(second)).toBeTruthy();
    expect(sid(second)).not.toBe(sid(first));
  });
});

describe('GET /api/auth/me and sign-out', () => {
  it('is 401 without a session', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  it('returns the user with roles, then 401 after sign-out', async () => {
    const agent = await signIn(t, 'approver@fieldfile.test');
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email: 'approver@fieldfile.test', name: 'Jonas Weber', roles: ['approver'] });
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('keeps a session across an app restart on the same database', async () => {
    const login = await request(t.app).post('/api/auth/login').send({ email: 'engineer@fieldfile.test', password: TEST_PASSWORD });
    const setCookie = String(login.headers['set-cookie']).split(';')[0];
    // A second app on the same SQLite file and data folder (same session secret) = a restart.
    const restarted = createApp({ handle: t.handle, config: t.config, mailer: createMailer(t.config, () => t.catcher.port), serveWeb: false });
    const me = await request(restarted.app).get('/api/auth/me').set('cookie', setCookie);
    restarted.close();
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('engineer@fieldfile.test');
  });
});

describe('role guards', () => {
  it.each(['specialist', 'engineer', 'approver'])('%s gets 403 on admin routes', async (role) => {
    const agent = await signIn(t, `${role}@fieldfile.test`);
    for (const url of ['/api/users', '/api/outbox', '/api/audit']) {
      const res = await agent.get(url);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/admin role/);
    }
  });

  it('unknown API routes are a JSON 404', async () => {
    const res = await request(t.app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
