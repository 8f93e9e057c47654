/**
 * The password policy (constants/schemas/password-policy.ts, password-strength.ts): at least 12
 * characters, zxcvbn score ≥ 3 with the person's own e-mail and name as known words (score scale:
 * Wheeler, "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016), Unicode NFKC
 * before hashing and before verifying (NIST SP 800-63B §5.1.1.2; UAX #15). The demo password and
 * every password the tests and benches set must pass it.
 */
import { randomBytes, scryptSync } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { normalisePassword, passwordUserInputs, PASSWORD_MIN_SCORE, zNewPassword, zNewPasswordFor } from '../../constants/schemas/password-policy';
import { passwordStrengthProblem } from '../../constants/schemas/password-strength';
import { loadConfig } from '../../server/env';
import { hashPassword, setPasswordHashCost, verifyPassword } from '../../server/services/passwords';
import { demoPasswordProblem, seedDemo } from '../../seeds';
import { DEMO_USERS } from '../../seeds/demo-people';
import * as usersRepo from '../../server/repos/users-repo';
import { createTestApp, seedUsers, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

const ADMIN = { email: 'admin@fieldfile.test', name: 'Mira Okafor' };
// Hashes in this file at the tests' cost (createTestApp sets it too, but only in the last block).
beforeAll(() => setPasswordHashCost(14));

describe('guessability', () => {
  it.each(['password1234', 'Password2024!', 'qwertyuiop123', 'aaaaaaaaaaaa', '123456789012', 'iloveyou2024', 'letmein12345'])('refuses the common password %s', (pw) => {
    expect(passwordStrengthProblem(pw, passwordUserInputs(ADMIN))).toMatch(/^Too easy to guess\./);
  });

  it.each(['admin@fieldfile.test', 'fieldfileadmin', 'miraokafor12', 'MiraOkafor!!', 'OkaforMira2024'])('refuses %s, built from the person’s own e-mail and name', (pw) => {
    expect(passwordStrengthProblem(pw, passwordUserInputs(ADMIN))).not.toBeNull();
  });

  it('uses the e-mail, its parts and the name’s words as known words', () => {
    expect(passwordUserInputs({ email: 'Ada.Nwosu@Halden-Ridge.example', name: 'Ada Nwosu' })).toEqual(
      expect.arrayContaining(['fieldfile', 'ada.nwosu@halden-ridge.example', 'ada.nwosu', 'adanwosu', 'nwosu', 'halden-ridge', 'example', 'ada', 'nwosuada']),
    );
  });

  it('accepts a few unrelated words and a long random string', () => {
    expect(passwordStrengthProblem('quill harbour lantern', passwordUserInputs(ADMIN))).toBeNull();
    expect(passwordStrengthProblem('v7#Qm2!pL9zR', passwordUserInputs(ADMIN))).toBeNull();
    expect(PASSWORD_MIN_SCORE).toBe(3);
  });

  it('keeps the demo password and every password the tests and benches set within the policy', () => {
    const defaultDemo = loadConfig({}).demoPassword;
    expect(defaultDemo).toBe('fieldfile-demo-2026');
    for (const pw of [defaultDemo, TEST_PASSWORD, 'bench-password-123', 'child-password-123', 'bench-password-for-timing-2026']) expect(demoPasswordProblem(pw), pw).toBeNull();
    const setByTests = ['a-long-enough-password', 'another-long-password', 'kestrel-admin-chose-this', 'quill phone harbour lantern', 'quill desktop harbour lantern'];
    for (const pw of setByTests) for (const person of DEMO_USERS) expect(passwordStrengthProblem(pw, passwordUserInputs(person)), pw).toBeNull();
  });

  it('refuses to seed the demo with a password the policy refuses', async () => {
    expect(demoPasswordProblem('fieldfile-2026')).toMatch(/Too easy to guess/);
    expect(demoPasswordProblem('short')).toBe('Use at least 12 characters.');
    expect(() => loadConfig({ FIELDFILE_DEMO_PASSWORD: 'eleven-char' })).toThrow(/FIELDFILE_DEMO_PASSWORD/);
    await expect(seedDemo({} as never, 'password1234')).rejects.toThrow(/Choose another FIELDFILE_DEMO_PASSWORD/);
  });
});

describe('the shared schemas', () => {
  it('measures the length after NFKC and keeps the normalised form', () => {
    expect(zNewPassword.safeParse('eleven char').error?.issues[0].message).toBe('Use at least 12 characters.');
    // "ﬃ" (U+FB03) is three letters in NFKC: eleven characters typed, thirteen compared.
    expect(zNewPassword.parse('o\uFB03ce lantern')).toBe('office lantern');
    expect(zNewPassword.safeParse('x'.repeat(201)).error?.issues[0].message).toBe('A password has at most 200 characters.');
  });

  it('checks guessability for the forms, before anything is sent', async () => {
    const schema = zNewPasswordFor(ADMIN);
    expect((await schema.safeParseAsync('Password2024!')).error?.issues[0].message).toMatch(/^Too easy to guess\./);
    expect((await schema.safeParseAsync('short')).error?.issues.map((i) => i.message)).toEqual(['Use at least 12 characters.']);
    expect((await schema.safeParseAsync('quill harbour lantern')).success).toBe(true);
  });
});

describe('NFKC before hashing and before verifying', () => {
  it('is the same password typed in full-width characters or plain ones', async () => {
    const fullWidth = 'ｑｕｉｌｌ harbour lantern ４２';
    expect(normalisePassword(fullWidth)).toBe('quill harbour lantern 42');
    const hash = await hashPassword(fullWidth);
    expect(await verifyPassword('quill harbour lantern 42', hash)).toBe(true);
    expect(await verifyPassword(fullWidth, hash)).toBe(true);
    expect(await verifyPassword('quill harbour lantern 43', hash)).toBe(false);
  });

  it('still accepts a hash made before passwords were normalised, from the password as typed', async () => {
    const typed = 'ｑｕｉｌｌ harbour lantern ４２';
    const salt = randomBytes(16);
    const N = 2 ** 14;
    const key = scryptSync(typed, salt, 32, { N, r: 8, p: 1, maxmem: 128 * N * 8 * 2 });
    const legacy = `scrypt$${N}$8$1$${salt.toString('base64')}$${key.toString('base64')}`;
    expect(await verifyPassword(typed, legacy)).toBe(true);
    expect(await verifyPassword('something else entirely', legacy)).toBe(false);
  });
});

describe('setting a password from a link', () => {
  let t: TestApp;
  const tokenFrom = (text: string) => decodeURIComponent(text.match(/set-password\?token=([^\s"<]+)/)![1]);
  let token = '';
  beforeAll(async () => {
    t = await createTestApp();
    await seedUsers(t);
    const admin = await signIn(t, 'admin@fieldfile.test');
    await admin.post('/api/users').send({ email: 'ines.pardo@fieldfile.test', name: 'Ines Pardo', roles: ['engineer'] });
    const mail = (await admin.get('/api/outbox')).body.messages.find((m: { to: string }) => m.to.includes('ines.pardo'));
    token = tokenFrom((await admin.get(`/api/outbox/${mail.id}`)).body.message.text);
  });
  afterAll(() => t.close());

  it('refuses a guessable password on the password field, and one built from the person’s name', async () => {
    for (const password of ['Password2024!', 'InesPardo2024', 'ines.pardo@fieldfile.test']) {
      const res = await request(t.app).post('/api/auth/set-password').send({ token, password });
      expect(res.status, password).toBe(422);
      expect(res.body.error.fields.password, password).toMatch(/^Too easy to guess\./);
    }
  });

  it('answers a dead link before judging the password', async () => {
    const res = await request(t.app).post('/api/auth/set-password').send({ token: 'no-such-token', password: 'Password2024!' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.token).toMatch(/expired or was already used/);
    expect(res.body.error.fields.password).toBeUndefined();
  });

  it('stores the NFKC form: the person signs in typing plain or full-width characters', async () => {
    expect((await request(t.app).post('/api/auth/set-password').send({ token, password: 'ｑｕｉｌｌ harbour lantern ４２' })).status).toBe(200);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'ines.pardo@fieldfile.test', password: 'quill harbour lantern 42' })).status).toBe(200);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'ines.pardo@fieldfile.test', password: 'ｑｕｉｌｌ harbour lantern ４２' })).status).toBe(200);
    const user = usersRepo.findUserByEmail(t.handle.db, 'ines.pardo@fieldfile.test')!;
    expect(await verifyPassword('quill harbour lantern 42', user.passwordHash!)).toBe(true);
  });
});
