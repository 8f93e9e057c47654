/**
 * Sources:
 * - 47 CFR §1.1310(e) Table 1 (A) occupational and (B) general population;
 * - RSS-102 Issue 5 Tables 4 and 5 = Safety Code 6 (2015) Tables 5 and 6 (RSS-102 Issue 5 Tables 4–5,, from memory;
 *   edge consistency checked in the reference);
 * - ICNIRP 1998 Tables 6–7;
 * - ICNIRP 2020 Table 5 whole-body (from memory) and Table 6 local;
 * - worked values (computed with python3 from the published formulas): #9, #10 (FCC), #19 (ICNIRP 1998 900 MHz), #20 (ICNIRP 2020 local
 *   28 GHz), #21 (ICNIRP 1998 averaging at 28 GHz).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeExposureLimit, exposureLimit, exposureLimitBreakpointsHz, exposureLimitRangeHz, exposureRegimes, tiers } from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';
import { runCalculation } from '../../calc/registry';

describe('exposure-limit — FCC 47 CFR §1.1310 Table 1', () => {
  it('47 CFR §1.1310 Table 1, worked: 850 MHz → GP 0.5667 mW/cm² (5.667 W/m², E_eq 46.2 V/m), Occ 2.833 mW/cm²', () => {
    const gp = computeExposureLimit({ frequencyHz: 850e6, regime: 'fcc', tier: 'general', exposure: 'whole-body' });
    expect(gp.powerDensityWPerM2).toBeCloseTo(5.667, 3);
    expect(gp.electricFieldVPerM).toBeNull();
    expect(gp.magneticFieldAPerM).toBeNull();
    expect(gp.derivation.notes.join(' ')).toMatch(/No value in the table for E, H/);
    expect(gp.derivation.notes.join(' ')).toMatch(/46\.2 V\/m/);
    expect(gp.averagingTimeS).toBe(30 * 60);
    expect(exposureLimit(850e6, 'fcc', 'occupational').powerDensityWPerM2! / 10).toBeCloseTo(2.833, 3);
    expect(exposureLimit(850e6, 'fcc', 'occupational').averagingTimeS).toBe(6 * 60);
  });
  it('47 CFR §1.1310 Table 1, worked: 2450 MHz → GP 1.0 mW/cm² (10 W/m²), Occ 5 mW/cm²', () => {
    expect(exposureLimit(2450e6, 'fcc', 'general').powerDensityWPerM2).toBeCloseTo(10, 6);
    expect(exposureLimit(2450e6, 'fcc', 'occupational').powerDensityWPerM2).toBeCloseTo(50, 6);
  });
  it('Table 1 (B) low rows as printed: 0.3–1.34 MHz 614 V/m, 1.63 A/m, (100) mW/cm²; 1.34–30 MHz 824/f, 2.19/f, 180/f²; 30–300 MHz 27.5, 0.073, 0.2', () => {
    expect(exposureLimit(1e6, 'fcc', 'general')).toMatchObject({ electricFieldVPerM: 614, magneticFieldAPerM: 1.63, powerDensityWPerM2: 1000 });
    const at10 = exposureLimit(10e6, 'fcc', 'general');
    expect(at10.electricFieldVPerM).toBeCloseTo(82.4, 6);
    expect(at10.magneticFieldAPerM).toBeCloseTo(0.219, 6);
    expect(at10.powerDensityWPerM2).toBeCloseTo(18, 6);
    expect(exposureLimit(100e6, 'fcc', 'general')).toMatchObject({ electricFieldVPerM: 27.5, magneticFieldAPerM: 0.073, powerDensityWPerM2: 2 });
  });
  it('Table 1 (A) rows as printed: 3–30 MHz 1842/f, 4.89/f, 900/f²; 30–300 MHz 61.4, 0.163, 1.0', () => {
    const at10 = exposureLimit(10e6, 'fcc', 'occupational');
    expect(at10.electricFieldVPerM).toBeCloseTo(184.2, 6);
    expect(at10.magneticFieldAPerM).toBeCloseTo(0.489, 6);
    expect(at10.powerDensityWPerM2).toBeCloseTo(90, 6);
    expect(exposureLimit(100e6, 'fcc', 'occupational')).toMatchObject({ electricFieldVPerM: 61.4, magneticFieldAPerM: 0.163, powerDensityWPerM2: 10 });
  });
  it('outside 0.3 MHz–100 GHz → CalcRangeError naming the table range', () => {
    expect(() => exposureLimit(0.2e6, 'fcc', 'general')).toThrow(CalcRangeError);
    expect(() => exposureLimit(120e9, 'fcc', 'general')).toThrow(/300 kHz to 100 GHz/);
    const out = runCalculation('exposure-limit', { frequencyHz: 120e9, regime: 'fcc', tier: 'general' });
    expect(out.ok).toBe(false);
  });
});

describe('exposure-limit — ICNIRP 1998 Tables 6–7', () => {
  it('ICNIRP 1998 Table 7, worked: public 900 MHz → 41.25 V/m, 0.111 A/m, 4.5 W/m²', () => {
    const r = exposureLimit(900e6, 'icnirp-1998', 'general');
    expect(r.electricFieldVPerM).toBeCloseTo(41.25, 2);
    expect(r.magneticFieldAPerM).toBeCloseTo(0.111, 3);
    expect(r.powerDensityWPerM2).toBeCloseTo(4.5, 1);
  });
  it('ICNIRP 1998 Table 7 averaging time, worked: averaging time at 28 GHz = 68/28^1.05 = 2.06 min; 6 min at and below 10 GHz', () => {
    expect(exposureLimit(28e9, 'icnirp-1998', 'general').averagingTimeS / 60).toBeCloseTo(2.06, 2);
    expect(exposureLimit(10e9, 'icnirp-1998', 'occupational').averagingTimeS).toBe(360);
    expect(exposureLimitBreakpointsHz('icnirp-1998', 'general')).toContain(10e9);
  });
  it('ICNIRP 1998 Tables 6–7: below 10 MHz no S_eq (null, said in notes); occupational 2–300 GHz 137 V/m, 50 W/m²', () => {
    const r = computeExposureLimit({ frequencyHz: 5e6, regime: 'icnirp-1998', tier: 'general', exposure: 'whole-body' });
    expect(r.powerDensityWPerM2).toBeNull();
    expect(r.electricFieldVPerM).toBeCloseTo(87 / Math.sqrt(5), 6);
    expect(r.derivation.notes.join(' ')).toMatch(/no equivalent plane-wave power density/);
    expect(exposureLimit(5e9, 'icnirp-1998', 'occupational')).toMatchObject({ electricFieldVPerM: 137, powerDensityWPerM2: 50 });
  });
});

describe('exposure-limit — ICNIRP 2020', () => {
  it('ICNIRP 2020 Table 6, worked: local (Table 6) 28 GHz → 55/28^0.177 = 30.49 W/m² (public), 152.5 W/m² (occupational)', () => {
    expect(exposureLimit(28e9, 'icnirp-2020', 'general', 'local').powerDensityWPerM2).toBeCloseTo(30.49, 2);
    expect(exposureLimit(28e9, 'icnirp-2020', 'occupational', 'local').powerDensityWPerM2).toBeCloseTo(152.5, 1);
  });
  it('Table 6: the 300 GHz row (20 / 100 W/m²) is separate from >6–<300 GHz', () => {
    expect(exposureLimit(300e9, 'icnirp-2020', 'general', 'local').powerDensityWPerM2).toBe(20);
    expect(exposureLimit(300e9, 'icnirp-2020', 'occupational', 'local').powerDensityWPerM2).toBe(100);
  });
  it('Table 5 whole-body (from memory): public >2–300 GHz 10 W/m² with E, H NA → null; 30 min', () => {
    const r = computeExposureLimit({ frequencyHz: 5e9, regime: 'icnirp-2020', tier: 'general', exposure: 'whole-body' });
    expect(r.powerDensityWPerM2).toBe(10);
    expect(r.electricFieldVPerM).toBeNull();
    expect(r.averagingTimeS).toBe(1800);
    expect(r.derivation.notes.join(' ')).toMatch(/from memory/);
    expect(exposureLimit(100e6, 'icnirp-2020', 'general').electricFieldVPerM).toBe(27.7);
  });
  it('"local" is refused for regimes without local tables', () => {
    expect(() => exposureLimit(1e9, 'fcc', 'general', 'local')).toThrow(/only tabulated for icnirp-2020/);
  });
});

describe('exposure-limit — RSS-102 Issue 5 Tables 4/5 (from memory, RSS-102 Issue 5 Tables 4–5, from memory)', () => {
  it('RSS-102 Issue 5 Table 4 edge checks: 0.02619·300^0.6834 = 1.291; 0.02619·6000^0.6834 = 10.00 W/m²', () => {
    expect(exposureLimit(300e6, 'ised', 'general').powerDensityWPerM2).toBeCloseTo(1.291, 3);
    expect(exposureLimit(6000e6, 'ised', 'general').powerDensityWPerM2).toBeCloseTo(10.0, 2);
  });
  it('RSS-102 Issue 5 Table 5 edge checks: 0.6455·100^0.5 = 6.455; 0.6455·6000^0.5 = 50.0; 44.72/20^0.5 = 10.0 W/m²', () => {
    expect(exposureLimit(100e6, 'ised', 'occupational').powerDensityWPerM2).toBeCloseTo(6.455, 3);
    expect(exposureLimit(6000e6, 'ised', 'occupational').powerDensityWPerM2).toBeCloseTo(50.0, 1);
    expect(exposureLimit(20.0001e6, 'ised', 'occupational').powerDensityWPerM2).toBeCloseTo(10.0, 1);
  });
  it('averaging 6 min to 15 GHz, 616000/f^1.2 min above; nerve-stimulation limits listed below 10 MHz', () => {
    expect(exposureLimit(2.45e9, 'ised', 'general').averagingTimeS).toBe(360);
    expect(exposureLimit(30e9, 'ised', 'general').averagingTimeS / 60).toBeCloseTo(616000 / 30000 ** 1.2, 9);
    expect(exposureLimit(5e6, 'ised', 'general').additionalLimits[0]).toMatchObject({ electricFieldVPerM: 83, magneticFieldAPerM: 90 });
    expect(exposureLimit(50e6, 'ised', 'general').additionalLimits).toEqual([]);
  });
});

// Boundaries where the source is continuous in S (47 CFR §1.1310(e) Table 1 rows; RSS-102 Issue 5 Tables 4–5 edge checks;
// ICNIRP 1998 at 400 and 2000 MHz: f/200 = 2 and 10). Tolerance: the printed 3–4 figures.
const continuousS: [(typeof exposureRegimes)[number], (typeof tiers)[number], number][] = [
  ['fcc', 'occupational', 3e6],
  ['fcc', 'occupational', 30e6],
  ['fcc', 'occupational', 300e6],
  ['fcc', 'occupational', 1500e6],
  ['fcc', 'general', 1.34e6],
  ['fcc', 'general', 30e6],
  ['fcc', 'general', 300e6],
  ['fcc', 'general', 1500e6],
  ['ised', 'general', 20e6],
  ['ised', 'general', 48e6],
  ['ised', 'general', 300e6],
  ['ised', 'general', 6000e6],
  ['ised', 'occupational', 20e6],
  ['ised', 'occupational', 48e6],
  ['ised', 'occupational', 100e6],
  ['ised', 'occupational', 6000e6],
  ['ised', 'occupational', 150000e6],
  ['icnirp-1998', 'general', 400e6],
  ['icnirp-1998', 'general', 2000e6],
  ['icnirp-1998', 'occupational', 400e6],
  ['icnirp-1998', 'occupational', 2000e6],
];

describe('exposure-limit — continuity and coverage', () => {
  it.each(continuousS)('%s %s: S continuous at %d Hz to 0.5 %%', (regime, tier, edge) => {
    const below = exposureLimit(edge, regime, tier).powerDensityWPerM2!;
    const above = exposureLimit(edge * (1 + 1e-9), regime, tier).powerDensityWPerM2!;
    expect(Math.abs(above - below) / below).toBeLessThan(0.005);
  });
  it('property: every regime/tier answers across its whole range with a positive averaging time and non-negative values', () => {
    fc.assert(
      fc.property(fc.constantFrom(...exposureRegimes), fc.constantFrom(...tiers), fc.double({ min: 0, max: 1, noNaN: true }), (regime, tier, u) => {
        const { minHz, maxHz } = exposureLimitRangeHz(regime, tier);
        const f = minHz * (maxHz / minHz) ** u;
        const r = exposureLimit(f, regime, tier);
        expect(r.averagingTimeS).toBeGreaterThan(0);
        for (const v of [r.powerDensityWPerM2, r.electricFieldVPerM, r.magneticFieldAPerM]) if (v !== null) expect(v).toBeGreaterThan(0);
      }),
    );
  });
  it('property: occupational limits are never below general-population limits (FCC, ICNIRP 1998)', () => {
    fc.assert(
      fc.property(fc.constantFrom('fcc' as const, 'icnirp-1998' as const), fc.double({ min: 0, max: 1, noNaN: true }), (regime, u) => {
        const f = 10.001e6 * (100e9 / 10.001e6) ** u; // above 10 MHz, where both tables give S
        const g = exposureLimit(f, regime, 'general').powerDensityWPerM2!;
        const o = exposureLimit(f, regime, 'occupational').powerDensityWPerM2!;
        expect(o).toBeGreaterThanOrEqual(g);
      }),
    );
  });
});
