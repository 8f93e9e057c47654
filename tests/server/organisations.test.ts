/**
 * Organisations are sealed from each other: the outbox, names, active state and invitations of
 * one organisation neither show nor change anything of another's.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/env';
import { createMailer } from '../../server/services/mailer';
import { createTestApp, OTHER_ORG, seedOtherOrganisation, seedUsers, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

let t: TestApp;
let adminA: Awaited<ReturnType<typeof signIn>>;
let adminB: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  await seedOtherOrganisation(t);
  adminA = await signIn(t, 'admin@fieldfile.test');
  adminB = await signIn(t, OTHER_ORG.admin.email);
});
afterAll(() => t.close());

const tokenFrom = (text: string) => decodeURIComponent(text.match(/set-password\?token=([^\s"<]+)/)![1]);
type Msg = { id: number; to: string; subject: string; text: string };
const outbox = async (agent: typeof adminA): Promise<Msg[]> => (await agent.get('/api/outbox')).body.messages;

describe('the outbox', () => {
  it("shows each organisation only its own mail, so no admin can read another's set-password link", async () => {
    expect((await adminA.post('/api/users').send({ email: 'new.hire@fieldfile.test', name: 'New Hire', roles: ['engineer'] })).status).toBe(201);
    const mineA = (await outbox(adminA)).find((m) => m.to.includes('new.hire@fieldfile.test'))!;
    expect(mineA.text).toMatch(/set-password\?token=/);

    expect((await outbox(adminB)).some((m) => m.to.includes('new.hire@fieldfile.test'))).toBe(false);
    expect((await adminB.get(`/api/outbox/${mineA.id}`)).status).toBe(404);
    expect((await adminA.get(`/api/outbox/${mineA.id}`)).status).toBe(200);
  });

  it('does not exist with real SMTP: nothing is kept and the outbox answers 404', async () => {
    const config = { ...t.config, mail: { ...t.config.mail, smtp: { host: '127.0.0.1', port: t.catcher.port, secure: false } } };
    const { app, close } = createApp({ handle: t.handle, config, mailer: createMailer(config, () => t.catcher.port), serveWeb: false });
    try {
      const agent = request.agent(app);
      await agent.post('/api/auth/login').send({ email: 'admin@fieldfile.test', password: TEST_PASSWORD });
      const res = await agent.get('/api/outbox');
      expect(res.status).toBe(404);
      expect(res.body.error.message).toMatch(/no outbox/i);
    } finally {
      close();
    }
    expect(loadConfig({ SMTP_HOST: 'mail.example.com' }).mail.smtp?.host).toBe('mail.example.com');
  });
});

describe('inviting someone who already has an account', () => {
  let specialistId: number;

  it('answers exactly as for a new person and reveals nothing about the account', async () => {
    const fresh = await adminB.post('/api/users').send({ email: 'brand.new@kestrel.test', name: 'Brand New', roles: ['engineer'] });
    const existing = await adminB.post('/api/users').send({ email: 'specialist@fieldfile.test', name: 'Tom L.', roles: ['engineer'] });
    expect(existing.status).toBe(fresh.status);
    expect(existing.status).toBe(201);
    expect(Object.keys(existing.body.user).sort()).toEqual(Object.keys(fresh.body.user).sort());
    expect(existing.body.user).toMatchObject({ name: 'Tom L.', invitationPending: true, lastSignInAt: null, active: true, roles: ['engineer'] });
    expect(fresh.body.user).toMatchObject({ invitationPending: true, lastSignInAt: null });
    expect(existing.body.invitation).toEqual(fresh.body.invitation);
    specialistId = existing.body.user.id;

    const listed = (await adminB.get('/api/users')).body.users.find((u: { id: number }) => u.id === specialistId);
    expect(listed).toMatchObject({ name: 'Tom L.', invitationPending: true, lastSignInAt: null });
  });

  it("renaming or deactivating them changes only the inviting organisation's view, and audits there", async () => {
    const auditBefore = (await adminA.get('/api/audit')).body.entries.length;
    expect((await adminB.patch(`/api/users/${specialistId}`).send({ name: 'Renamed By Kestrel', active: false })).status).toBe(200);

    const inA = (await adminA.get('/api/users')).body.users.find((u: { id: number }) => u.id === specialistId);
    expect(inA).toMatchObject({ name: 'Tomas Lindqvist', active: true, invitationPending: false });
    expect((await adminA.get('/api/audit')).body.entries.length).toBe(auditBefore);
    const auditB = (await adminB.get('/api/audit')).body.entries.map((e: { action: string }) => e.action);
    expect(auditB).toContain('user.deactivate');

    const specialist = await signIn(t, 'specialist@fieldfile.test');
    expect((await specialist.get('/api/auth/me')).body.user).toMatchObject({ name: 'Tomas Lindqvist', organisation: { name: 'Halden Ridge Instruments' } });
    await adminB.patch(`/api/users/${specialistId}`).send({ name: 'Tom L.', active: true });
  });

  it('the mail asks them to accept with their own password; the link cannot set a new one', async () => {
    const mail = (await outbox(adminB)).find((m) => m.to.includes('specialist@fieldfile.test'))!;
    expect(mail.text).toMatch(/Accept with your existing Fieldfile password/);
    const token = tokenFrom(mail.text);

    const who = await request(t.app).get(`/api/auth/password-token/${encodeURIComponent(token)}`);
    expect(who.body).toEqual({ purpose: 'invitation', email: 'specialist@fieldfile.test', name: 'Tom L.', existingAccount: true, organisationName: OTHER_ORG.name });

    const takeover = await request(t.app).post('/api/auth/set-password').send({ token, password: 'kestrel-admin-chose-this' });
    expect(takeover.status).toBe(422);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'specialist@fieldfile.test', password: TEST_PASSWORD })).status).toBe(200);

    const wrong = await request(t.app).post('/api/auth/accept-invitation').send({ token, password: 'not-their-password' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.password).toMatch(/not the password/);

    const ok = await request(t.app).post('/api/auth/accept-invitation').send({ token, password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
    const listed = (await adminB.get('/api/users')).body.users.find((u: { id: number }) => u.id === specialistId);
    expect(listed.invitationPending).toBe(false);
    expect((await request(t.app).post('/api/auth/accept-invitation').send({ token, password: TEST_PASSWORD })).status).toBe(422);
  }, 60_000);
});

describe('resending an invitation', () => {
  it('a second invite is a conflict, but a resend mails a new link and retires the old one', async () => {
    const first = await adminA.post('/api/users').send({ email: 'stuck@fieldfile.test', name: 'Stuck Person', roles: ['approver'] });
    expect(first.status).toBe(201);
    expect((await adminA.post('/api/users').send({ email: 'stuck@fieldfile.test', name: 'Stuck Person', roles: ['approver'] })).status).toBe(409);
    const oldToken = tokenFrom((await outbox(adminA)).find((m) => m.to.includes('stuck@'))!.text);

    const resent = await adminA.post(`/api/users/${first.body.user.id}/invitation`).send({});
    expect(resent.status).toBe(200);
    expect(resent.body.invitation.sent).toBe(true);
    const newToken = tokenFrom((await outbox(adminA)).find((m) => m.to.includes('stuck@'))!.text);
    expect(newToken).not.toBe(oldToken);
    expect((await request(t.app).get(`/api/auth/password-token/${encodeURIComponent(oldToken)}`)).status).toBe(404);
    expect((await request(t.app).post('/api/auth/set-password').send({ token: newToken, password: 'a-long-enough-password' })).status).toBe(200);

    expect((await adminA.post(`/api/users/${first.body.user.id}/invitation`).send({})).status).toBe(409);
    // Another organisation cannot resend (or learn about) this person's invitation.
    expect((await adminB.post(`/api/users/${first.body.user.id}/invitation`).send({})).status).toBe(404);
  }, 60_000);
});
