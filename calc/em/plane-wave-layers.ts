/**
 * `plane-wave-layers`: a uniform plane wave at normal incidence from free space onto planar
 * tissue layers — reflection, absorption per layer, transmission, the SAR depth profile, peak and
 * surface SAR, and the 1 g / 10 g surface-cube averages. Solver: layered-field.ts (transmission-line
 * recursion); SAR quantities: sar-cube.ts; tissue layers: tissue-properties.ts (Gabriel 1996).
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, type Quantity } from '../types';
import { abs2, add, div, scale, toJson, ONE, type Complex } from './complex';
import { CONSTANTS_SOURCE, FREE_SPACE_IMPEDANCE_OHM } from './constants';
import { absorbedFromField, fieldSquaredSeries, solveLayers, type LayerMedium, type LayeredSolution } from './layered-field';
import { MEDIUM_SOURCES } from './medium';
import { q } from '../types';
import { cubeAveragedSar, layerPeakSar, layerSarAt, type CubeAverage } from './sar-cube';
import { assertColeColeRange, tissueDielectric, tissueIdSchema, TISSUE_SOURCES, type TissueId } from './tissue-properties';

export const MIN_PROFILE_POINTS = 200;
export const MAX_PROFILE_POINTS = 100_000;
export const MAX_LAYERS = 50;

const thickness = z.number().positive().nullable().describe('Layer thickness, m; null for a semi-infinite last layer');

const materialLayer = z.strictObject({
  name: z.string().max(80).optional(),
  thicknessM: thickness,
  relativePermittivity: z.number().positive().describe('Relative permittivity εr, 1'),
  conductivitySPerM: z.number().nonnegative().describe('Conductivity σ, S/m'),
  densityKgPerM3: z.number().positive().describe('Mass density ρ, kg/m³'),
});

const tissueLayer = z.strictObject({
  name: z.string().max(80).optional(),
  thicknessM: thickness,
  tissue: tissueIdSchema,
});

const LAYER_SHAPE_MESSAGE =
  'each layer needs thicknessM (m, or null for a semi-infinite last layer) and either tissue (a tissue id) or relativePermittivity, conductivitySPerM and densityKgPerM3 — not both';

/** Names the rule and the closest of the two layer shapes' own complaints. */
function explainLayerShape(issue: { code?: string; errors?: { path: PropertyKey[]; message: string }[][] }): string {
  const options = issue.errors ?? [];
  if (!options.length) return LAYER_SHAPE_MESSAGE;
  const closest = options.reduce((best, o) => (o.length < best.length ? o : best));
  return `${LAYER_SHAPE_MESSAGE} (closest match: ${closest.map((i) => `${i.path.map(String).join('.') || 'layer'}: ${i.message}`).join('; ')})`;
}

export const planeWaveLayersInput = z
  .object({
    frequencyHz: z.number().positive().describe('Frequency, Hz'),
    incidentPowerDensityWPerM2: z.number().positive().describe('Incident plane-wave power density (rms), W/m²'),
    layers: z
      .array(z.union([materialLayer, tissueLayer], { error: explainLayerShape }))
      .min(1)
      .max(MAX_LAYERS)
      .describe('Layers from the surface inwards; free space lies behind a finite last layer'),
    profilePoints: z.number().int().min(MIN_PROFILE_POINTS).max(MAX_PROFILE_POINTS).default(MIN_PROFILE_POINTS).describe('Number of evenly spaced SAR profile points (layer boundaries are added)'),
  })
  .superRefine((input, ctx) => {
    input.layers.forEach((layer, i) => {
      if (layer.thicknessM === null && i !== input.layers.length - 1) {
        ctx.addIssue({ code: 'custom', path: ['layers', i, 'thicknessM'], message: 'only the last layer may be semi-infinite (thicknessM: null)' });
      }
    });
  });

export type PlaneWaveLayersInput = z.input<typeof planeWaveLayersInput>;
type ParsedInput = z.output<typeof planeWaveLayersInput>;

