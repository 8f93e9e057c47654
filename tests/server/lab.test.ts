/**
 * Lab results through the API: roles (engineer writes; specialist, approver and admin read),
 * replace-all PUTs that keep what is stored when a body is refused, the spreadsheet import (good,
 * bad row, dry run, wrong type by bytes, oversize, decimal comma with units, remembered mapping,
 * XLSX) and the lab-results figures of a hand-computed filing.
 *
 * Expected figures (FCC KDB 447498 D01 v06 / KDB 865664 D01 scaling, from memory; 47 CFR §1.1310
 * 1.6 W/kg over 1 g; 1999/519/EC 2.0 W/kg over 10 g), worked by hand:
 *   M1: 24 − 23.2 dBm = 0.8 dB → ×1.202264; 0.92 → 1.106083 W/kg (1 g); 0.55 → 0.661245 (10 g);
 *       FCC margin 10·log10(1.6/1.106083) = 1.6033 dB.
 *   M2: 18 − 17.5 dBm → ×1.122018 × (1/0.98) = ×1.144917; 0.40 → 0.457967 W/kg (1 g).
 *   Head, FCC, WWAN + WLAN: 1.106083 + 0.457967 = 1.564050 W/kg ≤ 1.6 (KDB 447498 §4.3.2).
 */
import ExcelJS from 'exceljs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEVICE_FILE_FORMAT } from '../../constants/schemas/device-file';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let specialist: Agent;
let engineer: Agent;
let approver: Agent;
let admin: Agent;
let id: number;

const deviceFile = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Skerry S1 handset', model: 'SK1', applicant: 'Halden Ridge Instruments', productType: 'phone' },
  markets: [{ regime: 'fcc' }, { regime: 'eu' }],
  antennas: [
    { id: 'A1', gainDbi: 0 },
    { id: 'A2', gainDbi: 0 },
  ],
  transmitters: [
    { id: 'WWAN', technology: 'LTE', band: 'B2', frequencyMinHz: 1.85e9, frequencyMaxHz: 1.91e9, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'A1' },
    { id: 'WLAN', technology: 'Wi-Fi', band: '2.4 GHz', frequencyMinHz: 2.412e9, frequencyMaxHz: 2.462e9, maxTuneUpPowerDbm: 18, dutyCycle: 1, antennaId: 'A2' },
  ],
  usePositions: [
    {
      id: 'P-HEAD',
      kind: 'head',
      separations: [
        { antennaId: 'A1', separationM: 0 },
        { antennaId: 'A2', separationM: 0 },
      ],
    },
    {
      id: 'P-HS',
      kind: 'hotspot',
      separations: [
        { antennaId: 'A1', separationM: 0.01 },
        { antennaId: 'A2', separationM: 0.01 },
      ],
    },
  ],
  simultaneous: [['WWAN', 'WLAN']],
};

const HEADER =
  'transmitter_id,use_position_id,test_position,channel,frequency_mhz,test_separation_mm,measured_power_dbm,tune_up_power_dbm,test_duty_cycle,sar_1g_w_kg,sar_10g_w_kg,drift_db,test_date,peak_x_mm,peak_y_mm';
const GOOD_ROWS = ['WWAN,P-HEAD,left cheek,9400,1880,0,23.2,,,0.92,0.55,-0.05,2026-10-12,10,20', 'WLAN,P-HEAD,left cheek,6,2437,0,17.5,18,0.98,0.40,0.20,0.1,2026-10-12,40,20'];
const csv = (...rows: string[]) => Buffer.from([HEADER, ...rows].join('\n') + '\n');

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  [specialist, engineer, approver, admin] = await Promise.all(['specialist', 'engineer', 'approver', 'admin'].map((r) => signIn(t, `${r}@fieldfile.test`)));
  const res = await specialist.post('/api/filings/import').send(deviceFile);
  expect(res.status).toBe(201);
  id = res.body.filing.id;
}, 60_000);
afterAll(() => t.close());

