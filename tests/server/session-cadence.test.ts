/**
 * Session cadence (server/auth/session-cadence.ts): a read does not write the session; the expiry
 * moves at most every 5 minutes; a session ends 12 h after its last extension (so between
 * 11 h 55 min and 12 h after its last request) and 7 days after sign-in however busy.
 * The app's clock is moved with fake Dates; the store compares expiry with the same clock, so the
 * server itself decides (each request sends the cookie by hand: no client-side expiry in the way).
 */
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { SESSION_ABSOLUTE_MS, SESSION_EXTEND_EVERY_MS, SESSION_IDLE_MS } from '../../server/auth/session-cadence';
import { createTestApp, seedUsers, TEST_PASSWORD, type TestApp } from './support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
});
afterAll(() => t.close());
afterEach(() => {
  vi.useRealTimers();
});

const MIN = 60 * 1000;
const T0 = Date.parse('2026-03-02T08:00:00.000Z');

/** Signs in at T0 (fake clock); the cookie to send by hand. */
async function signInAtT0(): Promise<string> {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(T0);
  const res = await request(t.app).post('/api/auth/login').send({ email: 'engineer@fieldfile.test', password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return (res.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
}

const sidOf = (cookie: string) => decodeURIComponent(cookie.split('=')[1]).slice(2).split('.')[0];
const storedRow = (cookie: string) => t.handle.sqlite.prepare('select sess, expire from sessions where sid = ?').get(sidOf(cookie)) as { sess: string; expire: string } | undefined;

async function readAt(offsetMs: number, cookie: string) {
  vi.setSystemTime(T0 + offsetMs);
  return request(t.app).get('/api/auth/me').set('Cookie', cookie);
}

const cookieExpiry = (res: request.Response) => {
  const set = res.headers['set-cookie'] as unknown as string[] | undefined;
  const match = set?.[0]?.match(/Expires=([^;]+)/);
  return match ? Date.parse(match[1]) : null;
};

describe('session cadence', () => {
  it('the constants are the documented ones: 12 h idle, moved at most every 5 min, 7 days absolute', () => {
    expect(SESSION_IDLE_MS).toBe(12 * 60 * MIN);
    expect(SESSION_EXTEND_EVERY_MS).toBe(5 * MIN);
    expect(SESSION_ABSOLUTE_MS).toBe(7 * 24 * 60 * MIN);
  });

  it('reads within 5 minutes of the last extension write nothing and send no cookie', async () => {
    const cookie = await signInAtT0();
    const atSignIn = storedRow(cookie)!;
    expect(Date.parse(atSignIn.expire)).toBe(T0 + SESSION_IDLE_MS);
    for (const offset of [0, 1 * MIN, 3 * MIN, 5 * MIN - 1]) {
      const res = await readAt(offset, cookie);
      expect(res.status).toBe(200);
      expect(res.headers['set-cookie'], `at +${offset} ms`).toBeUndefined();
      expect(storedRow(cookie)).toEqual(atSignIn);
    }
  });

  it('the first request 5 minutes or more after the last extension moves the expiry (row and cookie) to now + 12 h', async () => {
    const cookie = await signInAtT0();
    const res = await readAt(5 * MIN, cookie);
    expect(res.status).toBe(200);
    expect(cookieExpiry(res)).toBe(T0 + 5 * MIN + SESSION_IDLE_MS);
    expect(Date.parse(storedRow(cookie)!.expire)).toBe(T0 + 5 * MIN + SESSION_IDLE_MS);
    // …and the next 5 minutes are quiet again.
    const quiet = await readAt(9 * MIN, cookie);
    expect(quiet.headers['set-cookie']).toBeUndefined();
    expect(Date.parse(storedRow(cookie)!.expire)).toBe(T0 + 5 * MIN + SESSION_IDLE_MS);
  });

  it('an idle session ends 12 h after its last extension, even if its last request came later', async () => {
    const cookie = await signInAtT0();
    expect((await readAt(4 * MIN, cookie)).status).toBe(200); // not an extension
    // 11 h 56 min after the last request, 12 h after the sign-in (the last extension): ended.
    expect((await readAt(SESSION_IDLE_MS, cookie)).status).toBe(401);
  });

  it('an idle session is still there just before 12 h', async () => {
    const cookie = await signInAtT0();
    expect((await readAt(SESSION_IDLE_MS - 1, cookie)).status).toBe(200);
  });

  it('a session used every few hours lives on past 12 h from sign-in', async () => {
    const cookie = await signInAtT0();
    expect((await readAt(6 * 60 * MIN, cookie)).status).toBe(200);
    expect((await readAt(6 * 60 * MIN + SESSION_IDLE_MS - MIN, cookie)).status).toBe(200);
  });

  it('however busy, a session ends 7 days after sign-in', async () => {
    const cookie = await signInAtT0();
    let offset = 0;
    while (offset + 11 * 60 * MIN < SESSION_ABSOLUTE_MS) {
      offset += 11 * 60 * MIN;
      expect((await readAt(offset, cookie)).status, `at +${offset / 3600000} h`).toBe(200);
    }
    expect((await readAt(SESSION_ABSOLUTE_MS + 1000, cookie)).status).toBe(401);
  });

  it('/api/health needs no session and sends no cookie', async () => {
    const cookie = await signInAtT0();
    const res = await request(t.app).get('/api/health').set('Cookie', cookie);
    expect(res.status).toBe(200);
    expect(res.headers['set-cookie']).toBeUndefined();
  });
});
