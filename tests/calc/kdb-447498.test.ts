/**
 * Sources:
 * - FCC KDB 447498 D01 v06 §4.3.1 a)–c) and §4.1 f) (FCC KDB 447498 D01 v06 §4.3.1, secondary source);
 * - §4.3.2 estimated SAR of an excluded transmitter (FCC KDB 447498 D01 v06 §4.3.2, from memory);
 * - worked values (computed with python3 from the published formulas): #11 (9.58 / 23.96 mW), #12 (integer cutoff 9 mW), #13 (595.8 mW),
 *   #14 (442.5 mW), #15 (0.209 / 0.083 W/kg).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeKdbSarTestExclusion, kdbCriticalFrequenciesHz, kdbEstimatedSarWPerKg, kdbExclusionThreshold, kdbExclusionThresholdMw, kdbTestRatio } from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';

describe('kdb-sar-test-exclusion — KDB 447498 D01 v06 §4.3.1', () => {
  it('KDB 447498 D01 v06 §4.3.1 a), worked: 2.45 GHz, 5 mm → 9.58 mW (1-g), 23.96 mW (10-g extremity)', () => {
    expect(kdbExclusionThresholdMw(2.45e9, 0.005)).toBeCloseTo(9.58, 2);
    expect(kdbExclusionThresholdMw(2.45e9, 0.005, true)).toBeCloseTo(23.96, 2);
  });
  it('KDB 447498 D01 v06 §4.3.1 a) rounding, worked: 9 mW → 2.8 (excluded), 10 mW → 3.1 (not); integer cutoff 9 mW', () => {
    expect(kdbTestRatio(9, 2.45e9, 0.005)).toBe(2.8);
    expect(kdbTestRatio(10, 2.45e9, 0.005)).toBe(3.1);
    const r9 = computeKdbSarTestExclusion({ frequencyHz: 2.45e9, separationM: 0.005, extremity: false, powerMw: 9 });
    expect(r9).toMatchObject({ excluded: true, testRatio: 2.8, maxExcludedPowerMw: 9 });
    expect(computeKdbSarTestExclusion({ frequencyHz: 2.45e9, separationM: 0.005, extremity: false, powerMw: 10 }).excluded).toBe(false);
  });
  it('§4.1 f): separations under 5 mm are taken as 5 mm; distance rounded to the nearest mm', () => {
    expect(kdbExclusionThresholdMw(2.45e9, 0)).toBe(kdbExclusionThresholdMw(2.45e9, 0.005));
    expect(kdbExclusionThresholdMw(2.45e9, 0.0031)).toBe(kdbExclusionThresholdMw(2.45e9, 0.005));
    expect(kdbExclusionThreshold(2.45e9, 0.0104).separationUsedMm).toBe(10);
  });
  it('KDB 447498 D01 v06 §4.3.1 b) 2), worked: 2.45 GHz, 100 mm → 95.83 + 50·10 = 595.8 mW', () => {
    const t = kdbExclusionThreshold(2.45e9, 0.1);
    expect(t.branch).toBe('b2');
    expect(t.thresholdMw).toBeCloseTo(595.8, 1);
  });
  it('KDB 447498 D01 v06 §4.3.1 b) 1), worked: 835 MHz, 100 mm → 164.15 + 50·835/150 = 442.5 mW', () => {
    const t = kdbExclusionThreshold(835e6, 0.1);
    expect(t.branch).toBe('b1');
    expect(t.thresholdMw).toBeCloseTo(442.5, 1);
  });
  // §4.3.1 c) (illustrated in v06 Appendix C): the step-a) power at 50 mm and 100 MHz is
  // 3.0·50/√0.1 = 474.3 mW, the number FCC filing exhibits applying §4.3.1 c) print (secondary
  // source). c) 2) at d ≤ 50 mm: ½ · 474.3 · [1 + log10(100/f_MHz)] — at 10 MHz exactly 474.3 mW,
  // at 13.56 MHz 443.0 mW; c) 1) at 100 mm: (474.3 + 50·100/150) · [1 + log10(100/f)] = 507.6 mW × 2 at 10 MHz.
  it('§4.3.1 c) below 100 MHz, pinned to the published 474.3 mW (50 mm, 100 MHz): c) 2) 474.3 mW at 10 MHz, 443.0 mW at 13.56 MHz; c) 1) 1015.35 mW at 10 MHz, 100 mm', () => {
    expect(kdbExclusionThreshold(10e6, 0.02)).toMatchObject({ branch: 'c2' });
    expect(kdbExclusionThresholdMw(10e6, 0.02)).toBeCloseTo(474.3, 1);
    expect(kdbExclusionThresholdMw(13.56e6, 0.005)).toBeCloseTo(443.0, 1);
    expect(kdbExclusionThresholdMw(10e6, 0.05)).toBe(kdbExclusionThresholdMw(10e6, 0.02)); // flat up to 50 mm
    expect(kdbExclusionThreshold(10e6, 0.1)).toMatchObject({ branch: 'c1' });
    expect(kdbExclusionThresholdMw(10e6, 0.1)).toBeCloseTo(1015.35, 1);
    expect(() => kdbExclusionThresholdMw(10e6, 0.2)).toThrow(CalcRangeError);
  });
  it('range: above 6 GHz and beyond 200 mm → CalcRangeError naming the range', () => {
    expect(() => kdbExclusionThresholdMw(6.5e9, 0.01)).toThrow(/6 GHz/);
    expect(() => kdbExclusionThresholdMw(2.45e9, 0.25)).toThrow(/200 mm/);
  });
  it('b) 1) and b) 2) agree at 1500 MHz (f/150 = 10 mW/mm)', () => {
    expect(kdbExclusionThresholdMw(1500e6, 0.1)).toBeCloseTo(kdbExclusionThresholdMw(1500e6 * (1 + 1e-12), 0.1), 6);
  });
  it('kdbCriticalFrequenciesHz adds the interior minimum of b) 1): 60 mm, 1-g → f = (3.75·3/10)^(2/3) GHz', () => {
    const crit = kdbCriticalFrequenciesHz(0.06);
    const fMin = ((3.75 * 3) / 10) ** (2 / 3) * 1e9;
    expect(crit).toEqual([100e6, fMin, 1.5e9]);
    const t = (f: number) => kdbExclusionThresholdMw(f, 0.06);
    expect(t(fMin)).toBeLessThan(t(fMin * 0.95));
    expect(t(fMin)).toBeLessThan(t(fMin * 1.05));
  });
  it('property: the threshold rises with separation (all branches, 1-g and 10-g)', () => {
    fc.assert(
      fc.property(fc.double({ min: 100e3, max: 6e9, noNaN: true }), fc.integer({ min: 0, max: 199 }), fc.integer({ min: 0, max: 199 }), fc.boolean(), (f, a, b, extremity) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(kdbExclusionThresholdMw(f, lo / 1000, extremity)).toBeLessThanOrEqual(kdbExclusionThresholdMw(f, hi / 1000, extremity) * (1 + 1e-12));
      }),
    );
  });
});

describe('kdb-sar-test-exclusion — §4.3.2 estimated SAR (from memory, FCC KDB 447498 D01 v06 §4.3.2, from memory)', () => {
  it('KDB 447498 D01 v06 §4.3.2 (from memory), worked: 5 mW, 5 mm, 2.45 GHz → 0.209 W/kg (1-g), 0.083 W/kg (10-g)', () => {
    expect(kdbEstimatedSarWPerKg(5, 2.45e9, 0.005)).toBeCloseTo(0.209, 3);
    expect(kdbEstimatedSarWPerKg(5, 2.45e9, 0.005, true)).toBeCloseTo(0.083, 3);
    const r = computeKdbSarTestExclusion({ frequencyHz: 2.45e9, separationM: 0.005, extremity: false, powerMw: 5 });
    expect(r.estimatedSarWPerKg).toBeCloseTo(0.209, 3);
    expect(r.derivation.notes.join(' ')).toMatch(/from memory/);
  });
  it('beyond 50 mm: 0.4 W/kg (1-g), 1.0 W/kg (10-g)', () => {
    expect(kdbEstimatedSarWPerKg(50, 2.45e9, 0.08)).toBe(0.4);
    expect(kdbEstimatedSarWPerKg(50, 2.45e9, 0.08, true)).toBe(1.0);
  });
  it('no estimate for a transmitter that is not excluded', () => {
    const r = computeKdbSarTestExclusion({ frequencyHz: 2.45e9, separationM: 0.005, extremity: false, powerMw: 20 });
    expect(r.excluded).toBe(false);
    expect(r.estimatedSarWPerKg).toBeNull();
  });
});