describe('roles', () => {
  it('the engineer writes; specialist, approver and admin read; signed-out is 401', async () => {
    const body = { instruments: [{ id: 'PRB', kind: 'probe', serial: 'EP-3391', calibrationDate: '2026-03-01', dueDate: '2027-03-01' }] };
    expect((await specialist.put(`/api/filings/${id}/instruments`).send(body)).status).toBe(403);
    expect((await approver.put(`/api/filings/${id}/instruments`).send(body)).status).toBe(403);
    expect((await admin.put(`/api/filings/${id}/instruments`).send(body)).status).toBe(403);
    const put = await engineer.put(`/api/filings/${id}/instruments`).send(body);
    expect(put.status).toBe(200);
    for (const agent of [specialist, approver, admin, engineer]) {
      const res = await agent.get(`/api/filings/${id}/instruments`);
      expect(res.status).toBe(200);
      expect(res.body.instruments[0]).toMatchObject({ id: 'PRB', kind: 'probe' });
      expect((await agent.get(`/api/filings/${id}/lab-results`)).status).toBe(200);
    }
    expect((await request(t.app).get(`/api/filings/${id}/measurements`)).status).toBe(401);
    expect((await specialist.post(`/api/filings/${id}/measurements/import`).attach('file', csv(...GOOD_ROWS), 'lab.csv')).status).toBe(403);
  });
});

describe('replacing data sets', () => {
  it('stores liquid checks, system checks, instruments and the budget, each replaced as a whole', async () => {
    const liquid = await engineer.put(`/api/filings/${id}/liquid-checks`).send({
      liquidChecks: [
        { id: 'L1', date: '2026-10-12', frequencyHz: 1.88e9, relativePermittivity: 41.0, conductivitySPerM: 1.45, temperatureC: 21.5 },
        { id: 'L2', date: '2026-10-12', frequencyHz: 2.437e9, relativePermittivity: 39.5, conductivitySPerM: 1.9, temperatureC: 21.0 },
      ],
    });
    expect(liquid.status).toBe(200);
    expect(liquid.body.liquidChecks).toHaveLength(2);
    const sys = await engineer
      .put(`/api/filings/${id}/system-checks`)
      .send({ systemChecks: [{ id: 'S1', date: '2026-10-12', frequencyHz: 1.9e9, dipoleSerial: 'D1900-118', measuredSarWPerKgPerW: 40.2, targetSarWPerKgPerW: 39.6 }] });
    expect(sys.status).toBe(200);
    const budget = await engineer.put(`/api/filings/${id}/uncertainty-budget`).send({ components: [{ name: 'probe calibration', valuePct: 6, distribution: 'normal', sensitivity: 1 }] });
    expect(budget.status).toBe(200);
    expect(budget.body.components[0]).toMatchObject({ name: 'probe calibration', divisor: null, degreesOfFreedom: null });
  });

  it('refuses measurements naming unknown ids, field by field, and keeps what was stored', async () => {
    const ok = await engineer
      .put(`/api/filings/${id}/measurements`)
      .send({ measurements: [{ id: 'X1', transmitterId: 'WWAN', usePositionId: 'P-HEAD', frequencyHz: 1.88e9, testSeparationM: 0, measuredPowerDbm: 23, sar1gWPerKg: 0.5, testDate: '2026-10-12' }] });
    expect(ok.status).toBe(200);
    const bad = await engineer.put(`/api/filings/${id}/measurements`).send({
      measurements: [
        { id: 'X1', transmitterId: 'BT', usePositionId: 'P-LAP', frequencyHz: 1.88e9, testSeparationM: 0, measuredPowerDbm: 23, sar1gWPerKg: 0.5, testDate: '2026-10-12', liquidCheckId: 'L9' },
        { id: 'X2', transmitterId: 'WWAN', usePositionId: 'P-HEAD', frequencyHz: 1.88e9, testSeparationM: 0, measuredPowerDbm: 23, sar1gWPerKg: 250, testDate: '2026-13-40' },
      ],
    });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['measurements.1.sar1gWPerKg']).toMatch(/at most 100 W\/kg/);
    expect(bad.body.error.fields['measurements.1.testDate']).toMatch(/date/);
    const refs = await engineer.put(`/api/filings/${id}/measurements`).send({
      measurements: [
        { id: 'X1', transmitterId: 'BT', usePositionId: 'P-LAP', frequencyHz: 1.88e9, testSeparationM: 0, measuredPowerDbm: 23, sar1gWPerKg: 0.5, testDate: '2026-10-12', liquidCheckId: 'L9' },
      ],
    });
    expect(refs.status).toBe(422);
    expect(refs.body.error.fields['measurements.0.transmitterId']).toMatch(/Unknown transmitter “BT”; this filing has WWAN, WLAN/);
    expect(refs.body.error.fields['measurements.0.usePositionId']).toMatch(/P-LAP/);
    expect(refs.body.error.fields['measurements.0.liquidCheckId']).toMatch(/L9/);
    const kept = await approver.get(`/api/filings/${id}/measurements`);
    expect(kept.body.measurements.map((m: { id: string }) => m.id)).toEqual(['X1']);
  });
});

