/**
 * Screening (calc/screening) — sources:
 * - 47 CFR §1.1307(b)(3)(i)(A)–(C) (FCC 19-126), FCC KDB 447498 D01 v06 §4.3.1–4.3.2, RSS-102 Issue 5
 *   §2.5.1 Table 1 and §2.5.2, EN 62479:2010 Annex A, 1999/519/EC Annex III (= ICNIRP 1998), ICNIRP
 *   2020 Table 5, FCC OET Bulletin 65 Eq. (3);
 * - worked values of those formulas (python3) (#1–#4, #7, #11, #13, #15, #17–#19, #22), reproduced through whole-device
 *   screening;
 * - hand arithmetic shown in the comments (python3 to the digits printed).
 * Each row's threshold is also checked against the engine function it comes from (calc/limits).
 * The demo device is fictional: a rugged handheld tracker with LTE, Wi-Fi 2.4/5 GHz and Bluetooth LE.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  HEAD_STACK,
  LIMB_STACK,
  TRUNK_STACK,
  tissueStackFor,
  screenDevice,
  screeningDepthProfile,
  SCREENING_MIN_DISTANCE_M,
  summarizeScreening,
  type ScreeningInputRaw,
  type ScreeningOutput,
  type ScreeningRow,
} from '../../calc/screening';
import { exposureLimit, fccMpeThresholdErpW, fccSarThresholdMw, isedRfExemptionEirpW, isedSarExemptionMw, kdbExclusionThreshold } from '../../calc/limits';
import { planeWaveLayers } from '../../calc/em';
import { runCalculation } from '../../calc/registry';
import { RULE_SET_VERSION, ruleSetWarnings } from '../../calc/versions';

const everyMarket = [
  { regime: 'fcc', tier: 'general' },
  { regime: 'ised', tier: 'general' },
  { regime: 'eu', tier: 'general' },
  { regime: 'icnirp-2020', tier: 'general' },
] as const;

const sep = (separationM: number, antennas = ['ant-lte', 'ant-wlan', 'ant-bt']) => antennas.map((antennaId) => ({ antennaId, separationM }));

/** Demo device (fictional). ble has no separation at the hotspot position: a gap. */
const DEMO: ScreeningInputRaw = {
  markets: [...everyMarket],
  antennas: [
    { id: 'ant-lte', gainDbi: -1.5 },
    { id: 'ant-wlan', gainDbi: 2.5 },
    { id: 'ant-bt', gainDbi: 0 },
  ],
  transmitters: [
    { id: 'lte-low', technology: 'LTE', band: 'B12/B13', frequencyMinHz: 699e6, frequencyMaxHz: 787e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ant-lte' },
    // One PA path over bands 11/21 and 3: the band straddles 1.5 GHz.
    { id: 'lte-mid', technology: 'LTE', band: 'B11/B21/B3', frequencyMinHz: 1427.9e6, frequencyMaxHz: 1785e6, maxTuneUpPowerDbm: 23.5, dutyCycle: 1, antennaId: 'ant-lte' },
    { id: 'wifi-2g4', technology: 'Wi-Fi', band: '2.4 GHz', frequencyMinHz: 2412e6, frequencyMaxHz: 2472e6, maxTuneUpPowerDbm: 18, dutyCycle: 0.95, antennaId: 'ant-wlan' },
    { id: 'wifi-5g', technology: 'Wi-Fi', band: '5 GHz', frequencyMinHz: 5150e6, frequencyMaxHz: 5850e6, maxTuneUpPowerDbm: 16, dutyCycle: 0.9, antennaId: 'ant-wlan' },
    { id: 'ble', technology: 'Bluetooth LE', band: '2.4 GHz', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 0, dutyCycle: 0.7, antennaId: 'ant-bt' },
  ],
  usePositions: [
    { id: 'head-0', kind: 'head', separations: sep(0) },
    { id: 'head-5', kind: 'head', separations: sep(0.005) },
    { id: 'body-0', kind: 'body-worn', separations: sep(0) },
    { id: 'body-5', kind: 'body-worn', separations: sep(0.005) },
    { id: 'belt-3', kind: 'body-worn', separations: sep(0.003) },
    { id: 'hand-3', kind: 'extremity', separations: sep(0.003) },
    { id: 'hotspot-10', kind: 'hotspot', separations: sep(0.01, ['ant-lte', 'ant-wlan']) },
    { id: 'desk-20', kind: 'far-field', separations: sep(0.2) },
  ],
};

const withMarkets = (markets: ScreeningInputRaw['markets'], input: ScreeningInputRaw = DEMO): ScreeningInputRaw => ({ ...input, markets });

function rowOf(out: ScreeningOutput, transmitterId: string, usePositionId: string, regime: ScreeningRow['regime']): ScreeningRow {
  const row = out.rows.find((r) => r.transmitterId === transmitterId && r.usePositionId === usePositionId && r.regime === regime);
  if (!row) throw new Error(`no row ${transmitterId} @ ${usePositionId} ${regime}`);
  return row;
}

const demo = screenDevice(DEMO);
const demoKdb = screenDevice(withMarkets([{ regime: 'fcc', tier: 'general', fccSarScreening: 'kdb-test-exclusion' }]));

// Time-averaged powers (hand arithmetic):
//   lte-low  24 dBm × 1    = 251.189 mW; EIRP ×10^(−0.15) = 177.828 mW; ERP = 177.828/10^0.215 = 108.393 mW
//   lte-mid  23.5 dBm × 1  = 223.872 mW; EIRP 158.489 mW; ERP 96.605 mW
//   wifi-2g4 18 dBm × 0.95 = 63.0957 × 0.95 = 59.941 mW; EIRP ×10^0.25 = 106.592 mW; ERP 64.972 mW
//   wifi-5g  16 dBm × 0.9  = 39.8107 × 0.9 = 35.830 mW; EIRP 63.715 mW
//   ble      0 dBm × 0.7   = 0.700 mW; EIRP = ERP·1.64 = 0.700 mW (0 dBi)

describe('screening: demo device, evaluated power (tune-up × duty cycle; ERP = EIRP − 2.15 dB)', () => {
  it('wifi-2g4: P_avg 59.941 mW, EIRP 106.592 mW, ERP 64.972 mW (hand arithmetic above; IEEE Std 145-2013 half-wave dipole gain 2.15 dBi)', () => {
    const { powers } = rowOf(demo, 'wifi-2g4', 'head-5', 'fcc');
    expect(powers.tuneUpPowerMw).toBeCloseTo(63.0957, 4);
    expect(powers.timeAveragedPowerMw).toBeCloseTo(59.941, 3);
    expect(powers.eirpMw).toBeCloseTo(106.592, 3);
    expect(powers.erpMw).toBeCloseTo(64.972, 3);
  });
});

describe('screening: FCC §1.1307(b)(3)(i) on the demo device', () => {
  it('(B) wifi-2g4 at the head, 5 mm: most restrictive 2.472 GHz, P_th = 2.7243 mW, ERP compared (greater than P_avg)', () => {
    // ERP_20cm = 3060 mW (f ≥ 1.5 GHz); x = −log10(60/(3060·√2.472)) = 1.904094;
    // P_th = 3060·(0.5/20)^1.904094 = 2.72426 mW (an FCC filing exhibit prints 2.72 (2.717) at 2.48 GHz: consistent).
    const row = rowOf(demo, 'wifi-2g4', 'head-5', 'fcc');
    expect(row.method).toBe('fcc-sar-exemption');
    expect(row.frequencyHz).toBe(2.472e9);
    expect(row.thresholdMw).toBe(fccSarThresholdMw(2.472e9, 0.005));
    expect(row.thresholdMw).toBeCloseTo(2.7243, 4);
    expect(row.evaluatedPowerMw).toBeCloseTo(64.972, 3); // ERP > P_avg 59.941 mW
    expect(row.result).toBe('evaluate-sar');
    expect(row.marginDb).toBeCloseTo(10 * Math.log10(2.72426 / 64.972), 3); // −13.775 dB
    expect(row.derivation.source).toContain('§1.1307(b)(3)(i)(B)');
    expect(row.derivation.intermediate.exponentX.value).toBeCloseTo(1.904094, 6);
  });

  it('band straddling 1.5 GHz (lte-mid 1427.9–1785 MHz, hotspot 10 mm): 1.5 GHz is a candidate and the reported threshold is the minimum over the candidates', () => {
    // P_th at 1 cm: 1427.9 MHz: ERP_20cm = 2040·1.4279 = 2912.9 mW, x = 1.763526 → 14.789 mW;
    // 1500 MHz: 3060 mW, x = 1.795616 → 14.111 mW; 1785 MHz: x = 1.833389 → 12.602 mW.
    const row = rowOf(demo, 'lte-mid', 'hotspot-10', 'fcc');
    expect(row.candidates.map((c) => c.frequencyHz)).toEqual([1427.9e6, 1.5e9, 1785e6]);
    const thresholds = row.candidates.map((c) => fccSarThresholdMw(c.frequencyHz, 0.01));
    expect(thresholds.map((t) => +t.toFixed(3))).toEqual([14.789, 14.111, 12.602]);
    expect(row.thresholdMw).toBe(Math.min(...thresholds));
    expect(row.frequencyHz).toBe(1785e6);
    expect(row.candidates.map((c) => c.threshold)).toEqual(thresholds);
    expect(row.evaluatedPowerMw).toBeCloseTo(223.872, 3); // P_avg > ERP 96.605 mW
    expect(row.marginDb).toBeCloseTo(10 * Math.log10(12.6016 / 223.872), 3);
  });

  it('separation 0 mm: (B) covers 0.5–40 cm, so no exemption — evaluate SAR, no threshold, and the note says so (conservative; 0.5 cm is common practice)', () => {
    const row = rowOf(demo, 'lte-mid', 'head-0', 'fcc');
    expect(row.method).toBe('fcc-sar-exemption');
    expect(row.result).toBe('evaluate-sar');
    expect(row.thresholdMw).toBeNull();
    expect(row.marginDb).toBeNull();
    const notes = row.derivation.notes.join(' ');
    expect(notes).toMatch(/0\.5–40 cm/);
    expect(notes).toMatch(/common practice, not the rule text/);
  });

  it('(A) 1 mW: ble P_avg = 0.7 mW is exempt at every position, margin 10·log10(1/0.7) = 1.549 dB', () => {
    const rows = demo.rows.filter((r) => r.transmitterId === 'ble' && r.regime === 'fcc');
    expect(rows).toHaveLength(7);
    for (const row of rows) {
      expect(row.method).toBe('fcc-1mw');
      expect(row.result).toBe('exempt');
      expect(row.thresholdMw).toBe(1);
      expect(row.marginDb).toBeCloseTo(1.549, 3);
      expect(row.derivation.source).toBe('47 CFR §1.1307(b)(3)(i)(A)');
    }
  });

  it('(C) far-field lte-low at 20 cm: ERP_th = 0.0128·R²·f = 0.0128·0.04·699 = 0.357888 W at the band’s low edge; ERP 0.108393 W → exempt, 5.187 dB', () => {
    const row = rowOf(demo, 'lte-low', 'desk-20', 'fcc');
    expect(row.method).toBe('fcc-mpe-exemption');
    expect(row.frequencyHz).toBe(699e6);
    expect(row.thresholdErpW).toBe(fccMpeThresholdErpW(699e6, 0.2));
    expect(row.thresholdErpW).toBeCloseTo(0.357888, 6);
    expect(row.evaluatedPowerMw).toBeCloseTo(108.393, 3);
    expect(row.result).toBe('exempt');
    expect(row.marginDb).toBeCloseTo(5.187, 3);
  });

  it('(C) closer than λ/2π (far-field position at 5 cm, 699 MHz: λ/2π = 6.826 cm): not exempt by (C), evaluate MPE, and why', () => {
    const out = screenDevice({ ...withMarkets([{ regime: 'fcc', tier: 'general' }]), usePositions: [{ id: 'close', kind: 'far-field', separations: sep(0.05) }] });
    const row = rowOf(out, 'lte-low', 'close', 'fcc');
    expect(row.result).toBe('evaluate-mpe');
    expect(row.thresholdErpW).toBeNull();
    expect(row.derivation.notes.join(' ')).toMatch(/λ\/2π = 6\.82\d* cm/);
  });
});

describe('screening: FCC KDB 447498 D01 v06 §4.3.1 test exclusion (market choice)', () => {
  it('3 mm is taken as 5 mm: wifi-2g4 threshold 3.0·5/√2.472 = 9.5404 mW, the same as at 5 mm', () => {
    const row = rowOf(demoKdb, 'wifi-2g4', 'belt-3', 'fcc');
    expect(row.method).toBe('kdb-447498-exclusion');
    expect(row.thresholdMw).toBe(kdbExclusionThreshold(2.472e9, 0.005).thresholdMw);
    expect(row.thresholdMw).toBeCloseTo(9.5404, 4);
    expect(row.thresholdMw).toBe(rowOf(demoKdb, 'wifi-2g4', 'body-5', 'fcc').thresholdMw);
    expect(row.derivation.intermediate.separationUsedMm.value).toBe(5);
    expect(row.derivation.notes.join(' ')).toMatch(/under 5 mm: §4\.1 f\) takes it as 5 mm/);
    expect(row.evaluatedPowerMw).toBeCloseTo(59.941, 3); // time-averaged power, not ERP
    expect(row.result).toBe('evaluate-sar');
  });

  it('extremity kind uses the 10-g ratio 7.5: 7.5·5/√2.472 = 23.851 mW', () => {
    const row = rowOf(demoKdb, 'wifi-2g4', 'hand-3', 'fcc');
    expect(row.thresholdMw).toBe(kdbExclusionThreshold(2.472e9, 0.003, true).thresholdMw);
    expect(row.thresholdMw).toBeCloseTo(23.851, 3);
  });

  it('§4.3.2 estimated SAR of an excluded transmitter, highest over the band: ble (0.7/5)·√2.48/7.5 = 0.029396 W/kg, extremity /18.75 = 0.011759 W/kg; none when not excluded', () => {
    const body = rowOf(demoKdb, 'ble', 'belt-3', 'fcc');
    expect(body.result).toBe('exempt');
    expect(body.method).toBe('kdb-447498-exclusion'); // (A) is not mixed into the legacy procedure
    expect(body.estimatedSarWPerKg).toBeCloseTo(0.029396, 6);
    expect(rowOf(demoKdb, 'ble', 'hand-3', 'fcc').estimatedSarWPerKg).toBeCloseTo(0.011759, 6);
    expect(rowOf(demoKdb, 'wifi-2g4', 'belt-3', 'fcc').estimatedSarWPerKg).toBeNull();
  });
});

