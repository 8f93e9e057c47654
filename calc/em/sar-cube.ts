/**
 * SAR quantities of a solved layered field: local SAR = σ|E|²/ρ (rms field), the peak in each
 * layer, and the average over a cube of given mass whose face lies on the surface.
 *
 * Cube model: the field is taken uniform across the cube face (plane wave), so for a side s
 *   mass  m(s) = s² · ∫_0^s ρ(z) dz,   power P(s) = s² · ∫_0^s σ|E(z)|² dz,   SAR_avg = P/m.
 * The side is found by solving m(s) = target mass (m is strictly increasing in s).
 * SAR definition: IEEE Std C95.1 / IEC/IEEE 62209-1528 (SAR = σ|E|²/ρ, rms field); cube averaging
 * of 1 g / 10 g as in IEEE 1528 / IEC/IEEE 62209-1528 (clause numbers from memory).
 */
import { absorbedFromField, fieldSquaredAt, fieldSquaredIntegral, type LayeredSolution, type SolvedLayer } from './layered-field';

/** Local SAR (W/kg) at local depth t (m) inside a layer. */
export function layerSarAt(layer: SolvedLayer, t: number): number {
  return (layer.conductivitySPerM * fieldSquaredAt(layer, t)) / layer.densityKgPerM3;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Maximises f on [a, b] (f unimodal there) by golden-section search; returns the argmax. */
function goldenMax(f: (t: number) => number, a: number, b: number): number {
  let lo = a;
  let hi = b;
  let x1 = hi - GOLDEN * (hi - lo);
  let x2 = lo + GOLDEN * (hi - lo);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let k = 0; k < 80 && hi - lo > 1e-12 * (Math.abs(hi) + 1e-9); k++) {
    if (f1 < f2) {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + GOLDEN * (hi - lo);
      f2 = f(x2);
    } else {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - GOLDEN * (hi - lo);
      f1 = f(x1);
    }
  }
  return (lo + hi) / 2;
}

/**
 * Peak local SAR (W/kg) in a layer and its local depth (m). |E|² in a finite layer is a
 * decaying sum plus a standing-wave term of period π/β, so it is sampled at ≥ 24 points per
 * half wavelength (at most 20 000) and the best sample refined by golden section.
 */
export function layerPeakSar(layer: SolvedLayer): { sarWPerKg: number; localDepthM: number } {
  const d = layer.thicknessM;
  if (d === null || layer.conductivitySPerM === 0) {
    return { sarWPerKg: layerSarAt(layer, 0), localDepthM: 0 };
  }
  const halfWaves = (d * layer.medium.phaseRadPerM) / Math.PI;
  const samples = Math.min(20_000, Math.max(16, Math.ceil(24 * halfWaves)));
  const f = (t: number) => fieldSquaredAt(layer, t);
  let best = 0;
  let bestValue = f(0);
  for (let k = 1; k <= samples; k++) {
    const v = f((d * k) / samples);
    if (v > bestValue) {
      bestValue = v;
      best = k;
    }
  }
  let t = (d * best) / samples;
  if (best > 0 && best < samples) {
    const refined = goldenMax(f, (d * (best - 1)) / samples, (d * (best + 1)) / samples);
    if (f(refined) > bestValue) t = refined;
  }
  return { sarWPerKg: layerSarAt(layer, t), localDepthM: t };
}

/** Overlap of [0, depthM] with each layer: calls visit(layer, local depth covered). */
function forEachCovered(solution: LayeredSolution, depthM: number, visit: (layer: SolvedLayer, t: number) => void) {
  for (const layer of solution.layers) {
    if (depthM <= layer.startDepthM) break;
    const t = layer.thicknessM === null ? depthM - layer.startDepthM : Math.min(layer.thicknessM, depthM - layer.startDepthM);
    visit(layer, t);
  }
}

/** ∫_0^depth ρ dz, kg/m² (free space behind a finite stack adds nothing). */
export function columnMassKgPerM2(solution: LayeredSolution, depthM: number): number {
  let total = 0;
  forEachCovered(solution, depthM, (layer, t) => {
    total += layer.densityKgPerM3 * t;
  });
  return total;
}

/** ∫_0^depth σ|E|² dz, W/m². */
export function columnAbsorbedWPerM2(solution: LayeredSolution, depthM: number): number {
  let total = 0;
  forEachCovered(solution, depthM, (layer, t) => {
    if (layer.conductivitySPerM === 0) return;
    total += layer.thicknessM !== null && t === layer.thicknessM ? absorbedFromField(layer) : layer.conductivitySPerM * fieldSquaredIntegral(layer, t);
  });
  return total;
}

/** Side (m) of the surface-faced cube of the given mass (kg): solves s²·∫_0^s ρ dz = mass. */
export function cubeSideM(solution: LayeredSolution, massKg: number): number {
  const mass = (s: number) => s * s * columnMassKgPerM2(solution, s);
  let hi = Math.cbrt(massKg / solution.layers[0].densityKgPerM3);
  while (mass(hi) < massKg) hi *= 2;
  let lo = 0;
  for (let k = 0; k < 200 && hi - lo > 1e-15 * hi; k++) {
    const mid = (lo + hi) / 2;
    if (mass(mid) < massKg) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

export interface CubeAverage {
  massKg: number;
  sideM: number;
  sarWPerKg: number;
  /** True when the cube reaches past a finite stack into the free space behind it. */
  extendsBeyondStack: boolean;
}

/** Mass-averaged SAR (W/kg) over a surface-faced cube of massKg (kg). */
export function cubeAveragedSar(solution: LayeredSolution, massKg: number): CubeAverage {
  const sideM = cubeSideM(solution, massKg);
  return {
    massKg,
    sideM,
    sarWPerKg: columnAbsorbedWPerM2(solution, sideM) / columnMassKgPerM2(solution, sideM),
    extendsBeyondStack: !solution.semiInfinite && sideM > solution.finiteDepthM,
  };
}
