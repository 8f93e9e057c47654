/**
 * uncertainty-budget — sources:
 * - JCGM 100:2008 (GUM): divisors rectangular √3 (§4.3.7), triangular √6 (§4.3.9), u_c = √Σ(c_i u_i)²
 *   (§5.1.2), Welch–Satterthwaite ν_eff (Annex G, eq. G.2b). Clause numbers from memory
 *   (JCGM 100:2008 (GUM) and IEC/IEEE 62209-1528:2020 uncertainty budget).
 * - U-shaped √2: JCGM 101:2008 §6.4.6 / EA-4/02 (from memory).
 * - Worked example: JCGM 100:2008 Annex H.1 (end-gauge calibration), Table H.1 — contributions
 *   u(l_s) = 25 nm (ν 18), u(d) = 9.7 nm (ν 25.6), δα 0.58e-6 °C⁻¹ × c 5e6 nm·°C (ν 50),
 *   δθ 0.029 °C × c 575 nm/°C (ν 2); result u_c = 32 nm, ν_eff ≈ 16 (truncated), U99 = t99(16)·u_c = 93 nm
 *   with t99(16) = 2.921 (Student-t table). Numbers recalled from memory, not re-read from the GUM.
 * - Hand-computed SAR-style budget (below), arithmetic shown in the test.
 */
import { describe, expect, it } from 'vitest';
import { uncertaintyBudget } from '../../calc/lab/uncertainty-budget';
import { runCalculation } from '../../calc/registry';

describe('uncertainty-budget', () => {
  it('reproduces JCGM 100:2008 H.1 (end gauge): u_c = 32 nm, ν_eff truncates to 16, U99 = 93 nm (from memory)', () => {
    const r = uncertaintyBudget({
      coverageFactor: 2.921, // t99(16)
      limitPct: 1000,
      components: [
        { name: 'l_s', valuePct: 25, distribution: 'normal', sensitivity: 1, degreesOfFreedom: 18 },
        { name: 'd', valuePct: 9.7, distribution: 'normal', sensitivity: 1, degreesOfFreedom: 25.6 },
        { name: 'alpha_s', valuePct: 1.2e-6, distribution: 'normal', sensitivity: 0 },
        { name: 'theta', valuePct: 0.41, distribution: 'normal', sensitivity: 0 },
        { name: 'delta_alpha', valuePct: 0.58e-6, distribution: 'normal', sensitivity: 5e6, degreesOfFreedom: 50 },
        { name: 'delta_theta', valuePct: 0.029, distribution: 'normal', sensitivity: -575, degreesOfFreedom: 2 },
      ],
    });
    expect(Math.round(r.combinedStandardPct)).toBe(32);
    expect(r.components[4].contributionPct).toBeCloseTo(2.9, 1);
    expect(r.components[5].contributionPct).toBeCloseTo(16.6, 0);
    expect(Math.floor(r.effectiveDegreesOfFreedom as number)).toBe(16);
    expect(Math.round(r.expandedPct)).toBe(93);
  });

  it('hand-computed SAR budget: u_c = √54.095 = 7.3549 %, U(k=2) = 14.71 %, ν_eff = 54.095²/(3⁴/9) = 325.1', () => {
    // probe cal 12 % at k=2 → 6.0; isotropy 4.7/√3·√0.5 = 1.9188; mismatch 2.0/√2 = 1.4142;
    // liquid σ 5.0/√3·0.64 = 1.8475; repeatability 3.0 (ν = 9). Σ squares = 36 + 3.6817 + 2 + 3.4133 + 9 = 54.095.
    const r = uncertaintyBudget({
      components: [
        { name: 'probe calibration', valuePct: 12, distribution: 'normal', divisor: 2, sensitivity: 1 },
        { name: 'axial isotropy', valuePct: 4.7, distribution: 'rectangular', sensitivity: Math.sqrt(0.5) },
        { name: 'mismatch', valuePct: 2.0, distribution: 'u-shaped', sensitivity: 1 },
        { name: 'liquid conductivity', valuePct: 5.0, distribution: 'rectangular', sensitivity: 0.64 },
        { name: 'repeatability', valuePct: 3.0, distribution: 'normal', sensitivity: 1, degreesOfFreedom: 9 },
      ],
    });
    expect(r.components.map((c) => c.standardUncertaintyPct)).toEqual([6, expect.closeTo(2.713546, 6), expect.closeTo(1.414214, 6), expect.closeTo(2.886751, 6), 3]);
    expect(r.combinedStandardPct).toBeCloseTo(7.3549, 4);
    expect(r.expandedPct).toBeCloseTo(14.71, 2);
    expect(r.effectiveDegreesOfFreedom).toBeCloseTo(325.14, 2);
    expect(r.withinLimit).toBe(true); // ≤ 30 % (IEEE 1528-2013 / 62209-1528, from memory)
  });

  it('uses the GUM divisors: normal 1, rectangular √3, U-shaped √2, triangular √6 (JCGM 100 §4.3.7/4.3.9)', () => {
    const r = uncertaintyBudget({
      components: (['normal', 'rectangular', 'u-shaped', 'triangular'] as const).map((distribution) => ({
        name: distribution,
        valuePct: 1,
        distribution,
        sensitivity: 1,
      })),
    });
    expect(r.components.map((c) => c.divisor)).toEqual([1, expect.closeTo(1.7320508, 7), expect.closeTo(1.4142136, 7), expect.closeTo(2.4494897, 7)]);
  });

  it('all Type B (infinite ν): ν_eff is null with a note; JSON-serialisable', () => {
    const r = uncertaintyBudget({ components: [{ name: 'a', valuePct: 10, distribution: 'rectangular', sensitivity: 1 }] });
    expect(r.effectiveDegreesOfFreedom).toBeNull();
    expect(r.effectiveDegreesOfFreedomInfinite).toBe(true);
    expect(r.derivation.notes.join(' ')).toMatch(/infinite/);
    expect(JSON.parse(JSON.stringify(r)).effectiveDegreesOfFreedom).toBeNull();
  });

  it('withinLimit false above 30 % (k = 2 ceiling, IEC/IEEE 62209-1528, from memory)', () => {
    const r = uncertaintyBudget({ components: [{ name: 'big', valuePct: 16, distribution: 'normal', sensitivity: 1 }] });
    expect(r.expandedPct).toBe(32);
    expect(r.withinLimit).toBe(false);
  });

  it('a negative sensitivity contributes by its magnitude', () => {
    const r = uncertaintyBudget({ components: [{ name: 'x', valuePct: 3, distribution: 'normal', sensitivity: -2 }] });
    expect(r.combinedStandardPct).toBe(6);
  });

  it('rejects duplicate component names (the derivation lists components by name)', () => {
    const c = { name: 'x', valuePct: 1, distribution: 'normal' as const, sensitivity: 1 };
    expect(() => uncertaintyBudget({ components: [c, c] })).toThrow(/unique/);
  });

  it('rejects an unknown distribution via the registry, naming the path', () => {
    const out = runCalculation('uncertainty-budget', { components: [{ name: 'x', valuePct: 1, distribution: 'gaussian', sensitivity: 1 }] });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.issues[0].path).toEqual(['components', 0, 'distribution']);
  });
});