describe('screening: ISED RSS-102 Issue 5 on the demo device', () => {
  it('§2.5.1 Table 1, wifi-2g4 hotspot 10 mm: e.i.r.p. compared (higher than conducted), candidates 2412/2450/2472 MHz, P_th 6.979 mW at 2472 MHz', () => {
    // Interpolation between 2450 MHz (7 mW) and 3500 MHz (6 mW) at 10 mm: 7 + (22/1050)·(6 − 7) = 6.97905 mW;
    // at 2412 MHz between 1900 (10) and 2450 (7): 10 − (512/550)·3 = 7.20727 mW.
    const row = rowOf(demo, 'wifi-2g4', 'hotspot-10', 'ised');
    expect(row.method).toBe('ised-sar-exemption');
    expect(row.candidates.map((c) => c.frequencyHz)).toEqual([2412e6, 2450e6, 2472e6]);
    expect(row.thresholdMw).toBe(isedSarExemptionMw(2.472e9, 0.01));
    expect(row.thresholdMw).toBeCloseTo(6.97905, 5);
    expect(row.evaluatedPowerMw).toBeCloseTo(106.592, 3);
    expect(row.result).toBe('evaluate-sar');
  });

  it('extremity kind: limb-worn Table 1 × 2.5 (RSS-102 Issue 5 §2.5.1 Table 1, from memory)', () => {
    const hand = rowOf(demo, 'ble', 'hand-3', 'ised');
    const belt = rowOf(demo, 'ble', 'belt-3', 'ised');
    expect(hand.thresholdMw).toBeCloseTo(2.5 * (belt.thresholdMw as number), 10);
    expect(hand.thresholdMw).toBe(isedSarExemptionMw(2.48e9, 0.003, true));
  });

  it('wifi-5g: Table 1 has no row above 5800 MHz, so 5.8–5.85 GHz is not covered — evaluate SAR even where the table part would be exempt (desk, 20 cm)', () => {
    const row = rowOf(demo, 'wifi-5g', 'desk-20', 'ised');
    expect(row.result).toBe('evaluate-sar');
    expect(row.method).toBe('no-applicable-rule');
    expect(row.candidates.some((c) => c.method === 'ised-sar-exemption' && c.result === 'exempt')).toBe(true);
    expect(row.derivation.notes.join(' ')).toMatch(/no row above 5800 MHz/);
  });
});

