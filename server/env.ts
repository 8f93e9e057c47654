/**
 * The environment, parsed once. Everything has a default that runs the product on one machine
 * with local stand-ins (SQLite file, local disk, in-process SMTP catcher).
 */
import path from 'node:path';
import { z } from 'zod';
import { DEFAULT_MAX_FILE_BYTES, DEFAULT_MAX_FILING_BYTES } from '../constants/schemas/evidence';
import { PASSWORD_MIN } from '../constants/schemas/limits';

const zBool = z
  .enum(['true', 'false', '1', '0', ''])
  .optional()
  .transform((v) => v === 'true' || v === '1');

const zEnv = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  /** Loopback by default: a deployment chooses to listen wider (HOST=0.0.0.0). */
  HOST: z.string().default('127.0.0.1'),
  /**
   * Demo people and filings: "1" seeds them, "0" never; unset seeds them only on a loopback bind
   * outside production, so a server reachable from the network never has the published password.
   */
  FIELDFILE_DEMO: z.enum(['0', '1']).optional(),
  /**
   * Express "trust proxy": which proxy may tell the client's address and protocol (X-Forwarded-*).
   * "loopback" (default) trusts a proxy on this machine; a number trusts that many hops; "false"
   * none; otherwise a comma-separated list of addresses or subnets. Behind a TLS proxy this
   * makes cookies Secure.
   */
  FIELDFILE_TRUST_PROXY: z.string().default('loopback'),
  /** Holds the SQLite file, uploads and built packages. */
  FIELDFILE_DATA_DIR: z.string().default('./data'),
  /** Where the exported web app lives. */
  FIELDFILE_DIST_DIR: z.string().default('./dist'),
  /** Base URL used in e-mailed links; defaults to http://localhost:PORT. */
  FIELDFILE_PUBLIC_URL: z.string().url().optional(),
  /** Set by `npm run dev`: the Expo dev server's origin, allowed to call the API with cookies. */
  FIELDFILE_DEV_WEB_ORIGIN: z.string().url().optional(),
  FIELDFILE_SESSION_SECRET: z.string().min(16).optional(),
  /** log2 of scrypt's N for new password hashes; below 17 only for tests. */
  FIELDFILE_SCRYPT_LOG2N: z.coerce.number().int().min(10).max(20).default(17),
  /** Must meet the password policy (seeding refuses one that does not). */
  FIELDFILE_DEMO_PASSWORD: z.string().min(PASSWORD_MIN).default('fieldfile-demo-2026'),
  /** Port of the in-process SMTP catcher (used when SMTP_HOST is not set). */
  FIELDFILE_MAIL_CATCHER_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  /** Largest evidence file, bytes (default 100 MB). */
  FIELDFILE_EVIDENCE_MAX_FILE_BYTES: z.coerce.number().int().positive().default(DEFAULT_MAX_FILE_BYTES),
  /** Most evidence one filing version may hold, bytes (default 2 GB). */
  FIELDFILE_EVIDENCE_MAX_FILING_BYTES: z.coerce.number().int().positive().default(DEFAULT_MAX_FILING_BYTES),
  /**
   * Where uploaded evidence and built packages live: "local" (default) under FIELDFILE_DATA_DIR,
   * or "s3" in the bucket FIELDFILE_S3_BUCKET of an S3-compatible service (credentials from the
   * AWS SDK's usual sources: AWS_ACCESS_KEY_ID / AWS_SECRET_ACCESS_KEY, a profile, a role).
   */
  FIELDFILE_STORAGE: z.enum(['local', 's3']).default('local'),
  FIELDFILE_S3_BUCKET: z.string().min(1).optional(),
  /** Key prefix inside the bucket (e.g. "fieldfile/"); the areas go below it as uploads/ and packages/. */
  FIELDFILE_S3_PREFIX: z.string().default(''),
  FIELDFILE_S3_REGION: z.string().default('us-east-1'),
  /** The service's URL when it is not AWS itself (MinIO, Ceph, a cloud's S3 API). */
  FIELDFILE_S3_ENDPOINT: z.string().url().optional(),
  /** Bucket in the path (http://host/bucket/key), as most S3-compatible services want; on by default with an endpoint. */
  FIELDFILE_S3_FORCE_PATH_STYLE: z.enum(['true', 'false', '1', '0']).optional(),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_SECURE: zBool,
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  MAIL_FROM: z.string().default('Fieldfile <no-reply@fieldfile.test>'),
  /** A calculation through the API is stopped after this long (ms) and answers 503. */
  FIELDFILE_CALC_TIME_LIMIT_MS: z.coerce.number().int().min(100).max(600_000).default(15_000),
  /** Largest measurement spreadsheet accepted by the lab import, bytes (default 20 MB). */
  FIELDFILE_IMPORT_MAX_BYTES: z.coerce
    .number()
    .int()
    .positive()
    .default(20 * 1024 * 1024),
});