export interface InterfaceCoefficients {
  reflectionCoefficient: Complex;
  transmissionCoefficient: Complex;
}

export interface LayerReport {
  name: string | null;
  tissue: TissueId | null;
  startDepthM: number;
  thicknessM: number | null;
  relativePermittivity: number;
  conductivitySPerM: number;
  densityKgPerM3: number;
  intrinsicImpedanceOhm: Complex;
  attenuationNpPerM: number;
  phaseRadPerM: number;
  /** 1/α, m; null when the layer is lossless. */
  skinDepthM: number | null;
  /** Fresnel coefficients of the interface in front of this layer (previous medium → this layer). */
  frontInterface: InterfaceCoefficients;
  /** Impedance looking into this layer's front face, everything behind it included, Ω. */
  inputImpedanceOhm: Complex;
  /** Reflection seen from the previous medium at this layer's front face, everything behind included. */
  inputReflectionCoefficient: Complex;
  absorbedFraction: number;
  peakSarWPerKg: number;
  peakSarDepthM: number;
}

export interface SarProfilePoint {
  depthM: number;
  sarWPerKg: number;
  layerIndex: number;
}

export interface PlaneWaveLayersResult {
  reflectedFraction: number;
  transmittedFraction: number;
  absorbedFractionByLayer: number[];
  peakSarWPerKgByLayer: number[];
  surfaceSarWPerKg: number;
  sarProfile: SarProfilePoint[];
  averagedSarWPerKg: { '1g': number; '10g': number };
  reflectionCoefficient: Complex;
  inputImpedanceOhm: Complex;
  layers: LayerReport[];
  /** Fresnel coefficients from the last finite layer into free space behind; null if semi-infinite. */
  exitInterface: InterfaceCoefficients | null;
  cubes: { '1g': CubeAverage; '10g': CubeAverage };
  /** 1 − (reflected + absorbed + transmitted). */
  energyBalanceResidual: number;
  /** Largest |Poynting-difference − σ∫|E|²| over layers, as a fraction of the incident power. */
  fieldIntegralMismatch: number;
  incidentFieldVPerM: number;
}

function resolveLayer(layer: ParsedInput['layers'][number], frequencyHz: number, index: number): LayerMedium & { tissue: TissueId | null; name: string | null } {
  if ('tissue' in layer) {
    try {
      assertColeColeRange(frequencyHz);
    } catch (err) {
      if (err instanceof CalcRangeError) {
        throw new CalcRangeError(`layers[${index}] (${layer.tissue}): ${err.message}`, [{ path: ['frequencyHz'], message: err.message }]);
      }
      throw err;
    }
    const t = tissueDielectric(layer.tissue, frequencyHz);
    return {
      name: layer.name ?? null,
      tissue: layer.tissue,
      thicknessM: layer.thicknessM,
      relativePermittivity: t.relativePermittivity,
      conductivitySPerM: t.conductivitySPerM,
      densityKgPerM3: t.densityKgPerM3,
    };
  }
  return {
    name: layer.name ?? null,
    tissue: null,
    thicknessM: layer.thicknessM,
    relativePermittivity: layer.relativePermittivity,
    conductivitySPerM: layer.conductivitySPerM,
    densityKgPerM3: layer.densityKgPerM3,
  };
}

function fresnel(etaFrom: Complex, etaTo: Complex): InterfaceCoefficients {
  const reflection = div(add(etaTo, scale(etaFrom, -1)), add(etaTo, etaFrom));
  return { reflectionCoefficient: toJson(reflection), transmissionCoefficient: toJson(add(ONE, reflection)) };
}

/**
 * Depth the profile covers: the finite stack, plus min(3 skin depths, 10 wavelengths) of a
 * semi-infinite layer (SAR is down to e^(−6) after 3 skin depths), and at least the 10 g cube.
 */
