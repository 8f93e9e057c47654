/**
 * Property-based fuzzing of every JSON route (fast-check, fixed seed): random and half-valid
 * bodies (query strings for GET routes) against the demo data, as a caller who passes the role
 * check. Every answer must be below 500, carry no stack trace, and a refused payload (4xx) must
 * leave the stored data exactly as it was.
 *
 * Routes come from Express's route table, as in the role matrix; each calculation is its own
 * target (POST /api/calc/:name × every registered name), with bodies generated half from the
 * calculation's own published input schema (so they reach the engine) and half at random.
 *
 * Change detection: temporary triggers count every INSERT, UPDATE and DELETE on every table of
 * the app's own connection, except `sessions` (every request rolls its expiry) and
 * `mail_messages` (the mail catcher stores mail asynchronously, after an accepted request).
 * Per route, a checksum of every table's rows is also compared when all its payloads were refused.
 */
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_DOCK_DEVICE } from '../../seeds/demo-filing';
import { listCalculations } from '../../calc/registry';
import { apiRouteTable } from './support/route-table';
import { createTestApp, seedOtherOrganisation, seedUsers, signIn, type TestApp } from './support/test-app';

/** Fixed: route i runs with seed SEED + i, so a failure reproduces and routes get different payloads. */
const SEED = 20_261_205;
/** Payloads per route; a calculation gets the same. About 70 targets × 45 ≈ 3 000 payloads. */
const RUNS_PER_ROUTE = 45;
/** Routes that take no JSON (multipart uploads, the event stream) or end the caller's session. */
const SKIP = new Set(['GET /api/jobs/:id/events', 'GET /api/filings/:id/versions/:n/package', 'GET /api/filings/:id/evidence/:evidenceId/file']);
/** Where the caller should sign in as nobody: the sign-in and password routes. */
const ANONYMOUS = new Set([
  'POST /api/auth/login',
  'POST /api/auth/logout',
  'POST /api/auth/set-password',
  'POST /api/auth/accept-invitation',
  'POST /api/auth/forgot-password',
  'GET /api/auth/password-token/:token',
]);
const UNTRACKED_TABLES = new Set(['sessions', 'mail_messages', 'sqlite_sequence']);
/** What keeping a step's draft writes: the draft row and the filing's last-changed time. */
const DRAFT_WRITES = new Set(['INSERT step_drafts', 'UPDATE step_drafts', 'DELETE step_drafts', 'UPDATE filings']);
const STACK_TRACE = /\n\s+at\s|\bat [\w.<>]+ \(|node_modules|\.tsx?:\d+:\d+|\.c?js:\d+:\d+/;

const ROLES = ['specialist', 'engineer', 'approver', 'admin'] as const;
type Agent = ReturnType<typeof request.agent>;

/** Field names used across the API, so random objects often hit real fields. */
const FIELD_NAMES = [
  'email',
  'password',
  'currentPassword',
  'newPassword',
  'name',
  'roles',
  'token',
  'step',
  'data',
  'message',
  'body',
  'statement',
  'sha256',
  'model',
  'brand',
  'hvin',
  'fccId',
  'icId',
  'markets',
  'regime',
  'transmitters',
  'antennas',
  'antennaId',
  'usePositions',
  'separations',
  'separationM',
  'frequencyHz',
  'frequenciesHz',
  'powerDbm',
  'tuneUpDbm',
  'gainDbi',
  'dutyCycle',
  'id',
  'ids',
  'measurements',
  'sarWPerKg',
  'rows',
  'modules',
  'groups',
  'members',
  'category',
  'kind',
  'value',
  'unit',
  'note',
  'from',
  'to',
];

const numbers = fc.oneof(fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(0, -0, -1, 1, 1e308, -1e308, 5e-324, 2 ** 53, 1e9, 2.4e9, 0.5, 100));
const strings = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.string({ unit: 'binary', maxLength: 10 }),
  fc.constantFrom('', ' ', '0x1', '1e3', 'NaN', '-1', 'null', '__proto__', 'constructor', '<script>', "'; drop table users; --", 'a'.repeat(5000)),
);
const leaf = fc.oneof(numbers, strings, fc.boolean(), fc.constant(null));
const { tree } = fc.letrec<{ tree: unknown }>((tie) => ({
  tree: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    leaf,
    fc.array(tie('tree'), { maxLength: 5 }),
    fc.dictionary(fc.oneof(fc.constantFrom(...FIELD_NAMES), fc.string({ maxLength: 8 })), tie('tree'), { maxKeys: 6 }),
  ),
}));
const objectOfKnownFields = fc.dictionary(fc.constantFrom(...FIELD_NAMES), tree, { minKeys: 1, maxKeys: 8 });

