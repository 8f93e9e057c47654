/**
 * Readiness, review and signing through the API on a real SQLite file with the real SMTP
 * catcher: every allowed and refused transition per role, comment threads, the hand-off mail,
 * signing (fresh password, blocking items, separation of duties, two approvers at once), the
 * signed-version triggers tried with raw SQL, the hash stable on a second connection, verify,
 * the next version and the comparison of the two.
 */
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../db/client';
import { SIGNING_STATEMENT } from '../../constants/schemas/review';
import { versionContentSha256 } from '../../server/services/version-content';
import { makePdf } from '../../seeds/documents';
import { EXEMPT_BADGE, EXEMPT_EVIDENCE, exemptBadgeNamed } from '../fixtures/exempt-badge';
import { createTestApp, seedUsers, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let admin: Agent, specialist: Agent, engineer: Agent, approver: Agent, approver2: Agent, dual: Agent;

const exemptDevice = EXEMPT_BADGE;

async function addPerson(email: string, name: string, roles: string[]): Promise<Agent> {
  const created = await admin.post('/api/users').send({ email, name, roles });
  expect(created.status).toBe(201);
  const mail = (await admin.get('/api/outbox')).body.messages.find((m: { to: string }) => m.to.includes(email));
  const token = decodeURIComponent(/token=([^\s]+)/.exec(mail.text)![1]);
  expect((await request(t.app).post('/api/auth/set-password').send({ token, password: TEST_PASSWORD })).status).toBe(200);
  return signIn(t, email);
}

async function newExemptFiling(by: Agent = specialist, name = exemptDevice.device.name): Promise<number> {
  const res = await by.post('/api/filings/import').send(exemptBadgeNamed(name));
  expect(res.status).toBe(201);
  const id = res.body.filing.id;
  for (const [category, title, lines] of EXEMPT_EVIDENCE) {
    const up = await by
      .post(`/api/filings/${id}/evidence`)
      .field('category', category)
      .field('title', title)
      .attach('file', await makePdf([lines], title), { filename: `${category}.pdf`, contentType: 'application/pdf' });
    expect(up.status).toBe(201);
  }
  return id;
}

const mailsTo = async (email: string, subject: RegExp) =>
  ((await admin.get('/api/outbox')).body.messages as { to: string; subject: string; text: string; html: string }[]).filter(
    (m) => m.to.replace(/^.*</, '').replace(/>.*$/, '') === email && subject.test(m.subject),
  );

const sql = () => t.handle.sqlite;
const versionId = (filingId: number, number = 1) => (sql().prepare('select id from filing_versions where filing_id = ? and number = ?').get(filingId, number) as { id: number }).id;

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  // One after another: sign-in answers 429 to attempts from one address that overlap.
  admin = await signIn(t, 'admin@fieldfile.test');
  specialist = await signIn(t, 'specialist@fieldfile.test');
  engineer = await signIn(t, 'engineer@fieldfile.test');
  approver = await signIn(t, 'approver@fieldfile.test');
  approver2 = await addPerson('second.approver@fieldfile.test', 'Ines Okafor', ['approver']);
  dual = await addPerson('dual.role@fieldfile.test', 'Tomas Reyes', ['specialist', 'approver']);
}, 60_000);
afterAll(() => t.close());

describe('the readiness checklist', () => {
  it('blocks the demo tracker (a missing separation) and names the step that fixes it', async () => {
    const list = (await specialist.get('/api/filings')).body.filings;
    const tracker = list.find((f: { device: { name: string } }) => f.device.name === 'Trailhound TH-4 rugged tracker');
    const res = await engineer.get(`/api/filings/${tracker.id}/readiness`);
    expect(res.status).toBe(200);
    expect(res.body.ready).toBe(false);
    const item = res.body.items.find((i: { id: string }) => i.id === 'data-complete');
    expect(item).toMatchObject({ status: 'fail', severity: 'blocks-signing' });
    expect(item.findings).toEqual(expect.arrayContaining([expect.objectContaining({ step: 'use-positions', text: expect.stringMatching(/wrist-strap.*ANT-WLAN/) })]));
    expect(res.body.counts.blocking).toBeGreaterThan(0);
    expect(res.body.cautions.join(' ')).toMatch(/certifying body/);
  });

  it('an exempt badge is ready, and every member may read it', async () => {
    const id = await newExemptFiling();
    for (const who of [admin, specialist, engineer, approver]) {
      const res = await who.get(`/api/filings/${id}/readiness`);
      expect(res.status).toBe(200);
      expect(res.body.ready).toBe(true);
    }
    expect((await request(t.app).get(`/api/filings/${id}/readiness`)).status).toBe(401);
  });
});