describe('import', () => {
  it('a good CSV with the standard header needs no mapping and replaces the measurements', async () => {
    const res = await engineer.post(`/api/filings/${id}/measurements/import`).attach('file', csv(...GOOD_ROWS), 'lab.csv');
    expect(res.status).toBe(201);
    expect(res.body.import).toMatchObject({ format: 'csv', delimiter: ',', decimalComma: false, mappingSource: 'header', rowCount: 2, imported: 2, problems: [] });
    const stored = (await approver.get(`/api/filings/${id}/measurements`)).body.measurements;
    expect(stored.map((m: { id: string }) => m.id)).toEqual(['M1', 'M2']);
    expect(stored[0]).toMatchObject({ transmitterId: 'WWAN', frequencyHz: 1.88e9, testSeparationM: 0, tuneUpPowerDbm: null, testDutyCycle: 1, sar1gWPerKg: 0.92 });
  });

  it('a CSV with a bad row names every bad cell by line and column and imports nothing', async () => {
    const file = csv(GOOD_ROWS[0], 'WWAN,P-HEAD,right cheek,9400,1880,0,23.1,,,abc,0.5,0,2026-10-12,,', 'WWAN,P-HEAD,right tilt,9400,1880,0,23.1,,,0.5,0.5,0,2026-02-30,,');
    const res = await engineer.post(`/api/filings/${id}/measurements/import`).attach('file', file, 'lab.csv');
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/nothing was imported/);
    const problems = res.body.import.problems as { line: number; column: string; message: string }[];
    expect(problems).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ line: 3, column: 'sar_1g_w_kg', message: '“abc” is not a number.' }),
        expect.objectContaining({ line: 4, column: 'test_date', message: '“2026-02-30”: That date does not exist.' }),
      ]),
    );
    const stored = (await approver.get(`/api/filings/${id}/measurements`)).body.measurements;
    expect(stored.map((m: { id: string }) => m.id)).toEqual(['M1', 'M2']);
    // The unknown transmitter is named once the row is otherwise readable.
    const onlyRef = await engineer.post(`/api/filings/${id}/measurements/import`).attach('file', csv(GOOD_ROWS[0], 'BT,P-HEAD,right tilt,9400,1880,0,23.1,,,0.5,0.5,0,2026-10-12,,'), 'lab.csv');
    expect(onlyRef.status).toBe(422);
    expect(onlyRef.body.import.problems[0]).toMatchObject({ line: 3, column: 'transmitter_id' });
    expect(onlyRef.body.import.problems[0].message).toMatch(/Unknown transmitter “BT”/);
  });

  it('a dry run returns the preview and its problems and stores nothing', async () => {
    const res = await engineer.post(`/api/filings/${id}/measurements/import`).field('dryRun', 'true').attach('file', csv('WLAN,P-HS,back,6,2437,10,17.9,,,0.6,,0,2026-10-13,80,20'), 'lab.csv');
    expect(res.status).toBe(200);
    expect(res.body.import).toMatchObject({ dryRun: true, imported: 0, rowCount: 1, problems: [] });
    expect(res.body.import.rows[0]).toMatchObject({ line: 2, cells: { transmitter_id: 'WLAN', sar_1g_w_kg: '0.6' } });
    expect((await approver.get(`/api/filings/${id}/measurements`)).body.measurements).toHaveLength(2);
  });

  it('a file that is not CSV or XLSX by its bytes is 415, naming what it is', async () => {
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n');
    const res = await engineer.post(`/api/filings/${id}/measurements/import`).attach('file', pdf, 'results.csv');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/application\/pdf/);
  });

  it('a semicolon CSV with decimal commas and mapped units (GHz, cm, mW) converts to SI, and the mapping is remembered', async () => {
    const header = 'Tx;Position;Freq (GHz);Gap (cm);Power (mW);SAR 1g;Date';
    const body = [header, 'WWAN;P-HEAD;1,88;0;208,9;0,92;2026-10-12', 'WLAN;P-HEAD;2,437;0;56,23;0,40;2026-10-12'].join('\r\n');
    const mapping = {
      transmitter_id: { column: 'Tx' },
      use_position_id: { column: 'Position' },
      frequency_mhz: { column: 'Freq (GHz)', unit: 'GHz' },
      test_separation_mm: { column: 'Gap (cm)', unit: 'cm' },
      measured_power_dbm: { column: 'Power (mW)', unit: 'mW' },
      sar_1g_w_kg: { column: 'SAR 1g', unit: 'W/kg' },
      test_date: { column: 'Date' },
    };
    const res = await engineer.post(`/api/filings/${id}/measurements/import`).field('mapping', JSON.stringify(mapping)).attach('file', Buffer.from(body), 'lab.csv');
    expect(res.status).toBe(201);
    expect(res.body.import).toMatchObject({ delimiter: ';', decimalComma: true, mappingSource: 'given', imported: 2 });
    const stored = (await approver.get(`/api/filings/${id}/measurements`)).body.measurements;
    expect(stored[0].frequencyHz).toBeCloseTo(1.88e9, 0);
    // 208.9 mW = 10·log10(208.9) = 23.1994 dBm.
    expect(stored[0].measuredPowerDbm).toBeCloseTo(23.1994, 4);
    const again = await engineer.post(`/api/filings/${id}/measurements/import`).field('dryRun', 'true').attach('file', Buffer.from(body), 'lab.csv');
    expect(again.body.import.mappingSource).toBe('remembered');
    expect(again.body.import.problems).toEqual([]);
  });

  it('an XLSX workbook imports like the CSV', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('SAR');
    ws.addRow(HEADER.split(','));
    for (const r of GOOD_ROWS) ws.addRow(r.split(',').map((c) => (c !== '' && !Number.isNaN(Number(c)) ? Number(c) : c)));
    const buf = Buffer.from(await wb.xlsx.writeBuffer());
    const res = await engineer.post(`/api/filings/${id}/measurements/import`).attach('file', buf, 'lab.xlsx');
    expect(res.status).toBe(201);
    expect(res.body.import).toMatchObject({ format: 'xlsx', imported: 2 });
  });

  it('over the size limit is 413 and stores nothing', { timeout: 60_000 }, async () => {
    const small = await createTestApp({ env: { FIELDFILE_IMPORT_MAX_BYTES: '2048' } });
    try {
      await seedUsers(small);
      const sp = await signIn(small, 'specialist@fieldfile.test');
      const eng = await signIn(small, 'engineer@fieldfile.test');
      const fid = (await sp.post('/api/filings/import').send(deviceFile)).body.filing.id;
      const big = csv(...Array.from({ length: 60 }, () => GOOD_ROWS[0]));
      expect(big.length).toBeGreaterThan(2048);
      const res = await eng.post(`/api/filings/${fid}/measurements/import`).attach('file', big, 'lab.csv');
      expect(res.status).toBe(413);
      expect(res.body.error.message).toMatch(/import limit/);
      expect((await eng.get(`/api/filings/${fid}/measurements`)).body.measurements).toEqual([]);
    } finally {
      await small.close();
    }
  });
});

