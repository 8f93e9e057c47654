/**
 * `medium` — plane-wave parameters of a homogeneous medium.
 * Reproduces: check values computed independently (python3) from the closed forms of Balanis, "Advanced Engineering Electromagnetics", ch. 4,
 * and Pozar, "Microwave Engineering", 4th ed., Table 1.1), and Z0 from CODATA 2022.
 * Limiting cases (free space, lossless dielectric √(μ/ε), good conductor δ = √(2/(ωμσ))) are the
 * textbook closed forms (Pozar Table 1.1 — table number from memory).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { complex, div, mul, sqrt } from '../../calc/em/complex';
import { EPSILON0_F_PER_M, FREE_SPACE_IMPEDANCE_OHM, MU0_H_PER_M, SPEED_OF_LIGHT_M_PER_S } from '../../calc/em/constants';
import { medium, mediumInput, mediumProperties } from '../../calc/em/medium';

const run = (raw: unknown) => medium.compute(mediumInput.parse(raw));

describe('medium: limiting cases', () => {
  it('free space has η = Z0 = 376.730 313 412 Ω (CODATA 2022, independent textbook computation (python3)) and no loss', () => {
    const r = run({ frequencyHz: 1e9, relativePermittivity: 1, conductivitySPerM: 0 });
    expect(r.intrinsicImpedanceOhm.re).toBeCloseTo(376.730313412, 9);
    expect(r.intrinsicImpedanceOhm.im).toBe(0);
    expect(FREE_SPACE_IMPEDANCE_OHM).toBeCloseTo(376.730313412, 9);
    expect(r.attenuationNpPerM).toBe(0);
    expect(r.skinDepthM).toBeNull();
    expect(r.lossTangent).toBe(0);
    // β = ω/c (textbook, Pozar §1.4); μ0ε0c² = 1 holds to ~1e-12 with the rounded CODATA 2022 values
    expect(r.phaseRadPerM / ((2 * Math.PI * 1e9) / SPEED_OF_LIGHT_M_PER_S)).toBeCloseTo(1, 10);
    // ε0·μ0·c² = 1 to CODATA 2022 precision (10 significant digits)
    expect(EPSILON0_F_PER_M * MU0_H_PER_M * SPEED_OF_LIGHT_M_PER_S ** 2).toBeCloseTo(1, 9);
  });

  it('a lossless dielectric has η = √(μ/ε) (εr 4 → Z0/2; εr 9, μr 4 → Z0·2/3) (Pozar Table 1.1)', () => {
    const a = run({ frequencyHz: 2.45e9, relativePermittivity: 4, conductivitySPerM: 0 });
    expect(a.intrinsicImpedanceOhm.re).toBeCloseTo(FREE_SPACE_IMPEDANCE_OHM / 2, 9);
    expect(a.intrinsicImpedanceOhm.im).toBeCloseTo(0, 12);
    const b = run({ frequencyHz: 1e6, relativePermittivity: 9, conductivitySPerM: 0, relativePermeability: 4 });
    expect(b.intrinsicImpedanceOhm.re).toBeCloseTo((FREE_SPACE_IMPEDANCE_OHM * 2) / 3, 9);
  });

  it.each([
    // independent textbook computation (python3), copper σ = 5.8e7 S/m: δ and Rs as printed
    { f: 60, deltaM: 8.5316e-3, deltaDigits: 7, rs: 2.0209e-6 },
    { f: 1e6, deltaM: 66.085e-6, deltaDigits: 9, rs: 2.609e-4 },
    { f: 10e9, deltaM: 0.66085e-6, deltaDigits: 11, rs: 2.609e-2 },
  ])('good conductor (copper, $f Hz): δ = √(2/(ωμσ)) and η = (1+j)Rs ≈ 0 (independent textbook computation (python3))', ({ f, deltaM, deltaDigits, rs }) => {
    const r = run({ frequencyHz: f, relativePermittivity: 1, conductivitySPerM: 5.8e7 });
    expect(r.skinDepthM!).toBeCloseTo(deltaM, deltaDigits);
    const omega = 2 * Math.PI * f;
    expect(r.skinDepthM! / Math.sqrt(2 / (omega * MU0_H_PER_M * 5.8e7))).toBeCloseTo(1, 8);
    // Rs printed with 5 significant digits
    expect(r.intrinsicImpedanceOhm.re / rs).toBeCloseTo(1, 4);
    expect(r.intrinsicImpedanceOhm.im / r.intrinsicImpedanceOhm.re).toBeCloseTo(1, 6);
    expect(Math.hypot(r.intrinsicImpedanceOhm.re, r.intrinsicImpedanceOhm.im)).toBeLessThan(0.04);
  });
});

describe('medium: values computed independently from the textbook formulas (python3)', () => {
  it('sea water at 1 MHz (εr 81, σ 4 S/m)', () => {
    const r = run({ frequencyHz: 1e6, relativePermittivity: 81, conductivitySPerM: 4 });
    expect(r.lossTangent).toBeCloseTo(887.659, 3);
    expect(r.attenuationNpPerM).toBeCloseTo(3.971598, 6);
    expect(r.phaseRadPerM).toBeCloseTo(3.976074, 6);
    expect(r.skinDepthM!).toBeCloseTo(0.251788, 6);
    expect(r.intrinsicImpedanceOhm.re).toBeCloseTo(0.99402, 5);
    expect(r.intrinsicImpedanceOhm.im).toBeCloseTo(0.9929, 5);
  });

  it('sea water at 1 GHz (εr 81, σ 4 S/m) — where the good-conductor formula would be wrong', () => {
    const r = run({ frequencyHz: 1e9, relativePermittivity: 81, conductivitySPerM: 4 });
    expect(r.lossTangent).toBeCloseTo(0.887659, 6);
    expect(r.attenuationNpPerM).toBeCloseTo(77.444544, 6);
    expect(r.phaseRadPerM).toBeCloseTo(203.90548, 6);
    expect(r.skinDepthM! * 1e3).toBeCloseTo(12.9125, 4);
    expect(r.intrinsicImpedanceOhm.re).toBeCloseTo(33.84067, 5);
    expect(r.intrinsicImpedanceOhm.im).toBeCloseTo(12.85289, 5);
    // independent textbook computation (python3): the good-conductor α would be 125.664 Np/m
    expect(Math.sqrt(Math.PI * 1e9 * MU0_H_PER_M * 4)).toBeCloseTo(125.664, 3);
  });

  it.each([
    { what: 'Gabriel muscle, 900 MHz', f: 900e6, er: 55.0319, s: 0.942959, re: 48.727, im: 8.1069, alpha: 23.6097 },
    { what: 'Gabriel muscle, 2450 MHz', f: 2450e6, er: 52.7295, s: 1.738794, re: 50.7881, im: 6.0564, alpha: 44.7829 },
    { what: 'classic textbook muscle, 915 MHz', f: 915e6, er: 51, s: 1.6, re: 46.8287, im: 13.2715, alpha: 40.472 },
    { what: 'classic textbook muscle, 2450 MHz', f: 2450e6, er: 47, s: 2.21, re: 52.6931, im: 8.8337, alpha: 59.8623 },
  ])('$what: η and α as printed (independent textbook computation (python3))', ({ f, er, s, re, im, alpha }) => {
    const r = run({ frequencyHz: f, relativePermittivity: er, conductivitySPerM: s });
    expect(r.intrinsicImpedanceOhm.re).toBeCloseTo(re, 4);
    expect(r.intrinsicImpedanceOhm.im).toBeCloseTo(im, 4);
    expect(r.attenuationNpPerM).toBeCloseTo(alpha, 4);
  });

  it('carries its derivation with units and sources (issue 3 output contract)', () => {
    const r = run({ frequencyHz: 9e8, relativePermittivity: 41.5, conductivitySPerM: 0.97 });
    expect(r.derivation.inputs.relativePermeability).toEqual({ value: 1, unit: '1' });
    expect(r.derivation.result.attenuationNpPerM.unit).toBe('Np/m');
    expect(r.derivation.source).toMatch(/Balanis/);
    expect(r.derivation.source).toMatch(/CODATA 2022/);
  });

  it('rejects non-physical input with a message naming the field (issue 3 error contract)', () => {
    const bad = mediumInput.safeParse({ frequencyHz: 0, relativePermittivity: 1, conductivitySPerM: -1 });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => i.path[0]).sort()).toEqual(['conductivitySPerM', 'frequencyHz']);
  });
});

describe('medium: properties (fast-check)', () => {
  const media = fc.record({
    f: fc.double({ min: 1e3, max: 1e11, noNaN: true }),
    er: fc.double({ min: 1, max: 100, noNaN: true }),
    s: fc.double({ min: 0, max: 1e4, noNaN: true }),
    mr: fc.double({ min: 1, max: 10, noNaN: true }),
  });

  it('closed-form α, β equal γ = √(jωμ(σ + jωε)) and η·γ = jωμ (definitions, Balanis ch. 4)', () => {
    fc.assert(
      fc.property(media, ({ f, er, s, mr }) => {
        const m = mediumProperties(f, er, s, mr);
        const w = 2 * Math.PI * f;
        const mu = MU0_H_PER_M * mr;
        const gamma = sqrt(mul(complex(0, w * mu), complex(s, w * EPSILON0_F_PER_M * er)));
        expect(Math.abs(m.attenuationNpPerM - gamma.re)).toBeLessThanOrEqual(1e-9 * abs(gamma) + 1e-12);
        expect(Math.abs(m.phaseRadPerM - gamma.im) / gamma.im).toBeLessThan(1e-9);
        const jwmu = div(complex(0, w * mu), m.intrinsicImpedanceOhm);
        expect(Math.abs(jwmu.re - gamma.re)).toBeLessThanOrEqual(1e-9 * abs(gamma));
        expect(Math.abs(jwmu.im - gamma.im)).toBeLessThanOrEqual(1e-9 * abs(gamma));
      }),
    );
  });

  it('α ≥ 0, β > 0, Re η > 0 and 0 ≤ arg η ≤ 45° for every passive medium', () => {
    fc.assert(
      fc.property(media, ({ f, er, s, mr }) => {
        const m = mediumProperties(f, er, s, mr);
        expect(m.attenuationNpPerM).toBeGreaterThanOrEqual(0);
        expect(m.phaseRadPerM).toBeGreaterThan(0);
        expect(m.intrinsicImpedanceOhm.re).toBeGreaterThan(0);
        const angle = Math.atan2(m.intrinsicImpedanceOhm.im, m.intrinsicImpedanceOhm.re);
        expect(angle).toBeGreaterThanOrEqual(0);
        expect(angle).toBeLessThanOrEqual(Math.PI / 4 + 1e-12);
      }),
    );
  });
});

function abs(a: { re: number; im: number }) {
  return Math.hypot(a.re, a.im);
}
