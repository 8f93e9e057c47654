/** Admins invite users (a real mail through the local SMTP catcher), change roles, deactivate. */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  admin = await signIn(t, 'admin@fieldfile.test');
});
afterAll(() => t.close());

const tokenFrom = (text: string) => decodeURIComponent(text.match(/set-password\?token=([^\s"<]+)/)![1]);

describe('users', () => {
  it('lists the organisation with roles', async () => {
    const res = await admin.get('/api/users');
    expect(res.status).toBe(200);
    expect(res.body.users.map((u: { email: string }) => u.email).sort()).toEqual(['admin@fieldfile.test', 'approver@fieldfile.test', 'engineer@fieldfile.test', 'specialist@fieldfile.test']);
  });

  it('invites a user: the mail reaches the outbox, the link sets a password, the user signs in', async () => {
    const created = await admin.post('/api/users').send({ email: 'Ada.Nwosu@fieldfile.test', name: 'Ada Nwosu', roles: ['engineer', 'approver'] });
    expect(created.status).toBe(201);
    expect(created.body.user).toMatchObject({ email: 'ada.nwosu@fieldfile.test', roles: ['engineer', 'approver'], invitationPending: true });
    expect(created.body.invitation.sent).toBe(true);

    const outbox = await admin.get('/api/outbox');
    const mail = outbox.body.messages.find((m: { to: string }) => m.to.includes('ada.nwosu@fieldfile.test'));
    expect(mail.subject).toMatch(/invited to Halden Ridge Instruments/);
    expect(mail.text).toMatch(/http:\/\/fieldfile\.test:8080\/set-password\?token=/);
    const token = tokenFrom(mail.text);

    // Not yet able to sign in: no password.
    expect((await request(t.app).post('/api/auth/login').send({ email: 'ada.nwosu@fieldfile.test', password: 'whatever-long-pass' })).status).toBe(401);

    const who = await request(t.app).get(`/api/auth/password-token/${encodeURIComponent(token)}`);
    expect(who.body).toEqual({ purpose: 'invitation', email: 'ada.nwosu@fieldfile.test', name: 'Ada Nwosu', existingAccount: false, organisationName: 'Halden Ridge Instruments' });

    const short = await request(t.app).post('/api/auth/set-password').send({ token, password: 'short' });
    expect(short.status).toBe(422);
    expect(short.body.error.fields.password).toMatch(/at least 12/);

    const set = await request(t.app).post('/api/auth/set-password').send({ token, password: 'a-long-enough-password' });
    expect(set.status).toBe(200);
    const again = await request(t.app).post('/api/auth/set-password').send({ token, password: 'another-long-password' });
    expect(again.status).toBe(422);
    expect(again.body.error.message).toMatch(/expired or was already used/);

    const login = await request(t.app).post('/api/auth/login').send({ email: 'ada.nwosu@fieldfile.test', password: 'a-long-enough-password' });
    expect(login.status).toBe(200);
    expect(login.body.user.roles).toEqual(['engineer', 'approver']);
  }, 60_000);

  it('refuses a duplicate e-mail with a field message and writes nothing', async () => {
    const before = (await admin.get('/api/users')).body.users.length;
    const res = await admin.post('/api/users').send({ email: 'engineer@fieldfile.test', name: 'Again', roles: ['engineer'] });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toMatch(/already a member/);
    expect((await admin.get('/api/users')).body.users.length).toBe(before);
  });

  it('refuses bad input with a message per field', async () => {
    const res = await admin.post('/api/users').send({ email: 'nope', name: '', roles: ['overlord'] });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'roles.0']);
    const none = await admin.post('/api/users').send({ email: 'x@fieldfile.test', name: 'X', roles: [] });
    expect(none.body.error.fields.roles).toMatch(/at least one role/);
  });

  it('changes roles, and the change applies to the live session at once', async () => {
    const users = (await admin.get('/api/users')).body.users;
    const engineer = users.find((u: { email: string }) => u.email === 'engineer@fieldfile.test');
    const engineerAgent = await signIn(t, 'engineer@fieldfile.test');
    expect((await engineerAgent.get('/api/users')).status).toBe(403);
    const res = await admin.patch(`/api/users/${engineer.id}`).send({ roles: ['engineer', 'admin'] });
    expect(res.status).toBe(200);
    expect(res.body.user.roles).toEqual(['admin', 'engineer']);
    expect((await engineerAgent.get('/api/users')).status).toBe(200);
    await admin.patch(`/api/users/${engineer.id}`).send({ roles: ['engineer'] });
    expect((await engineerAgent.get('/api/users')).status).toBe(403);
  });

  it('deactivates a user: their session ends and they cannot sign in', async () => {
    const users = (await admin.get('/api/users')).body.users;
    const approver = users.find((u: { email: string }) => u.email === 'approver@fieldfile.test');
    const approverAgent = await signIn(t, 'approver@fieldfile.test');
    const res = await admin.patch(`/api/users/${approver.id}`).send({ active: false });
    expect(res.body.user.active).toBe(false);
    expect((await approverAgent.get('/api/auth/me')).status).toBe(401);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'approver@fieldfile.test', password: 'test-password-123' })).status).toBe(401);
    await admin.patch(`/api/users/${approver.id}`).send({ active: true });
  });

  it('an admin cannot lock themselves out', async () => {
    const me = (await admin.get('/api/auth/me')).body.user;
    const res = await admin.patch(`/api/users/${me.id}`).send({ active: false });
    expect(res.status).toBe(403);
    expect((await admin.patch(`/api/users/${me.id}`).send({ roles: ['engineer'] })).status).toBe(403);
  });

  it('404s for a user outside the organisation or an id that is not a plain number, 422s for an empty change', async () => {
    expect((await admin.patch('/api/users/99999').send({ name: 'X' })).status).toBe(404);
    for (const bad of ['abc', '0x1', '1e0', '01', '-1']) expect((await admin.patch(`/api/users/${bad}`).send({ name: 'X' })).status).toBe(404);
    expect((await admin.patch('/api/users/1').send({})).status).toBe(422);
  });
});