describe('the review flow, role by role', () => {
  let id: number;
  let threadId: number;

  beforeAll(async () => {
    id = await newExemptFiling(specialist, 'Wren W1 badge (flow)');
  });

  it('only a specialist asks for review', async () => {
    for (const who of [admin, engineer, approver]) {
      const res = await who.post(`/api/filings/${id}/review/request`);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/specialist/);
    }
    const res = await specialist.post(`/api/filings/${id}/review/request`);
    expect(res.status).toBe(200);
    expect(res.body.review.version.state).toBe('in-review');
    expect((await specialist.post(`/api/filings/${id}/review/request`)).status).toBe(409);
  });

  it('the approvers are told by mail, with a link into the review', async () => {
    const mails = await mailsTo('approver@fieldfile.test', /Ready for your review: Wren W1 badge \(flow\)/);
    expect(mails.length).toBe(1);
    expect(mails[0].text).toContain(`http://fieldfile.test:8080/filings/${id}/review`);
    expect(mails[0].html).toContain(`href="http://fieldfile.test:8080/filings/${id}/review"`);
    expect(await mailsTo('second.approver@fieldfile.test', /Ready for your review: Wren W1 badge \(flow\)/)).toHaveLength(1);
  });

  it('data cannot change while in review', async () => {
    const res = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...exemptDevice.device, model: 'WR1-C' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/until the approver returns it/);
  });

  it('approvers start comment threads on a step and row; specialists answer; others may not', async () => {
    expect((await specialist.post(`/api/filings/${id}/review/threads`).send({ step: 'radios', body: 'x' })).status).toBe(403);
    expect((await engineer.post(`/api/filings/${id}/review/threads`).send({ step: 'radios', body: 'x' })).status).toBe(403);
    expect((await approver.post(`/api/filings/${id}/review/threads`).send({ step: 'radios', body: '   ' })).status).toBe(422);
    const res = await approver.post(`/api/filings/${id}/review/threads`).send({ step: 'radios', rowRef: 'BT-LE', body: 'Tune-up 4 dBm: the lab sheet says 4.5 dBm. Which is right?' });
    expect(res.status).toBe(201);
    threadId = res.body.thread.id;
    expect(res.body.thread).toMatchObject({ step: 'radios', rowRef: 'BT-LE', state: 'open' });
    expect((await engineer.post(`/api/filings/${id}/review/threads/${threadId}/replies`).send({ body: 'x' })).status).toBe(403);
    expect((await admin.post(`/api/filings/${id}/review/threads/${threadId}/replies`).send({ body: 'x' })).status).toBe(403);
    expect((await approver.post(`/api/filings/${id}/review/threads/999999/replies`).send({ body: 'x' })).status).toBe(404);
  });

  it('only an approver returns the version, and the specialist gets the comments by mail', async () => {
    for (const who of [admin, engineer, specialist]) expect((await who.post(`/api/filings/${id}/review/return`).send({})).status).toBe(403);
    const res = await approver.post(`/api/filings/${id}/review/return`).send({ message: 'Please settle the tune-up figure.' });
    expect(res.status).toBe(200);
    expect(res.body.review.version.state).toBe('returned');
    const [mail] = await mailsTo('specialist@fieldfile.test', /Returned with comments: Wren W1 badge \(flow\)/);
    expect(mail.text).toMatch(/Radios, row BT-LE/);
    expect(mail.text).toMatch(/the lab sheet says 4\.5 dBm/);
    expect(mail.text).toMatch(/Note: Please settle the tune-up figure\./);
    expect(mail.text).toContain(`/filings/${id}/review`);
  });

  it('a returned version cannot be signed or returned again', async () => {
    expect((await approver.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT })).status).toBe(409);
    expect((await approver.post(`/api/filings/${id}/review/return`).send({ message: 'again' })).status).toBe(409);
  });

  it('the specialist fixes, answers and resolves, then asks again', async () => {
    const radios = { antennas: exemptDevice.antennas, transmitters: [{ ...exemptDevice.transmitters[0], maxTuneUpPowerDbm: 4.5 }] };
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(radios)).status).toBe(200);
    expect((await specialist.post(`/api/filings/${id}/review/threads/${threadId}/replies`).send({ body: '4.5 dBm is right; Radios now says so.' })).status).toBe(201);
    expect((await approver.post(`/api/filings/${id}/review/threads/${threadId}/resolve`)).status).toBe(403);
    const resolved = await specialist.post(`/api/filings/${id}/review/threads/${threadId}/resolve`);
    expect(resolved.body.thread.state).toBe('resolved');
    expect(resolved.body.thread.comments.map((c: { author: { name: string } }) => c.author.name)).toHaveLength(2);
    expect((await specialist.post(`/api/filings/${id}/review/request`)).body.review.version.state).toBe('in-review');
  });

  it('signing: only approvers; a wrong password is 401 and counted in the audit trail', async () => {
    for (const who of [admin, engineer, specialist]) {
      expect((await who.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT })).status).toBe(403);
    }
    for (const attempt of [1, 2]) {
      const res = await approver.post(`/api/filings/${id}/review/sign`).send({ password: 'not-my-password', statement: SIGNING_STATEMENT });
      expect(res.status).toBe(401);
      expect(res.body.error.fields.password).toMatch(/not right/);
      const timeline = (await admin.get(`/api/filings/${id}/timeline`)).body.entries;
      expect(timeline[0]).toMatchObject({ action: 'version.sign-refused', details: { attempt, reason: 'wrong password' } });
    }
    expect((await approver.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: 'I sign whatever.' })).status).toBe(422);
    expect((await specialist.get(`/api/filings/${id}/review`)).body.review.version.state).toBe('in-review');
  });

  it('two approvers signing at once give one signature', async () => {
    const body = { password: TEST_PASSWORD, statement: SIGNING_STATEMENT };
    const [a, b] = await Promise.all([approver.post(`/api/filings/${id}/review/sign`).send(body), approver2.post(`/api/filings/${id}/review/sign`).send(body)]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const count = sql().prepare('select count(*) as n from version_signatures where version_id = ?').get(versionId(id)) as { n: number };
    expect(count.n).toBe(1);
    const review = (await engineer.get(`/api/filings/${id}/review`)).body.review;
    expect(review.version.state).toBe('signed');
    expect(review.version.signature).toMatchObject({ statement: SIGNING_STATEMENT, contentFormat: 'fieldfile.version-content/1', signer: { role: 'approver' } });
    expect(review.version.signature.contentSha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('the filing’s people are told it is signed', async () => {
    const [mail] = await mailsTo('specialist@fieldfile.test', /Signed: Wren W1 badge \(flow\), version 1/);
    expect(mail.text).toMatch(/SHA-256 [0-9a-f]{64}/);
    expect(mail.text).toContain(`/filings/${id}/review`);
  });

  it('any write to the signed version through the API is refused and nothing changes', async () => {
    const before = (await specialist.get(`/api/filings/${id}`)).body.filing.data;
    const res = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...exemptDevice.device, model: 'WR1-Z' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/signed and frozen. Start version 2/);
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send({ antennas: [], transmitters: [] })).status).toBe(409);
    expect((await approver.post(`/api/filings/${id}/review/threads`).send({ step: 'radios', body: 'late' })).status).toBe(409);
    expect((await specialist.post(`/api/filings/${id}/review/threads/${threadId}/reopen`)).status).toBe(409);
    expect((await specialist.get(`/api/filings/${id}`)).body.filing.data).toEqual(before);
    // Reading the screening of a signed version never stores anything new.
    const n = () => (sql().prepare('select count(*) as n from screening_results where version_id = ?').get(versionId(id)) as { n: number }).n;
    const stored = n();
    expect((await specialist.get(`/api/filings/${id}/screening`)).status).toBe(200);
    expect(n()).toBe(stored);
  });

  it('the database itself refuses UPDATE, DELETE and INSERT on the signed version’s rows (raw SQL)', () => {
    const v = versionId(id);
    const refused = (statement: string, ...params: unknown[]) =>
      expect(() =>
        sql()
          .prepare(statement)
          .run(...params),
      ).toThrow(/signed version is frozen/);
    refused('update transmitters set max_tune_up_power_dbm = 10 where version_id = ?', v);
    refused('delete from transmitters where version_id = ?', v);
    refused('update antennas set gain_dbi = 9 where version_id = ?', v);
    refused('delete from antennas where version_id = ?', v);
    refused('insert into antennas (version_id, key, gain_dbi, location, sort_order) values (?, ?, 0, ?, 9)', v, 'ANT-X', '');
    refused('update use_position_separations set separation_m = 0.5 where use_position_id in (select id from use_positions where version_id = ?)', v);
    refused('delete from use_positions where version_id = ?', v);
    refused('update market_selections set tier = ? where version_id = ?', 'occupational', v);
    refused('delete from screening_results where version_id = ?', v);
    refused('insert into step_drafts (version_id, step, data, updated_at) values (?, ?, ?, ?)', v, 'device', '{}', 'now');
    refused('update devices set model = ? where id = (select device_id from filing_versions where id = ?)', 'HACK', v);
    refused('update filing_versions set state = ? where id = ?', 'draft', v);
    refused('delete from filing_versions where id = ?', v);
    refused('update version_signatures set content_sha256 = ? where version_id = ?', 'x', v);
    refused('delete from version_signatures where version_id = ?', v);
    refused('update review_comments set body = ? where thread_id in (select id from review_threads where version_id = ?)', 'rewritten', v);
    refused('delete from review_threads where version_id = ?', v);
    // Moving another version's row into the signed version is refused too.
    refused('update antennas set version_id = ? where version_id = (select id from filing_versions where state = ? limit 1)', v, 'draft');
  });

  it('the signed hash is the same on a fresh connection to the file, and verify says it matches', async () => {
    const signed = (await approver.get(`/api/filings/${id}/review`)).body.review.version.signature.contentSha256;
    const again = openDatabase(path.join(t.config.dataDir, 'fieldfile.db'));
    try {
      expect(versionContentSha256(again.db, versionId(id))).toBe(signed);
    } finally {
      again.sqlite.close();
    }
    const res = await admin.post(`/api/filings/${id}/versions/1/verify`);
    expect(res.status).toBe(200);
    expect(res.body.verification).toMatchObject({ version: 1, matches: true, signedSha256: signed, currentSha256: signed });
    expect((await admin.get(`/api/filings/${id}/timeline`)).body.entries[0]).toMatchObject({ action: 'version.verified', details: { matches: true } });
  });

  it('editing a signed filing starts version 2 as a copy; compare shows the change and the results it moved', async () => {
    expect((await engineer.post(`/api/filings/${id}/versions`)).status).toBe(403);
    expect((await approver.post(`/api/filings/${id}/versions`)).status).toBe(403);
    const res = await specialist.post(`/api/filings/${id}/versions`);
    expect(res.status).toBe(201);
    expect(res.body.version).toBe(2);
    const v2 = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(v2.version).toMatchObject({ number: 2, state: 'draft' });
    expect(v2.editable).toBe(true);
    // An unchanged copy compares equal: the copy's rows have new row ids, which are not changes.
    const same = (await engineer.get(`/api/filings/${id}/compare?from=1&to=2`)).body.comparison;
    expect(same.fields).toEqual([]);
    expect(same.impact).toEqual({ screening: [], checklist: [], markets: [], lab: [] });
    // The copy: same data as version 1.
    const usePositions = {
      usePositions: [
        { id: 'lanyard', kind: 'body-worn', separations: [{ antennaId: 'ANT-BT', separationM: 0.005 }] },
        { id: 'wrist', kind: 'extremity', separations: [{ antennaId: 'ANT-BT', separationM: 0 }] },
      ],
    };
    const radios = { antennas: exemptDevice.antennas, transmitters: [{ ...exemptDevice.transmitters[0], maxTuneUpPowerDbm: 20, dutyCycle: 1 }] };
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(radios)).status).toBe(200);
    expect((await specialist.put(`/api/filings/${id}/steps/use-positions`).send(usePositions)).status).toBe(200);
    expect((await specialist.put(`/api/filings/${id}/steps/device`).send({ ...exemptDevice.device, firmwareVersion: '1.3.0' })).status).toBe(200);

    // Version 1 is untouched (its own device row, its own radios), and still verifies.
    expect((await admin.post(`/api/filings/${id}/versions/1/verify`)).body.verification.matches).toBe(true);

    const cmp = await engineer.get(`/api/filings/${id}/compare?from=1&to=2`);
    expect(cmp.status).toBe(200);
    const c = cmp.body.comparison;
    expect(c.fields).toEqual(
      expect.arrayContaining([
        { step: 'radios', label: 'Transmitter BT-LE · maximum tune-up power', before: '4.5 dBm', after: '20 dBm' },
        { step: 'device', label: 'Device · firmware version', before: '1.2.0', after: '1.3.0' },
        { step: 'use-positions', label: 'Use position wrist · kind', before: null, after: 'extremity' },
      ]),
    );
    // 100 mW at 0 mm: the FCC exemption is lost on the body; the new wrist rows appear.
    expect(c.impact.screening.some((m: { usePositionId: string; before: unknown; after: unknown }) => m.usePositionId === 'wrist' && m.before === null && m.after)).toBe(true);
    const lanyardFcc = c.impact.screening.find((m: { usePositionId: string; regime: string }) => m.usePositionId === 'lanyard' && m.regime === 'fcc');
    expect(lanyardFcc.before.result).toBe('exempt');
    expect(lanyardFcc.after.marginDb).toBeLessThan(lanyardFcc.before.marginDb);
    expect(c.impact.markets.map((m: { regime: string }) => m.regime)).toEqual(expect.arrayContaining(['fcc', 'eu']));
    expect(c.cautions.join(' ')).toMatch(/certifying body/);
    expect((await engineer.get(`/api/filings/${id}/compare?from=1&to=9`)).status).toBe(404);
  });

  it('the timeline lists every state change, comment, signature and verification', async () => {
    const actions = (await engineer.get(`/api/filings/${id}/timeline`)).body.entries.map((e: { action: string }) => e.action);
    for (const a of [
      'version.review-requested',
      'review.comment',
      'version.returned',
      'review.reply',
      'review.resolve',
      'version.sign-refused',
      'version.signed',
      'version.verified',
      'version.started',
    ]) {
      expect(actions).toContain(a);
    }
  });
});

