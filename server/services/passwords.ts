/**
 * Password hashing with node:crypto scrypt (memory-hard, RFC 7914) at the OWASP Password Storage
 * Cheat Sheet's minimum cost: N = 2^17, r = 8, p = 1 (128 MiB, about 0.5 s on this machine).
 * N, r and p are stored with each hash so the cost can be raised later without invalidating
 * existing hashes.
 *
 * At most HASH_CONCURRENCY hashes run at once, whoever asks (sign-in, set or change password, the
 * approver's signature): scrypt runs on libuv's thread pool (4 threads by default), which file
 * reads, uploads and DNS share, so a flood of sign-ins must not take every thread. The rest wait
 * in line; the sign-in guard (server/auth/sign-in-guard.ts) keeps that line short.
 */
import { randomBytes, scrypt as scryptCb, timingSafeEqual, type ScryptOptions } from 'node:crypto';
import { normalisePassword } from '../../constants/schemas/password-policy';

const KEY_LENGTH = 32;
const DEFAULT_COST = { N: 2 ** 17, r: 8, p: 1 };
let cost = DEFAULT_COST;

/**
 * Tests run with a cheaper N (FIELDFILE_SCRYPT_LOG2N, see server/env.ts) so that a suite full of
 * sign-ins does not starve a shared machine; production keeps the default. Existing hashes carry
 * their own cost and verify either way.
 */
export function setPasswordHashCost(log2N: number): void {
  cost = { ...DEFAULT_COST, N: 2 ** log2N };
}

/** Hashes running at once (half of libuv's default pool of 4). */
export const HASH_CONCURRENCY = 2;
let running = 0;
const waiting: (() => void)[] = [];

async function withHashSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= HASH_CONCURRENCY) await new Promise<void>((resolve) => waiting.push(resolve));
  else running += 1;
  try {
    return await work();
  } finally {
    const next = waiting.shift();
    // The slot passes straight to the next in line, or is given back.
    if (next) next();
    else running -= 1;
  }
}

/** How many hashes are running and waiting (for tests and the bench). */
export const hashLoad = () => ({ running, waiting: waiting.length });

function scrypt(password: string, salt: Buffer, keylen: number, options: ScryptOptions): Promise<Buffer> {
  return withHashSlot(
    () =>
      new Promise((resolve, reject) => {
        scryptCb(password, salt, keylen, options, (err, key) => (err ? reject(err) : resolve(key)));
      }),
  );
}

const maxmem = (N: number, r: number) => 128 * N * r * 2;

/** Hashes the password's NFKC form (constants/schemas/password-policy.ts says why). */
export async function hashPassword(password: string): Promise<string> {
  const { N, r, p } = cost;
  const salt = randomBytes(16);
  const key = await scrypt(normalisePassword(password), salt, KEY_LENGTH, { N, r, p, maxmem: maxmem(N, r) });
  return `scrypt$${N}$${r}$${p}$${salt.toString('base64')}$${key.toString('base64')}`;
}

async function matchesHash(password: string, stored: string): Promise<boolean> {
  const parts = stored.split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return false;
  const [N, r, p] = parts.slice(1, 4).map(Number);
  const salt = Buffer.from(parts[4], 'base64');
  const expected = Buffer.from(parts[5], 'base64');
  const key = await scrypt(password, salt, expected.length, { N, r, p, maxmem: maxmem(N, r) });
  return key.length === expected.length && timingSafeEqual(key, expected);
}

/**
 * Checks the password's NFKC form against the hash. A password that NFKC changes is also tried
 * as typed, for hashes made before passwords were normalised (one more hash, and only for
 * passwords with compatibility characters in them).
 */
export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const normalised = normalisePassword(password);
  if (await matchesHash(normalised, stored)) return true;
  return normalised !== password && (await matchesHash(password, stored));
}

/** A hash of a random password, verified against when the e-mail is unknown so that timing
 * does not reveal which part of a sign-in was wrong. */
let decoyHash: Promise<string> | undefined;
export function decoyPasswordHash(): Promise<string> {
  decoyHash ??= hashPassword(randomBytes(16).toString('hex'));
  return decoyHash;
}