function profileDepthM(solution: LayeredSolution, cube10gSideM: number): number {
  if (!solution.semiInfinite) return solution.finiteDepthM;
  const last = solution.layers[solution.layers.length - 1].medium;
  const tail = Math.min(3 * last.skinDepthM, (20 * Math.PI) / last.phaseRadPerM);
  return Math.max(solution.finiteDepthM + tail, cube10gSideM);
}

/** Evenly spaced points plus both sides of every layer boundary, sorted by depth. */
function sarProfile(solution: LayeredSolution, depthM: number, points: number): SarProfilePoint[] {
  const out: SarProfilePoint[] = [];
  const step = depthM / (points - 1);
  solution.layers.forEach((layer, layerIndex) => {
    const start = layer.startDepthM;
    if (start > depthM) return;
    const end = layer.thicknessM === null ? depthM : Math.min(start + layer.thicknessM, depthM);
    const sarPerFieldSq = layer.conductivitySPerM / layer.densityKgPerM3;
    out.push({ depthM: start, sarWPerKg: layerSarAt(layer, 0), layerIndex });
    // interior grid points k·step with start < k·step < end
    const first = Math.floor(start / step) + 1;
    let last = Math.min(points - 1, Math.ceil(end / step) - 1);
    while (last >= first && last * step >= end) last--;
    if (last >= first) {
      const fieldSq = fieldSquaredSeries(layer, first * step - start, step, last - first + 1);
      for (let k = first; k <= last; k++) out.push({ depthM: k * step, sarWPerKg: sarPerFieldSq * fieldSq[k - first], layerIndex });
    }
    out.push({ depthM: end, sarWPerKg: layerSarAt(layer, end - start), layerIndex });
  });
  return out;
}

/** Plain entry point (no derivation) for the app and benchmarks; input is validated here. */
export function planeWaveLayers(rawInput: PlaneWaveLayersInput): PlaneWaveLayersResult {
  return planeWaveLayersParsed(planeWaveLayersInput.parse(rawInput));
}

