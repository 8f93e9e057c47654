/**
 * lab-results — a small hand-computed filing. Sources of each expected figure:
 * - Reported SAR = measured SAR × 10^((P_tune-up − P_meas)/10) × DC_max/DC_test, never scaled
 *   down: FCC KDB 447498 D01 v06 / KDB 865664 D01 v01r04 (from memory); duty cycle: common practice.
 * - Limits: 47 CFR §1.1310 (1.6 W/kg over 1 g, head/trunk); 1999/519/EC Annex II (2.0 W/kg over 10 g).
 * - Repeats: KDB 865664 D01 §2.8.1 (≥ 0.80 W/kg repeat once; from memory).
 * - Liquid targets IEEE Std 1528-2013 Table 3 with linear interpolation, ±5 % (KDB 865664 D01,
 *   from memory): 1880 MHz → εr 40.0, σ 1.40; 2437 MHz → εr 39.226, σ 1.78873.
 * - System check ±10 %, drift ±5 % (IEEE 1528-2013 / KDB 865664 D01, from memory).
 * - Co-transmission: KDB 447498 D01 v06 §4.3.2 — Σ SAR ≤ 1.6; estimated SAR = (P/d)·√f/7.5;
 *   SPLSR = (SAR₁+SAR₂)^1.5/R ≤ 0.04 (from memory).
 * Every expected value below is worked by hand from these formulas in the comments.
 */
import { describe, expect, it } from 'vitest';
import { computeLabResults, labChecks, labResultsInput, type LabResultsInputRaw } from '../../calc/lab/lab-results';
import { runCalculation } from '../../calc/registry';

const screeningRow = (
  transmitterId: string,
  usePositionId: string,
  regime: 'fcc' | 'eu',
  result: 'exempt' | 'evaluate-sar',
  extra: Partial<{ frequencyHz: number; separationM: number; timeAveragedPowerMw: number }> = {},
) => ({
  transmitterId,
  usePositionId,
  regime,
  result,
  frequencyHz: extra.frequencyHz ?? 1.91e9,
  separationM: extra.separationM ?? 0,
  timeAveragedPowerMw: extra.timeAveragedPowerMw ?? 251,
  eirpMw: extra.timeAveragedPowerMw ?? 251,
  evaluatedPowerMw: extra.timeAveragedPowerMw ?? 251,
  thresholdMw: 10,
  thresholdErpW: null,
  thresholdEirpW: null,
  evaluatedPowerDensityWPerM2: null,
  thresholdPowerDensityWPerM2: null,
});