describe('audit trail', () => {
  it('records sign-ins and user changes, newest first', async () => {
    const res = await admin.get('/api/audit');
    const actions = res.body.entries.map((e: { action: string }) => e.action);
    expect(actions).toContain('auth.sign-in');
    expect(actions).toContain('user.invite');
    expect(actions).toContain('user.deactivate');
    expect(res.body.entries[0].id).toBeGreaterThan(res.body.entries.at(-1).id);
  });

  it('says who was changed and what changed, before → after; an accepted invitation is there', async () => {
    const entries = (await admin.get('/api/audit')).body.entries as { action: string; details: Record<string, unknown> }[];
    const roleChanges = entries.filter((e) => e.action === 'user.update' && e.details.email === 'engineer@fieldfile.test');
    // Newest first: engineer+admin → engineer, then engineer → engineer+admin.
    expect(roleChanges.map((e) => [e.details.rolesBefore, e.details.roles])).toEqual([
      [['admin', 'engineer'], ['engineer']],
      [['engineer'], ['engineer', 'admin']],
    ]);
    expect(roleChanges[0].details.targetName).toEqual(expect.any(String));
    const deactivated = entries.find((e) => e.action === 'user.deactivate')!;
    expect(deactivated.details).toMatchObject({ email: 'approver@fieldfile.test', active: false, activeBefore: true });
    expect(entries.find((e) => e.action === 'auth.set-password' && e.details.purpose === 'invitation')).toBeDefined();
  });

  it('is append-only in the database itself', () => {
    expect(() => t.handle.sqlite.exec("update audit_log set action = 'x'")).toThrow(/append-only/);
    expect(() => t.handle.sqlite.exec('delete from audit_log')).toThrow(/append-only/);
  });
});
