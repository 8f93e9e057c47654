/**
 * The role matrix: every API route × every kind of caller, with the status each must get. The
 * routes come from the app's own route table, so adding a route without its row here fails.
 *
 * Callers: nobody signed in; the demo organisation's admin, specialist, engineer and approver;
 * and a second organisation's admin and specialist, who must not reach the first one's data
 * (404: they cannot even learn that it exists). Path parameters name the demo organisation's
 * resources. Bodies are empty unless a row gives one, so an allowed caller mostly sees the
 * validation answer (422) and nothing is changed.
 *
 * Adding a route: add its row (and `params`/`body` if the defaults below do not fit).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SIGNING_STATEMENT } from '../../constants/schemas/review';
import { DEMO_DOCK_DEVICE, DEMO_TRACKER } from '../../seeds/demo-filing';
import { apiRouteTable } from './support/route-table';
import { createTestApp, OTHER_ORG, seedOtherOrganisation, seedUsers, signIn, type TestApp } from './support/test-app';

const CALLERS = ['anon', 'admin', 'specialist', 'engineer', 'approver', 'otherAdmin', 'otherSpecialist'] as const;
type Caller = (typeof CALLERS)[number];
type Expected = Record<Caller, number>;

interface Fixture {
  filingId: number;
  /** The demo tracker (owned by the specialist): archived by the admin, then restored. */
  trackerFilingId: number;
  engineerUserId: number;
  mailId: number;
}

interface Row {
  expect: Expected;
  /** Path parameters beyond the defaults (see paramsFor). */
  params?: (fx: Fixture) => Record<string, string | number>;
  body?: unknown;
  query?: Record<string, string> | ((fx: Fixture) => Record<string, string>);
  /** Sign in afresh for this request (the route ends the session). */
  freshSession?: boolean;
}

/** Everyone, signed in or not, gets the same status. */
const everyone = (status: number): Expected => ({ anon: status, admin: status, specialist: status, engineer: status, approver: status, otherAdmin: status, otherSpecialist: status });
/** Every signed-in caller gets `status`, nobody signed in gets 401. */
const signedIn = (status: number): Expected => ({ ...everyone(status), anon: 401 });
/** The demo organisation's data: its members get `status`, the other organisation 404. */
const ownOrganisation = (status: number): Expected => ({ ...signedIn(status), otherAdmin: 404, otherSpecialist: 404 });
/** Only one role may: the others get 403 (the role check comes before any lookup). */
const onlyRole = (role: 'admin' | 'specialist', status: number, otherOrg = 403): Expected => ({
  anon: 401,
  admin: role === 'admin' ? status : 403,
  specialist: role === 'specialist' ? status : 403,
  engineer: 403,
  approver: 403,
  otherAdmin: role === 'admin' ? otherOrg : 403,
  otherSpecialist: role === 'specialist' ? otherOrg : 403,
});

/** Only the engineer may (lab data): the others get 403 before any lookup. */
const onlyEngineer = (status: number): Expected => ({ ...signedIn(403), engineer: status });
/** Engineers and specialists may (the other organisation's specialist too, up to the lookup). */
const filers = (status: number): Expected => ({ anon: 401, admin: 403, specialist: status, engineer: status, approver: 403, otherAdmin: 403, otherSpecialist: status });
/** Review actions: 403 for roles that take no part, the given status for those that do, 404 outside the organisation. */
const review = (allowed: Partial<Record<'admin' | 'specialist' | 'engineer' | 'approver', number>>): Expected => ({
  anon: 401,
  admin: 403,
  specialist: 403,
  engineer: 403,
  approver: 403,
  ...allowed,
  otherAdmin: 404,
  otherSpecialist: 404,
});