export type Env = z.infer<typeof zEnv>;

export interface Config {
  env: Env['NODE_ENV'];
  port: number;
  host: string;
  dataDir: string;
  dbFile: string;
  uploadsDir: string;
  packagesDir: string;
  distDir: string;
  publicUrl: string;
  sessionSecret?: string;
  devWebOrigin?: string;
  demoPassword: string;
  demo: { seed: boolean; reason: string };
  trustProxy: boolean | number | string;
  scryptLog2N: number;
  importMaxBytes: number;
  calcTimeLimitMs: number;
  evidence: { maxFileBytes: number; maxFilingBytes: number };
  /** Where bytes live (server/storage): local disk (uploadsDir, packagesDir) or an S3-compatible bucket. */
  storage: { kind: 'local' } | { kind: 's3'; bucket: string; prefix: string; region: string; endpoint?: string; forcePathStyle: boolean };
  mail: {
    from: string;
    catcherPort: number;
    smtp?: { host: string; port: number; secure: boolean; user?: string; pass?: string };
  };
}

export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = zEnv.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid environment:\n${lines}`);
  }
  const e = parsed.data;
  const dataDir = path.resolve(e.FIELDFILE_DATA_DIR);
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    dataDir,
    dbFile: path.join(dataDir, 'fieldfile.db'),
    uploadsDir: path.join(dataDir, 'uploads'),
    packagesDir: path.join(dataDir, 'packages'),
    distDir: path.resolve(e.FIELDFILE_DIST_DIR),
    publicUrl: (e.FIELDFILE_PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, ''),
    sessionSecret: e.FIELDFILE_SESSION_SECRET,
    devWebOrigin: e.FIELDFILE_DEV_WEB_ORIGIN,
    demoPassword: e.FIELDFILE_DEMO_PASSWORD,
    demo: demoDecision(e),
    trustProxy: parseTrustProxy(e.FIELDFILE_TRUST_PROXY),
    scryptLog2N: e.FIELDFILE_SCRYPT_LOG2N,
    importMaxBytes: e.FIELDFILE_IMPORT_MAX_BYTES,
    calcTimeLimitMs: e.FIELDFILE_CALC_TIME_LIMIT_MS,
    evidence: { maxFileBytes: e.FIELDFILE_EVIDENCE_MAX_FILE_BYTES, maxFilingBytes: e.FIELDFILE_EVIDENCE_MAX_FILING_BYTES },
    storage: storageChoice(e),
    mail: {
      from: e.MAIL_FROM,
      catcherPort: e.FIELDFILE_MAIL_CATCHER_PORT,
      smtp: e.SMTP_HOST ? { host: e.SMTP_HOST, port: e.SMTP_PORT, secure: e.SMTP_SECURE, user: e.SMTP_USER, pass: e.SMTP_PASS } : undefined,
    },
  };
}

function storageChoice(e: Env): Config['storage'] {
  if (e.FIELDFILE_STORAGE === 'local') return { kind: 'local' };
  if (!e.FIELDFILE_S3_BUCKET) throw new Error('Invalid environment:\n  FIELDFILE_S3_BUCKET: FIELDFILE_STORAGE=s3 needs the bucket name.');
  const prefix = e.FIELDFILE_S3_PREFIX && !e.FIELDFILE_S3_PREFIX.endsWith('/') ? `${e.FIELDFILE_S3_PREFIX}/` : e.FIELDFILE_S3_PREFIX;
  const pathStyle = e.FIELDFILE_S3_FORCE_PATH_STYLE;
  return {
    kind: 's3',
    bucket: e.FIELDFILE_S3_BUCKET,
    prefix,
    region: e.FIELDFILE_S3_REGION,
    endpoint: e.FIELDFILE_S3_ENDPOINT,
    forcePathStyle: pathStyle === undefined ? !!e.FIELDFILE_S3_ENDPOINT : pathStyle === 'true' || pathStyle === '1',
  };
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', '::1', 'localhost']);

/** Whether the demo data is seeded, and why (printed at start). */
function demoDecision(e: Env): { seed: boolean; reason: string } {
  if (e.FIELDFILE_DEMO === '1') return { seed: true, reason: 'FIELDFILE_DEMO=1' };
  if (e.FIELDFILE_DEMO === '0') return { seed: false, reason: 'FIELDFILE_DEMO=0' };
  if (e.NODE_ENV === 'production') return { seed: false, reason: 'NODE_ENV=production' };
  if (LOOPBACK_HOSTS.has(e.HOST) || e.HOST.startsWith('127.')) return { seed: true, reason: `loopback bind ${e.HOST}` };
  return { seed: false, reason: `HOST=${e.HOST} is reachable from the network (set FIELDFILE_DEMO=1 to seed anyway)` };
}

function parseTrustProxy(v: string): boolean | number | string {
  if (v === 'false' || v === '0') return false;
  if (v === 'true') return true;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}