describe('screening: EU and ICNIRP 2020 on the demo device', () => {
  it('EN 62479 near-body: 20 mW (2 W/kg × 10 g) head/trunk, 40 mW (4 W/kg × 10 g) extremity; P_avg compared', () => {
    const head = rowOf(demo, 'wifi-2g4', 'head-0', 'eu');
    expect(head.method).toBe('en62479-low-power');
    expect(head.thresholdMw).toBe(20);
    expect(head.evaluatedPowerMw).toBeCloseTo(59.941, 3);
    expect(head.marginDb).toBeCloseTo(10 * Math.log10(20 / 59.941), 3); // −4.767 dB
    const hand = rowOf(demo, 'wifi-5g', 'hand-3', 'eu');
    expect(hand.thresholdMw).toBe(40);
    expect(hand.result).toBe('exempt'); // 35.830 mW ≤ 40 mW
    expect(hand.marginDb).toBeCloseTo(10 * Math.log10(40 / 35.8296), 3); // 0.478 dB
    expect(rowOf(demo, 'wifi-5g', 'hand-3', 'icnirp-2020').thresholdMw).toBe(40);
  });

  it('occupational tier uses the occupational restriction: 10 W/kg × 10 g = 100 mW (2013/35/EU, ICNIRP 2020)', () => {
    const out = screenDevice(
      withMarkets([
        { regime: 'eu', tier: 'occupational' },
        { regime: 'icnirp-2020', tier: 'occupational' },
      ]),
    );
    expect(rowOf(out, 'wifi-2g4', 'head-5', 'eu').thresholdMw).toBe(100);
    expect(rowOf(out, 'wifi-2g4', 'head-5', 'icnirp-2020').thresholdMw).toBe(100);
  });

  it('far field: S = EIRP/(4πR²) vs the reference level — wifi-2g4 at 20 cm: 0.106592/(4π·0.04) = 0.21206 W/m² vs 10 W/m² → 16.7355 dB (1999/519/EC = ICNIRP 1998)', () => {
    const row = rowOf(demo, 'wifi-2g4', 'desk-20', 'eu');
    expect(row.method).toBe('eu-reference-level');
    expect(row.evaluatedPowerDensityWPerM2).toBeCloseTo(0.21206, 5);
    expect(row.thresholdPowerDensityWPerM2).toBe(10);
    expect(row.marginDb).toBeCloseTo(16.7355, 4);
    expect(row.evaluatedPowerMw).toBeCloseTo(106.592, 3); // the EIRP behind S
  });

  it('far field, ICNIRP 2020 Table 5: lte-low at its low edge, S_RL = f/200 = 3.495 W/m²; wifi-5g 0.12676 W/m² vs 10 W/m² → 18.970 dB', () => {
    const low = rowOf(demo, 'lte-low', 'desk-20', 'icnirp-2020');
    expect(low.frequencyHz).toBe(699e6);
    expect(low.thresholdPowerDensityWPerM2).toBe(exposureLimit(699e6, 'icnirp-2020', 'general').powerDensityWPerM2);
    expect(low.thresholdPowerDensityWPerM2).toBeCloseTo(3.495, 3);
    const five = rowOf(demo, 'wifi-5g', 'desk-20', 'icnirp-2020');
    expect(five.evaluatedPowerDensityWPerM2).toBeCloseTo(0.12676, 5);
    expect(five.marginDb).toBeCloseTo(18.97, 3);
  });
});

