/**
 * Co-transmission groups per use position through the API: who reads and who writes, ids checked
 * against the filing, If-Match refusals that keep what is stored, a group of one position summed
 * there only (FCC KDB 447498 D01 v06 §4.3.2, from memory: the sum of the highest reported SAR of
 * the transmitters on together, per exposure condition), and groups that go with their position.
 * Also the lab tables' If-Match (a second engineer's stale save is refused).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEVICE_FILE_FORMAT } from '../../constants/schemas/device-file';
import { createTestApp, OTHER_ORG, seedOtherOrganisation, seedUsers, signIn, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let specialist: Agent;
let engineer: Agent;
let approver: Agent;
let admin: Agent;
let otherSpecialist: Agent;
let id: number;

const positions = [
  {
    id: 'P-HEAD',
    kind: 'head',
    separations: [
      { antennaId: 'A1', separationM: 0 },
      { antennaId: 'A2', separationM: 0 },
      { antennaId: 'A3', separationM: 0 },
    ],
  },
  {
    id: 'P-HS',
    kind: 'hotspot',
    separations: [
      { antennaId: 'A1', separationM: 0.01 },
      { antennaId: 'A2', separationM: 0.01 },
      { antennaId: 'A3', separationM: 0.01 },
    ],
  },
];
const deviceFile = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Skerry S2 handset', model: 'SK2', applicant: 'Halden Ridge Instruments', productType: 'phone' },
  markets: [{ regime: 'fcc' }],
  antennas: [
    { id: 'A1', gainDbi: 0 },
    { id: 'A2', gainDbi: 0 },
    { id: 'A3', gainDbi: 0 },
  ],
  transmitters: [
    { id: 'WWAN', technology: 'LTE', band: 'B2', frequencyMinHz: 1.85e9, frequencyMaxHz: 1.91e9, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'A1' },
    { id: 'WLAN', technology: 'Wi-Fi', band: '2.4 GHz', frequencyMinHz: 2.412e9, frequencyMaxHz: 2.462e9, maxTuneUpPowerDbm: 18, dutyCycle: 1, antennaId: 'A2' },
    { id: 'BT', technology: 'Bluetooth', band: '2.4 GHz', frequencyMinHz: 2.402e9, frequencyMaxHz: 2.48e9, maxTuneUpPowerDbm: 10, dutyCycle: 1, antennaId: 'A3' },
  ],
  usePositions: positions,
  simultaneous: [['WWAN', 'WLAN']],
};

const url = () => `/api/filings/${id}/co-transmission`;

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  await seedOtherOrganisation(t);
  [specialist, engineer, approver, admin] = await Promise.all(['specialist', 'engineer', 'approver', 'admin'].map((r) => signIn(t, `${r}@fieldfile.test`)));
  otherSpecialist = await signIn(t, OTHER_ORG.specialist.email);
  const res = await specialist.post('/api/filings/import').send(deviceFile);
  expect(res.status).toBe(201);
  id = res.body.filing.id;
}, 60_000);
afterAll(() => t.close());

describe('reading and roles', () => {
  it('every member reads the groups of the device file as holding in every use position', async () => {
    for (const who of [specialist, engineer, approver, admin]) {
      const res = await who.get(url());
      expect(res.status).toBe(200);
      expect(res.body.groups).toEqual([{ usePositionId: null, transmitterIds: ['WWAN', 'WLAN'] }]);
      expect(res.body.revision).toMatch(/^[0-9a-f]{24}$/);
    }
    expect((await request(t.app).get(url())).status).toBe(401);
    expect((await otherSpecialist.get(url())).status).toBe(404);
  });

  it('only the specialist writes: engineer, approver and admin get 403, another organisation 404, and nothing changes', async () => {
    const body = { groups: [{ usePositionId: 'P-HS', transmitterIds: ['WLAN', 'BT'] }] };
    for (const who of [engineer, approver, admin]) {
      const res = await who.put(url()).send(body);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/specialist/);
    }
    expect((await otherSpecialist.put(url()).send(body)).status).toBe(404);
    expect((await specialist.get(url())).body.groups).toEqual([{ usePositionId: null, transmitterIds: ['WWAN', 'WLAN'] }]);
  });
});

describe('saving', () => {
  it('refuses unknown ids and a group of one, naming each, and keeps what is stored', async () => {
    const before = (await specialist.get(url())).body;
    const res = await specialist.put(url()).send({
      groups: [
        { usePositionId: 'P-NOPE', transmitterIds: ['WWAN', 'WLAN'] },
        { usePositionId: null, transmitterIds: ['WWAN', 'GPS'] },
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields['groups.0.usePositionId']).toMatch(/No use position “P-NOPE”; this filing has P-HEAD, P-HS/);
    expect(res.body.error.fields['groups.1.transmitterIds']).toMatch(/No transmitter “GPS”/);
    const one = await specialist.put(url()).send({ groups: [{ usePositionId: 'P-HS', transmitterIds: ['BT'] }] });
    expect(one.status).toBe(422);
    expect(one.body.error.fields['groups.0.transmitterIds']).toMatch(/at least two transmitters/);
    expect((await specialist.get(url())).body).toEqual(before);
  });

  it('saves a group of one use position; the lab results sum it there only, the all-position group everywhere', async () => {
    const { revision } = (await specialist.get(url())).body;
    const groups = [
      { usePositionId: null, transmitterIds: ['WWAN', 'WLAN'] },
      { usePositionId: 'P-HS', transmitterIds: ['WLAN', 'BT'] },
    ];
    const res = await specialist.put(url()).set('If-Match', `"${revision}"`).send({ groups });
    expect(res.status).toBe(200);
    expect(res.body.groups).toEqual(groups);
    expect(res.body.revision).not.toBe(revision);
    const lab = await engineer.get(`/api/filings/${id}/lab-results`);
    expect(lab.status).toBe(200);
    const combos = lab.body.coTransmission.map((c: { id: string; transmitterIds: string[]; usePositionId: string }) => `${c.id}:${c.transmitterIds.join('+')}`);
    // G1 (every position) in both positions; G2 (hotspot only) in P-HS and nowhere else.
    expect(combos).toEqual(['G1@P-HEAD@fcc:WWAN+WLAN', 'G1@P-HS@fcc:WWAN+WLAN', 'G2@P-HS@fcc:WLAN+BT']);
    // The device file keeps both: the every-position group as a bare list, the other with its position.
    expect((await specialist.get(`/api/filings/${id}/device.json`)).body.simultaneous).toEqual([['WWAN', 'WLAN'], { transmitterIds: ['WLAN', 'BT'], usePositionId: 'P-HS' }]);
    // The audit trail names the save.
    const audit = await admin.get('/api/audit').query({ filing: String(id), person: '', kind: 'filing-data' });
    expect(JSON.stringify(audit.body)).toContain('co-transmission');
  });

  it('a save based on an older revision is refused with the current groups; nothing is written', async () => {
    const res = await specialist.put(url()).set('If-Match', '"0000000000000000deadbeef"').send({ groups: [] });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stale_co_transmission');
    expect(res.body.current.groups).toHaveLength(2);
    expect((await specialist.get(url())).body.groups).toHaveLength(2);
  });

  it('a group goes with its use position when the position is removed', async () => {
    const filing = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const kept = filing.data['use-positions'].usePositions.filter((p: { id: string }) => p.id !== 'P-HS');
    const save = await specialist.put(`/api/filings/${id}/steps/use-positions`).send({ usePositions: kept });
    expect(save.status).toBe(200);
    expect((await specialist.get(url())).body.groups).toEqual([{ usePositionId: null, transmitterIds: ['WWAN', 'WLAN'] }]);
    // Put it back for the tests after this one.
    expect((await specialist.put(`/api/filings/${id}/steps/use-positions`).send({ usePositions: positions })).status).toBe(200);
  });
});

describe('lab tables and If-Match', () => {
  it('a second save based on the first revision is refused with the current rows (409), a fresh one passes', async () => {
    const first = await engineer.get(`/api/filings/${id}/instruments`);
    expect(first.body.revision).toMatch(/^[0-9a-f]{24}$/);
    const mine = { instruments: [{ id: 'PRB', kind: 'probe', serial: 'EP-1', calibrationDate: '2026-03-01', dueDate: '2027-03-01' }] };
    const theirs = { instruments: [{ id: 'DAE', kind: 'dae', serial: 'D-7', calibrationDate: '2026-02-01', dueDate: '2027-02-01' }] };
    expect((await engineer.put(`/api/filings/${id}/instruments`).set('If-Match', `"${first.body.revision}"`).send(mine)).status).toBe(200);
    const stale = await engineer.put(`/api/filings/${id}/instruments`).set('If-Match', `"${first.body.revision}"`).send(theirs);
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_lab_set');
    expect(stale.body.current.instruments.map((i: { id: string }) => i.id)).toEqual(['PRB']);
    // The same data as stored is never stale.
    expect((await engineer.put(`/api/filings/${id}/instruments`).set('If-Match', `"${first.body.revision}"`).send(mine)).status).toBe(200);
    const fresh = await engineer.get(`/api/filings/${id}/instruments`);
    expect((await engineer.put(`/api/filings/${id}/instruments`).set('If-Match', `"${fresh.body.revision}"`).send(theirs)).status).toBe(200);
  });
});

describe('the device file', () => {
  it('an exported filing with a group of one use position imports with that group in its position, and exports the same', async () => {
    const source = (await specialist.post('/api/filings/import').send(deviceFile)).body.filing.id as number;
    const { revision } = (await specialist.get(`/api/filings/${source}/co-transmission`)).body;
    const groups = [
      { usePositionId: null, transmitterIds: ['WWAN', 'WLAN'] },
      { usePositionId: 'P-HS', transmitterIds: ['WLAN', 'BT'] },
    ];
    expect((await specialist.put(`/api/filings/${source}/co-transmission`).set('If-Match', `"${revision}"`).send({ groups })).status).toBe(200);
    const exported = await specialist.get(`/api/filings/${source}/device.json`);
    expect(JSON.parse(exported.text).simultaneous).toEqual([['WWAN', 'WLAN'], { transmitterIds: ['WLAN', 'BT'], usePositionId: 'P-HS' }]);
    const copy = await specialist.post('/api/filings/import').send(JSON.parse(exported.text));
    expect(copy.status).toBe(201);
    expect((await specialist.get(`/api/filings/${copy.body.filing.id}/co-transmission`)).body.groups).toEqual(groups);
    expect((await specialist.get(`/api/filings/${copy.body.filing.id}/device.json`)).text).toBe(exported.text);
  });

  it('a group naming an unknown use position is refused at its JSON path; nothing is created', async () => {
    const count = (await specialist.get('/api/filings')).body.filings.length;
    const res = await specialist.post('/api/filings/import').send({ ...deviceFile, simultaneous: [['WWAN', 'WLAN'], { transmitterIds: ['WLAN', 'BT'], usePositionId: 'P-NOPE' }] });
    expect(res.status).toBe(422);
    expect(res.body.error.fields['simultaneous.1.usePositionId']).toMatch(/Unknown use position id "P-NOPE"/);
    expect((await specialist.get('/api/filings')).body.filings.length).toBe(count);
  });

  it('the JSON Schema says a group without a use position holds in every one', async () => {
    const schema = (await specialist.get('/api/schema/device.json')).body;
    expect(JSON.stringify(schema.properties.simultaneous)).toMatch(/absent means every use position/);
  });
});
