/**
 * The admin's activity view: GET /api/audit filtered by filing, person and kind (alone and
 * together), on a real SQLite file. Entries about a filing's evidence count as the filing's. A
 * filter that is not well-formed is a 400 saying which; one naming a filing or person the
 * organisation does not have is a 422 (the same words whether it exists elsewhere or not). Only
 * admins read, and only their own organisation's entries.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AUDIT_KINDS, auditKindOf } from '../../constants/schemas/audit';
import { makePdf } from '../../seeds/documents';
import { EXEMPT_BADGE, exemptBadgeNamed } from '../fixtures/exempt-badge';
import { createTestApp, OTHER_ORG, seedOtherOrganisation, seedUsers, signIn, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let admin: Agent, specialist: Agent, engineer: Agent, otherAdmin: Agent;
let badge: number, gateway: number, otherFiling: number;
let specialistId: number, engineerId: number;

interface Entry {
  id: number;
  action: string;
  actorName: string | null;
  kind: string | null;
  filingId: number | null;
  targetType: string | null;
  details: Record<string, unknown> | null;
}
const list = async (query: Record<string, string | number> = {}, who: Agent = admin) => {
  const res = await who.get('/api/audit').query(query);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.entries as Entry[];
};

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  await seedOtherOrganisation(t);
  [admin, specialist, engineer, otherAdmin] = await Promise.all([
    signIn(t, 'admin@fieldfile.test'),
    signIn(t, 'specialist@fieldfile.test'),
    signIn(t, 'engineer@fieldfile.test'),
    signIn(t, OTHER_ORG.admin.email),
  ]);
  const users = (await admin.get('/api/users')).body.users as { id: number; email: string }[];
  specialistId = users.find((u) => u.email === 'specialist@fieldfile.test')!.id;
  engineerId = users.find((u) => u.email === 'engineer@fieldfile.test')!.id;
  // Two filings by the specialist; the engineer files evidence on the first one.
  badge = (await specialist.post('/api/filings/import').send(exemptBadgeNamed('Audit badge'))).body.filing.id;
  gateway = (await specialist.post('/api/filings/import').send(exemptBadgeNamed('Audit gateway'))).body.filing.id;
  const filed = await engineer
    .post(`/api/filings/${badge}/evidence`)
    .field('category', 'tune-up-table')
    .attach('file', await makePdf([['Tune-up table', 'Bluetooth LE: 4.0 dBm']]), { filename: 'tune-up.pdf', contentType: 'application/pdf' });
  expect(filed.status).toBe(201);
  const radios = { antennas: EXEMPT_BADGE.antennas, transmitters: [{ ...EXEMPT_BADGE.transmitters[0], maxTuneUpPowerDbm: 5 }] };
  expect((await specialist.put(`/api/filings/${gateway}/steps/radios`).send(radios)).status).toBe(200);
  const otherSpecialist = await signIn(t, OTHER_ORG.specialist.email);
  otherFiling = (await otherSpecialist.post('/api/filings/import').send(exemptBadgeNamed('Elsewhere'))).body.filing.id;
}, 60_000);
afterAll(() => t.close());

describe('filters', () => {
  it('without filters lists every entry of the organisation, newest first, each with its kind and filing', async () => {
    const all = await list();
    expect(all.length).toBeGreaterThan(5);
    expect(all.map((e) => e.id)).toEqual([...all.map((e) => e.id)].sort((a, b) => b - a));
    const upload = all.find((e) => e.action === 'evidence.upload' || (e.targetType === 'evidence' && e.details?.filingId === badge))!;
    expect(upload).toMatchObject({ kind: 'evidence', filingId: badge });
    expect(all.find((e) => e.action === 'filing.import')).toMatchObject({ kind: 'filing-data' });
    expect(all.some((e) => e.details && JSON.stringify(e.details).includes('Elsewhere'))).toBe(false);
  });

  it('by filing: the filing’s own entries and its evidence’s, nothing of another filing', async () => {
    const entries = await list({ filing: badge });
    expect(entries.length).toBeGreaterThanOrEqual(2);
    expect(entries.every((e) => e.filingId === badge)).toBe(true);
    expect(entries.map((e) => e.kind)).toEqual(expect.arrayContaining(['filing-data', 'evidence']));
    const other = await list({ filing: gateway });
    expect(other.map((e) => e.action)).toEqual(['filing.step-save', 'filing.import']);
  });

  it('by person: only what that person did', async () => {
    const byEngineer = await list({ person: engineerId });
    expect(byEngineer.length).toBeGreaterThan(0);
    expect(new Set(byEngineer.map((e) => e.actorName))).toEqual(new Set(['Priya Raman']));
    const bySpecialist = await list({ person: specialistId });
    expect(bySpecialist.some((e) => e.action === 'filing.import')).toBe(true);
    expect(bySpecialist.some((e) => e.kind === 'evidence')).toBe(false);
  });

  it('by kind: only the actions of that kind (sign-ins are auth.*, filing data filing.*)', async () => {
    const signIns = await list({ kind: 'sign-in' });
    expect(signIns.length).toBeGreaterThan(0);
    expect(signIns.every((e) => e.action.startsWith('auth.'))).toBe(true);
    const data = await list({ kind: 'filing-data' });
    expect(data.every((e) => e.action.startsWith('filing.'))).toBe(true);
    expect(await list({ kind: 'signature' })).toEqual([]);
  });

  it('combined: filing and person and kind narrow together', async () => {
    expect((await list({ filing: badge, person: engineerId, kind: 'evidence' })).map((e) => e.kind)).toEqual(['evidence']);
    expect(await list({ filing: badge, person: engineerId, kind: 'filing-data' })).toEqual([]);
    expect(await list({ filing: gateway, person: engineerId })).toEqual([]);
  });

  it('an empty value is no filter (a picker left on “all”)', async () => {
    expect((await list({ filing: '', person: '', kind: '' })).length).toBe((await list()).length);
  });

  it('every kind names its actions, and every action the app records has a kind', () => {
    for (const action of [
      'auth.sign-in',
      'user.invite',
      'filing.step-save',
      'lab.measurements.import',
      'evidence.upload',
      'version.review-requested',
      'review.comment',
      'version.signed',
      'version.sign-refused',
      'version.verified',
      'package.build',
    ])
      expect(auditKindOf(action), action).not.toBeNull();
    expect(
      new Set(['auth.sign-in', 'user.invite', 'filing.create', 'lab.x', 'evidence.x', 'version.returned', 'review.reply', 'version.signed', 'version.verified', 'package.download'].map(auditKindOf)),
    ).toEqual(new Set(AUDIT_KINDS));
    // A prefix is a whole word: "users.x" is not a people entry.
    expect(auditKindOf('users.x')).toBeNull();
  });
});

describe('bad filters', () => {
  it.each([
    [{ filing: 'abc' }, 'filing', /plain positive number/],
    [{ filing: '0' }, 'filing', /plain positive number/],
    [{ person: '1.5' }, 'person', /plain positive number/],
    [{ kind: 'everything' }, 'kind', /must be one of: sign-in, people/],
    [{ since: '2026-01-01' }, 'since', /Unknown field "since"/],
  ])('%o is a 400 naming the filter', async (query, field, message) => {
    const res = await admin.get('/api/audit').query(query);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toMatch(message);
    expect(res.body.error.message).toMatch(/The filters are not valid/);
  });

  it('a filter given twice is a 400', async () => {
    const res = await admin.get(`/api/audit?filing=${badge}&filing=${gateway}`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.filing).toMatch(/Give one filing id/);
  });

  it('a filing or person of another organisation (or none) is a 422 that reveals nothing', async () => {
    const other = await admin.get('/api/audit').query({ filing: otherFiling });
    expect(other.status).toBe(422);
    expect(other.body.error.fields.filing).toBe(`Your organisation has no filing ${otherFiling}.`);
    const none = await admin.get('/api/audit').query({ filing: 999999 });
    expect(none.body.error.fields.filing).toBe('Your organisation has no filing 999999.');
    const person = await otherAdmin.get('/api/audit').query({ person: engineerId });
    expect(person.status).toBe(422);
    expect(person.body.error.fields.person).toBe(`Your organisation has no person ${engineerId}.`);
  });
});

describe('who reads', () => {
  it('only admins, each of their own organisation', async () => {
    for (const who of [specialist, engineer]) expect((await who.get('/api/audit').query({ kind: 'sign-in' })).status).toBe(403);
    const theirs = await list({ kind: 'filing-data' }, otherAdmin);
    expect(theirs.map((e) => e.filingId)).toContain(otherFiling);
    expect(theirs.some((e) => e.filingId === badge || e.filingId === gateway)).toBe(false);
    expect((await list({ kind: 'filing-data' })).some((e) => e.filingId === otherFiling)).toBe(false);
  });
});