describe('screening: rows, gaps and summary of the demo device', () => {
  it('one row per transmitter × position × market with a separation; ble has none at the hotspot → one gap and no row', () => {
    expect(demo.rows).toHaveLength((5 * 8 - 1) * 4);
    expect(demo.gaps).toEqual([{ transmitterId: 'ble', usePositionId: 'hotspot-10', message: expect.stringMatching(/no separation for antenna "ant-bt"/) }]);
    expect(demo.rows.some((r) => r.transmitterId === 'ble' && r.usePositionId === 'hotspot-10')).toBe(false);
  });

  it('summary per market, reasoned row by row', () => {
    // FCC: 7 ble rows by the 1 mW rule + 4 far-field rows by (C) = 11 exempt of 39.
    // ISED: 7 ble + lte-mid and wifi-2g4 at the desk (Table 1 ≥ 50 mm column) = 9; lte-low at the desk
    //   is over (251.2 mW > 140.35 mW at 787 MHz) and wifi-5g is not covered above 5.8 GHz.
    // EU and ICNIRP 2020: 7 ble + 4 desk rows + wifi-5g on the hand (35.8 ≤ 40 mW) = 12.
    // Nothing needs MPE: every far-field row is exempt or under §2.5.1 (20 cm ≤ 20 cm).
    expect(demo.summary.byRegime).toEqual({
      fcc: { combinations: 39, exempt: 11, evaluateSar: 28, evaluateMpe: 0, needsEvaluation: 28 },
      ised: { combinations: 39, exempt: 9, evaluateSar: 30, evaluateMpe: 0, needsEvaluation: 30 },
      eu: { combinations: 39, exempt: 12, evaluateSar: 27, evaluateMpe: 0, needsEvaluation: 27 },
      'icnirp-2020': { combinations: 39, exempt: 12, evaluateSar: 27, evaluateMpe: 0, needsEvaluation: 27 },
    });
    expect(demo.summary.total).toEqual({ combinations: 156, exempt: 44, evaluateSar: 112, evaluateMpe: 0, needsEvaluation: 112 });
    expect(demo.summary.gaps).toBe(1);
  });

  it('summarizeScreening counts hand-made rows and lists selected markets with no rows', () => {
    const s = summarizeScreening(
      [
        { regime: 'fcc', result: 'exempt' },
        { regime: 'fcc', result: 'evaluate-sar' },
        { regime: 'fcc', result: 'evaluate-mpe' },
        { regime: 'eu', result: 'evaluate-mpe' },
      ],
      [{}],
      ['fcc', 'eu', 'ised'],
    );
    expect(s.byRegime.fcc).toEqual({ combinations: 3, exempt: 1, evaluateSar: 1, evaluateMpe: 1, needsEvaluation: 2 });
    expect(s.byRegime.eu).toEqual({ combinations: 1, exempt: 0, evaluateSar: 0, evaluateMpe: 1, needsEvaluation: 1 });
    expect(s.byRegime.ised).toEqual({ combinations: 0, exempt: 0, evaluateSar: 0, evaluateMpe: 0, needsEvaluation: 0 });
    expect(s.total.needsEvaluation).toBe(3);
    expect(s.gaps).toBe(1);
  });

  it('every row carries a derivation with formula, inputs with units, result and source', () => {
    for (const row of demo.rows) {
      expect(row.derivation.formula).toContain('P_avg = P_tune × duty cycle');
      expect(row.derivation.inputs.maxTuneUpPowerDbm.unit).toBe('dBm');
      expect(row.derivation.result.result.value).toBe(row.result);
      expect(row.derivation.source.length).toBeGreaterThan(10);
    }
  });
});

/** Single-frequency transmitters for the worked values of the published formulas. */
function single(frequencyHz: number, tuneUpDbm: number, separationM: number, kind: 'head' | 'body-worn' | 'extremity' | 'far-field', market: ScreeningInputRaw['markets'][number], gainDbi = 0) {
  const out = screenDevice({
    markets: [market],
    antennas: [{ id: 'a', gainDbi }],
    transmitters: [{ id: 't', frequencyMinHz: frequencyHz, frequencyMaxHz: frequencyHz, maxTuneUpPowerDbm: tuneUpDbm, dutyCycle: 1, antennaId: 'a' }],
    usePositions: [{ id: 'p', kind, separations: [{ antennaId: 'a', separationM }] }],
  });
  return out.rows[0];
}

