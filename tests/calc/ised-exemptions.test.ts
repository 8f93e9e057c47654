/**
 * Sources:
 * - RSS-102 Issue 5 §2.5.1 Table 1 (2450 MHz ≤5 mm = 4 mW and 10 mm = 7 mW are from a secondary source,
 *   the other entries, the interpolation rule and the ×2.5 limb factor are from memory; the ≤5 mm
 *   column below 5 mm is S);
 * - RSS-102 Issue 5 §2.5.2 e.i.r.p. exemption formulas;
 * - worked values (computed with python3 from the published formulas): #17 (2.713 W at 2450 MHz), #18 (4.889 W at 5800 MHz; 0.820 W at 30 MHz).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeIsedRfExemption, computeIsedSarExemption, isedRfBreakpointsHz, isedRfExemptionEirpW, isedSarExemptionMw, isedSarTableFrequenciesHz, mostRestrictiveInBand } from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';

describe('ised-sar-exemption — RSS-102 Issue 5 §2.5.1 Table 1', () => {
  it('Table 1 at 2450 MHz (S): 4 mW at ≤ 5 mm, 7 mW at 10 mm', () => {
    expect(isedSarExemptionMw(2450e6, 0.005)).toBe(4);
    expect(isedSarExemptionMw(2450e6, 0.01)).toBe(7);
  });
  it('other Table 1 entries as printed (from memory): 835 MHz 20 mm 55 mW; 5800 MHz ≥ 50 mm 106 mW; ≤ 300 MHz 5 mm 71 mW', () => {
    expect(isedSarExemptionMw(835e6, 0.02)).toBe(55);
    expect(isedSarExemptionMw(5800e6, 0.05)).toBe(106);
    expect(isedSarExemptionMw(300e6, 0.005)).toBe(71);
  });
  it('edges (RSS-102 Issue 5 §2.5.1 Table 1): < 5 mm uses the ≤ 5 mm column; 50–200 mm the ≥ 50 mm column; < 300 MHz the ≤ 300 MHz row', () => {
    expect(isedSarExemptionMw(2450e6, 0.001)).toBe(4);
    expect(isedSarExemptionMw(1900e6, 0.15)).toBe(431);
    expect(isedSarExemptionMw(100e6, 0.03)).toBe(223);
    const r = computeIsedSarExemption({ frequencyHz: 2450e6, separationM: 0.002, limbWorn: false });
    expect(r.tableSeparationMm).toBe(5);
    expect(r.derivation.notes.join(' ')).toMatch(/≤ 5 mm column/);
  });
  it('linear interpolation (RSS-102 Issue 5 §2.5.1 Table 1, from memory): 2450 MHz 7.5 mm → (4+7)/2 = 5.5 mW; 2175 MHz 10 mm → (10+7)/2 = 8.5 mW', () => {
    expect(isedSarExemptionMw(2450e6, 0.0075)).toBeCloseTo(5.5, 9);
    expect(isedSarExemptionMw(2175e6, 0.01)).toBeCloseTo(8.5, 9);
  });
  it('limb-worn ×2.5 (RSS-102 Issue 5 §2.5.1 Table 1, from memory): 2450 MHz 5 mm → 10 mW', () => {
    expect(isedSarExemptionMw(2450e6, 0.005, true)).toBe(10);
  });
  it('out of table: above 5800 MHz or beyond 20 cm → CalcRangeError naming the range', () => {
    expect(() => isedSarExemptionMw(5900e6, 0.01)).toThrow(/5\.8 GHz/);
    expect(() => isedSarExemptionMw(2450e6, 0.25)).toThrow(/20 cm/);
  });
  it('compares power with the limit: 3 mW at 2450 MHz, 5 mm is exempt with margin 10·log10(4/3) dB', () => {
    const r = computeIsedSarExemption({ frequencyHz: 2450e6, separationM: 0.005, limbWorn: false, powerMw: 3 });
    expect(r.exempt).toBe(true);
    expect(r.marginDb).toBeCloseTo(1.249, 3);
  });
  it('property: the limit rises with separation (every Table 1 row increases left to right)', () => {
    fc.assert(
      fc.property(fc.double({ min: 100e3, max: 5800e6, noNaN: true }), fc.double({ min: 0, max: 0.2, noNaN: true }), fc.double({ min: 0, max: 0.2, noNaN: true }), (f, a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(isedSarExemptionMw(f, lo)).toBeLessThanOrEqual(isedSarExemptionMw(f, hi) + 1e-9);
      }),
    );
  });
  it('property: the band minimum over edges and table frequencies is never above a dense scan (bilinear)', () => {
    fc.assert(
      fc.property(fc.double({ min: 300e6, max: 5800e6, noNaN: true }), fc.double({ min: 300e6, max: 5800e6, noNaN: true }), fc.double({ min: 0, max: 0.2, noNaN: true }), (f1, f2, d) => {
        const [lo, hi] = f1 <= f2 ? [f1, f2] : [f2, f1];
        const best = mostRestrictiveInBand(lo, hi, isedSarTableFrequenciesHz, (f) => isedSarExemptionMw(f, d));
        for (let i = 0; i <= 40; i++) expect(best.threshold).toBeLessThanOrEqual(isedSarExemptionMw(lo + ((hi - lo) * i) / 40, d) + 1e-9);
      }),
      { numRuns: 50 },
    );
  });
});

describe('ised-rf-exemption — RSS-102 Issue 5 §2.5.2', () => {
  it('RSS-102 Issue 5 §2.5.2, worked: 2450 MHz → 1.31×10⁻²·2450^0.6834 = 2.713 W', () => {
    expect(isedRfExemptionEirpW(2450e6, 0.3)).toBeCloseTo(2.713, 3);
  });
  it('RSS-102 Issue 5 §2.5.2, worked: 5800 MHz → 4.889 W; 30 MHz → 4.49/√30 = 0.820 W', () => {
    expect(isedRfExemptionEirpW(5800e6, 0.3)).toBeCloseTo(4.889, 3);
    expect(isedRfExemptionEirpW(30e6, 0.3)).toBeCloseTo(0.82, 3);
  });
  it('§2.5.2 rows as printed: f < 20 MHz 1 W; 48 ≤ f < 300 MHz 0.6 W; f ≥ 6 GHz 5 W (row edges belong to the upper row)', () => {
    expect(isedRfExemptionEirpW(10e6, 1)).toBe(1);
    expect(isedRfExemptionEirpW(48e6, 1)).toBe(0.6);
    expect(isedRfExemptionEirpW(6e9, 1)).toBe(5);
    expect(isedRfExemptionEirpW(20e6, 1)).toBeCloseTo(4.49 / Math.sqrt(20), 12);
    expect(isedRfBreakpointsHz).toEqual([20e6, 48e6, 300e6, 6e9]);
  });
  it('RSS-102 Issue 5 §2.5.2 check: each limit ≈ Table 4 S × 4π(0.2 m)² (at 2450 MHz within 1 %)', () => {
    const s = 0.02619 * 2450 ** 0.6834;
    expect(Math.abs(isedRfExemptionEirpW(2450e6, 0.3) / (s * 4 * Math.PI * 0.04) - 1)).toBeLessThan(0.01);
  });
  it('separation at or below 20 cm → CalcRangeError pointing to the SAR exemption', () => {
    expect(() => isedRfExemptionEirpW(2450e6, 0.2)).toThrow(CalcRangeError);
    expect(() => isedRfExemptionEirpW(2450e6, 0.1)).toThrow(/ised-sar-exemption/);
  });
  it('compares e.i.r.p.: 3 W at 2450 MHz is not exempt', () => {
    expect(computeIsedRfExemption({ frequencyHz: 2450e6, separationM: 0.5, eirpW: 3 }).exempt).toBe(false);
  });
});