export const MATRIX: Record<string, Row> = {
  'GET /api/health': { expect: everyone(200) },
  'GET /api/schema/device.json': { expect: everyone(200) },
  'GET /api/schema/evidence-categories.json': { expect: everyone(200) },

  'POST /api/auth/login': { expect: everyone(422) },
  'POST /api/auth/logout': { expect: everyone(204), freshSession: true },
  'GET /api/auth/me': { expect: signedIn(200) },
  'GET /api/auth/password-token/:token': { expect: everyone(404) },
  'POST /api/auth/set-password': { expect: everyone(422) },
  'POST /api/auth/accept-invitation': { expect: everyone(422) },
  'POST /api/auth/forgot-password': { expect: everyone(422) },
  'POST /api/auth/change-password': { expect: signedIn(422) },

  'GET /api/users': { expect: onlyRole('admin', 200, 200) },
  'POST /api/users': { expect: onlyRole('admin', 422, 422) },
  'PATCH /api/users/:id': { expect: onlyRole('admin', 200, 404), params: (fx) => ({ id: fx.engineerUserId }), body: { roles: ['engineer'] } },
  'POST /api/users/:id/invitation': { expect: onlyRole('admin', 409, 404), params: (fx) => ({ id: fx.engineerUserId }) },
  'GET /api/outbox': { expect: onlyRole('admin', 200, 200) },
  'GET /api/outbox/:id': { expect: onlyRole('admin', 200, 404), params: (fx) => ({ id: fx.mailId }) },
  // Filtered by the demo organisation's filing: another organisation's admin is told it has no such filing (422).
  'GET /api/audit': { expect: onlyRole('admin', 200, 422), query: (fx) => ({ filing: String(fx.filingId), person: '', kind: 'filing-data' }) },

  'GET /api/calc': { expect: signedIn(200) },
  'POST /api/calc/:name': { expect: signedIn(422) },

  'GET /api/filings': { expect: signedIn(200) },
  'POST /api/filings': { expect: onlyRole('specialist', 422, 422) },
  'POST /api/filings/import': { expect: onlyRole('specialist', 422, 422) },
  'GET /api/filings/:id': { expect: ownOrganisation(200) },
  // Owner or admin, after the lookup. In caller order: the admin archives (200), then the specialist
  // (the owner) finds it already archived (409); the restore row puts it back the same way.
  'POST /api/filings/:id/archive': {
    expect: { anon: 401, admin: 200, specialist: 409, engineer: 403, approver: 403, otherAdmin: 404, otherSpecialist: 404 },
    params: (fx) => ({ id: fx.trackerFilingId }),
  },
  'POST /api/filings/:id/restore': {
    expect: { anon: 401, admin: 200, specialist: 409, engineer: 403, approver: 403, otherAdmin: 404, otherSpecialist: 404 },
    params: (fx) => ({ id: fx.trackerFilingId }),
  },
  'PUT /api/filings/:id/steps/:step': { expect: onlyRole('specialist', 422, 404) },
  'GET /api/filings/:id/device.json': { expect: ownOrganisation(200) },
  'GET /api/filings/:id/screening': { expect: ownOrganisation(200) },
  // Evidence: engineers and specialists change it, every member reads. No multipart body → 400.
  'GET /api/filings/:id/evidence': { expect: ownOrganisation(200) },
  'POST /api/filings/:id/evidence': { expect: { ...filers(400), otherSpecialist: 404 } },
  'GET /api/filings/:id/evidence/:evidenceId/file': { expect: signedIn(404) },
  'DELETE /api/filings/:id/evidence/:evidenceId': { expect: filers(404) },
  'POST /api/filings/:id/evidence/:evidenceId/findings/explain': { expect: { ...filers(422), otherSpecialist: 404 } },
  'GET /api/filings/:id/screening/depth-profile': { expect: ownOrganisation(404), query: { transmitterId: 'NO-SUCH-TX', usePositionId: 'NO-SUCH-POS' } },

  // Lab results: every member of the organisation reads; only the engineer writes (role check first).
  ...Object.fromEntries(
    ['measurements', 'liquid-checks', 'system-checks', 'instruments', 'uncertainty-budget'].flatMap((set) => [
      [`GET /api/filings/:id/${set}`, { expect: ownOrganisation(200) }],
      [`PUT /api/filings/:id/${set}`, { expect: onlyEngineer(422) }],
    ]),
  ),
  'POST /api/filings/:id/measurements/import': { expect: onlyEngineer(400) },
  'GET /api/filings/:id/lab-results': { expect: ownOrganisation(200) },
  // Co-transmission groups: every member reads; the specialist (who edits the device data) replaces them.
  'GET /api/filings/:id/co-transmission': { expect: ownOrganisation(200) },
  'PUT /api/filings/:id/co-transmission': { expect: onlyRole('specialist', 422, 404) },
  // Review and signing of the demo organisation's charging dock (a draft that is not ready):
  // the role is checked after the filing is found, so the other organisation always gets 404.
  'GET /api/filings/:id/readiness': { expect: ownOrganisation(200) },
  'GET /api/filings/:id/review': { expect: ownOrganisation(200) },
  'GET /api/filings/:id/timeline': { expect: ownOrganisation(200) },
  'GET /api/filings/:id/compare': { expect: ownOrganisation(200), query: { from: '1', to: '1' } },
  'POST /api/filings/:id/review/request': { expect: review({ specialist: 409 }) },
  'POST /api/filings/:id/review/return': { expect: review({ approver: 409 }), body: { message: 'x' } },
  'POST /api/filings/:id/review/sign': { expect: review({ approver: 409 }), body: { password: 'x', statement: SIGNING_STATEMENT } },
  'POST /api/filings/:id/review/threads': { expect: review({ approver: 409 }), body: { step: 'radios', body: 'x' } },
  'POST /api/filings/:id/review/threads/:threadId/replies': { expect: review({ specialist: 409, approver: 409 }), params: () => ({ threadId: 999999 }), body: { body: 'x' } },
  'POST /api/filings/:id/review/threads/:threadId/resolve': { expect: review({ specialist: 409 }), params: () => ({ threadId: 999999 }) },
  'POST /api/filings/:id/review/threads/:threadId/reopen': { expect: review({ specialist: 409 }), params: () => ({ threadId: 999999 }) },
  'POST /api/filings/:id/versions': { expect: review({ specialist: 409 }) },
  'POST /api/filings/:id/versions/:number/verify': { expect: ownOrganisation(409), params: () => ({ number: 1 }) },
  // Packages: version 1 of the demo filing is a draft, so its package is a DRAFT preview (no build yet
  // when the download row runs: 409 for the roles that may download it; admins hold no filing role).
  'GET /api/filings/:id/versions/:n/package/status': { expect: ownOrganisation(200), params: () => ({ n: 1 }) },
  'GET /api/filings/:id/versions/:n/package': {
    expect: { anon: 401, admin: 403, specialist: 409, engineer: 409, approver: 409, otherAdmin: 404, otherSpecialist: 404 },
    params: () => ({ n: 1 }),
  },
  'POST /api/filings/:id/versions/:n/package': {
    expect: { anon: 401, admin: 403, specialist: 202, engineer: 202, approver: 202, otherAdmin: 404, otherSpecialist: 404 },
    params: () => ({ n: 1 }),
  },
  'GET /api/jobs/:id/events': { expect: signedIn(404), params: () => ({ id: 999_999 }) },
  'POST /api/packages/verify': { expect: signedIn(422) },
};