// KDB 447498 D01 v06 §4.3.1 a): "power and distance are rounded to the nearest mW and mm before
// calculation; the result is rounded to one decimal place for comparison". 2.45 GHz, 5 mm: P_th =
// 3.0·5/√2.45 = 9.583 mW unrounded, but 9.55 mW rounds to 10 mW → (10/5)·1.5652 = 3.13 → 3.1 > 3.0.
describe('screening and the kdb-sar-test-exclusion calculation decide alike (§4.3.1 rounding)', () => {
  const kdb = { regime: 'fcc', tier: 'general', fccSarScreening: 'kdb-test-exclusion' } as const;
  const cases: [powerMw: number, frequencyHz: number, separationM: number, kind: 'head' | 'extremity'][] = [
    [9.55, 2.45e9, 0.005, 'head'], // unrounded 9.55 < 9.583 would exempt; the rule says not excluded
    [9.4, 2.45e9, 0.005, 'head'], // 9 mW → 2.8: excluded
    [9.5, 2.45e9, 0.0054, 'head'], // 10 mW, 5 mm → 3.1: not excluded
    [24.4, 2.45e9, 0.005, 'extremity'], // 24 mW → 7.5 ≤ 7.5: excluded (10-g)
    [0.4, 2.45e9, 0.005, 'head'], // rounds to 0 mW: excluded
    [600.4, 2.45e9, 0.1, 'head'], // b) 2): 600 mW > 595.8 mW
    [595.4, 2.45e9, 0.1, 'head'], // b) 2): 595 mW ≤ 595.8 mW
  ];
  it.each(cases)('%s mW at %s Hz, %s m (%s): same verdict and margin', (powerMw, frequencyHz, separationM, kind) => {
    const row = single(frequencyHz, 10 * Math.log10(powerMw), separationM, kind, kdb);
    const calc = runCalculation('kdb-sar-test-exclusion', { frequencyHz, separationM, extremity: kind === 'extremity', powerMw });
    if (!calc.ok) throw new Error('calculation failed');
    const out = calc.result as { excluded: boolean; marginDb: number };
    expect(row.result === 'exempt').toBe(out.excluded);
    expect(row.marginDb).toBeCloseTo(out.marginDb, 12);
    expect(row.derivation.formula).toMatch(/rounded to the nearest mW and mm/);
  });
  it('9.55 mW at 5 mm, 2.45 GHz: evaluate SAR, margin 10·log10(3.0/3.1) = −0.142 dB at the rule’s precision', () => {
    const row = single(2.45e9, 10 * Math.log10(9.55), 0.005, 'head', kdb);
    expect(row.result).toBe('evaluate-sar');
    expect(row.marginDb).toBeCloseTo(10 * Math.log10(3.0 / 3.1), 9);
  });
});

// A value at the threshold: 13.0103 dBm is 20.00004 mW; 47 CFR §1.1307(b)(3)(i)(B) states no rounding.
describe('a comparison at the threshold says how it was made', () => {
  it('the derivation gives the figures in full and the rule’s precision when |margin| reads ±0.0 dB', () => {
    const fcc = { regime: 'fcc', tier: 'general' } as const;
    const base = single(2.45e9, 20, 0.015, 'head', fcc); // P_th at 1.5 cm
    const atDbm = 10 * Math.log10(base.thresholdMw!) + 1e-6;
    const row = single(2.45e9, atDbm, 0.015, 'head', fcc);
    expect(row.result).toBe('evaluate-sar');
    expect(Math.abs(row.marginDb!)).toBeLessThan(1e-5);
    const note = row.derivation.notes.find((n) => n.startsWith('At the threshold'));
    expect(note).toMatch(/compared unrounded: the rule states no rounding/);
    expect(note).toMatch(/margin -\d/);
    expect(row.derivation.formula).toMatch(/compared unrounded/);
  });
});

// RSS-102 Issue 6 (ISED, 15 Dec 2023) superseded Issue 5 after a one-year transition; its exemption
// tables are not in the rule set, so ISED results say they rest on Issue 5 and exemptions are provisional.
describe('ISED results say what they rest on', () => {
  it('every ISED row names RSS-102 Issue 5; every ISED exemption is provisional with the reason; no other regime is', () => {
    const isedRows = demo.rows.filter((r) => r.regime === 'ised');
    expect(isedRows.length).toBeGreaterThan(0);
    for (const row of isedRows) {
      expect(row.derivation.notes.join(' ')).toMatch(/RSS-102 Issue 5/);
      expect(row.provisional).toBe(row.result === 'exempt');
      if (row.provisional) expect(row.provisionalReason).toMatch(/Issue 6.*not in this rule set/);
    }
    expect(isedRows.some((r) => r.provisional)).toBe(true);
    expect(demo.rows.filter((r) => r.regime !== 'ised').every((r) => !r.provisional && r.provisionalReason === null)).toBe(true);
  });
  it('the output and the rule-set version carry the Canada warning', () => {
    expect(RULE_SET_VERSION).toMatch(/rss102-issue5/);
    expect(demo.warnings.map((w) => w.code)).toEqual(['ised-rss102-issue5']);
    expect(ruleSetWarnings(['fcc', 'eu'])).toEqual([]);
    expect(screenDevice(withMarkets([{ regime: 'fcc', tier: 'general' }])).warnings).toEqual([]);
  });
});