describe('signing guards', () => {
  it('an approver who changed the version cannot sign it (separation of duties)', async () => {
    const id = await newExemptFiling(dual, 'Wren W1 badge (dual)');
    expect((await dual.post(`/api/filings/${id}/review/request`)).status).toBe(200);
    const review = (await dual.get(`/api/filings/${id}/review`)).body.review;
    expect(review.can.sign).toMatchObject({ allowed: false, reason: expect.stringMatching(/another approver/) });
    const res = await dual.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/separation of duties/);
    expect((await approver.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT })).status).toBe(200);
  });

  it('asking for review and signing are refused (409) while a blocking item stands, naming it', async () => {
    const list = (await specialist.get('/api/filings')).body.filings;
    const tracker = list.find((f: { device: { name: string } }) => f.device.name === 'Trailhound TH-4 rugged tracker');
    const asked = await specialist.post(`/api/filings/${tracker.id}/review/request`);
    expect(asked.status).toBe(409);
    expect(asked.body.error.code).toBe('not_ready');
    expect(asked.body.error.fields['data-complete']).toMatch(/complete and saved/);

    // In review, then input with errors arrives: signing names the item.
    const id = await newExemptFiling(specialist, 'Wren W1 badge (blocked)');
    expect((await specialist.post(`/api/filings/${id}/review/request`)).status).toBe(200);
    sql().prepare('insert into step_drafts (version_id, step, data, updated_at) values (?, ?, ?, ?)').run(versionId(id), 'radios', '{"antennas":"?"}', new Date().toISOString());
    const res = await approver.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Radios, use positions and markets are complete and saved/);
    expect(Object.keys(res.body.error.fields)).toEqual(['data-complete']);
    expect((await approver.get(`/api/filings/${id}/review`)).body.review.version.state).toBe('in-review');
  });

  it('returning needs a comment or a note', async () => {
    const id = await newExemptFiling(specialist, 'Wren W1 badge (return)');
    await specialist.post(`/api/filings/${id}/review/request`);
    const res = await approver.post(`/api/filings/${id}/review/return`).send({});
    expect(res.status).toBe(422);
    expect(res.body.error.fields.message).toMatch(/what needs changing/);
  });

  it('a changed row shows in verify when the guard is taken away (the hash catches what the triggers would refuse)', async () => {
    const id = await newExemptFiling(specialist, 'Wren W1 badge (tamper)');
    await specialist.post(`/api/filings/${id}/review/request`);
    expect((await approver.post(`/api/filings/${id}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT })).status).toBe(200);
    const trigger = sql().prepare("select sql from sqlite_master where type = 'trigger' and name = 'transmitters_frozen_update'").get() as { sql: string };
    sql().exec('drop trigger transmitters_frozen_update');
    try {
      sql().prepare('update transmitters set max_tune_up_power_dbm = 3 where version_id = ?').run(versionId(id));
    } finally {
      sql().exec(trigger.sql);
    }
    const res = await approver.post(`/api/filings/${id}/versions/1/verify`);
    expect(res.body.verification.matches).toBe(false);
    expect(res.body.verification.currentSha256).not.toBe(res.body.verification.signedSha256);
  });
});
