/**
 * The forgotten-password flow (ask by mail, the one-hour single-use link, choose a new password
 * through the set-password route) and changing the password from the profile, on the real app
 * with the real SMTP catcher. Both end the person's other sessions and land in the audit trail.
 */
import { eq, like } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { RESET_REQUESTED_MESSAGE } from '../../constants/schemas/auth';
import { mailMessages, passwordTokens } from '../../db/schema';
import { RESET_REQUEST_LIMITS, SIGN_IN_LIMITS } from '../../server/auth/sign-in-guard';
import { listOrganisationAudit } from '../../server/repos/audit-repo';
import * as usersRepo from '../../server/repos/users-repo';
import { hashPassword } from '../../server/services/passwords';
import { createTestApp, seedUsers, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

let t: TestApp;
let organisationId: number;
/** A member with the test password who has no other part in this file. */
const LENA = { email: 'lena.brandt@fieldfile.test', name: 'Lena Brandt' };
beforeAll(async () => {
  t = await createTestApp();
  ({ organisationId } = await seedUsers(t));
  const user = usersRepo.insertUser(t.handle.db, { ...LENA, passwordHash: await hashPassword(TEST_PASSWORD) });
  const m = usersRepo.insertMembership(t.handle.db, { userId: user.id, organisationId, name: LENA.name, acceptedAt: new Date().toISOString() });
  usersRepo.replaceRoles(t.handle.db, m.id, ['engineer']);
});
afterAll(() => t.close());
afterEach(() => vi.restoreAllMocks());

const forgot = (email: string, from = '198.51.100.77') => request(t.app).post('/api/auth/forgot-password').set('X-Forwarded-For', from).send({ email });
const login = (email: string, password: string, from = '198.51.100.78') => request(t.app).post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password });
const mailsTo = (email: string) =>
  t.handle.db
    .select()
    .from(mailMessages)
    .where(like(mailMessages.toAddress, `%${email}%`))
    .all();
