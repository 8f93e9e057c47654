/**
 * Field of a plane wave at normal incidence from free space onto planar layers (e^(+jωt), rms
 * phasors), solved with the transmission-line input-impedance recursion:
 *
 *   Γ_L,i = (Z_L,i − η_i)/(Z_L,i + η_i)                        load seen at the back of layer i
 *   Z_in,i = η_i·(1 + Γ_L,i·e^(−2γ_i d_i))/(1 − Γ_L,i·e^(−2γ_i d_i))
 *          (= η_i·(Z_L + η_i tanh γd)/(η_i + Z_L tanh γd), written with decaying exponentials
 *           so that thick lossy layers cannot overflow)
 *   Γ = (Z_in,1 − η0)/(Z_in,1 + η0),  E(0) = E_inc·(1 + Γ),  |E_inc|² = S_inc·η0
 *   in layer i (local depth t):  E(t) = A_i e^(−γt) + B_i e^(−γ(d−t)),  B_i = Γ_L,i·A_i·e^(−γd)
 *   power entering a boundary: S = Re(E·H*) = |E|²·Re(1/Z_in)
 *
 * Sources: D. M. Pozar, Microwave Engineering, 4th ed., §2.3 (terminated line, input impedance)
 * and §1.7 (plane-wave reflection at a dielectric interface); C. A. Balanis, Advanced Engineering
 * Electromagnetics, 2nd ed., ch. 5 (reflection and transmission, multiple interfaces) — section
 * numbers from memory.
 */
import { abs2, add, complex, conj, div, exp, mul, ONE, scale, sub, ZERO, type Complex } from './complex';
import { FREE_SPACE_IMPEDANCE_OHM } from './constants';
import { mediumProperties, type MediumProperties } from './medium';

export interface LayerMedium {
  /** Thickness, m; null for a semi-infinite last layer. */
  thicknessM: number | null;
  relativePermittivity: number;
  conductivitySPerM: number;
  densityKgPerM3: number;
}

export interface SolvedLayer extends LayerMedium {
  startDepthM: number;
  medium: MediumProperties;
  /** Z_in looking into the front face of the layer, Ω. */
  inputImpedanceOhm: Complex;
  /** Γ_L at the back face (0 for a semi-infinite layer). */
  loadReflection: Complex;
  /** Forward-wave amplitude at the front face, V/m rms. */
  forwardAmplitude: Complex;
  /** Backward-wave amplitude at the back face, V/m rms. */
  backwardAmplitude: Complex;
  /** Total E at the front face, V/m rms. */
  frontFieldVPerM: Complex;
  /** Power density entering the front face, W/m². */
  powerInWPerM2: number;
  /** Power density leaving through the back face, W/m² (0 for a semi-infinite layer). */
  powerOutWPerM2: number;
}

export interface LayeredSolution {
  frequencyHz: number;
  incidentPowerDensityWPerM2: number;
  incidentFieldVPerM: number;
  /** Γ at the surface. */
  reflectionCoefficient: Complex;
  inputImpedanceOhm: Complex;
  layers: SolvedLayer[];
  /** Sum of finite thicknesses, m. */
  finiteDepthM: number;
  semiInfinite: boolean;
  /** Power density leaving the stack into free space behind it, W/m² (0 if semi-infinite). */
  transmittedWPerM2: number;
}