type JsonSchema = {
  type?: string | string[];
  enum?: unknown[];
  const?: unknown;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  prefixItems?: JsonSchema[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  maxLength?: number;
  $ref?: string;
  $defs?: Record<string, JsonSchema>;
  default?: unknown;
};

/**
 * Values that mostly fit a calculation's published input schema (JSON Schema from zod), with
 * small arrays; a value of the wrong kind now and then so refusals deep in the input happen too.
 */
function fromSchema(schema: JsonSchema, defs: Record<string, JsonSchema>, depth = 0): fc.Arbitrary<unknown> {
  if (depth > 8) return leaf;
  const wrong = (a: fc.Arbitrary<unknown>) => fc.oneof({ arbitrary: a, weight: 12 }, { arbitrary: leaf, weight: 1 });
  if (schema.$ref) return fromSchema(defs[schema.$ref.replace(/^#\/\$defs\//, '')] ?? {}, defs, depth + 1);
  if (schema.const !== undefined) return wrong(fc.constant(schema.const));
  if (schema.enum) return wrong(fc.constantFrom(...schema.enum));
  const alternatives = schema.anyOf ?? schema.oneOf;
  if (alternatives?.length) return fc.oneof(...alternatives.map((s) => fromSchema(s, defs, depth + 1)));
  if (schema.allOf?.length) return fromSchema(schema.allOf[0], defs, depth + 1);
  const type = Array.isArray(schema.type) ? schema.type[0] : schema.type;
  switch (type) {
    case 'object': {
      const props = Object.entries(schema.properties ?? {});
      const required = new Set(schema.required ?? []);
      const record: Record<string, fc.Arbitrary<unknown>> = {};
      for (const [k, s] of props) record[k] = fromSchema(s, defs, depth + 1);
      return wrong(fc.record(record, { requiredKeys: props.map(([k]) => k).filter((k) => required.has(k)) }));
    }
    case 'array': {
      if (schema.prefixItems) return wrong(fc.tuple(...schema.prefixItems.map((s) => fromSchema(s, defs, depth + 1))));
      const minLength = Math.min(schema.minItems ?? 0, 4);
      return wrong(fc.array(fromSchema(schema.items ?? {}, defs, depth + 1), { minLength, maxLength: Math.max(minLength, Math.min(schema.maxItems ?? 4, 4)) }));
    }
    case 'number':
    case 'integer': {
      const min = schema.minimum ?? schema.exclusiveMinimum ?? -1e6;
      const max = schema.maximum ?? schema.exclusiveMaximum ?? 1e6;
      const lo = Math.max(min, -1e12);
      const hi = Math.min(max, 1e12);
      const inRange = type === 'integer' ? fc.integer({ min: Math.ceil(Math.max(lo, -1e9)), max: Math.floor(Math.min(hi, 1e9)) }) : fc.double({ min: lo, max: hi, noNaN: true });
      return wrong(fc.oneof(inRange, fc.constantFrom(min, max, 0)));
    }
    case 'string':
      return wrong(fc.string({ maxLength: Math.min(schema.maxLength ?? 20, 20) }));
    case 'boolean':
      return wrong(fc.boolean());
    case 'null':
      return fc.constant(null);
    default:
      return tree;
  }
}

let t: TestApp;
let filingId: number;
const agents = new Map<string, Agent>();

/** Counts every row change on the app's connection (temporary triggers live only on it). */
function installChangeCounter(t: TestApp): string[] {
  const sqlite = t.handle.sqlite;
  sqlite.exec('CREATE TEMP TABLE fuzz_changes (id INTEGER PRIMARY KEY, change TEXT NOT NULL);');
  const tables = (sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%'").pluck().all() as string[]).filter(
    (n) => !UNTRACKED_TABLES.has(n),
  );
  for (const table of tables) {
    for (const op of ['INSERT', 'UPDATE', 'DELETE']) {
      sqlite.exec(`CREATE TEMP TRIGGER "fuzz_${table}_${op}" AFTER ${op} ON main."${table}" BEGIN INSERT INTO temp.fuzz_changes (change) VALUES ('${op} ${table}'); END;`);
    }
  }
  return tables;
}
const changeCount = () => t.handle.sqlite.prepare('SELECT count(*) FROM temp.fuzz_changes').pluck().get() as number;
/** What changed since the given count, e.g. "INSERT audit_log × 2". */
const changesSince = (count: number) => (t.handle.sqlite.prepare('SELECT change FROM temp.fuzz_changes WHERE id > ?').pluck().all(count) as string[]).join(', ');

/** A checksum of every tracked table's rows, in rowid order. */
function checksum(tables: string[]): string {
  const hash = createHash('sha256');
  for (const table of tables) {
    hash.update(table);
    for (const row of t.handle.sqlite.prepare(`SELECT * FROM "${table}"`).raw().iterate())
      hash.update(JSON.stringify(row, (_k, v) => (Buffer.isBuffer(v) ? v.toString('hex') : typeof v === 'bigint' ? String(v) : v)));
  }
  return hash.digest('hex');
}

let tables: string[] = [];
const caller = new Map<string, Agent>();
const paramsFor = (): Record<string, string | number> => ({ id: filingId, step: 'radios', token: 'no-such-token', evidenceId: 999_999, threadId: 999_999, number: 1, n: 1, name: 'fcc-sar-exemption' });

function send(agent: Agent, method: string, url: string, payload: unknown) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  if (method === 'GET') {
    const query =
      payload && typeof payload === 'object' && !Array.isArray(payload) ? Object.fromEntries(Object.entries(payload).map(([k, v]) => [k, typeof v === 'string' ? v : JSON.stringify(v)])) : {};
    return agent.get(url).query(query);
  }
  // Raw JSON text, so top-level strings, numbers and null are sent as they are.
  return agent[m](url)
    .set('Content-Type', 'application/json')
    .send(JSON.stringify(payload) ?? 'null');
}

const targets: { key: string; method: string; url: string; arbitrary: fc.Arbitrary<unknown> }[] = [];

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  await seedOtherOrganisation(t);
  agents.set('anon', request.agent(t.app));
  for (const role of ROLES) agents.set(role, await signIn(t, `${role}@fieldfile.test`));
  const filings = (await agents.get('specialist')!.get('/api/filings')).body.filings as { id: number; device: { model: string } }[];
  filingId = filings.find((f) => f.device.model === DEMO_DOCK_DEVICE.model)!.id;
  const params = paramsFor();

  const anyPayload = fc.oneof({ arbitrary: objectOfKnownFields, weight: 3 }, { arbitrary: tree, weight: 2 });
  for (const key of apiRouteTable(t.app)) {
    if (SKIP.has(key)) continue;
    const [method, pattern] = key.split(' ');
    if (pattern === '/api/calc/:name') {
      for (const c of listCalculations()) {
        const schema = c.inputSchema as JsonSchema;
        const arbitrary = fc.oneof({ arbitrary: fromSchema(schema, schema.$defs ?? {}), weight: 3 }, { arbitrary: anyPayload, weight: 1 });
        targets.push({ key: `POST /api/calc/${c.name}`, method, url: `/api/calc/${c.name}`, arbitrary });
      }
      continue;
    }
    const url = pattern.replace(/:(\w+)/g, (_m, name: string) => encodeURIComponent(String(params[name])));
    targets.push({ key, method, url, arbitrary: anyPayload });
  }
  // A package build goes on in the background after its 202: fuzz it last, so its writes are not taken for another route's.
  targets.sort((a, b) => Number(a.key.endsWith('/package')) - Number(b.key.endsWith('/package')));
  // The caller: nobody for the sign-in routes; otherwise the first role the route's role check lets through.
  for (const target of targets) {
    if (ANONYMOUS.has(target.key)) {
      caller.set(target.key, agents.get('anon')!);
      continue;
    }
    let chosen = agents.get('specialist')!;
    for (const role of ROLES) {
      const res = await send(agents.get(role)!, target.method, target.url, target.method === 'GET' ? {} : { fuzzProbe: true });
      if (res.status !== 401 && res.status !== 403) {
        chosen = agents.get(role)!;
        break;
      }
    }
    caller.set(target.key, chosen);
  }
  await jobsSettled();
  tables = installChangeCounter(t);
}, 180_000);

/** Waits until no background job (a package build queued by signing or by a probe) is still writing. */
async function jobsSettled() {
  for (let waited = 0; waited < 120_000; waited += 200) {
    if (t.handle.sqlite.prepare("SELECT count(*) FROM jobs WHERE state IN ('queued', 'running')").pluck().get() === 0) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('background jobs did not finish within 2 min');
}
afterAll(() => t?.close());

describe('fuzzing every JSON route', () => {
  it('covers every API route of the route table (apart from the listed non-JSON ones)', () => {
    const routes = apiRouteTable(t.app).filter((r) => !SKIP.has(r));
    const covered = new Set(targets.map((x) => (x.key.startsWith('POST /api/calc/') ? 'POST /api/calc/:name' : x.key)));
    expect(routes.filter((r) => !covered.has(r))).toEqual([]);
    expect(targets.filter((x) => x.key.startsWith('POST /api/calc/')).length).toBe(listCalculations().length);
  });

  it('answers every payload below 500, without a stack trace, and a refused one changes nothing', async () => {
    const problems: string[] = [];
    let payloads = 0;
    for (const [i, target] of targets.entries()) {
      const agent = caller.get(target.key)!;
      const before = checksum(tables);
      let accepted = 0;
      await fc
        .assert(
          fc.asyncProperty(target.arbitrary, async (payload) => {
            payloads++;
            const changesBefore = changeCount();
            const res = await send(agent, target.method, target.url, payload);
            const text = res.text ?? '';
            const shown = `${target.key} ${JSON.stringify(payload)?.slice(0, 300)} → ${res.status} ${text.slice(0, 300)}`;
            if (res.status >= 500) throw new Error(`5xx: ${shown}`);
            if (STACK_TRACE.test(text)) throw new Error(`stack trace in the answer: ${shown}`);
            // A wizard step keeps invalid input as its draft (by design: the 422 says so and gives draftSavedAt); nothing else may change.
            const keptDraft = res.status === 422 && typeof res.body?.draftSavedAt === 'string';
            if (keptDraft) {
              const other = changesSince(changesBefore)
                .split(', ')
                .filter((c) => c && !DRAFT_WRITES.has(c));
              if (other.length) throw new Error(`a step refused as a draft changed more than its draft (${other.join(', ')}): ${shown}`);
              accepted++;
            } else if (res.status >= 400) {
              if (changeCount() !== changesBefore) throw new Error(`a refused payload changed stored data (${changesSince(changesBefore)}): ${shown}`);
              if (res.type === 'application/json' && !(typeof res.body?.error?.message === 'string' && res.body.error.message.length > 0)) throw new Error(`a refusal without a message: ${shown}`);
            } else accepted++;
          }),
          { seed: SEED + i, numRuns: RUNS_PER_ROUTE, endOnFailure: true },
        )
        .catch((e: Error) => problems.push(((e.cause as Error | undefined)?.message ?? e.message).slice(0, 800)));
      if (accepted === 0 && checksum(tables) !== before) problems.push(`${target.key}: every payload was refused, yet the stored data changed`);
    }
    expect(problems).toEqual([]);
    expect(payloads).toBeGreaterThan(2_000);
  }, 300_000);
});