describe('lab results of a hand-computed filing', () => {
  it('gives reported SAR, the highest per market and condition, checks and co-transmission', async () => {
    const imp = await engineer.post(`/api/filings/${id}/measurements/import`).attach('file', csv(...GOOD_ROWS), 'lab.csv');
    expect(imp.status).toBe(201);
    const res = await approver.get(`/api/filings/${id}/lab-results`);
    expect(res.status).toBe(200);
    const body = res.body;
    expect(body).toMatchObject({ filingId: id, version: 1, engineVersion: expect.any(String), ruleSetVersion: expect.any(String) });
    expect(body.cautions.join(' ')).toMatch(/certifying body decide/);
    const m1 = body.rows.find((r: { measurementId: string }) => r.measurementId === 'M1');
    expect(m1).toMatchObject({ transmitterId: 'WWAN', usePositionId: 'P-HEAD', channel: '9400', frequencyHz: 1.88e9, measuredPowerDbm: 23.2, tuneUpPowerDbm: 24 });
    expect(m1.scalingFactor).toBeCloseTo(1.202264, 6);
    expect(m1.reportedSar1gWPerKg).toBeCloseTo(1.106083, 6);
    expect(m1.reportedSar10gWPerKg).toBeCloseTo(0.661245, 6);
    expect(m1.derivation.source).toMatch(/KDB 447498/);
    const m2 = body.rows.find((r: { measurementId: string }) => r.measurementId === 'M2');
    expect(m2.scalingFactor).toBeCloseTo(1.144917, 6);
    const fccHead = body.highest.find((h: { regime: string; usePositionKind: string }) => h.regime === 'fcc' && h.usePositionKind === 'head');
    expect(fccHead).toMatchObject({ measurementId: 'M1', transmitterId: 'WWAN', usePositionId: 'P-HEAD', averagingMassKg: 0.001, limitWPerKg: 1.6 });
    expect(fccHead.marginDb).toBeCloseTo(1.6033, 4);
    // No hotspot measurement yet: the hotspot entries have no value, and coverage names the gap.
    const fccHotspot = body.highest.find((h: { regime: string; usePositionKind: string }) => h.regime === 'fcc' && h.usePositionKind === 'hotspot');
    expect(fccHotspot).toMatchObject({ reportedSarWPerKg: null, measurementId: null });
    const liquid = body.checks.find((c: { id: string }) => c.id === 'liquid:L2');
    expect(liquid).toMatchObject({ status: 'fail', blocking: true, tolerance: '±5 % of target, each of εr and σ' });
    expect(liquid.howToFix).toBeTruthy();
    const headCotx = body.coTransmission.find((c: { usePositionId: string; regime: string }) => c.usePositionId === 'P-HEAD' && c.regime === 'fcc');
    expect(headCotx.sum).toBeCloseTo(1.56405, 5);
    expect(headCotx.outcome).toBe('sum-within-limit');
    expect(body.coverage.length).toBeGreaterThan(0);
    // The same data answers from the stored result with the same computedAt.
    const again = await specialist.get(`/api/filings/${id}/lab-results`);
    expect(again.body.computedAt).toBe(body.computedAt);
  });
});