/** Transmission-line solve of the stack. `layers` must be non-empty; only the last may be semi-infinite. */
export function solveLayers(frequencyHz: number, incidentPowerDensityWPerM2: number, layers: LayerMedium[]): LayeredSolution {
  const eta0 = complex(FREE_SPACE_IMPEDANCE_OHM);
  const media = layers.map((l) => mediumProperties(frequencyHz, l.relativePermittivity, l.conductivitySPerM));
  const n = layers.length;
  const zin: Complex[] = new Array(n);
  const gammaL: Complex[] = new Array(n);
  const decay2: Complex[] = new Array(n); // e^(−2γd)

  // Backward pass: input impedances from the back of the stack to the front.
  let zLoad = eta0;
  for (let i = n - 1; i >= 0; i--) {
    const eta = media[i].intrinsicImpedanceOhm;
    const d = layers[i].thicknessM;
    if (d === null) {
      zin[i] = eta;
      gammaL[i] = ZERO;
      decay2[i] = ZERO;
    } else {
      gammaL[i] = div(sub(zLoad, eta), add(zLoad, eta));
      decay2[i] = exp(scale(media[i].propagationConstantPerM, -2 * d));
      const g = mul(gammaL[i], decay2[i]);
      zin[i] = mul(eta, div(add(ONE, g), sub(ONE, g)));
    }
    zLoad = zin[i];
  }

  const reflection = div(sub(zin[0], eta0), add(zin[0], eta0));
  const incidentFieldVPerM = Math.sqrt(incidentPowerDensityWPerM2 * FREE_SPACE_IMPEDANCE_OHM);

  // Forward pass: amplitudes from the surface down.
  const solved: SolvedLayer[] = [];
  let front = scale(add(ONE, reflection), incidentFieldVPerM);
  let depth = 0;
  for (let i = 0; i < n; i++) {
    const d = layers[i].thicknessM;
    const powerIn = abs2(front) * div(ONE, zin[i]).re;
    let forward: Complex;
    let backward: Complex;
    let back: Complex;
    if (d === null) {
      forward = front;
      backward = ZERO;
      back = ZERO;
    } else {
      forward = div(front, add(ONE, mul(gammaL[i], decay2[i])));
      const decay = exp(scale(media[i].propagationConstantPerM, -d));
      backward = mul(gammaL[i], mul(forward, decay));
      back = add(mul(forward, decay), backward);
    }
    const zNext = i + 1 < n ? zin[i + 1] : eta0;
    const powerOut = d === null ? 0 : abs2(back) * div(ONE, zNext).re;
    // explicit fields, not an object spread: spread is slow under the tsx/esbuild transform
    solved.push({
      thicknessM: d,
      relativePermittivity: layers[i].relativePermittivity,
      conductivitySPerM: layers[i].conductivitySPerM,
      densityKgPerM3: layers[i].densityKgPerM3,
      startDepthM: depth,
      medium: media[i],
      inputImpedanceOhm: zin[i],
      loadReflection: gammaL[i],
      forwardAmplitude: forward,
      backwardAmplitude: backward,
      frontFieldVPerM: front,
      powerInWPerM2: powerIn,
      powerOutWPerM2: powerOut,
    });
    front = back;
    if (d !== null) depth += d;
  }
  const last = solved[n - 1];
  return {
    frequencyHz,
    incidentPowerDensityWPerM2,
    incidentFieldVPerM,
    reflectionCoefficient: reflection,
    inputImpedanceOhm: zin[0],
    layers: solved,
    finiteDepthM: depth,
    semiInfinite: last.thicknessM === null,
    transmittedWPerM2: last.thicknessM === null ? 0 : last.powerOutWPerM2,
  };
}

/** |E|² (V²/m², rms) at local depth t (m) inside a solved layer. Scalar arithmetic: this is the profile's inner loop. */
export function fieldSquaredAt(layer: SolvedLayer, t: number): number {
  const { attenuationNpPerM: alpha, phaseRadPerM: beta } = layer.medium;
  const A = layer.forwardAmplitude;
  // A·e^(−γt) = A·e^(−αt)(cos βt − j sin βt)
  const ef = Math.exp(-alpha * t);
  const cf = Math.cos(beta * t);
  const sf = Math.sin(beta * t);
  let re = ef * (A.re * cf + A.im * sf);
  let im = ef * (A.im * cf - A.re * sf);
  if (layer.thicknessM !== null) {
    const B = layer.backwardAmplitude;
    const u = layer.thicknessM - t;
    const eb = Math.exp(-alpha * u);
    const cb = Math.cos(beta * u);
    const sb = Math.sin(beta * u);
    re += eb * (B.re * cb + B.im * sb);
    im += eb * (B.im * cb - B.re * sb);
  }
  return re * re + im * im;
}