function planeWaveLayersParsed(input: ParsedInput): PlaneWaveLayersResult {
  const resolved = input.layers.map((l, i) => resolveLayer(l, input.frequencyHz, i));
  const solution = solveLayers(input.frequencyHz, input.incidentPowerDensityWPerM2, resolved);
  const incident = input.incidentPowerDensityWPerM2;
  const last = solution.layers[solution.layers.length - 1];
  // A lossless semi-infinite last layer carries its power away: that is transmission, not absorption.
  const losslessHalfSpace = solution.semiInfinite && last.medium.attenuationNpPerM === 0;

  const absorbedFractionByLayer = solution.layers.map((l, i) => (losslessHalfSpace && i === solution.layers.length - 1 ? 0 : (l.powerInWPerM2 - l.powerOutWPerM2) / incident));
  const reflectedFraction = abs2(solution.reflectionCoefficient);
  const transmittedFraction = (losslessHalfSpace ? last.powerInWPerM2 : solution.transmittedWPerM2) / incident;
  const energyBalanceResidual = 1 - (reflectedFraction + transmittedFraction + absorbedFractionByLayer.reduce((a, b) => a + b, 0));
  const fieldIntegralMismatch = Math.max(...solution.layers.map((l, i) => Math.abs(absorbedFromField(l) / incident - absorbedFractionByLayer[i])));

  const peaks = solution.layers.map(layerPeakSar);
  const cube1g = cubeAveragedSar(solution, 1e-3);
  const cube10g = cubeAveragedSar(solution, 1e-2);
  const eta0 = { re: FREE_SPACE_IMPEDANCE_OHM, im: 0 };

  const layers: LayerReport[] = solution.layers.map((l, i) => {
    const prevEta = i === 0 ? eta0 : solution.layers[i - 1].medium.intrinsicImpedanceOhm;
    const inputReflection = div(add(l.inputImpedanceOhm, scale(prevEta, -1)), add(l.inputImpedanceOhm, prevEta));
    return {
      name: resolved[i].name,
      tissue: resolved[i].tissue,
      startDepthM: l.startDepthM,
      thicknessM: l.thicknessM,
      relativePermittivity: l.relativePermittivity,
      conductivitySPerM: l.conductivitySPerM,
      densityKgPerM3: l.densityKgPerM3,
      intrinsicImpedanceOhm: toJson(l.medium.intrinsicImpedanceOhm),
      attenuationNpPerM: l.medium.attenuationNpPerM,
      phaseRadPerM: l.medium.phaseRadPerM,
      skinDepthM: Number.isFinite(l.medium.skinDepthM) ? l.medium.skinDepthM : null,
      frontInterface: fresnel(prevEta, l.medium.intrinsicImpedanceOhm),
      inputImpedanceOhm: toJson(l.inputImpedanceOhm),
      inputReflectionCoefficient: toJson(inputReflection),
      absorbedFraction: absorbedFractionByLayer[i],
      peakSarWPerKg: peaks[i].sarWPerKg,
      peakSarDepthM: l.startDepthM + peaks[i].localDepthM,
    };
  });

  return {
    reflectedFraction,
    transmittedFraction,
    absorbedFractionByLayer,
    peakSarWPerKgByLayer: peaks.map((p) => p.sarWPerKg),
    surfaceSarWPerKg: layerSarAt(solution.layers[0], 0),
    sarProfile: sarProfile(solution, profileDepthM(solution, cube10g.sideM), input.profilePoints),
    averagedSarWPerKg: { '1g': cube1g.sarWPerKg, '10g': cube10g.sarWPerKg },
    reflectionCoefficient: toJson(solution.reflectionCoefficient),
    inputImpedanceOhm: toJson(solution.inputImpedanceOhm),
    layers,
    exitInterface: solution.semiInfinite ? null : fresnel(last.medium.intrinsicImpedanceOhm, eta0),
    cubes: { '1g': cube1g, '10g': cube10g },
    energyBalanceResidual,
    fieldIntegralMismatch,
    incidentFieldVPerM: solution.incidentFieldVPerM,
  };
}

const SOURCES = [
  'D. M. Pozar, Microwave Engineering, 4th ed. (Wiley, 2012), §2.3 terminated transmission line input impedance; §1.7 plane-wave reflection (sections from memory)',
  'C. A. Balanis, Advanced Engineering Electromagnetics, 2nd ed. (Wiley, 2012), ch. 5: reflection and transmission at normal incidence, multiple interfaces (chapter from memory)',
  'SAR = σ|E|²/ρ with rms E (IEEE Std C95.1-2019 definitions; IEC/IEEE 62209-1528:2020 — from memory)',
  'Surface-faced 1 g / 10 g cube averaging as in IEC/IEEE 62209-1528:2020 (cube averaging; clause from memory), field uniform across the face',
  ...TISSUE_SOURCES.slice(0, 3),
  MEDIUM_SOURCES[0],
  CONSTANTS_SOURCE,
];