/** Defaults for path parameters; a row's `params` overrides them. */
const paramsFor = (fx: Fixture): Record<string, string | number> => ({
  id: fx.filingId,
  step: 'device',
  name: 'fcc-sar-exemption',
  token: 'no-such-token',
  evidenceId: 999999,
});

let t: TestApp;
let fx: Fixture;
const EMAILS: Record<Exclude<Caller, 'anon'>, string> = {
  admin: 'admin@fieldfile.test',
  specialist: 'specialist@fieldfile.test',
  engineer: 'engineer@fieldfile.test',
  approver: 'approver@fieldfile.test',
  otherAdmin: OTHER_ORG.admin.email,
  otherSpecialist: OTHER_ORG.specialist.email,
};
const agents = new Map<Caller, ReturnType<typeof request.agent>>();

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  await seedOtherOrganisation(t);
  for (const caller of CALLERS) agents.set(caller, caller === 'anon' ? request.agent(t.app) : await signIn(t, EMAILS[caller]));
  const admin = agents.get('admin')!;
  const users = (await admin.get('/api/users')).body.users as { id: number; email: string }[];
  // One mail in the demo organisation's outbox, for the message route.
  await admin.post('/api/users').send({ email: 'matrix.invitee@fieldfile.test', name: 'Matrix Invitee', roles: ['engineer'] });
  // The dock: a draft that is not ready (the demo also holds filings in review and signed).
  const filings = (await agents.get('specialist')!.get('/api/filings')).body.filings as { id: number; device: { model: string } }[];
  fx = {
    filingId: filings.find((f) => f.device.model === DEMO_DOCK_DEVICE.model)!.id,
    trackerFilingId: filings.find((f) => f.device.model === DEMO_TRACKER.device.model)!.id,
    engineerUserId: users.find((u) => u.email === 'engineer@fieldfile.test')!.id,
    mailId: (await admin.get('/api/outbox')).body.messages[0].id,
  };
}, 120_000);
afterAll(() => t.close());

describe('role matrix', () => {
  it('has exactly one row for every API route', async () => {
    const routes = apiRouteTable(t.app);
    const rows = Object.keys(MATRIX).sort();
    expect(
      routes.filter((r) => !rows.includes(r)),
      'routes without a row in the role matrix',
    ).toEqual([]);
    expect(
      rows.filter((r) => !routes.includes(r)),
      'rows for routes that do not exist',
    ).toEqual([]);
  });

  it.each(Object.entries(MATRIX))(
    '%s',
    async (key, row) => {
      const [method, pattern] = key.split(' ');
      const params = { ...paramsFor(fx), ...row.params?.(fx) };
      const url = pattern.replace(/:(\w+)/g, (_m, name: string) => encodeURIComponent(String(params[name])));
      const actual: Partial<Expected> = {};
      for (const caller of CALLERS) {
        const agent = row.freshSession && caller !== 'anon' ? await signIn(t, EMAILS[caller]) : agents.get(caller)!;
        let req = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](url);
        if (row.query) req = req.query(typeof row.query === 'function' ? row.query(fx) : row.query);
        if (method !== 'GET') req = req.send((row.body ?? {}) as object);
        const res = await req;
        actual[caller] = res.status;
      }
      expect(actual).toEqual(row.expect);
    },
    60_000,
  );
});