/**
 * |E|² at t0 + k·h, k = 0..count−1, inside a solved layer, by complex recurrence (one complex
 * multiply per point instead of exp/cos/sin). Each wave is stepped in its own decaying direction
 * (forward from the front, backward from the back), so neither can overflow or lose an underflowed start.
 */
export function fieldSquaredSeries(layer: SolvedLayer, t0: number, h: number, count: number): Float64Array {
  const out = new Float64Array(count);
  if (count === 0) return out;
  const { attenuationNpPerM: alpha, phaseRadPerM: beta } = layer.medium;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  // step multiplier e^(−γh)
  const ms = Math.exp(-alpha * h);
  const mr = ms * Math.cos(beta * h);
  const mi = -ms * Math.sin(beta * h);
  let start = mul(layer.forwardAmplitude, exp(scale(layer.medium.propagationConstantPerM, -t0)));
  let fr = start.re;
  let fi = start.im;
  for (let k = 0; k < count; k++) {
    re[k] = fr;
    im[k] = fi;
    const nr = fr * mr - fi * mi;
    fi = fr * mi + fi * mr;
    fr = nr;
  }
  if (layer.thicknessM !== null) {
    const tLast = t0 + (count - 1) * h;
    start = mul(layer.backwardAmplitude, exp(scale(layer.medium.propagationConstantPerM, -(layer.thicknessM - tLast))));
    let br = start.re;
    let bi = start.im;
    for (let k = count - 1; k >= 0; k--) {
      re[k] += br;
      im[k] += bi;
      const nr = br * mr - bi * mi;
      bi = br * mi + bi * mr;
      br = nr;
    }
  }
  for (let k = 0; k < count; k++) out[k] = re[k] * re[k] + im[k] * im[k];
  return out;
}

/** (1 − e^(−x))/x, accurate for small x and equal to 1 at x = 0. */
function oneMinusExpOverX(x: number): number {
  return x === 0 ? 1 : -Math.expm1(-x) / x;
}

/**
 * ∫_0^t |E|² dt' (V²/m, rms) from the front face of a layer to local depth t (m), in closed form:
 *   |A|²(1 − e^(−2αt))/(2α) + |B|² e^(−2α(d−t))(1 − e^(−2αt))/(2α)
 *   + 2 Re[A B* e^(−γ* d)(1 − e^(−2jβt))/(2jβ)]
 */
export function fieldSquaredIntegral(layer: SolvedLayer, t: number): number {
  if (t <= 0) return 0;
  const { attenuationNpPerM: alpha, phaseRadPerM: beta } = layer.medium;
  const decayTerm = t * oneMinusExpOverX(2 * alpha * t);
  let total = abs2(layer.forwardAmplitude) * decayTerm;
  if (layer.thicknessM === null) return total;
  const d = layer.thicknessM;
  total += abs2(layer.backwardAmplitude) * Math.exp(-2 * alpha * (d - t)) * decayTerm;
  const gammaConjD = conj(scale(layer.medium.propagationConstantPerM, d));
  const cross = mul(mul(layer.forwardAmplitude, conj(layer.backwardAmplitude)), exp(scale(gammaConjD, -1)));
  const osc = div(sub(ONE, exp(complex(0, -2 * beta * t))), complex(0, 2 * beta));
  total += 2 * mul(cross, osc).re;
  return total;
}

/** Power absorbed per unit area in a layer from the field integral σ∫|E|² dz, W/m². */
export function absorbedFromField(layer: SolvedLayer): number {
  if (layer.conductivitySPerM === 0) return 0;
  const d = layer.thicknessM;
  if (d === null) {
    const alpha = layer.medium.attenuationNpPerM;
    if (alpha === 0) return 0; // σ so small that α underflows: the power leaves through the half-space
    return (layer.conductivitySPerM * abs2(layer.forwardAmplitude)) / (2 * alpha);
  }
  return layer.conductivitySPerM * fieldSquaredIntegral(layer, d);
}