export const planeWaveLayersCalculation = defineCalculation({
  name: 'plane-wave-layers',
  title: 'Plane wave on planar tissue layers',
  description: 'Normal-incidence plane wave from free space onto planar layers: reflected, absorbed and transmitted fractions, SAR profile, peak, surface and 1 g / 10 g cube-averaged SAR.',
  input: planeWaveLayersInput,
  sources: SOURCES,
  compute(input) {
    const r = planeWaveLayersParsed(input);
    const inputs: Record<string, Quantity> = {
      frequencyHz: q(input.frequencyHz, 'Hz'),
      incidentPowerDensityWPerM2: q(input.incidentPowerDensityWPerM2, 'W/m²'),
      profilePoints: q(input.profilePoints, '1'),
    };
    r.layers.forEach((l, i) => {
      const key = `layer${i + 1}`;
      inputs[`${key}Name`] = q(l.name ?? l.tissue ?? `layer ${i + 1}`, 'text');
      inputs[`${key}ThicknessM`] = q(l.thicknessM, 'm');
      inputs[`${key}RelativePermittivity`] = q(l.relativePermittivity, '1');
      inputs[`${key}ConductivitySPerM`] = q(l.conductivitySPerM, 'S/m');
      inputs[`${key}DensityKgPerM3`] = q(l.densityKgPerM3, 'kg/m³');
    });
    const notes = [
      'Fields are rms phasors; time convention e^(+jωt); layers are non-magnetic (μr = 1).',
      'Absorbed power per layer = difference of the Poynting flux at its faces; cross-checked against σ∫|E|² dz (see intermediate.fieldIntegralMismatch).',
      "Cube averages assume the field is uniform across the cube face (infinite plane wave); the cube mass uses each layer's density.",
    ];
    if (input.layers.some((l) => 'tissue' in l)) notes.push("Tissue layers take εr, σ from the Gabriel 1996 Cole-Cole model and ρ from the IT'IS database (see tissue-properties).");
    if (!r.exitInterface) notes.push('The last layer is semi-infinite: no power is transmitted beyond it.');
    for (const key of ['1g', '10g'] as const) {
      if (r.cubes[key].extendsBeyondStack) notes.push(`The ${key} cube (side ${r.cubes[key].sideM} m) reaches past the finite stack into free space (no mass, no absorption there).`);
    }
    // r is ours and fresh: attach the derivation instead of copying ~16 fields with a spread
    return Object.assign(r, {
      derivation: {
        formula:
          'Z_in,i = η_i(1 + Γ_L,i e^(−2γ_i d_i))/(1 − Γ_L,i e^(−2γ_i d_i)), Γ_L,i = (Z_L − η_i)/(Z_L + η_i); Γ = (Z_in,1 − η0)/(Z_in,1 + η0); ' +
          'E(t) = A e^(−γt) + B e^(−γ(d−t)); absorbed_i = Re(E H*)|front − Re(E H*)|back; SAR = σ|E|²/ρ; ' +
          'cube: s²∫_0^s ρ dz = m, SAR_m = ∫_0^s σ|E|² dz / ∫_0^s ρ dz',
        inputs,
        intermediate: {
          incidentFieldVPerM: q(r.incidentFieldVPerM, 'V/m'),
          freeSpaceImpedanceOhm: q(FREE_SPACE_IMPEDANCE_OHM, 'Ω'),
          inputImpedanceReOhm: q(r.inputImpedanceOhm.re, 'Ω'),
          inputImpedanceImOhm: q(r.inputImpedanceOhm.im, 'Ω'),
          reflectionCoefficientRe: q(r.reflectionCoefficient.re, '1'),
          reflectionCoefficientIm: q(r.reflectionCoefficient.im, '1'),
          cube1gSideM: q(r.cubes['1g'].sideM, 'm'),
          cube10gSideM: q(r.cubes['10g'].sideM, 'm'),
          energyBalanceResidual: q(r.energyBalanceResidual, '1'),
          fieldIntegralMismatch: q(r.fieldIntegralMismatch, '1'),
        },
        result: {
          reflectedFraction: q(r.reflectedFraction, '1'),
          transmittedFraction: q(r.transmittedFraction, '1'),
          absorbedFraction: q(
            r.absorbedFractionByLayer.reduce((a, b) => a + b, 0),
            '1',
          ),
          surfaceSarWPerKg: q(r.surfaceSarWPerKg, 'W/kg'),
          averagedSar1gWPerKg: q(r.averagedSarWPerKg['1g'], 'W/kg'),
          averagedSar10gWPerKg: q(r.averagedSarWPerKg['10g'], 'W/kg'),
        },
        source: SOURCES.slice(0, 4).join('; '),
        notes,
      },
    });
  },
});
