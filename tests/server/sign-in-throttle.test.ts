/**
 * The sign-in guard (server/auth/sign-in-guard.ts) on the real app: per-account and per-address
 * limits answer 429 with Retry-After and a sentence saying when; the owner still signs in from
 * another address; a flood from one address is told "busy" at once and never holds more than its
 * share of the password hashes; failed and blocked sign-ins land in the organisation's audit trail
 * without the caller learning whether the account exists.
 *
 * Addresses are given with X-Forwarded-For, which the app trusts from a proxy on this machine
 * (FIELDFILE_TRUST_PROXY defaults to "loopback", and supertest connects over loopback).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addressKey, retryInWords, SIGN_IN_LIMITS, SIGN_IN_QUEUE_PER_ADDRESS } from '../../server/auth/sign-in-guard';
import { HASH_CONCURRENCY, hashLoad, hashPassword, setPasswordHashCost } from '../../server/services/passwords';
import { listOrganisationAudit } from '../../server/repos/audit-repo';
import { createTestApp, seedUsers, TEST_PASSWORD, type TestApp } from './support/test-app';

let t: TestApp;
let organisationId: number;
beforeAll(async () => {
  t = await createTestApp();
  ({ organisationId } = await seedUsers(t));
});
afterAll(() => t.close());

const login = (from: string, email: string, password: string) => request(t.app).post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password });
const auditOf = (action: string) => listOrganisationAudit(t.handle.db, organisationId, 10_000).filter((e) => e.action === action);

describe('per-account limit', () => {
  const N = SIGN_IN_LIMITS.accountFromAddress.points;

  it(`answers 429 with Retry-After after ${N} wrong passwords from one address, and the owner still signs in from another`, async () => {
    const attacker = '203.0.113.10';
    for (let i = 0; i < N; i++) expect((await login(attacker, 'engineer@fieldfile.test', `wrong-guess-${i}`)).status).toBe(401);

    const blocked = await login(attacker, 'engineer@fieldfile.test', `wrong-guess-${N}`);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('too_many_attempts');
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(SIGN_IN_LIMITS.accountFromAddress.blockDuration - 60);
    expect(retryAfter).toBeLessThanOrEqual(SIGN_IN_LIMITS.accountFromAddress.blockDuration);
    expect(blocked.body.error.message).toBe('Too many wrong passwords for this account. Try again in 15 minutes, or reset your password by e-mail.');

    // The right password from the blocked address is refused too: points are taken before the hash.
    expect((await login(attacker, 'engineer@fieldfile.test', TEST_PASSWORD)).status).toBe(429);
    // The owner, elsewhere, is not affected.
    const owner = await login('198.51.100.7', 'engineer@fieldfile.test', TEST_PASSWORD);
    expect(owner.status).toBe(200);
    expect(owner.body.user.email).toBe('engineer@fieldfile.test');
  });

  it('records the failed sign-ins and the moment the limit closed in the organisation’s trail', () => {
    const failed = auditOf('auth.sign-in-failed').filter((e) => e.details?.address === '203.0.113.10');
    expect(failed).toHaveLength(N);
    expect(failed[0]).toMatchObject({ targetType: 'user', details: { email: 'engineer@fieldfile.test', reason: 'wrong-password' } });
    const blocked = auditOf('auth.sign-in-blocked');
    expect(blocked).toHaveLength(1);
    expect(blocked[0].details).toMatchObject({ email: 'engineer@fieldfile.test', address: '203.0.113.10', limit: 'accountFromAddress' });
  });

  it('answers an unknown e-mail exactly like a known one, and records nothing for it', async () => {
    const from = '203.0.113.11';
    const before = listOrganisationAudit(t.handle.db, organisationId, 10_000).length;
    const answers: request.Response[] = [];
    for (let i = 0; i <= N; i++) answers.push(await login(from, 'nobody@fieldfile.test', `wrong-guess-${i}`));
    expect(answers.slice(0, N).map((r) => r.status)).toEqual(Array(N).fill(401));
    expect(answers[N].status).toBe(429);
    expect(answers[N].body.error.message).toBe('Too many wrong passwords for this account. Try again in 15 minutes, or reset your password by e-mail.');
    expect(listOrganisationAudit(t.handle.db, organisationId, 10_000).length).toBe(before);
  });

  it('gives the points back for a right password: mistyping now and then never locks the owner out', async () => {
    const from = '203.0.113.12';
    for (let round = 0; round < 2; round++) {
      for (let i = 0; i < N - 1; i++) expect((await login(from, 'approver@fieldfile.test', `typo-${round}-${i}`)).status).toBe(401);
      expect((await login(from, 'approver@fieldfile.test', TEST_PASSWORD)).status).toBe(200);
    }
  });
});

describe('account-wide limit', () => {
  it('closes for an account guessed at from many addresses, for its owner too, with the reset offered', async () => {
    const perAddress = SIGN_IN_LIMITS.accountFromAddress.points;
    const addresses = SIGN_IN_LIMITS.account.points / perAddress;
    // Each address one guess at a time (more would be "busy"), the addresses side by side.
    for (let i = 0; i < perAddress; i++) {
      const answers = await Promise.all(Array.from({ length: addresses }, (_, a) => login(`192.0.2.${a + 1}`, 'admin@fieldfile.test', `spread-${a}-${i}`)));
      expect(answers.map((r) => r.status)).toEqual(Array(addresses).fill(401));
    }
    const blocked = await login('198.51.100.50', 'admin@fieldfile.test', TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toBe('Too many wrong passwords for this account. Try again in 60 minutes, or reset your password by e-mail.');
    expect(auditOf('auth.sign-in-blocked').filter((e) => e.details?.limit === 'account')).toHaveLength(1);
  }, 120_000);
});

describe('per-address limit', () => {
  it('closes for an address that sprays guesses over many accounts, and not for others', async () => {
    const from = '203.0.113.20';
    const points = SIGN_IN_LIMITS.address.points;
    // Different accounts each time, so only the address limit can close.
    for (let i = 0; i < points; i++) expect((await login(from, `spray-${i}@example.test`, 'Password2024!')).status).toBe(401);
    const blocked = await login(from, 'spray-last@example.test', 'Password2024!');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toBe('Too many sign-in attempts from your network. Try again in 60 minutes.');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(SIGN_IN_LIMITS.address.blockDuration - 60);
    expect((await login(from, 'approver@fieldfile.test', TEST_PASSWORD)).status).toBe(429);
    expect((await login('198.51.100.8', 'approver@fieldfile.test', TEST_PASSWORD)).status).toBe(200);
  }, 120_000);

  it('counts an IPv6 subscriber by its /64', () => {
    expect(addressKey('2001:db8:1:2:aaaa::1')).toBe('2001:db8:1:2::/64');
    expect(addressKey('2001:db8:1:2:ffff:ffff:ffff:ffff')).toBe('2001:db8:1:2::/64');
    expect(addressKey('2001:db8::1')).toBe('2001:db8:0:0::/64');
    expect(addressKey('::ffff:192.0.2.1')).toBe('192.0.2.1');
    expect(addressKey('192.0.2.1')).toBe('192.0.2.1');
  });

  it('says when to try again in words', () => {
    expect(retryInWords(1)).toBe('in 1 second');
    expect(retryInWords(42_000)).toBe('in 42 seconds');
    expect(retryInWords(61_000)).toBe('in 2 minutes');
    expect(retryInWords(15 * 60_000)).toBe('in 15 minutes');
  });
});

describe('a flood from one address', () => {
  it('is told "busy" at once beyond one check and a short line', async () => {
    const from = '203.0.113.30';
    const flood = 12;
    const finished: { status: number; code?: string; retryAfter?: string }[] = [];
    // Two slow hashes (production cost) hold every hash slot, so no check of the flood can end
    // before they do: whatever answers first was answered without waiting for a hash.
    setPasswordHashCost(17);
    const holders = [hashPassword('slot-holder-one'), hashPassword('slot-holder-two')];
    setPasswordHashCost(t.config.scryptLog2N);
    void Promise.race(holders).then(() => finished.push({ status: 0, code: 'slots-free' }));
    await Promise.all([
      ...holders,
      ...Array.from({ length: flood }, (_, i) =>
        login(from, `flood-${i}@example.test`, 'not-the-password').then((r) => {
          finished.push({ status: r.status, code: r.body.error?.code, retryAfter: r.headers['retry-after'] });
        }),
      ),
    ]);
    const checked = finished.filter((r) => r.status === 401);
    const busy = finished.filter((r) => r.status === 429);
    expect(checked).toHaveLength(1 + SIGN_IN_QUEUE_PER_ADDRESS);
    // "At once": every busy answer came back before the first hash slot was free again.
    expect(busy).toHaveLength(flood - 1 - SIGN_IN_QUEUE_PER_ADDRESS);
    for (const b of busy) expect(b).toMatchObject({ code: 'busy', retryAfter: '1' });
    const slotsFree = finished.findIndex((r) => r.code === 'slots-free');
    expect(finished.slice(0, slotsFree).map((r) => r.code)).toEqual(Array(busy.length).fill('busy'));
  });

  it('holds at most one hash slot at a time', async () => {
    let maxRunning = 0;
    const sampler = setInterval(() => (maxRunning = Math.max(maxRunning, hashLoad().running)), 1);
    const answers = await Promise.all(Array.from({ length: 8 }, (_, i) => login('203.0.113.31', `flood-b-${i}@example.test`, 'not-the-password')));
    clearInterval(sampler);
    expect(answers.filter((r) => r.status === 401)).toHaveLength(1 + SIGN_IN_QUEUE_PER_ADDRESS);
    expect(maxRunning).toBe(1);
  });

  it('leaves a hash slot for everyone else while three addresses flood', async () => {
    let maxRunning = 0;
    const sampler = setInterval(() => (maxRunning = Math.max(maxRunning, hashLoad().running)), 1);
    const floods = ['203.0.113.41', '203.0.113.42', '203.0.113.43'].flatMap((from) => Array.from({ length: 4 }, (_, i) => login(from, `flood-${from}-${i}@example.test`, 'not-the-password')));
    const owner = login('198.51.100.9', 'specialist@fieldfile.test', TEST_PASSWORD);
    const [answers, ownerAnswer] = await Promise.all([Promise.all(floods), owner]);
    clearInterval(sampler);
    expect(ownerAnswer.status).toBe(200);
    expect(answers.every((r) => r.status === 401 || (r.status === 429 && r.body.error.code === 'busy'))).toBe(true);
    expect(maxRunning).toBeLessThanOrEqual(HASH_CONCURRENCY);
    expect(hashLoad()).toEqual({ running: 0, waiting: 0 });
  });
});