const auditOf = (action: string) => listOrganisationAudit(t.handle.db, organisationId, 10_000).filter((e) => e.action === action);
const tokenFrom = (text: string) => decodeURIComponent(text.match(/reset-password\?token=([^\s"<]+)/)![1]);

/** Waits until `count` mails to the address have arrived (the request answers before it mails). */
async function waitForMails(email: string, count: number) {
  for (let i = 0; i < 200; i++) {
    const rows = mailsTo(email);
    if (rows.length >= count) return rows;
    await new Promise((r) => setTimeout(r, 25));
  }
  throw new Error(`expected ${count} mail(s) to ${email}, found ${mailsTo(email).length}`);
}

/** Waits for the mail with this subject (notices are sent after the answer, so they may trail it). */
async function waitForSubject(email: string, subject: string) {
  for (let i = 0; i < 200; i++) {
    const found = mailsTo(email).find((m) => m.subject === subject);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 25));
  }
  throw new Error(`expected a mail to ${email} titled "${subject}"`);
}

/** Asks for a reset and returns the token from the mail that arrives. */
async function resetToken(email: string, from?: string): Promise<string> {
  const before = mailsTo(email).length;
  expect((await forgot(email, from)).status).toBe(202);
  const rows = await waitForMails(email, before + 1);
  return tokenFrom(rows[rows.length - 1].text);
}

describe('asking for a reset link', () => {
  it('answers 202 with the same words whether or not the address has an account', async () => {
    const unknown = await forgot('nobody.here@fieldfile.test');
    const known = await forgot('engineer@fieldfile.test');
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(known.body).toEqual({ message: RESET_REQUESTED_MESSAGE });
    expect(unknown.body).toEqual(known.body);
    await waitForMails('engineer@fieldfile.test', 1);
    expect(mailsTo('nobody.here@fieldfile.test')).toEqual([]);
    expect((await forgot('not-an-address')).status).toBe(422);
  });

  it('mails a one-hour link that names no organisation or person, seen in no outbox, and prints it once', async () => {
    const log = vi.spyOn(console, 'log').mockImplementation(() => undefined);
    const token = await resetToken('approver@fieldfile.test');
    const mail = mailsTo('approver@fieldfile.test').at(-1)!;
    expect(mail.organisationId).toBeNull();
    expect(mail.subject).toBe('Choose a new Fieldfile password');
    expect(mail.text).toContain(`http://fieldfile.test:8080/reset-password?token=${encodeURIComponent(token)}`);
    expect(mail.html).toContain('Choose a new password</a>');
    // Nothing of the organisation, the person or their role.
    for (const leak of ['Halden Ridge', 'Jonas', 'Weber', 'Approver']) expect(mail.text + mail.html).not.toContain(leak);
    const printed = log.mock.calls.map((c) => String(c[0])).filter((l) => l.includes('password reset link'));
    expect(printed).toEqual([`[fieldfile] password reset link for approver@fieldfile.test (no SMTP configured): http://fieldfile.test:8080/reset-password?token=${encodeURIComponent(token)}`]);

    const row = t.handle.db.select().from(passwordTokens).where(eq(passwordTokens.purpose, 'reset')).all().at(-1)!;
    expect(row.tokenSha256).not.toContain(token); // stored hashed
    const ttl = new Date(row.expiresAt).getTime() - new Date(row.createdAt).getTime();
    expect(Math.abs(ttl - 3600_000)).toBeLessThan(5_000);

    const admin = await signIn(t, 'admin@fieldfile.test');
    const outbox = (await admin.get('/api/outbox')).body.messages as { subject: string }[];
    expect(outbox.map((m) => m.subject)).not.toContain('Choose a new Fieldfile password');
    expect(auditOf('auth.password-reset-requested').length).toBeGreaterThanOrEqual(1);
  });

  it('says who the link is for and that it is a reset', async () => {
    const token = await resetToken('specialist@fieldfile.test');
    const who = await request(t.app).get(`/api/auth/password-token/${encodeURIComponent(token)}`);
    expect(who.status).toBe(200);
    expect(who.body).toMatchObject({ purpose: 'reset', email: 'specialist@fieldfile.test', existingAccount: false });
  });

  it('sends at most three links an hour to one address (then answers the same and sends nothing), and refuses a flooding network', async () => {
    const email = 'engineer@fieldfile.test';
    const from = '198.51.100.90';
    const before = mailsTo(email).length;
    // This address already had one link above; the hour's limit counts every request for it.
    for (let i = 1; i < RESET_REQUEST_LIMITS.email.points; i++) expect((await forgot(email, from)).status).toBe(202);
    await waitForMails(email, before + RESET_REQUEST_LIMITS.email.points - 1);
    const extra = await forgot(email, from);
    expect(extra.status).toBe(202);
    expect(extra.body).toEqual({ message: RESET_REQUESTED_MESSAGE });
    // The mail of a request answered before it would be here by now if there were one.
    await resetToken('admin@fieldfile.test', '198.51.100.91');
    expect(mailsTo(email)).toHaveLength(before + RESET_REQUEST_LIMITS.email.points - 1);

    const flood = '198.51.100.92';
    for (let i = 0; i < RESET_REQUEST_LIMITS.address.points; i++) expect((await forgot(`someone-${i}@example.test`, flood)).status).toBe(202);
    const refused = await forgot('someone-else@example.test', flood);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(refused.body.error.message).toMatch(/^Too many reset requests from your network\. Try again in \d+ minutes\.$/);
  });
});

describe('choosing a new password from the link', () => {
  it('refuses a guessable password, then sets a good one, ends every session, and works once', async () => {
    const email = 'specialist@fieldfile.test';
    const elsewhere = await signIn(t, email);
    const token = await resetToken(email);

    const weak = await request(t.app).post('/api/auth/set-password').send({ token, password: 'Password2024!' });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields.password).toMatch(/^Too easy to guess\./);

    const set = await request(t.app).post('/api/auth/set-password').send({ token, password: 'heron slate orchard 7' });
    expect(set.status).toBe(200);
    expect(set.body).toEqual({ email });
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
    expect((await login(email, TEST_PASSWORD)).status).toBe(401);
    expect((await login(email, 'heron slate orchard 7')).status).toBe(200);

    const again = await request(t.app).post('/api/auth/set-password').send({ token, password: 'another heron orchard 8' });
    expect(again.status).toBe(422);
    expect(again.body.error.fields.token).toBe('This link has expired or was already used.');
    expect((await request(t.app).get(`/api/auth/password-token/${encodeURIComponent(token)}`)).status).toBe(404);

    const reset = auditOf('auth.password-reset').at(-1)!;
    expect(reset.details).toMatchObject({ sessionsEnded: 1 });
    const notice = await waitForSubject(email, 'Your Fieldfile password changed');
    expect(notice?.text).toMatch(/replaced through an e-mailed link/);
  });

  it('refuses an expired link and one a newer request replaced', async () => {
    const email = 'approver@fieldfile.test';
    const older = await resetToken(email, '198.51.100.93');
    const newer = await resetToken(email, '198.51.100.93');
    expect((await request(t.app).post('/api/auth/set-password').send({ token: older, password: 'heron slate orchard 9' })).status).toBe(422);

    t.handle.sqlite.prepare("update password_tokens set expires_at = ? where purpose = 'reset' and used_at is null").run(new Date(Date.now() - 1000).toISOString());
    const expired = await request(t.app).post('/api/auth/set-password').send({ token: newer, password: 'heron slate orchard 9' });
    expect(expired.status).toBe(422);
    expect(expired.body.error.message).toMatch(/expired or was already used.*Forgot your password/);
    expect((await login(email, TEST_PASSWORD)).status).toBe(200);
  });

  it('opens the sign-in limits the owner ran into again', async () => {
    const email = LENA.email;
    const from = '203.0.113.99';
    for (let i = 0; i < SIGN_IN_LIMITS.accountFromAddress.points; i++) await login(email, `wrong-${i}`, from);
    expect((await login(email, TEST_PASSWORD, from)).status).toBe(429);
    const token = await resetToken(email, '198.51.100.94');
    expect((await request(t.app).post('/api/auth/set-password').send({ token, password: 'kettle meadow copper 4' })).status).toBe(200);
    expect((await login(email, 'kettle meadow copper 4', from)).status).toBe(200);
  }, 60_000);
});

describe('changing the password in the profile', () => {
  const email = 'admin@fieldfile.test';

  it('needs the current password and a new one within the policy, other than the current one', async () => {
    const me = await signIn(t, email);
    const wrong = await me.post('/api/auth/change-password').send({ currentPassword: 'not-my-password', newPassword: 'lantern quarry bicycle 5' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields).toEqual({ currentPassword: 'That is not your current password.' });
    const weak = await me.post('/api/auth/change-password').send({ currentPassword: TEST_PASSWORD, newPassword: 'MiraOkafor2024' });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields.newPassword).toMatch(/^Too easy to guess\./);
    const same = await me.post('/api/auth/change-password').send({ currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD });
    expect(same.status).toBe(422);
    expect(same.body.error.fields.newPassword).toBe('Choose a password other than your current one.');
    const short = await me.post('/api/auth/change-password').send({ currentPassword: TEST_PASSWORD, newPassword: 'short' });
    expect(short.body.error.fields.newPassword).toBe('Use at least 12 characters.');
    expect((await login(email, TEST_PASSWORD)).status).toBe(200);
  });

  it('changes it, keeps this session, ends the others, records it and tells the account', async () => {
    const me = await signIn(t, email);
    const other = await signIn(t, email);
    const res = await me.post('/api/auth/change-password').send({ currentPassword: TEST_PASSWORD, newPassword: 'lantern quarry bicycle 5' });
    expect(res.status).toBe(200);
    expect(res.body.sessionsEnded).toBeGreaterThanOrEqual(1);
    expect((await me.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await login(email, TEST_PASSWORD)).status).toBe(401);
    expect((await login(email, 'lantern quarry bicycle 5')).status).toBe(200);
    expect(auditOf('auth.password-change').at(-1)).toMatchObject({ targetId: expect.any(String), details: { sessionsEnded: res.body.sessionsEnded } });
    const notice = await waitForSubject(email, 'Your Fieldfile password changed');
    expect(notice?.text).toMatch(/changed from its profile/);
    expect(notice?.organisationId).toBeNull();
  });

  it('counts a wrong current password against the sign-in limits', async () => {
    const me = await signIn(t, email, 'lantern quarry bicycle 5');
    const from = '203.0.113.98';
    for (let i = 0; i < SIGN_IN_LIMITS.accountFromAddress.points; i++) {
      expect(
        (
          await me
            .post('/api/auth/change-password')
            .set('X-Forwarded-For', from)
            .send({ currentPassword: `guess-${i}`, newPassword: 'lantern quarry bicycle 6' })
        ).status,
      ).toBe(422);
    }
    const blocked = await me.post('/api/auth/change-password').set('X-Forwarded-For', from).send({ currentPassword: 'lantern quarry bicycle 5', newPassword: 'lantern quarry bicycle 6' });
    expect(blocked.status).toBe(429);
    expect(blocked.headers['retry-after']).toBeDefined();
  }, 60_000);
});
