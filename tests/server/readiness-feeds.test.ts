/**
 * The readiness checklist fed from real data, through the API on a real SQLite file: the lab
 * results (calc/lab `lab-results`), the required evidence (`requiredEvidenceRules`), the test
 * report read back from an uploaded PDF, the user manual's stated separations and the antenna
 * drawing's edge distances. One complete filing passes every wired rule; each case then changes
 * one thing through the API — a measurement, a document — and the rule it feeds fails with a
 * message naming what to fix, and passes again once it is put back.
 *
 * Tolerances are the engine's (IEEE Std 1528-2013 liquid ±5 %, system check ±10 %, drift ±5 %;
 * FCC KDB 865664 D01 repeats and calibration; KDB 941225 D06 hotspot edges within 25 mm — from
 * memory where the rules say so). The filing is fictional.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEVICE_FILE_FORMAT, type DeviceFileInput } from '../../constants/schemas/device-file';
import { makePdf } from '../../seeds/documents';
import { antennaEdgeDistances, manualSeparationStatements } from '../../server/services/report-readback';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let specialist: Agent;
let engineer: Agent;
let id: number;

/** A field hotspot: LTE Band 12 at 24 dBm (needs SAR) and Bluetooth LE at 4 dBm (exempt), on one antenna; on together. */
const DEVICE: DeviceFileInput = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Kestrel KH-3 field hotspot', model: 'KH3-LTE', applicant: 'Halden Ridge Instruments', productType: 'hotspot', hardwareVersion: 'EVT2', firmwareVersion: '1.0.3' },
  markets: [{ regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' }],
  antennas: [{ id: 'ANT1', gainDbi: 1, location: 'Top edge' }],
  transmitters: [
    { id: 'LTE-B12', technology: 'LTE', band: 'Band 12', frequencyMinHz: 699e6, frequencyMaxHz: 716e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ANT1' },
    { id: 'BT-LE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 4, dutyCycle: 0.35, antennaId: 'ANT1' },
  ],
  usePositions: [
    { id: 'hotspot-top', kind: 'hotspot', separations: [{ antennaId: 'ANT1', separationM: 0.01 }] },
    { id: 'belt', kind: 'body-worn', separations: [{ antennaId: 'ANT1', separationM: 0.005 }] },
  ],
  simultaneous: [['LTE-B12', 'BT-LE']],
};

/** Measured SAR under 0.8 W/kg (no repeat, KDB 865664) and 1.5 W/kg (no budget); power 0.2 dB under tune-up. */
const measurement = (over: Record<string, unknown> = {}) => ({
  id: 'M1',
  transmitterId: 'LTE-B12',
  usePositionId: 'hotspot-top',
  testPosition: 'top edge, 10 mm',
  channel: '23095',
  frequencyHz: 707.5e6,
  testSeparationM: 0.01,
  measuredPowerDbm: 23.8,
  sar1gWPerKg: 0.61,
  sar10gWPerKg: 0.33,
  driftDb: 0.05,
  testDate: '2026-11-12',
  liquidCheckId: 'L1',
  systemCheckId: 'S1',
  ...over,
});
const GOOD_MEASUREMENTS = () => [measurement(), measurement({ id: 'M2', usePositionId: 'belt', testPosition: 'back, 5 mm', testSeparationM: 0.005, sar1gWPerKg: 0.52, sar10gWPerKg: 0.28 })];
// Head-liquid targets at 750 MHz: εr 41.9, σ 0.89 S/m (IEEE Std 1528-2013 Table 3, from memory).
const GOOD_LIQUID = { id: 'L1', date: '2026-11-12', liquid: 'head', frequencyHz: 750e6, relativePermittivity: 41.5, conductivitySPerM: 0.9, temperatureC: 21.5 };
const GOOD_SYSTEM = { id: 'S1', date: '2026-11-12', frequencyHz: 750e6, dipoleSerial: 'D750-1042', averagingMass: '1g', measuredSarWPerKgPerW: 8.5, targetSarWPerKgPerW: 8.4 };
const GOOD_PROBE = { id: 'P1', kind: 'probe', model: 'EP-4', serial: '4471', calibrationDate: '2026-05-01', dueDate: '2027-05-01' };

const REPORT = [
  ['RF exposure (SAR) test report', 'Model KH3-LTE - Kestrel KH-3 field hotspot'],
  ['Conducted power', 'LTE Band 12 maximum tune-up power: 24.0 dBm'],
  ['Test positions', 'Hotspot separation distance: 10 mm', 'Body-worn separation distance: 5 mm'],
];
const MANUAL = [['RF exposure', 'Hotspot use: keep the device at least 10 mm from the body.', 'Body-worn use: wear it in the belt clip, at least 5 mm from the body.']];
const DRAWING = [['Antenna locations, KH3-LTE', 'ANT1: top edge 8 mm, left edge 31 mm, right edge 30 mm, bottom edge 112 mm']];

async function put(set: string, body: Record<string, unknown>) {
  const res = await engineer.put(`/api/filings/${id}/${set}`).send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}
const putMeasurements = (measurements: unknown[]) => put('measurements', { measurements });

async function upload(category: string, title: string, pages: string[][]): Promise<number> {
  const res = await engineer
    .post(`/api/filings/${id}/evidence`)
    .field('category', category)
    .field('title', title)
    .attach('file', await makePdf(pages, title), { filename: `${title}.pdf`, contentType: 'application/pdf' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.record.id;
}
async function remove(evidenceId: number) {
  expect((await engineer.delete(`/api/filings/${id}/evidence/${evidenceId}`)).status).toBe(204);
}

interface Item {
  id: string;
  status: string;
  severity: string;
  step: string;
  source: string;
  findings: { text: string; step?: string }[];
}
async function checklist(): Promise<{ ready: boolean; items: Item[] }> {
  const res = await specialist.get(`/api/filings/${id}/readiness`);
  expect(res.status).toBe(200);
  return res.body;
}
async function item(ruleId: string): Promise<Item> {
  return (await checklist()).items.find((i) => i.id === ruleId)!;
}
const texts = (i: Item) => i.findings.map((f) => f.text).join('\n');

/** The rules this test wires; each passes on the complete filing. */
const WIRED = [
  'sar-measured',
  'measurements-match-device',
  'lab-records-complete',
  'reported-sar-within-limit',
  'co-transmission-evaluated',
  'tune-up-consistent',
  'measured-power-within-tune-up',
  'lab-checks-in-tolerance',
  'tested-at-use-separation',
  'manual-separation',
  'manual-separation-stated',
  'report-agrees',
  'evidence-present',
  'hotspot-edges',
  'hotspot-edge-distances',
];

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  [specialist, engineer] = await Promise.all([signIn(t, 'specialist@fieldfile.test'), signIn(t, 'engineer@fieldfile.test')]);
  const res = await specialist.post('/api/filings/import').send(DEVICE);
  expect(res.status).toBe(201);
  id = res.body.filing.id;
}, 60_000);
afterAll(() => t.close());

describe('a filing with nothing recorded yet', () => {
  it('says what to enter or upload instead of passing', async () => {
    const list = await checklist();
    const by = (rule: string) => list.items.find((i) => i.id === rule)!;
    expect(by('sar-measured')).toMatchObject({ status: 'fail' });
    expect(texts(by('sar-measured'))).toMatch(/LTE-B12 at “hotspot-top” needs SAR \(US FCC\) and has no measurement/);
    expect(texts(by('evidence-present'))).toMatch(/Nothing filed under “RF-exposure test report”/);
    expect(by('manual-separation-stated')).toMatchObject({ status: 'fail', severity: 'warning', step: 'evidence' });
    expect(texts(by('manual-separation-stated'))).toMatch(/No user-manual text is on file/);
    expect(by('hotspot-edge-distances')).toMatchObject({ status: 'fail', severity: 'warning' });
    expect(texts(by('hotspot-edge-distances'))).toMatch(/No antenna location drawing with readable text/);
    // Co-transmission is evaluated from screening even before the lab: the LTE side is missing.
    expect(texts(by('co-transmission-evaluated'))).toMatch(/LTE-B12 \+ BT-LE at “hotspot-top”, US FCC cannot be summed/);
    expect(list.ready).toBe(false);
  });
});

describe('the complete filing', () => {
  beforeAll(async () => {
    await put('liquid-checks', { liquidChecks: [GOOD_LIQUID] });
    await put('system-checks', { systemChecks: [GOOD_SYSTEM] });
    await put('instruments', { instruments: [GOOD_PROBE] });
    await putMeasurements(GOOD_MEASUREMENTS());
    await upload('test-report', 'SAR test report', REPORT);
    await upload('user-manual', 'User manual, RF exposure', MANUAL);
    await upload('antenna-drawing', 'Antenna location drawing', DRAWING);
    for (const [category, title] of [
      ['report-appendix', 'SAR plots'],
      ['calibration-certificate', 'Probe calibration'],
      ['check-records', 'Liquid and system checks'],
      ['setup-photos', 'Setup photos'],
      ['tune-up-table', 'Tune-up table'],
      ['label-drawing', 'Label drawing'],
    ])
      await upload(category, title, [[title, 'KH3-LTE']]);
  }, 60_000);

  it('passes every rule the lab results, the evidence and the documents feed, and is ready', async () => {
    const list = await checklist();
    const wired = list.items.filter((i) => WIRED.includes(i.id));
    expect(wired.map((i) => [i.id, i.status, texts(i)])).toEqual(WIRED.map((rule) => [rule, 'pass', '']));
    expect(list.ready).toBe(true);
    for (const i of list.items) {
      expect(i.source.length).toBeGreaterThan(5);
      expect(['blocks-signing', 'warning']).toContain(i.severity);
    }
  });

  const cases: { rule: string; why: string; breaks: () => Promise<void>; restores: () => Promise<void>; finding: RegExp; blocks: boolean }[] = [
    {
      rule: 'sar-measured',
      why: '47 CFR §2.1093(d): the belt position needs SAR and its measurement is removed',
      breaks: () => putMeasurements([measurement()]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /LTE-B12 at “belt” needs SAR \(US FCC\) and has no measurement/,
      blocks: true,
    },
    {
      rule: 'measurements-match-device',
      why: 'common practice: a Band 12 row at 1900 MHz is not a combination of this device',
      breaks: () => putMeasurements([measurement({ frequencyHz: 1900e6 }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /M1: 1900 MHz is outside the band of LTE-B12/,
      blocks: true,
    },
    {
      rule: 'lab-records-complete',
      why: 'IEC/IEEE 62209-1528: each scan records its drift',
      breaks: () => putMeasurements([measurement({ driftDb: null }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /M1: no power drift recorded/,
      blocks: false,
    },
    {
      rule: 'reported-sar-within-limit',
      why: '47 CFR §1.1310: 1.6 W/kg over 1 g; 1.58 measured × 10^(0.2/10) = 1.65 reported',
      breaks: () => putMeasurements([measurement({ sar1gWPerKg: 1.58, repeatSarWPerKg: [1.55] }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /US FCC, hotspot: reported SAR 1\.65 W\/kg \(LTE-B12 at “hotspot-top”\) is over the limit of 1\.6 W\/kg/,
      blocks: true,
    },
    {
      rule: 'co-transmission-evaluated',
      why: 'KDB 447498 §4.3.2: LTE has no measurement at the hotspot, so the sum cannot be made',
      breaks: () => putMeasurements([GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /LTE-B12 \+ BT-LE at “hotspot-top”, US FCC cannot be summed/,
      blocks: true,
    },
    {
      rule: 'tune-up-consistent',
      why: 'common practice: the measurements scale to the tune-up power Radios declares',
      breaks: () => putMeasurements([measurement({ tuneUpPowerDbm: 24.5 }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /LTE-B12: measurements use 24\.5 dBm, Radios says 24 dBm/,
      blocks: true,
    },
    {
      rule: 'measured-power-within-tune-up',
      why: 'KDB 447498 §4.1: measured 24.3 dBm over the 24 dBm tune-up limit',
      breaks: () => putMeasurements([measurement({ measuredPowerDbm: 24.3 }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /Measurement M1 .*24\.3 dBm measured, tune-up limit 24 dBm/,
      blocks: true,
    },
    {
      rule: 'lab-checks-in-tolerance',
      why: 'IEEE 1528-2013: the liquid’s σ 8 % over its target (±5 %)',
      breaks: () => put('liquid-checks', { liquidChecks: [{ ...GOOD_LIQUID, conductivitySPerM: 0.96 }] }),
      restores: () => put('liquid-checks', { liquidChecks: [GOOD_LIQUID] }),
      finding: /Liquid L1 \(2026-11-12\): σ outside ±5 % of the target/,
      blocks: true,
    },
    {
      rule: 'lab-checks-in-tolerance',
      why: 'IEEE 1528-2013: system check 13 % over the dipole target (±10 %)',
      breaks: () => put('system-checks', { systemChecks: [{ ...GOOD_SYSTEM, measuredSarWPerKgPerW: 9.5 }] }),
      restores: () => put('system-checks', { systemChecks: [GOOD_SYSTEM] }),
      finding: /System check S1 \(2026-11-12\) is 13\.1 % from its target/,
      blocks: true,
    },
    {
      rule: 'lab-checks-in-tolerance',
      why: 'IEEE 1528-2013: drift of 0.5 dB is 12 %, over ±5 %',
      breaks: () => putMeasurements([measurement({ driftDb: 0.5 }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /M1: power drift 0\.5 dB is outside ±5 %/,
      blocks: true,
    },
    {
      rule: 'lab-checks-in-tolerance',
      why: 'KDB 865664: the probe’s calibration ran out before the test date',
      breaks: () => put('instruments', { instruments: [{ ...GOOD_PROBE, calibrationDate: '2025-10-01', dueDate: '2026-10-01' }] }),
      restores: () => put('instruments', { instruments: [GOOD_PROBE] }),
      finding: /P1 \(probe 4471\) was not in calibration on 2026-11-12/,
      blocks: true,
    },
    {
      rule: 'lab-checks-in-tolerance',
      why: 'KDB 865664 §2.8.1: 0.85 W/kg measured needs a repeat',
      breaks: () => putMeasurements([measurement({ sar1gWPerKg: 0.85 }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /M1: .*repeat/i,
      blocks: true,
    },
    {
      rule: 'tested-at-use-separation',
      why: 'KDB 447498 §4.1: the belt is used at 5 mm and was tested at 8 mm',
      breaks: () => putMeasurements([measurement(), { ...GOOD_MEASUREMENTS()[1], testSeparationM: 0.008 }]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /M2: tested at 8 mm, farther than the 5 mm of belt/,
      blocks: true,
    },
    {
      rule: 'uncertainty-given',
      why: 'KDB 865664 §2.8.2: 1.52 W/kg measured (≥ 1.5 W/kg, 1 g) needs a budget',
      breaks: () => putMeasurements([measurement({ sar1gWPerKg: 1.52, repeatSarWPerKg: [1.5, 1.49] }), GOOD_MEASUREMENTS()[1]]),
      restores: () => putMeasurements(GOOD_MEASUREMENTS()),
      finding: /requires an uncertainty budget, and none is given/,
      blocks: true,
    },
  ];

  describe.each(cases)('$rule: $why', ({ rule, breaks, restores, finding, blocks }) => {
    it('fails with what to fix, and passes again once put back', async () => {
      await breaks();
      const list = await checklist();
      const failed = list.items.find((i) => i.id === rule)!;
      expect(failed.status).toBe('fail');
      expect(texts(failed)).toMatch(finding);
      expect(failed.severity).toBe(blocks ? 'blocks-signing' : 'warning');
      if (blocks) expect(list.ready).toBe(false);
      await restores();
      expect((await item(rule)).status).not.toBe('fail');
      expect((await checklist()).ready).toBe(true);
    });
  });

  it('uncertainty-given: a budget given passes; an expanded uncertainty over 30 % fails (IEEE 1528-2013, from memory)', async () => {
    await putMeasurements([measurement({ sar1gWPerKg: 1.52, repeatSarWPerKg: [1.5, 1.49] }), GOOD_MEASUREMENTS()[1]]);
    const budget = (valuePct: number) => ({ components: [{ name: 'Probe calibration', valuePct, distribution: 'normal', divisor: 1, sensitivity: 1 }] });
    await put('uncertainty-budget', budget(11));
    expect((await item('uncertainty-given')).status).toBe('pass');
    await put('uncertainty-budget', budget(16));
    const over = await item('uncertainty-given');
    expect(over.status).toBe('fail');
    expect(texts(over)).toMatch(/expanded uncertainty is 32\.0 % \(k = 2\), above 30 %/);
    await put('uncertainty-budget', { components: [] });
    await putMeasurements(GOOD_MEASUREMENTS());
    expect((await checklist()).ready).toBe(true);
  });

  it('tune-up-consistent and report-agrees: a report that disagrees fails until the engineer explains it', async () => {
    const other = await upload('test-report', 'SAR test report, part 2', [
      ['SAR test report part 2, model KH3-LTE'],
      ['LTE Band 12 maximum tune-up power: 23.5 dBm'],
      ['Hotspot separation distance: 15 mm'],
    ]);
    const list = await checklist();
    const tuneUp = list.items.find((i) => i.id === 'tune-up-consistent')!;
    expect(tuneUp.status).toBe('fail');
    expect(texts(tuneUp)).toMatch(/LTE-B12: the report \(“SAR test report, part 2”, page 2\) says 23\.5 dBm, Radios says 24 dBm/);
    const agrees = list.items.find((i) => i.id === 'report-agrees')!;
    expect(agrees).toMatchObject({ status: 'fail', severity: 'blocks-signing', step: 'evidence' });
    expect(texts(agrees)).toMatch(/“SAR test report, part 2”: Report page 3 gives a hotspot .*separation of 15 mm/);
    expect(list.ready).toBe(false);

    // The Evidence step lists the same findings, and an explanation clears them from the checklist.
    const evidence = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    const findings = evidence.findings.filter((f: { evidenceId: number }) => f.evidenceId === other);
    expect(findings.map((f: { kind: string }) => f.kind).sort()).toEqual(['separation', 'tune-up-power']);
    for (const f of findings) {
      const res = await engineer.post(`/api/filings/${id}/evidence/${other}/findings/explain`).send({ key: f.key, reason: 'Part 2 covers a pre-production sample; the lab confirmed by letter.' });
      expect(res.status).toBe(200);
    }
    expect((await item('tune-up-consistent')).status).toBe('pass');
    expect((await item('report-agrees')).status).toBe('pass');
    await remove(other);
    expect((await checklist()).ready).toBe(true);
  });

  it('report-agrees: the report’s highest reported SAR is compared with the lab results', async () => {
    // 0.61 W/kg measured × 10^(0.2/10) = 0.64 W/kg reported at the hotspot.
    const agreeing = await upload('test-report', 'SAR summary', [['Summary, KH3-LTE', 'Highest reported SAR hotspot 0.64 W/kg (1 g)']]);
    expect((await item('report-agrees')).status).toBe('pass');
    await remove(agreeing);
    const wrong = await upload('test-report', 'SAR summary (draft)', [['Summary, KH3-LTE', 'Highest reported SAR hotspot 0.59 W/kg (1 g)']]);
    const agrees = await item('report-agrees');
    expect(agrees.status).toBe('fail');
    expect(texts(agrees)).toMatch(/says 0\.59 W\/kg for hotspot .*highest reported is 0\.64 W\/kg/);
    await remove(wrong);
  });

  it('manual-separation: a manual that tells users 3 mm where the belt was tested at 5 mm blocks signing', async () => {
    const manual = await upload('user-manual', 'Quick start', [['Quick start', 'Keep the device at least 3 mm from your body.']]);
    const i = await item('manual-separation');
    expect(i).toMatchObject({ status: 'fail', severity: 'blocks-signing', step: 'evidence' });
    expect(texts(i)).toMatch(/“belt”: the manual \(“Quick start”, page 1\) states 3 mm; it was tested at 5 mm/);
    await remove(manual);
    expect((await item('manual-separation')).status).toBe('pass');
  });

  it('manual-separation-stated: a manual that gives no distance says what sentence to add', async () => {
    const list = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    const manual = list.records.find((r: { category: string }) => r.category === 'user-manual');
    await remove(manual.id);
    await upload('user-manual', 'User manual, no distance', [['RF exposure', 'This device meets the applicable limits.']]);
    const i = await item('manual-separation-stated');
    expect(i).toMatchObject({ status: 'fail', severity: 'warning' });
    expect(texts(i)).toMatch(/states no separation for “hotspot-top” \(hotspot\)/);
    expect(texts(i)).toMatch(/states no separation for “belt” \(body-worn\)/);
    const now = (await engineer.get(`/api/filings/${id}/evidence`)).body.records.find((r: { category: string }) => r.category === 'user-manual');
    await remove(now.id);
    await upload('user-manual', 'User manual, RF exposure', MANUAL);
    expect((await item('manual-separation-stated')).status).toBe('pass');
  });

  it('evidence-present: removing the label drawing names it', async () => {
    const label = (await engineer.get(`/api/filings/${id}/evidence`)).body.records.find((r: { category: string }) => r.category === 'label-drawing');
    await remove(label.id);
    const i = await item('evidence-present');
    expect(i.status).toBe('fail');
    expect(texts(i)).toBe('Nothing filed under “Label drawing”.');
    await upload('label-drawing', 'Label drawing', [['Label drawing', 'KH3-LTE']]);
    expect((await item('evidence-present')).status).toBe('pass');
  });

  it('hotspot-edges: an edge within 25 mm that no hotspot position tests blocks signing (KDB 941225 D06)', async () => {
    const drawing = await upload('antenna-drawing', 'Antenna drawing rev B', [['Antenna locations', 'ANT1: left edge 12 mm']]);
    const i = await item('hotspot-edges');
    expect(i).toMatchObject({ status: 'fail', severity: 'blocks-signing', step: 'use-positions' });
    expect(texts(i)).toMatch(/The left edge is 12 mm from ANT1 and no hotspot use position tests it \(give one an id naming the edge, such as “hotspot-left”\)/);
    await remove(drawing);
    expect((await item('hotspot-edges')).status).toBe('pass');
  });

  it('hotspot-edges: the transmitters on an antenna near a tested edge must be measured there', async () => {
    await putMeasurements([GOOD_MEASUREMENTS()[1]]);
    const i = await item('hotspot-edges');
    expect(i.status).toBe('fail');
    expect(texts(i)).toMatch(/LTE-B12 at hotspot “hotspot-top” \(top edge, 8 mm from ANT1\) needs SAR and has no measurement/);
    await putMeasurements(GOOD_MEASUREMENTS());
    expect((await item('hotspot-edges')).status).toBe('pass');
  });

  it('hotspot-edge-distances: a drawing that is only a picture (no text) leaves the distances unknown', async () => {
    const drawing = (await engineer.get(`/api/filings/${id}/evidence`)).body.records.find((r: { category: string }) => r.category === 'antenna-drawing');
    await remove(drawing.id);
    await upload('antenna-drawing', 'Antenna sketch', [['Antenna sketch (see figure)']]);
    const i = await item('hotspot-edge-distances');
    expect(i).toMatchObject({ status: 'fail', severity: 'warning', step: 'evidence' });
    expect(texts(i)).toBe('The antenna drawing gives no edge distance for ANT1.');
    await upload('antenna-drawing', 'Antenna location drawing', DRAWING);
    expect((await item('hotspot-edge-distances')).status).toBe('pass');
    expect((await checklist()).ready).toBe(true);
  });
});

describe('reading the documents’ text', () => {
  it('finds the separations a manual states, in mm or cm, English or French, with the condition it names', () => {
    const found = manualSeparationStatements([
      'RF exposure\nHotspot use: keep at least 1 cm between the device and the body.\nDimensions: 120 mm × 60 mm',
      'Exposition aux RF\nGardez l’appareil à au moins 15 mm du corps.',
    ]);
    expect(found.map((s) => [s.kind, s.separationMm, s.page])).toEqual([
      ['hotspot', 10, 1],
      [null, 15, 2],
    ]);
  });

  it('finds antenna-to-edge distances on one line or under an antenna heading, and ignores other antennas’ names', () => {
    const found = antennaEdgeDistances(['ANT-MAIN: top edge 6 mm, left edge 3.1 cm\nANT-DIV\nBottom edge: 9 mm\nRight 40 mm'], ['ANT-MAIN', 'ANT-DIV', 'ANT']);
    expect(found.map((e) => [e.antennaId, e.edge, e.distanceMm])).toEqual([
      ['ANT-MAIN', 'top', 6],
      ['ANT-MAIN', 'left', 31],
      ['ANT-DIV', 'bottom', 9],
      ['ANT-DIV', 'right', 40],
    ]);
  });
});