describe('screening reproduces the worked values of the published formulas', () => {
  const fcc = { regime: 'fcc', tier: 'general' } as const;
  const kdb = { regime: 'fcc', tier: 'general', fccSarScreening: 'kdb-test-exclusion' } as const;
  it('#1–#4 FCC P_th: 2.744 mW (2.45 GHz, 0.5 cm), 43.72 mW (0.835 GHz, 1.5 cm), 39.71 mW (5.8 GHz, 2.5 cm), 3060 mW (1.9 GHz, 30 cm)', () => {
    expect(single(2.45e9, 20, 0.005, 'head', fcc).thresholdMw).toBeCloseTo(2.744, 3);
    expect(single(0.835e9, 20, 0.015, 'body-worn', fcc).thresholdMw).toBeCloseTo(43.72, 2);
    expect(single(5.8e9, 20, 0.025, 'body-worn', fcc).thresholdMw).toBeCloseTo(39.71, 2);
    expect(single(1.9e9, 20, 0.3, 'body-worn', fcc).thresholdMw).toBe(3060);
  });
  it('#7 FCC MPE ERP threshold at 2450 MHz, R = 0.5 m: 19.2·0.5² = 4.80 W', () => {
    expect(single(2.45e9, 20, 0.5, 'far-field', fcc).thresholdErpW).toBeCloseTo(4.8, 2);
  });
  it('#11 KDB exclusion power at 2.45 GHz, 5 mm: 9.58 mW (1-g), 23.96 mW (10-g extremity); #13 at 100 mm: 595.8 mW', () => {
    expect(single(2.45e9, 20, 0.005, 'head', kdb).thresholdMw).toBeCloseTo(9.58, 2);
    expect(single(2.45e9, 20, 0.005, 'extremity', kdb).thresholdMw).toBeCloseTo(23.96, 2);
    expect(single(2.45e9, 20, 0.1, 'body-worn', kdb).thresholdMw).toBeCloseTo(595.8, 1);
  });
  it('#15 KDB estimated SAR, 5 mW at 5 mm, 2.45 GHz: 0.209 W/kg (1-g), 0.083 W/kg (10-g)', () => {
    const dbm5mw = 10 * Math.log10(5);
    expect(single(2.45e9, dbm5mw, 0.005, 'body-worn', kdb).estimatedSarWPerKg).toBeCloseTo(0.209, 3);
    expect(single(2.45e9, dbm5mw, 0.005, 'extremity', kdb).estimatedSarWPerKg).toBeCloseTo(0.083, 3);
  });
  it('#17–#18 RSS-102 §2.5.2 e.i.r.p. limit beyond 20 cm: 2.713 W at 2450 MHz, 4.889 W at 5800 MHz', () => {
    const ised = { regime: 'ised', tier: 'general' } as const;
    const r = single(2.45e9, 20, 0.5, 'far-field', ised);
    expect(r.method).toBe('ised-rf-exemption');
    expect(r.thresholdEirpW).toBeCloseTo(2.713, 3);
    expect(r.thresholdEirpW).toBe(isedRfExemptionEirpW(2.45e9, 0.5));
    expect(single(5.8e9, 20, 0.5, 'far-field', ised).thresholdEirpW).toBeCloseTo(4.889, 3);
  });
  it('RSS-102 Table 1 at 2450 MHz: 4 mW at ≤ 5 mm, 7 mW at 10 mm (RSS-102 Issue 5 §2.5.1 Table 1, the confirmed cells)', () => {
    const ised = { regime: 'ised', tier: 'general' } as const;
    expect(single(2.45e9, 0, 0.005, 'head', ised).thresholdMw).toBe(4);
    expect(single(2.45e9, 0, 0.01, 'head', ised).thresholdMw).toBe(7);
  });
  it('#19 1999/519/EC reference level at 900 MHz: f/200 = 4.5 W/m²; #22 1 W EIRP at 20 cm: 0.199 mW/cm² = 1.989 W/m²', () => {
    const eu = { regime: 'eu', tier: 'general' } as const;
    expect(single(0.9e9, 20, 0.2, 'far-field', eu).thresholdPowerDensityWPerM2).toBeCloseTo(4.5, 1);
    const r = single(2.45e9, 30, 0.2, 'far-field', eu); // 30 dBm, 0 dBi, duty 1: EIRP = 1 W
    expect(r.evaluatedPowerDensityWPerM2).toBeCloseTo(1.989, 3);
    expect(r.evaluatedPowerDensityWPerM2! / 10).toBeCloseTo(0.199, 3);
  });
  it('a Table 1 breakpoint inside a band can be the most restrictive frequency: 2.0–3.0 GHz at 20 mm → 30 mW at 2450 MHz (33.27 at 2.0 GHz, 31.05 at 3.0 GHz; Table 1 values from memory)', () => {
    const out = screenDevice({
      markets: [{ regime: 'ised' }],
      antennas: [{ id: 'a', gainDbi: 0 }],
      transmitters: [{ id: 't', frequencyMinHz: 2.0e9, frequencyMaxHz: 3.0e9, maxTuneUpPowerDbm: 20, antennaId: 'a' }],
      usePositions: [{ id: 'p', kind: 'body-worn', separations: [{ antennaId: 'a', separationM: 0.02 }] }],
    });
    const row = out.rows[0];
    expect(row.candidates.map((c) => [c.frequencyHz, +(c.threshold as number).toFixed(2)])).toEqual([
      [2.0e9, 33.27],
      [2.45e9, 30],
      [3.0e9, 31.05],
    ]);
    expect(row.frequencyHz).toBe(2.45e9);
    expect(row.thresholdMw).toBe(30);
  });
});

describe('screening never throws for one odd transmitter', () => {
  it('60 GHz and 100–150 kHz transmitters get rows that say what is needed and why', () => {
    const out = screenDevice({
      ...DEMO,
      transmitters: [
        { id: 'radar-60g', frequencyMinHz: 57e9, frequencyMaxHz: 64e9, maxTuneUpPowerDbm: 10, antennaId: 'ant-bt' },
        { id: 'tag-lf', frequencyMinHz: 100e3, frequencyMaxHz: 150e3, maxTuneUpPowerDbm: 10, antennaId: 'ant-bt' },
      ],
    });
    expect(out.rows).toHaveLength(2 * 7 * 4);
    // Above 6 GHz at the head ICNIRP 2020 restricts absorbed power density: no low-power exclusion here.
    const radar = rowOf(out, 'radar-60g', 'head-5', 'icnirp-2020');
    expect(radar.result).toBe('evaluate-mpe');
    expect(radar.method).toBe('no-applicable-rule');
    // Below 0.3 MHz no §1.1307(b)(3)(i) exemption applies (and 10 mW is over the 1 mW rule).
    const lf = rowOf(out, 'tag-lf', 'head-5', 'fcc');
    expect(lf.result).toBe('evaluate-sar');
    expect(lf.derivation.notes.join(' ')).toMatch(/outside Table 1 to §1\.1307\(b\)\(3\)\(i\)\(C\)/);
    // EN 62479 starts at 10 MHz.
    expect(rowOf(out, 'tag-lf', 'head-5', 'eu').result).toBe('evaluate-sar');
  });
});

