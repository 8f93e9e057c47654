/**
 * Sources:
 * - 47 CFR §1.1307(b)(3)(i)(A), (B), (C) (FCC 19-126; 85 FR 18131);
 * - worked values (#1–#8, computed with python3 from the published formulas), two of them published: the filing exhibit
 *   P_th = 2.72 mW at 2.48 GHz, 0.5 cm (#5) and the open-source example 44.3725 mW at 0.45 GHz, 1 cm (#6);
 *   #8 5.6832 W at 444 MHz, 1 m matches a published example.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  computeFcc1mwExemption,
  computeFccMpeExemption,
  computeFccSarExemption,
  fccMpeBreakpointsHz,
  fccMpeMinimumDistanceM,
  fccMpeThresholdErpW,
  fccSarBreakpointsHz,
  fccSarThresholdMw,
  mostRestrictiveInBand,
} from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';
import { runCalculation } from '../../calc/registry';

describe('fcc-sar-exemption — 47 CFR §1.1307(b)(3)(i)(B)', () => {
  it('§1.1307(b)(3)(i)(B) Formula (B.2), worked: 2.45 GHz, 0.5 cm → x = 1.90215, P_th = 2.744 mW', () => {
    const r = computeFccSarExemption({ frequencyHz: 2.45e9, separationM: 0.005 });
    expect(r.exponentX).toBeCloseTo(1.90215, 5);
    expect(r.erp20cmMw).toBe(3060);
    expect(r.thresholdMw).toBeCloseTo(2.744, 3);
    expect(r.derivation.source).toContain('§1.1307(b)(3)(i)(B)');
  });
  it('§1.1307(b)(3)(i)(B) Formula (B.2), worked: 0.835 GHz, 1.5 cm → ERP_20cm = 1703.4 mW, x = 1.41401, P_th = 43.72 mW', () => {
    const r = computeFccSarExemption({ frequencyHz: 0.835e9, separationM: 0.015 });
    expect(r.erp20cmMw).toBeCloseTo(1703.4, 1);
    expect(r.exponentX).toBeCloseTo(1.41401, 5);
    expect(r.thresholdMw).toBeCloseTo(43.72, 2);
  });
  it('§1.1307(b)(3)(i)(B) Formula (B.2), worked: 5.8 GHz, 2.5 cm → x = 2.08928, P_th = 39.71 mW', () => {
    const r = computeFccSarExemption({ frequencyHz: 5.8e9, separationM: 0.025 });
    expect(r.exponentX).toBeCloseTo(2.08928, 5);
    expect(r.thresholdMw).toBeCloseTo(39.71, 2);
  });
  it('§1.1307(b)(3)(i)(B) Formula (B.2), worked: 1.9 GHz, 30 cm (20 < d ≤ 40 cm) → P_th = ERP_20cm = 3060 mW', () => {
    expect(fccSarThresholdMw(1.9e9, 0.3)).toBe(3060);
  });
  it('§1.1307(b)(3)(i)(B), value printed in an FCC filing exhibit: 2.48 GHz, 0.5 cm → 2.72 mW (2.717)', () => {
    expect(fccSarThresholdMw(2.48e9, 0.005)).toBeCloseTo(2.72, 2);
    expect(fccSarThresholdMw(2.48e9, 0.005)).toBeCloseTo(2.717, 3);
  });
  it('§1.1307(b)(3)(i)(B), published open-source example: 0.45 GHz, 1 cm → 44.3725 mW', () => {
    expect(fccSarThresholdMw(0.45e9, 0.01)).toBeCloseTo(44.3725, 4);
  });
  it('§1.1307(b)(3)(i)(B) range: 0.3–6 GHz and 0.5–40 cm inclusive; outside → CalcRangeError naming the range', () => {
    expect(() => fccSarThresholdMw(0.3e9, 0.005)).not.toThrow();
    expect(() => fccSarThresholdMw(6e9, 0.4)).not.toThrow();
    expect(() => fccSarThresholdMw(6.1e9, 0.01)).toThrow(/6 GHz/);
    expect(() => fccSarThresholdMw(0.29e9, 0.01)).toThrow(CalcRangeError);
    expect(() => fccSarThresholdMw(2.45e9, 0.004)).toThrow(/0\.5 cm.*40 cm/);
    expect(() => fccSarThresholdMw(2.45e9, 0.41)).toThrow(/40 cm/);
  });
  it('compares the given power with P_th (47 CFR §1.1307(b)(3)(i)(B): greater of time-averaged power and ERP ≤ P_th)', () => {
    const r = computeFccSarExemption({ frequencyHz: 2.45e9, separationM: 0.005, powerMw: 2 });
    expect(r.exempt).toBe(true);
    expect(r.marginDb).toBeCloseTo(10 * Math.log10(2.7438 / 2), 3);
    expect(computeFccSarExemption({ frequencyHz: 2.45e9, separationM: 0.005, powerMw: 3 }).exempt).toBe(false);
  });
  it('ERP_20cm is continuous at the 1.5 GHz breakpoint (2040·1.5 = 3060 mW, 47 CFR §1.1307(b)(3)(i)(B))', () => {
    expect(fccSarBreakpointsHz).toEqual([1.5e9]);
    expect(fccSarThresholdMw(1.5e9 - 1, 0.01)).toBeCloseTo(fccSarThresholdMw(1.5e9, 0.01), 4);
  });
  it('property: P_th rises with separation (formula B.2, x > 0 over 0.3–6 GHz)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3e9, max: 6e9, noNaN: true }), fc.double({ min: 0.005, max: 0.4, noNaN: true }), fc.double({ min: 0.005, max: 0.4, noNaN: true }), (f, d1, d2) => {
        const [a, b] = d1 <= d2 ? [d1, d2] : [d2, d1];
        expect(fccSarThresholdMw(f, a)).toBeLessThanOrEqual(fccSarThresholdMw(f, b) * (1 + 1e-12));
      }),
    );
  });
  it('property: the band minimum over edges and the 1.5 GHz breakpoint is never above a dense scan (piecewise monotone in log f)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3e9, max: 6e9, noNaN: true }), fc.double({ min: 0.3e9, max: 6e9, noNaN: true }), fc.double({ min: 0.005, max: 0.4, noNaN: true }), (f1, f2, d) => {
        const [lo, hi] = f1 <= f2 ? [f1, f2] : [f2, f1];
        const best = mostRestrictiveInBand(lo, hi, fccSarBreakpointsHz, (f) => fccSarThresholdMw(f, d));
        for (let i = 0; i <= 50; i++) {
          expect(best.threshold).toBeLessThanOrEqual(fccSarThresholdMw(lo + ((hi - lo) * i) / 50, d) * (1 + 1e-9));
        }
      }),
      { numRuns: 50 },
    );
  });
  it('CLI path: registry runs it and reports a range error with the field path', () => {
    const bad = runCalculation('fcc-sar-exemption', { frequencyHz: 2.45e9, separationM: 0.002 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error.issues[0].path).toEqual(['separationM']);
  });
});

describe('fcc-mpe-exemption — Table 1 to 47 CFR §1.1307(b)(3)(i)(C)', () => {
  it('Table 1 to §1.1307(b)(3)(i)(C), worked: 2450 MHz, R = 0.5 m → λ/2π = 0.0195 m, 19.2·0.5² = 4.80 W', () => {
    const r = computeFccMpeExemption({ frequencyHz: 2450e6, distanceM: 0.5 });
    expect(r.minimumDistanceM).toBeCloseTo(0.0195, 4);
    expect(r.thresholdErpW).toBeCloseTo(4.8, 2);
  });
  it('Table 1 to §1.1307(b)(3)(i)(C), worked: 444 MHz, R = 1 m → 0.0128·1²·444 = 5.6832 W (matches published example)', () => {
    expect(fccMpeThresholdErpW(444e6, 1)).toBeCloseTo(5.6832, 4);
  });
  it('each Table 1 row as printed (Table 1 to 47 CFR §1.1307(b)(3)(i)(C)): 1,920 R², 3,450 R²/f², 3.83 R², 0.0128 R² f, 19.2 R²', () => {
    expect(fccMpeThresholdErpW(1e6, 300)).toBeCloseTo(1920 * 300 ** 2, 6);
    expect(fccMpeThresholdErpW(10e6, 10)).toBeCloseTo((3450 * 100) / 100, 6);
    expect(fccMpeThresholdErpW(100e6, 3)).toBeCloseTo(3.83 * 9, 6);
    expect(fccMpeThresholdErpW(900e6, 2)).toBeCloseTo(0.0128 * 4 * 900, 6);
    expect(fccMpeThresholdErpW(28e9, 2)).toBeCloseTo(19.2 * 4, 6);
  });
  it('coefficients agree with the re-derivation S_GP·4πR²/(4·1.64) to the printed 3 significant figures (worked re-derivation)', () => {
    const derived = (sWPerM2: number) => (sWPerM2 * 4 * Math.PI) / (4 * 1.64);
    expect(derived(1000)).toBeCloseTo(1915.6, 1);
    expect(Math.abs(fccMpeThresholdErpW(1e6, 1000) / 1000 ** 2 - derived(1000)) / derived(1000)).toBeLessThan(0.003);
    expect(Math.abs(fccMpeThresholdErpW(3e9, 1) - derived(10)) / derived(10)).toBeLessThan(0.003);
  });
  it('minimum-distance condition R ≥ λ/2π (Table 1 to 47 CFR §1.1307(b)(3)(i)(C)): violated → CalcRangeError naming λ/2π', () => {
    expect(fccMpeMinimumDistanceM(2450e6)).toBeCloseTo(299792458 / 2450e6 / (2 * Math.PI), 12);
    expect(() => fccMpeThresholdErpW(100e6, 0.3)).toThrow(/λ\/2π/);
    const out = runCalculation('fcc-mpe-exemption', { frequencyHz: 100e6, distanceM: 0.3 });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.issues[0].path).toEqual(['distanceM']);
  });
  it('frequency outside 0.3 MHz–100 GHz → CalcRangeError naming the range', () => {
    expect(() => fccMpeThresholdErpW(150e9, 1)).toThrow(/100 GHz/);
    expect(() => fccMpeThresholdErpW(0.2e6, 1000)).toThrow(/300 kHz/);
  });
  it('property: threshold rises with distance and is continuous across row edges to the printed 3 figures', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3e6, max: 100e9, noNaN: true }), fc.double({ min: 1, max: 2, noNaN: true }), (f, k) => {
        const r = Math.max(fccMpeMinimumDistanceM(f), 0.01);
        expect(fccMpeThresholdErpW(f, r * k)).toBeGreaterThanOrEqual(fccMpeThresholdErpW(f, r));
      }),
    );
    for (const edge of fccMpeBreakpointsHz) {
      const r = 2 * fccMpeMinimumDistanceM(edge * 0.999);
      const below = fccMpeThresholdErpW(edge, r);
      const above = fccMpeThresholdErpW(edge * (1 + 1e-9), r);
      expect(Math.abs(above - below) / below).toBeLessThan(0.003);
    }
  });
});

describe('fcc-1mw-exemption — 47 CFR §1.1307(b)(3)(i)(A) (wording from memory)', () => {
  it('1 mW or less is exempt at any separation; above is not', () => {
    expect(computeFcc1mwExemption({ powerMw: 1, separationM: 0 }).exempt).toBe(true);
    expect(computeFcc1mwExemption({ powerMw: 0.5 }).thresholdMw).toBe(1);
    const over = computeFcc1mwExemption({ powerMw: 1.2, frequencyHz: 2.45e9 });
    expect(over.exempt).toBe(false);
    expect(over.marginDb).toBeCloseTo(-0.792, 3);
    expect(over.condition).toMatch(/regardless of separation/);
  });
});
