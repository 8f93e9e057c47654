/**
 * `plane-wave-layers` — normal-incidence plane wave from free space onto planar layers.
 * Reproduces: the air→muscle half-space values computed independently (python3) from the closed forms
 * (Γ, reflected/transmitted fractions, α; from Γ = (η2 − η1)/(η2 + η1), Pozar §1.7 / Balanis ch. 5);
 * the cube sides (1 g at 1000 kg/m³ → 10.000 mm, 10 g → 21.544 mm); closed forms of a
 * half-space (SAR ∝ e^(−2αz)); and textbook invariants (energy balance, perfect conductor, matched
 * layer, half-wave window — Pozar §2.5 / Balanis ch. 5, from memory).
 * The transmission-line recursion in calc/ is checked against an independent solve written here:
 * the boundary conditions (E and H continuous at every interface) assembled into one linear system
 * on the forward/backward amplitudes and solved by Gaussian elimination, with absorption from
 * Simpson quadrature of σ|E|².
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EPSILON0_F_PER_M, FREE_SPACE_IMPEDANCE_OHM, MU0_H_PER_M } from '../../calc/em/constants';
import { mediumProperties } from '../../calc/em/medium';
import { planeWaveLayers, planeWaveLayersCalculation, planeWaveLayersInput, type PlaneWaveLayersInput } from '../../calc/em/plane-wave-layers';
import { TISSUE_IDS, tissueDielectric } from '../../calc/em/tissue-properties';
import { CalcRangeError } from '../../calc/types';

// ---------------------------------------------------------------------------------------------
// Independent boundary-condition solve (tests only). Complex numbers as [re, im] tuples.
type C = [number, number];
const cadd = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
const csub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const cmul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const cdiv = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const cabs2 = (a: C) => a[0] * a[0] + a[1] * a[1];
const cexp = (a: C): C => [Math.exp(a[0]) * Math.cos(a[1]), Math.exp(a[0]) * Math.sin(a[1])];
const csqrtPolar = (a: C): C => {
  const r = Math.sqrt(Math.hypot(a[0], a[1]));
  const t = Math.atan2(a[1], a[0]) / 2;
  return [r * Math.cos(t), r * Math.sin(t)];
};

interface Slab {
  d: number | null;
  er: number;
  s: number;
}

function solveByBoundaryConditions(f: number, slabs: Slab[]) {
  const w = 2 * Math.PI * f;
  const jwmu: C = [0, w * MU0_H_PER_M];
  const gam = slabs.map((l) => csqrtPolar(cmul(jwmu, [l.s, w * EPSILON0_F_PER_M * l.er])));
  const eta = gam.map((g) => cdiv(jwmu, g));
  const p = slabs.map((l, k) => (l.d === null ? ([0, 0] as C) : cexp([-gam[k][0] * l.d, -gam[k][1] * l.d])));
  const semi = slabs[slabs.length - 1].d === null;
  // unknowns: b0, then (a_k, b_k) per finite layer, then a_N (semi-infinite) or t (free space behind)
  const n = 1 + 2 * slabs.filter((l) => l.d !== null).length + 1;
  const aIdx = (k: number) => 1 + 2 * k;
  const bIdx = (k: number) => 2 + 2 * k;
  const tIdx = n - 1;
  const rows: C[][] = [];
  const rhs: C[] = [];
  type Side = { coef: Map<number, C>; k: C };
  const eq = (left: Side, right: Side) => {
    const row: C[] = Array.from({ length: n }, () => [0, 0] as C);
    for (const [i, c] of left.coef) row[i] = cadd(row[i], c);
    for (const [i, c] of right.coef) row[i] = csub(row[i], c);
    rows.push(row);
    rhs.push(csub(right.k, left.k));
  };
  const inv = (z: C) => cdiv([1, 0], z);
  const eta0: C = [FREE_SPACE_IMPEDANCE_OHM, 0];
  // left side of interface k (k = 0: incident free space; else back face of layer k−1)
  const leftE = (k: number): Side =>
    k === 0
      ? { coef: new Map([[0, [1, 0]]]), k: [1, 0] }
      : {
          coef: new Map([
            [aIdx(k - 1), p[k - 1]],
            [bIdx(k - 1), [1, 0]],
          ]),
          k: [0, 0],
        };
  const leftH = (k: number): Side =>
    k === 0
      ? { coef: new Map([[0, cmul([-1, 0], inv(eta0))]]), k: inv(eta0) }
      : {
          coef: new Map([
            [aIdx(k - 1), cmul(p[k - 1], inv(eta[k - 1]))],
            [bIdx(k - 1), cmul([-1, 0], inv(eta[k - 1]))],
          ]),
          k: [0, 0],
        };
  for (let k = 0; k <= slabs.length; k++) {
    if (k === slabs.length) {
      if (semi) break;
      eq(leftE(k), { coef: new Map([[tIdx, [1, 0]]]), k: [0, 0] });
      eq(leftH(k), { coef: new Map([[tIdx, inv(eta0)]]), k: [0, 0] });
    } else if (slabs[k].d === null) {
      eq(leftE(k), { coef: new Map([[tIdx, [1, 0]]]), k: [0, 0] });
      eq(leftH(k), { coef: new Map([[tIdx, inv(eta[k])]]), k: [0, 0] });
    } else {
      eq(leftE(k), {
        coef: new Map([
          [aIdx(k), [1, 0]],
          [bIdx(k), p[k]],
        ]),
        k: [0, 0],
      });
      eq(leftH(k), {
        coef: new Map([
          [aIdx(k), inv(eta[k])],
          [bIdx(k), cmul([-1, 0], cmul(p[k], inv(eta[k])))],
        ]),
        k: [0, 0],
      });
    }
  }
  const x = gaussianSolve(rows, rhs);
  // |E|² at local depth t of layer k (incident |E| = 1 V/m)
  const fieldSq = (k: number, t: number) => {
    if (slabs[k].d === null) return cabs2(cmul(x[tIdx], cexp([-gam[k][0] * t, -gam[k][1] * t])));
    const d = slabs[k].d!;
    const fwd = cmul(x[aIdx(k)], cexp([-gam[k][0] * t, -gam[k][1] * t]));
    const bwd = cmul(x[bIdx(k)], cexp([-gam[k][0] * (d - t), -gam[k][1] * (d - t)]));
    return cabs2(cadd(fwd, bwd));
  };
  const absorbed = slabs.map((l, k) => {
    if (l.s === 0) return 0;
    const len = l.d ?? 40 / gam[k][0];
    return l.s * FREE_SPACE_IMPEDANCE_OHM * simpson((t) => fieldSq(k, t), len, 4000);
  });
  return {
    reflection: x[0],
    reflected: cabs2(x[0]),
    // into free space behind, or — for a lossless half-space — into the half-space: |E|²·Re(1/η*)·η0
    transmitted: semi ? cabs2(x[tIdx]) * cdiv([FREE_SPACE_IMPEDANCE_OHM, 0], [eta.at(-1)![0], -eta.at(-1)![1]])[0] : cabs2(x[tIdx]),
    absorbed,
    fieldSq,
  };
}

function gaussianSolve(a: C[][], b: C[]): C[] {
  const n = b.length;
  const m = a.map((r, i) => [...r, b[i]]);
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (cabs2(m[r][c]) > cabs2(m[piv][c])) piv = r;
    [m[c], m[piv]] = [m[piv], m[c]];
    for (let r = c + 1; r < n; r++) {
      const factor = cdiv(m[r][c], m[c][c]);
      for (let j = c; j <= n; j++) m[r][j] = csub(m[r][j], cmul(factor, m[c][j]));
    }
  }
  const x: C[] = new Array(n);
  for (let r = n - 1; r >= 0; r--) {
    let acc = m[r][n];
    for (let j = r + 1; j < n; j++) acc = csub(acc, cmul(m[r][j], x[j]));
    x[r] = cdiv(acc, m[r][r]);
  }
  return x;
}

function simpson(fn: (t: number) => number, len: number, intervals: number) {
  const h = len / intervals;
  let acc = fn(0) + fn(len);
  for (let i = 1; i < intervals; i++) acc += (i % 2 ? 4 : 2) * fn(i * h);
  return (acc * h) / 3;
}

// ---------------------------------------------------------------------------------------------
// Generators
const frequency = fc.double({ min: 8, max: 10, noNaN: true }).map((e) => 10 ** e); // 100 MHz – 10 GHz
const materialLayer = fc.record({
  thicknessM: fc.double({ min: 1e-4, max: 0.03, noNaN: true }),
  relativePermittivity: fc.double({ min: 1, max: 80, noNaN: true }),
  // σ is 0 (lossless) or physically lossy; subnormal σ would make the quadrature reference meaningless
  conductivitySPerM: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 4, noNaN: true })),
  densityKgPerM3: fc.double({ min: 500, max: 2000, noNaN: true }),
});
const tissueLayer = fc.record({
  thicknessM: fc.double({ min: 1e-4, max: 0.03, noNaN: true }),
  tissue: fc.constantFrom(...TISSUE_IDS),
});
const anyLayer = fc.oneof(materialLayer, tissueLayer);
const stack = fc
  .tuple(fc.array(anyLayer, { minLength: 1, maxLength: 4 }), fc.boolean())
  .map(([layers, semiInfinite]) => (semiInfinite ? layers.map((l, i) => (i === layers.length - 1 ? { ...l, thicknessM: null } : l)) : layers));
const scenario = fc.record({ frequencyHz: frequency, incidentPowerDensityWPerM2: fc.double({ min: 0.1, max: 100, noNaN: true }), layers: stack });

type Layer = PlaneWaveLayersInput['layers'][number];
const slabOf = (l: Layer, f: number): Slab =>
  'tissue' in l
    ? { d: l.thicknessM, er: tissueDielectric(l.tissue, f).relativePermittivity, s: tissueDielectric(l.tissue, f).conductivitySPerM }
    : { d: l.thicknessM, er: l.relativePermittivity, s: l.conductivitySPerM };

const halfSpace = (f: number, er: number, s: number, rho = 1000): PlaneWaveLayersInput => ({
  frequencyHz: f,
  incidentPowerDensityWPerM2: 10,
  layers: [{ thicknessM: null, relativePermittivity: er, conductivitySPerM: s, densityKgPerM3: rho }],
});

// ---------------------------------------------------------------------------------------------
describe('plane-wave-layers: air → muscle half-space (independent textbook computation (python3))', () => {
  it.each([
    { what: 'Gabriel muscle, 900 MHz', f: 900e6, er: 55.0319, s: 0.942959, g: [-0.7703, 0.033732], refl: 0.5945, alpha: 23.6097, powerDepthMm: 21.178 },
    { what: 'Gabriel muscle, 2450 MHz', f: 2450e6, er: 52.7295, s: 1.738794, g: [-0.762052, 0.024962], refl: 0.581346, alpha: 44.7829, powerDepthMm: 11.165 },
    { what: 'classic muscle, 915 MHz', f: 915e6, er: 51, s: 1.6, g: [-0.777135, 0.055683], refl: 0.60704, alpha: 40.472, powerDepthMm: 12.354 },
    { what: 'classic muscle, 2450 MHz', f: 2450e6, er: 47, s: 2.21, g: [-0.753844, 0.036079], refl: 0.569583, alpha: 59.8623, powerDepthMm: 8.352 },
  ])('$what: Γ, reflected/transmitted fractions and α as printed', ({ f, er, s, g, refl, alpha, powerDepthMm }) => {
    const r = planeWaveLayers(halfSpace(f, er, s));
    expect(r.reflectionCoefficient.re).toBeCloseTo(g[0], 6);
    expect(r.reflectionCoefficient.im).toBeCloseTo(g[1], 6);
    expect(r.reflectedFraction).toBeCloseTo(refl, 6);
    // the reference's "transmitted into the half-space" is what the half-space absorbs
    expect(r.absorbedFractionByLayer[0]).toBeCloseTo(1 - refl, 6);
    expect(r.transmittedFraction).toBe(0);
    expect(r.layers[0].attenuationNpPerM).toBeCloseTo(alpha, 4);
    expect(1e3 / (2 * r.layers[0].attenuationNpPerM)).toBeCloseTo(powerDepthMm, 3);
  });

  it('surface SAR = σ|τ|²·S·η0/ρ and the profile falls as e^(−2αz) (closed form of a half-space)', () => {
    const r = planeWaveLayers(halfSpace(900e6, 55.0319, 0.942959, 1090));
    const tau2 = (1 + r.reflectionCoefficient.re) ** 2 + r.reflectionCoefficient.im ** 2;
    expect(r.surfaceSarWPerKg / ((0.942959 * tau2 * 10 * FREE_SPACE_IMPEDANCE_OHM) / 1090)).toBeCloseTo(1, 12);
    const a = r.layers[0].attenuationNpPerM;
    for (const pt of r.sarProfile) {
      expect(pt.sarWPerKg / (r.surfaceSarWPerKg * Math.exp(-2 * a * pt.depthM))).toBeCloseTo(1, 10);
    }
    expect(r.peakSarWPerKgByLayer[0]).toBe(r.surfaceSarWPerKg);
  });
});

describe('plane-wave-layers: surface-faced cube averages', () => {
  it('cube sides at 1000 kg/m³ are 10.000 mm (1 g) and 21.544 mm (10 g) (IT’IS tissue database v4.x)', () => {
    const r = planeWaveLayers(halfSpace(900e6, 41.5, 0.97, 1000));
    expect(r.cubes['1g'].sideM * 1e3).toBeCloseTo(10, 3);
    expect(r.cubes['10g'].sideM * 1e3).toBeCloseTo(21.544, 3);
  });

  it('a half-space averages to SAR0·(1 − e^(−2αs))/(2αs) (closed form)', () => {
    const r = planeWaveLayers(halfSpace(2450e6, 52.7295, 1.738794, 1090));
    const a = r.layers[0].attenuationNpPerM;
    for (const key of ['1g', '10g'] as const) {
      const s = r.cubes[key].sideM;
      expect(r.averagedSarWPerKg[key] / ((r.surfaceSarWPerKg * -Math.expm1(-2 * a * s)) / (2 * a * s))).toBeCloseTo(1, 10);
    }
  });

  it('the cube mass s²·∫ρ dz equals 1 g and 10 g through a layered stack (cube definition, IEC/IEEE 62209-1528 — from memory)', () => {
    const layers = [
      { tissue: 'skin-dry' as const, thicknessM: 0.0015 },
      { tissue: 'fat' as const, thicknessM: 0.004 },
      { tissue: 'muscle' as const, thicknessM: null },
    ];
    const r = planeWaveLayers({ frequencyHz: 1.8e9, incidentPowerDensityWPerM2: 10, layers });
    for (const [key, massKg] of [
      ['1g', 1e-3],
      ['10g', 1e-2],
    ] as const) {
      const s = r.cubes[key].sideM;
      const column = 1109 * Math.min(s, 0.0015) + 911 * Math.max(0, Math.min(s, 0.0055) - 0.0015) + 1090 * Math.max(0, s - 0.0055);
      expect((s * s * column) / massKg).toBeCloseTo(1, 12);
    }
  });

  it('averaged SAR equals the quadrature of σ|E|² over the cube depth divided by its column mass (independent solve above)', () => {
    const input = {
      frequencyHz: 2.45e9,
      incidentPowerDensityWPerM2: 10,
      layers: [
        { tissue: 'skin-wet' as const, thicknessM: 0.002 },
        { tissue: 'fat' as const, thicknessM: 0.003 },
        { tissue: 'muscle' as const, thicknessM: 0.02 },
        { tissue: 'bone-cortical' as const, thicknessM: null },
      ],
    };
    const r = planeWaveLayers(input);
    const ref = solveByBoundaryConditions(
      input.frequencyHz,
      input.layers.map((l) => slabOf(l, input.frequencyHz)),
    );
    const s = r.cubes['10g'].sideM;
    let absorbed = 0;
    let column = 0;
    r.layers.forEach((l, k) => {
      const end = Math.min(s, l.thicknessM === null ? s : l.startDepthM + l.thicknessM);
      if (end <= l.startDepthM) return;
      absorbed += l.conductivitySPerM * simpson((t) => ref.fieldSq(k, t), end - l.startDepthM, 4000);
      column += l.densityKgPerM3 * (end - l.startDepthM);
    });
    const incidentFieldSq = 10 * FREE_SPACE_IMPEDANCE_OHM;
    expect(r.averagedSarWPerKg['10g'] / ((absorbed * incidentFieldSq) / column)).toBeCloseTo(1, 8);
  });

  it('a cube larger than a finite stack is flagged and noted (free space behind has no mass; our own convention)', () => {
    const out = planeWaveLayersCalculation.compute(planeWaveLayersInput.parse({ frequencyHz: 9e8, incidentPowerDensityWPerM2: 10, layers: [{ tissue: 'muscle', thicknessM: 0.005 }] }));
    expect(out.cubes['10g'].extendsBeyondStack).toBe(true);
    expect(out.cubes['10g'].sideM ** 2 * 1090 * 0.005).toBeCloseTo(0.01, 12);
    expect(out.derivation.notes.join(' ')).toMatch(/10g cube .* reaches past the finite stack/);
  });
});

describe('plane-wave-layers: profile and report (issue 3 output contract)', () => {
  const input: PlaneWaveLayersInput = {
    frequencyHz: 900e6,
    incidentPowerDensityWPerM2: 10,
    layers: [
      { name: 'skin', tissue: 'skin-dry', thicknessM: 0.001 },
      { name: 'fat', tissue: 'fat', thicknessM: 0.01 },
      { name: 'muscle', tissue: 'muscle', thicknessM: null },
    ],
  };

  it('has ≥ 200 points in depth order, both sides of every boundary included', () => {
    const r = planeWaveLayers(input);
    expect(r.sarProfile.length).toBeGreaterThanOrEqual(200);
    for (let i = 1; i < r.sarProfile.length; i++) expect(r.sarProfile[i].depthM).toBeGreaterThanOrEqual(r.sarProfile[i - 1].depthM);
    for (const [i, z] of [
      [1, 0.001],
      [2, 0.011],
    ] as const) {
      expect(r.sarProfile.some((p) => p.layerIndex === i - 1 && p.depthM === z)).toBe(true);
      expect(r.sarProfile.some((p) => p.layerIndex === i && p.depthM === z)).toBe(true);
    }
    expect(r.sarProfile[0]).toEqual({ depthM: 0, sarWPerKg: r.surfaceSarWPerKg, layerIndex: 0 });
    expect(planeWaveLayers({ ...input, profilePoints: 1000 }).sarProfile.length).toBeGreaterThanOrEqual(1000);
  });

  it('peak SAR per layer is at least the largest of 100 000 profile points and within 1e-6 of it (dense-sampling cross-check)', () => {
    const r = planeWaveLayers({ ...input, frequencyHz: 5.8e9, profilePoints: 100_000 });
    r.layers.forEach((l, i) => {
      const sampled = Math.max(...r.sarProfile.filter((p) => p.layerIndex === i).map((p) => p.sarWPerKg));
      expect(r.peakSarWPerKgByLayer[i]).toBeGreaterThanOrEqual(sampled * (1 - 1e-12));
      expect(r.peakSarWPerKgByLayer[i]).toBeLessThanOrEqual(sampled * (1 + 1e-6));
      expect(l.peakSarWPerKg).toBe(r.peakSarWPerKgByLayer[i]);
    });
  });

  it('reports each layer with its medium and the Fresnel coefficients of its front interface (Pozar §1.7)', () => {
    const r = planeWaveLayers(input);
    const fat = tissueDielectric('fat', 900e6);
    expect(r.layers[1]).toMatchObject({ name: 'fat', tissue: 'fat', startDepthM: 0.001, densityKgPerM3: 911, relativePermittivity: fat.relativePermittivity });
    const m = mediumProperties(900e6, fat.relativePermittivity, fat.conductivitySPerM);
    expect(r.layers[1].intrinsicImpedanceOhm).toEqual(m.intrinsicImpedanceOhm);
    expect(r.layers[1].skinDepthM).toBe(m.skinDepthM);
    const eta1 = r.layers[0].intrinsicImpedanceOhm;
    const eta2 = r.layers[1].intrinsicImpedanceOhm;
    const g = cdiv(csub([eta2.re, eta2.im], [eta1.re, eta1.im]), cadd([eta2.re, eta2.im], [eta1.re, eta1.im]));
    expect(r.layers[1].frontInterface.reflectionCoefficient.re).toBeCloseTo(g[0], 14);
    expect(r.layers[1].frontInterface.reflectionCoefficient.im).toBeCloseTo(g[1], 14);
    expect(r.layers[1].frontInterface.transmissionCoefficient.re).toBeCloseTo(1 + g[0], 14);
    expect(r.layers[0].inputReflectionCoefficient).toEqual(r.reflectionCoefficient);
    expect(r.exitInterface).toBeNull();
    const finite = planeWaveLayers({ ...input, layers: input.layers.slice(0, 2) });
    expect(finite.exitInterface).not.toBeNull();
    expect(finite.transmittedFraction).toBeGreaterThan(0);
  });

  it('the derivation lists each layer with units and names its sources', () => {
    const out = planeWaveLayersCalculation.compute(planeWaveLayersInput.parse(input));
    expect(out.derivation.inputs.layer3ThicknessM).toEqual({ value: null, unit: 'm' });
    expect(out.derivation.inputs.layer2DensityKgPerM3).toEqual({ value: 911, unit: 'kg/m³' });
    expect(out.derivation.result.averagedSar10gWPerKg.unit).toBe('W/kg');
    expect(out.derivation.source).toMatch(/Pozar/);
    expect(out.derivation.intermediate.energyBalanceResidual.value).toBe(out.energyBalanceResidual);
  });
});

describe('plane-wave-layers: bad input names what to fix (issue 3 error contract)', () => {
  it('only the last layer may be semi-infinite', () => {
    const bad = planeWaveLayersInput.safeParse({
      frequencyHz: 9e8,
      incidentPowerDensityWPerM2: 1,
      layers: [
        { tissue: 'fat', thicknessM: null },
        { tissue: 'muscle', thicknessM: null },
      ],
    });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => i.path)).toEqual([['layers', 0, 'thicknessM']]);
  });

  it.each([
    [{ tissue: 'fat', relativePermittivity: 5, thicknessM: 0.01 }, /Unrecognized key: "relativePermittivity"/],
    [{ thicknessM: 0.01 }, /either tissue .* or relativePermittivity, conductivitySPerM and densityKgPerM3/],
    [{ thicknessM: 0.01, relativePermittivity: 5, conductivitySPerM: 1 }, /closest match: densityKgPerM3/],
    [{ thicknessM: 0.01, tissue: 'liver' }, /closest match: tissue: .*skin-dry/],
  ])('layer %j is refused, naming what to fix', (layer, message) => {
    const bad = planeWaveLayersInput.safeParse({ frequencyHz: 9e8, incidentPowerDensityWPerM2: 1, layers: [layer] });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(['layers', 0]);
    expect(bad.error!.issues[0].message).toMatch(message);
  });

  it('tissue layers outside 10 Hz–100 GHz raise a range error naming the range (Gabriel 1996 validity range)', () => {
    const input = { frequencyHz: 2e11, incidentPowerDensityWPerM2: 1, layers: [{ tissue: 'muscle' as const, thicknessM: null }] };
    expect(() => planeWaveLayers(input)).toThrow(CalcRangeError);
    expect(() => planeWaveLayers(input)).toThrow(/layers\[0\] \(muscle\).*10 Hz to 100 GHz/);
  });

  it.each([[0], [150], [2e5]])('profilePoints %s is refused (200 to 100 000)', (n) => {
    const bad = planeWaveLayersInput.safeParse({ ...halfSpace(1e9, 2, 0), profilePoints: n });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(['profilePoints']);
  });
});

// ---------------------------------------------------------------------------------------------
describe('plane-wave-layers: invariants (fast-check)', () => {
  it('agrees with the independent boundary-condition solve (Γ, fractions per layer, field profile) (Balanis ch. 5 boundary conditions)', () => {
    fc.assert(
      fc.property(scenario, (input) => {
        const r = planeWaveLayers(input);
        const ref = solveByBoundaryConditions(
          input.frequencyHz,
          input.layers.map((l) => slabOf(l, input.frequencyHz)),
        );
        expect(Math.abs(r.reflectionCoefficient.re - ref.reflection[0])).toBeLessThan(1e-9);
        expect(Math.abs(r.reflectionCoefficient.im - ref.reflection[1])).toBeLessThan(1e-9);
        const losslessHalfSpace = input.layers.at(-1)!.thicknessM === null && r.layers.at(-1)!.attenuationNpPerM === 0;
        const semiInfinite = input.layers.at(-1)!.thicknessM === null;
        expect(Math.abs(r.transmittedFraction - (semiInfinite && !losslessHalfSpace ? 0 : ref.transmitted))).toBeLessThan(1e-9);
        r.absorbedFractionByLayer.forEach((a, k) => {
          if (losslessHalfSpace && k === r.layers.length - 1) return;
          expect(Math.abs(a - ref.absorbed[k])).toBeLessThan(1e-6);
        });
        const e2 = input.incidentPowerDensityWPerM2 * FREE_SPACE_IMPEDANCE_OHM;
        for (const pt of r.sarProfile.filter((_, i) => i % 17 === 0)) {
          const l = r.layers[pt.layerIndex];
          if (l.conductivitySPerM === 0) continue;
          const expected = (l.conductivitySPerM * e2 * ref.fieldSq(pt.layerIndex, pt.depthM - l.startDepthM)) / l.densityKgPerM3;
          expect(Math.abs(pt.sarWPerKg - expected)).toBeLessThanOrEqual(1e-8 * Math.max(expected, r.surfaceSarWPerKg));
        }
      }),
      { numRuns: 60 },
    );
  });

  it('energy balance: reflected + absorbed + transmitted = 1 to 1e-9, and Poynting differences match σ∫|E|² (Poynting theorem, Balanis ch. 1 — from memory)', () => {
    fc.assert(
      fc.property(scenario, (input) => {
        const r = planeWaveLayers(input);
        const total = r.reflectedFraction + r.transmittedFraction + r.absorbedFractionByLayer.reduce((a, b) => a + b, 0);
        expect(Math.abs(1 - total)).toBeLessThan(1e-9);
        expect(Math.abs(r.energyBalanceResidual)).toBeLessThan(1e-9);
        expect(r.fieldIntegralMismatch).toBeLessThan(1e-9);
        for (const a of r.absorbedFractionByLayer) expect(a).toBeGreaterThan(-1e-12);
        expect(r.reflectedFraction).toBeLessThanOrEqual(1 + 1e-12);
      }),
    );
  });

  it('a perfect conductor (σ = 1e14 S/m) reflects everything, alone or behind a lossless layer (Pozar §1.7 — from memory)', () => {
    fc.assert(
      fc.property(frequency, fc.boolean(), fc.double({ min: 1, max: 10, noNaN: true }), fc.double({ min: 1e-4, max: 0.03, noNaN: true }), (f, withCoat, er, d) => {
        const conductor = { thicknessM: null, relativePermittivity: 1, conductivitySPerM: 1e14, densityKgPerM3: 8960 };
        const coat = { thicknessM: d, relativePermittivity: er, conductivitySPerM: 0, densityKgPerM3: 1000 };
        const r = planeWaveLayers({ frequencyHz: f, incidentPowerDensityWPerM2: 1, layers: withCoat ? [coat, conductor] : [conductor] });
        expect(r.reflectedFraction).toBeGreaterThan(1 - 1e-5);
        expect(r.transmittedFraction).toBe(0);
      }),
    );
  });

  it('a matched lossless layer (εr = 1, σ = 0: η = η0) in front does not change the reflection (Pozar §2.3, matched line — from memory)', () => {
    fc.assert(
      fc.property(scenario, fc.double({ min: 1e-4, max: 0.1, noNaN: true }), (input, d) => {
        const air = { thicknessM: d, relativePermittivity: 1, conductivitySPerM: 0, densityKgPerM3: 1.2 };
        const r0 = planeWaveLayers(input);
        const r1 = planeWaveLayers({ ...input, layers: [air, ...input.layers] });
        expect(Math.abs(r1.reflectedFraction - r0.reflectedFraction)).toBeLessThan(1e-12);
        expect(Math.abs(r1.transmittedFraction - r0.transmittedFraction)).toBeLessThan(1e-12);
        expect(r1.absorbedFractionByLayer[0]).toBeCloseTo(0, 12);
      }),
    );
  });

  it('a single semi-infinite layer equals the closed form Γ = (η − η0)/(η + η0) (Pozar §1.7)', () => {
    fc.assert(
      fc.property(frequency, fc.double({ min: 1, max: 100, noNaN: true }), fc.oneof(fc.constant(0), fc.double({ min: 1e-9, max: 1e3, noNaN: true })), (f, er, s) => {
        const eta = mediumProperties(f, er, s).intrinsicImpedanceOhm;
        const g = cdiv(csub([eta.re, eta.im], [FREE_SPACE_IMPEDANCE_OHM, 0]), cadd([eta.re, eta.im], [FREE_SPACE_IMPEDANCE_OHM, 0]));
        const r = planeWaveLayers(halfSpace(f, er, s));
        expect(Math.abs(r.reflectionCoefficient.re - g[0])).toBeLessThan(1e-12);
        expect(Math.abs(r.reflectionCoefficient.im - g[1])).toBeLessThan(1e-12);
        const into = s === 0 ? r.transmittedFraction : r.absorbedFractionByLayer[0];
        expect(into).toBeCloseTo(1 - cabs2(g), 12);
      }),
    );
  });

  it('a lossless half-wave layer (d = nλ/2) is transparent: alone it reflects nothing, in front of a stack it leaves Γ unchanged (half-wave window, Pozar §2.3 — from memory)', () => {
    fc.assert(
      fc.property(scenario, fc.double({ min: 1.5, max: 80, noNaN: true }), fc.integer({ min: 1, max: 3 }), (input, er, n) => {
        const beta = mediumProperties(input.frequencyHz, er, 0).phaseRadPerM;
        const slab = { thicknessM: (n * Math.PI) / beta, relativePermittivity: er, conductivitySPerM: 0, densityKgPerM3: 1000 };
        const alone = planeWaveLayers({ ...input, layers: [slab] });
        expect(alone.reflectedFraction).toBeLessThan(1e-12);
        expect(alone.transmittedFraction).toBeCloseTo(1, 12);
        const r0 = planeWaveLayers(input);
        const r1 = planeWaveLayers({ ...input, layers: [slab, ...input.layers] });
        expect(Math.abs(r1.reflectionCoefficient.re - r0.reflectionCoefficient.re)).toBeLessThan(1e-9);
        expect(Math.abs(r1.reflectionCoefficient.im - r0.reflectionCoefficient.im)).toBeLessThan(1e-9);
      }),
    );
  });
});