describe('screening input: malformed or inconsistent input is refused with paths', () => {
  it('unknown antenna, min > max, duplicate id', () => {
    const bad = {
      ...DEMO,
      transmitters: [
        { id: 'x', frequencyMinHz: 2e9, frequencyMaxHz: 1e9, maxTuneUpPowerDbm: 10, antennaId: 'nope' },
        { id: 'x', frequencyMinHz: 1e9, frequencyMaxHz: 1e9, maxTuneUpPowerDbm: 10, antennaId: 'ant-bt' },
      ],
    };
    const out = runCalculation('screening', bad);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    const paths = out.error.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['transmitters.0.antennaId', 'transmitters.0.frequencyMaxHz', 'transmitters.1.id']));
  });
  it('the registry runs the demo device', () => {
    const out = runCalculation('screening', DEMO);
    expect(out.ok).toBe(true);
  });
});

/*
 * screening-depth-profile — sources:
 * - S = EIRP/(4πR²): FCC OET Bulletin 65 (Edition 97-01) Eq. (3);
 * - reactive near-field boundary d = λ/2π (kr = 1): H. A. Wheeler, "The radiansphere around a small
 *   antenna", Proc. IRE 47 (1959) 1325; C. A. Balanis, Antenna Theory, 4th ed. (2016), §4.2 (section
 *   from memory). λ/2π at 2.45 GHz = 299 792 458/2.45e9/2π = 19.47 mm; at 835 MHz = 57.14 mm (python3);
 * - the stacks' thicknesses are typical values, common practice (from memory): only the choice of
 *   tissues per kind is asserted, and the profile against an independent plane-wave-layers call.
 */