function filing(): LabResultsInputRaw {
  return {
    markets: [{ regime: 'fcc' }, { regime: 'eu' }],
    transmitters: [
      { id: 'WWAN', frequencyMinHz: 1.85e9, frequencyMaxHz: 1.91e9, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'A1' },
      { id: 'WLAN', frequencyMinHz: 2.412e9, frequencyMaxHz: 2.462e9, maxTuneUpPowerDbm: 18, dutyCycle: 1, antennaId: 'A2' },
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
    screening: [
      screeningRow('WWAN', 'P-HEAD', 'fcc', 'evaluate-sar'),
      screeningRow('WWAN', 'P-HEAD', 'eu', 'evaluate-sar'),
      screeningRow('WLAN', 'P-HEAD', 'fcc', 'evaluate-sar'),
      screeningRow('WLAN', 'P-HEAD', 'eu', 'evaluate-sar'),
      screeningRow('WWAN', 'P-HS', 'fcc', 'evaluate-sar'),
      screeningRow('WWAN', 'P-HS', 'eu', 'evaluate-sar'),
      // 18 dBm = 63.1 mW at 2.462 GHz and 10 mm: estimated 1-g SAR (63.1/10)·√2.462/7.5 = 1.32011 W/kg.
      screeningRow('WLAN', 'P-HS', 'fcc', 'exempt', { frequencyHz: 2.462e9, separationM: 0.01, timeAveragedPowerMw: 63.1 }),
      screeningRow('WLAN', 'P-HS', 'eu', 'exempt', { frequencyHz: 2.462e9, separationM: 0.01, timeAveragedPowerMw: 63.1 }),
    ],
    measurements: [
      // 24 − 23.2 = 0.8 dB → ×1.202264; 0.92 → 1.106083 W/kg (1 g), 0.55 → 0.661245 W/kg (10 g).
      {
        id: 'M1',
        transmitterId: 'WWAN',
        usePositionId: 'P-HEAD',
        testPosition: 'left cheek',
        channel: '9400',
        frequencyHz: 1.88e9,
        testSeparationM: 0,
        measuredPowerDbm: 23.2,
        sar1gWPerKg: 0.92,
        sar10gWPerKg: 0.55,
        repeatSarWPerKg: [0.9],
        driftDb: -0.05,
        testDate: '2026-10-12',
        peakXMm: 10,
        peakYMm: 20,
        liquidCheckId: 'L1',
        systemCheckId: 'S1',
      },
      // 0.5 dB → ×1.122018, duty 1/0.98 → ×1.020408: ×1.144917; 0.40 → 0.457967, 0.20 → 0.228983.
      {
        id: 'M2',
        transmitterId: 'WLAN',
        usePositionId: 'P-HEAD',
        testPosition: 'left cheek',
        channel: '6',
        frequencyHz: 2.437e9,
        testSeparationM: 0,
        measuredPowerDbm: 17.5,
        tuneUpPowerDbm: 18,
        testDutyCycle: 0.98,
        sar1gWPerKg: 0.4,
        sar10gWPerKg: 0.2,
        driftDb: 0.1,
        testDate: '2026-10-12',
        peakXMm: 40,
        peakYMm: 20,
        liquidCheckId: 'L2',
        systemCheckId: 'S1',
      },
      // Measured 24.5 dBm above the 24 dBm tune-up: blocking, scale 1. Drift 0.3 dB = +7.15 % > 5 %.
      {
        id: 'M3',
        transmitterId: 'WWAN',
        usePositionId: 'P-HS',
        testPosition: 'back, 10 mm',
        channel: '9400',
        frequencyHz: 1.88e9,
        testSeparationM: 0.01,
        measuredPowerDbm: 24.5,
        sar1gWPerKg: 1.2,
        sar10gWPerKg: 0.7,
        driftDb: 0.3,
        testDate: '2026-10-13',
        peakXMm: 10,
        peakYMm: 20,
        liquidCheckId: 'L1',
        systemCheckId: 'S1',
      },
    ],
    liquidChecks: [
      { id: 'L1', date: '2026-10-12', frequencyHz: 1.88e9, relativePermittivity: 41.0, conductivitySPerM: 1.45, temperatureC: 21.5 },
      // σ 1.90 against 1.78873 = +6.22 % > 5 %.
      { id: 'L2', date: '2026-10-12', frequencyHz: 2.437e9, relativePermittivity: 39.5, conductivitySPerM: 1.9, temperatureC: 21.0 },
    ],
    systemChecks: [{ id: 'S1', date: '2026-10-12', frequencyHz: 1.9e9, dipoleSerial: 'D1900-118', averagingMass: '1g', measuredSarWPerKgPerW: 40.2, targetSarWPerKgPerW: 39.6 }],
    instruments: [
      { id: 'PRB', kind: 'probe', serial: 'EP-3391', calibrationDate: '2026-03-01', dueDate: '2027-03-01' },
      { id: 'DAE', kind: 'dae', serial: 'DA-771', calibrationDate: '2025-09-01', dueDate: '2026-09-01' },
    ],
  };
}

const run = (raw: LabResultsInputRaw = filing()) => computeLabResults(labResultsInput.parse(raw));

describe('lab-results: reported SAR and margins (KDB 447498 / 865664 scaling, 47 CFR §1.1310, 1999/519/EC)', () => {
  const r = run();
  const row = (id: string) => r.rows.find((x) => x.measurementId === id)!;

  it('scales to the transmitter’s tune-up power when the row gives none', () => {
    expect(row('M1').tuneUpPowerDbm).toBe(24);
    expect(row('M1').tuneUpFromTransmitter).toBe(true);
    expect(row('M1').scalingFactor).toBeCloseTo(1.202264, 6);
    expect(row('M1').reportedSar1gWPerKg).toBeCloseTo(1.106083, 6);
    expect(row('M1').reportedSar10gWPerKg).toBeCloseTo(0.661245, 6);
  });

  it('multiplies in max/test duty cycle when the test duty cycle is lower', () => {
    expect(row('M2').dutyCycleScalingFactor).toBeCloseTo(1.020408, 6);
    expect(row('M2').scalingFactor).toBeCloseTo(1.144917, 6);
    expect(row('M2').reportedSar1gWPerKg).toBeCloseTo(0.457967, 6);
  });

  it('gives the margin to each market’s limit at that limit’s averaging mass', () => {
    const [fcc, eu] = row('M1').margins;
    // 10·log10(1.6/1.106083) = 1.6033 dB; 10·log10(2.0/0.661245) = 4.8067 dB.
    expect(fcc).toMatchObject({ regime: 'fcc', averagingMassKg: 0.001, limitWPerKg: 1.6 });
    expect(fcc.marginDb).toBeCloseTo(1.6033, 4);
    expect(eu).toMatchObject({ regime: 'eu', averagingMassKg: 0.01, limitWPerKg: 2 });
    expect(eu.marginDb).toBeCloseTo(4.8067, 4);
  });

  it('never scales down: a measured power above the tune-up limit is a blocking flag', () => {
    expect(row('M3').scalingFactor).toBe(1);
    const flag = row('M3').flags.find((f) => f.kind === 'power')!;
    expect(flag).toMatchObject({ status: 'fail', blocking: true });
    expect(flag.howToFix).toMatch(/tune-up/);
  });

  it('the highest reported SAR per market × condition names the row it came from', () => {
    const fccHead = r.highest.find((h) => h.regime === 'fcc' && h.usePositionKind === 'head')!;
    expect(fccHead).toMatchObject({ measurementId: 'M1', transmitterId: 'WWAN', usePositionId: 'P-HEAD', limitWPerKg: 1.6, averagingMassKg: 0.001 });
    expect(fccHead.reportedSarWPerKg).toBeCloseTo(1.106083, 6);
    const euHotspot = r.highest.find((h) => h.regime === 'eu' && h.usePositionKind === 'hotspot')!;
    expect(euHotspot).toMatchObject({ measurementId: 'M3', reportedSarWPerKg: 0.7, limitWPerKg: 2 });
    // Only the conditions the device has: no body-worn or extremity use positions here.
    expect(r.highest.map((h) => h.usePositionKind)).toEqual(['head', 'hotspot', 'head', 'hotspot']);
  });
});

describe('lab-results: checks (IEEE 1528-2013 / KDB 865664 D01 tolerances, from memory)', () => {
  const r = run();
  const byId = (id: string) => r.checks.find((c) => c.id === id);

  it('liquid εr and σ against the interpolated target, ±5 %', () => {
    expect(byId('liquid:L1')).toMatchObject({ status: 'pass' });
    const l2 = byId('liquid:L2')!;
    expect(l2).toMatchObject({ status: 'fail', blocking: true, tolerance: '±5 % of target, each of εr and σ' });
    expect(l2.value).toContain('+6.2 %');
    expect(l2.source).toMatch(/IEEE Std 1528-2013/);
    // The measurement that relied on it carries the flag too, but the check is listed once.
    expect(r.rows.find((x) => x.measurementId === 'M2')!.flags.some((f) => f.kind === 'liquid' && f.status === 'fail')).toBe(true);
    expect(r.checks.filter((c) => c.kind === 'liquid' && c.status === 'fail')).toHaveLength(1);
  });

  it('system check +1.5 % passes ±10 %; drift +0.3 dB (+7.2 %) fails ±5 %', () => {
    expect(byId('system-check:S1')).toMatchObject({ status: 'pass' });
    expect(byId('drift:M3')).toMatchObject({ status: 'fail', blocking: true });
    expect(byId('drift:M1')).toMatchObject({ status: 'pass' });
  });

  it('an instrument out of calibration on a test date fails, naming the dates', () => {
    const dae = byId('calibration:DAE')!;
    expect(dae.status).toBe('fail');
    expect(dae.message).toContain('2026-10-12, 2026-10-13');
    expect(byId('calibration:PRB')).toMatchObject({ status: 'pass' });
  });

  it('repeats: M1 at 0.92 W/kg needs one repeat and has it (0.92/0.90 = 1.02 ≤ 1.20); M3 at 1.2 W/kg has none', () => {
    expect(byId('repeats:M1')).toBeUndefined(); // M3 is the highest WWAN 1 g value, so it decides
    const m3 = byId('repeats:M3')!;
    expect(m3).toMatchObject({ status: 'fail', blocking: true });
    const one = run({ ...filing(), measurements: filing().measurements.slice(0, 2) });
    expect(one.checks.find((c) => c.id === 'repeats:M1')).toMatchObject({ status: 'pass' });
    expect(one.rows[0].repeats).toMatchObject({ repeatsRequired: 1, repeatsDone: 1, nextRepeatRequired: false });
  });

  it('uncertainty: not required below 1.5 W/kg (1 g), required at or above it', () => {
    expect(r.uncertainty.required).toBe(false);
    const high = filing();
    high.measurements[2].sar1gWPerKg = 1.5;
    const hr = run(high);
    expect(hr.uncertainty.required).toBe(true);
    expect(hr.checks.find((c) => c.kind === 'uncertainty')).toMatchObject({ status: 'fail', blocking: true });
    // JCGM 100:2008: u = √((3/√3)² + 2²) = √7 = 2.6458 %, U = 5.2915 % (k = 2).
    high.uncertainty = [
      { name: 'probe calibration', valuePct: 3, distribution: 'rectangular', sensitivity: 1 },
      { name: 'positioning', valuePct: 2, distribution: 'normal', sensitivity: 1 },
    ];
    const withBudget = run(high);
    expect(withBudget.uncertainty.combinedStandardPct).toBeCloseTo(2.6458, 4);
    expect(withBudget.uncertainty.expandedPct).toBeCloseTo(5.2915, 4);
    expect(withBudget.checks.find((c) => c.kind === 'uncertainty')).toMatchObject({ status: 'pass' });
  });

  it('test separation farther than the use position is a blocking flag', () => {
    const far = filing();
    far.measurements[2].testSeparationM = 0.015;
    expect(run(far).checks.find((c) => c.id === 'separation:M3')).toMatchObject({ status: 'fail', blocking: true });
  });

  it('coverage: every combination screening sends to SAR has a measurement', () => {
    expect(r.coverage.find((c) => c.transmitterId === 'WWAN' && c.usePositionId === 'P-HS')).toMatchObject({ status: 'measured', measurementIds: ['M3'] });
    expect(r.coverage.find((c) => c.transmitterId === 'WLAN' && c.usePositionId === 'P-HS')).toMatchObject({ status: 'not-required' });
    const missing = run({ ...filing(), measurements: filing().measurements.slice(0, 1) });
    expect(missing.checks.find((c) => c.id === 'coverage:WLAN@P-HEAD')).toMatchObject({ status: 'fail', blocking: true });
  });

  it('a frequency outside the transmitter’s band names a combination that does not exist', () => {
    const wrong = filing();
    wrong.measurements[0].frequencyHz = 2.437e9;
    expect(run(wrong).checks.find((c) => c.id === 'band:M1')).toMatchObject({ status: 'fail', blocking: true });
  });

  it('labChecks() gives the same checks for the readiness rules', () => {
    expect(labChecks(filing()).map((c) => c.id)).toEqual(r.checks.map((c) => c.id));
  });
});

describe('lab-results: co-transmission (KDB 447498 D01 v06 §4.3.2, from memory)', () => {
  it('head, FCC: 1.106083 + 0.457967 = 1.564050 W/kg ≤ 1.6 — sum within limit', () => {
    const r = run();
    const c = r.coTransmission.find((x) => x.usePositionId === 'P-HEAD' && x.regime === 'fcc')!;
    expect(c.sum).toBeCloseTo(1.56405, 5);
    expect(c.outcome).toBe('sum-within-limit');
  });

  it('hotspot, FCC: an exempt transmitter adds its estimated SAR 1.32011 W/kg; 1.2 + 1.32011 > 1.6 with no peak → simultaneous measurement', () => {
    const r = run();
    const c = r.coTransmission.find((x) => x.usePositionId === 'P-HS' && x.regime === 'fcc')!;
    expect(c.contributions.find((x) => x.transmitterId === 'WLAN')).toMatchObject({ basis: 'estimated' });
    expect(c.contributions.find((x) => x.transmitterId === 'WLAN')!.value).toBeCloseTo(1.32011, 4);
    expect(c.sum).toBeCloseTo(2.52011, 4);
    expect(c.outcome).toBe('needs-simultaneous-measurement');
  });

  it('a combination of one use position only is summed there and nowhere else; numbering goes on after the every-position groups', () => {
    const raw = { ...filing(), simultaneous: [], simultaneousAt: [{ usePositionId: 'P-HEAD', transmitterIds: ['WWAN', 'WLAN'] }] };
    const r = run(raw);
    expect(r.coTransmission.map((c) => c.id)).toEqual(['G1@P-HEAD@fcc', 'G1@P-HEAD@eu']);
    // The same figures as the every-position group in P-HEAD: 1.106083 + 0.457967 = 1.564050 W/kg ≤ 1.6.
    expect(r.coTransmission[0].sum).toBeCloseTo(1.56405, 5);
    const both = run({ ...filing(), simultaneousAt: [{ usePositionId: 'P-HS', transmitterIds: ['WWAN', 'WLAN'] }] });
    expect(both.coTransmission.map((c) => c.id)).toEqual(['G1@P-HEAD@fcc', 'G1@P-HEAD@eu', 'G1@P-HS@fcc', 'G1@P-HS@eu', 'G2@P-HS@fcc', 'G2@P-HS@eu']);
  });

  it('hotspot with both measured: 1.2 + 0.6 = 1.8 > 1.6; SPLSR 1.8^1.5/70 mm = 0.0345 → 0.03 ≤ 0.04', () => {
    const raw = filing();
    raw.measurements.push({
      id: 'M4',
      transmitterId: 'WLAN',
      usePositionId: 'P-HS',
      frequencyHz: 2.437e9,
      testSeparationM: 0.01,
      measuredPowerDbm: 18,
      sar1gWPerKg: 0.6,
      driftDb: 0,
      testDate: '2026-10-13',
      peakXMm: 80,
      peakYMm: 20,
    });
    const c = run(raw).coTransmission.find((x) => x.usePositionId === 'P-HS' && x.regime === 'fcc')!;
    expect(c.sum).toBeCloseTo(1.8, 9);
    expect(c.pairs[0].distanceMm).toBeCloseTo(70, 9);
    expect(c.pairs[0].splsr).toBeCloseTo(0.034499, 5);
    expect(c.outcome).toBe('splsr-within-limit');
  });
});

describe('lab-results through the registry', () => {
  it('runs as `lab-results` and refuses measurements for unknown transmitters, naming them', () => {
    const ok = runCalculation('lab-results', filing());
    expect(ok.ok).toBe(true);
    const bad = filing();
    bad.measurements[0].transmitterId = 'NOPE';
    const res = runCalculation('lab-results', bad);
    expect(res.ok).toBe(false);
    if (!res.ok) expect(res.error.issues[0]).toMatchObject({ path: ['measurements', 0, 'transmitterId'] });
  });
});