describe('screening-depth-profile: SAR against depth in the tissue stack of the position kind (screening estimate)', () => {
  it('picks the stack by kind: head skin/fat/bone/brain; body-worn, hotspot, far-field skin/fat/muscle; extremity skin/fat/muscle/bone', () => {
    const tissues = (k: Parameters<typeof tissueStackFor>[0]) => tissueStackFor(k).layers.map((l) => l.tissue);
    expect(tissues('head')).toEqual(['skin-dry', 'fat', 'bone-cortical', 'brain-grey-matter']);
    for (const k of ['body-worn', 'hotspot', 'far-field'] as const) expect(tissues(k)).toEqual(['skin-dry', 'fat', 'muscle']);
    expect(tissues('extremity')).toEqual(['skin-dry', 'fat', 'muscle', 'bone-cortical']);
    for (const s of [HEAD_STACK, TRUNK_STACK, LIMB_STACK]) {
      expect(s.layers[s.layers.length - 1].thicknessM).toBeNull();
      // every finite layer lies within the chart's 20 mm close-up
      expect(s.layers.reduce((a, l) => a + (l.thicknessM ?? 0), 0)).toBeLessThan(0.02);
    }
    const p = screeningDepthProfile({ frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.01, usePositionKind: 'body-worn' });
    expect(p.stackId).toBe('trunk');
    expect(p.stack.map((l) => l.name)).toEqual(['skin', 'fat', 'muscle']);
    expect(p.derivation.notes[0]).toMatch(/^Model: Trunk: skin, fat, muscle as flat layers/);
    expect(p.derivation.notes.join(' ')).toMatch(/typical adult values, common practice/);
  });
  it('reactive near-field boundary λ/2π = 19.47 mm at 2.45 GHz and 57.14 mm at 835 MHz (Wheeler 1959; Balanis §4.2)', () => {
    expect(screeningDepthProfile({ frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.01, usePositionKind: 'head' }).reactiveNearFieldBoundaryM * 1000).toBeCloseTo(19.47, 2);
    expect(screeningDepthProfile({ frequencyHz: 835e6, eirpW: 0.1, separationM: 0.01, usePositionKind: 'head' }).reactiveNearFieldBoundaryM * 1000).toBeCloseTo(57.14, 2);
  });
  it('switches at d = λ/2π: 19 mm at 2.45 GHz is relative (no W/kg), 20 mm is absolute', () => {
    const near = screeningDepthProfile({ frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.019, usePositionKind: 'body-worn' });
    const far = screeningDepthProfile({ frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.02, usePositionKind: 'body-worn' });
    expect(near.scale).toBe('relative');
    expect(near.absolute).toBeNull();
    expect(near.scaleReason).toMatch(/within the reactive near field \(λ\/2π = 19.5 mm/);
    expect(Object.values(near.derivation.result).every((v) => v.unit === '1')).toBe(true);
    expect(far.scale).toBe('absolute');
    expect(far.absolute?.averagedSarWPerKg['1g']).toBeGreaterThan(0);
    expect(far.scaleReason).toMatch(/beyond the reactive near field/);
  });
  it('a contact position stays relative even where the 5 mm floor exceeds λ/2π (10 GHz: 4.77 mm)', () => {
    const p = screeningDepthProfile({ frequencyHz: 10e9, eirpW: 0.01, separationM: 0, usePositionKind: 'hotspot' });
    expect(p.distanceUsedM).toBe(SCREENING_MIN_DISTANCE_M);
    expect(p.reactiveNearFieldBoundaryM * 1000).toBeCloseTo(4.771, 3);
    expect(p.scale).toBe('relative');
  });
  it('absolute: S = EIRP/(4πR²), 1 W at 20 cm = 1.989 W/m² (OET 65 Eq. (3)), and the profile is plane-wave-layers on the trunk stack at that S', () => {
    const p = screeningDepthProfile({ frequencyHz: 2.45e9, eirpW: 1, separationM: 0.2, usePositionKind: 'body-worn' });
    expect(p.absolute!.incidentPowerDensityWPerM2).toBeCloseTo(1.989, 3);
    const direct = planeWaveLayers({ frequencyHz: 2.45e9, incidentPowerDensityWPerM2: p.absolute!.incidentPowerDensityWPerM2, layers: TRUNK_STACK.layers.map((l) => ({ ...l })) });
    expect(p.absolute!.surfaceSarWPerKg).toBe(direct.surfaceSarWPerKg);
    expect(p.absolute!.sarProfile.length).toBeGreaterThanOrEqual(200);
    expect(p.estimate).toBe('screening');
  });
  it('relative profile = local SAR ÷ surface SAR of the same plane-wave-layers solve (1 at the surface), whatever the EIRP', () => {
    const a = screeningDepthProfile({ frequencyHz: 0.9e9, eirpW: 0.2, separationM: 0.01, usePositionKind: 'extremity' });
    const b = screeningDepthProfile({ frequencyHz: 0.9e9, eirpW: 0.4, separationM: 0.01, usePositionKind: 'extremity' });
    const direct = planeWaveLayers({ frequencyHz: 0.9e9, incidentPowerDensityWPerM2: 1, layers: LIMB_STACK.layers.map((l) => ({ ...l })) });
    expect(a.relativeProfile[0].relativeSar).toBe(1);
    a.relativeProfile.forEach((pt, i) => {
      expect(b.relativeProfile[i].relativeSar).toBeCloseTo(pt.relativeSar, 12);
      expect(pt.relativeSar).toBeCloseTo(direct.sarProfile[i].sarWPerKg / direct.surfaceSarWPerKg, 12);
    });
  });
  it('is registered, needs the kind, and refuses a frequency outside the tissue model (10 Hz–100 GHz)', () => {
    expect(runCalculation('screening-depth-profile', { frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.01, usePositionKind: 'head' }).ok).toBe(true);
    expect(runCalculation('screening-depth-profile', { frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.01 }).ok).toBe(false);
    expect(runCalculation('screening-depth-profile', { frequencyHz: 200e9, eirpW: 0.1, separationM: 0.01, usePositionKind: 'head' }).ok).toBe(false);
  });
});

// Property tests (fast-check): a random single-transmitter device at a random position and market.
const regimeMarket = fc.oneof(
  fc.record({
    regime: fc.constant('fcc' as const),
    tier: fc.constantFrom('general' as const, 'occupational' as const),
    fccSarScreening: fc.constantFrom('exemption' as const, 'kdb-test-exclusion' as const),
  }),
  fc.record({ regime: fc.constantFrom('ised' as const, 'eu' as const, 'icnirp-2020' as const), tier: fc.constantFrom('general' as const, 'occupational' as const) }),
);
const device = fc
  .record({
    market: regimeMarket,
    fMinLog: fc.double({ min: 5, max: 11.4, noNaN: true }), // 100 kHz … 250 GHz
    spanRatio: fc.double({ min: 1, max: 1.5, noNaN: true }),
    tuneUpDbm: fc.double({ min: -30, max: 40, noNaN: true }),
    dutyCycle: fc.double({ min: 0.01, max: 1, noNaN: true }),
    gainDbi: fc.double({ min: -10, max: 10, noNaN: true }),
    separationM: fc.oneof(fc.constantFrom(0, 0.003, 0.005, 0.2, 0.4), fc.double({ min: 0, max: 2, noNaN: true })),
    kind: fc.constantFrom('head' as const, 'body-worn' as const, 'hotspot' as const, 'extremity' as const, 'far-field' as const),
  })
  .map((d) => ({ ...d, fMinHz: 10 ** d.fMinLog, fMaxHz: Math.min(300e9, 10 ** d.fMinLog * d.spanRatio) }));

type RandomDevice = {
  market: ScreeningInputRaw['markets'][number];
  fMinHz: number;
  fMaxHz: number;
  dutyCycle: number;
  gainDbi: number;
  separationM: number;
  kind: ScreeningInputRaw['usePositions'][number]['kind'];
};
const build = (d: RandomDevice, tuneUpDbm: number): ScreeningInputRaw => ({
  markets: [d.market],
  antennas: [{ id: 'a', gainDbi: d.gainDbi }],
  transmitters: [{ id: 't', frequencyMinHz: d.fMinHz, frequencyMaxHz: d.fMaxHz, maxTuneUpPowerDbm: tuneUpDbm, dutyCycle: d.dutyCycle, antennaId: 'a' }],
  usePositions: [{ id: 'p', kind: d.kind, separations: [{ antennaId: 'a', separationM: d.separationM }] }],
});

describe('screening properties (fast-check)', () => {
  it('margin sign matches the result: margin ≥ 0 ⇔ exempt; no margin ⇒ not exempt — also within ±0.3 dB of the threshold', () => {
    const consistent = (row: ScreeningRow) => (row.marginDb === null ? row.result !== 'exempt' : row.marginDb >= 0 === (row.result === 'exempt'));
    fc.assert(
      fc.property(device, fc.double({ min: -0.3, max: 0.3, noNaN: true }), (d, offsetDb) => {
        const [row] = screenDevice(build(d, d.tuneUpDbm)).rows;
        if (!consistent(row)) return false;
        if (row.marginDb === null || row.method === 'fcc-1mw') return true;
        // Move the power to just above or below the threshold (every evaluated power is ∝ tune-up power).
        const tuneUpDbm = d.tuneUpDbm + row.marginDb + offsetDb;
        if (tuneUpDbm < -30 || tuneUpDbm > 60) return true;
        return consistent(screenDevice(build(d, tuneUpDbm)).rows[0]);
      }),
      { numRuns: 400 },
    );
  });
  it('raising the tune-up power never turns "evaluate" into "exempt"', () => {
    fc.assert(
      fc.property(device, fc.double({ min: 0, max: 30, noNaN: true }), (d, raiseDb) => {
        const low = screenDevice(build(d, d.tuneUpDbm)).rows[0];
        const high = screenDevice(build(d, Math.min(60, d.tuneUpDbm + raiseDb))).rows[0];
        return low.result === 'exempt' || high.result !== 'exempt';
      }),
      { numRuns: 400 },
    );
  });
});
