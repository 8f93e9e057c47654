/**
 * SAR against depth for a transmitter at a use position — a screening estimate that explains why a
 * margin is what it is, never a SAR assessment. The tissue stack follows the use-position kind
 * (tissue-stacks.ts: head, trunk or limb). The incident power density is the far-field value
 * S = EIRP/(4πR²) (FCC OET Bulletin 65, Edition 97-01, Eq. (3)), applied as a plane wave at normal
 * incidence on planar layers (calc/em/plane-wave-layers.ts).
 *
 * Absolute SAR (W/kg) is given only where a plane wave is a fair model of the incident field:
 * beyond the reactive near field of a small antenna, d > λ/2π (the "radian distance" where the
 * 1/r³ and 1/r² reactive terms of a small dipole's field fall below the 1/r radiating term:
 * H. A. Wheeler, "The radiansphere around a small antenna", Proc. IRE 47 (1959) 1325–1331;
 * C. A. Balanis, Antenna Theory: Analysis and Design, 4th ed. (Wiley, 2016), §4.2 infinitesimal
 * dipole field regions, kr = 1 — section number from memory). Closer than that the field is
 * reactive, neither far-field in strength nor planar, so only the shape of the profile is given:
 * SAR normalised to its value at the surface (surface = 1).
 */
import { z } from 'zod';
import { defineCalculation, type Derivation } from '../types';
import { q } from '../types';
import { SPEED_OF_LIGHT_M_PER_S } from '../em/constants';
import { planeWaveLayers, type PlaneWaveLayersResult } from '../em/plane-wave-layers';
import { MAX_PROFILE_POINTS, MIN_PROFILE_POINTS } from '../em/plane-wave-layers';
import { farFieldPowerDensityWPerM2 } from '../limits/far-field';
import { formatM } from '../limits/range';
import { USE_POSITION_KINDS, type UsePositionKind } from './input';
import { tissueStackFor, TISSUE_STACK_SOURCE, type StackLayer, type TissueStackId } from './tissue-stacks';

/** R is floored here so that S = EIRP/(4πR²) stays finite at contact positions (common practice choice). */
export const SCREENING_MIN_DISTANCE_M = 0.005;

export const NEAR_FIELD_SOURCE = 'Reactive near-field boundary d = λ/2π: H. A. Wheeler, Proc. IRE 47 (1959) 1325; C. A. Balanis, Antenna Theory, 4th ed. (Wiley, 2016), §4.2 (section from memory)';

export const screeningDepthProfileInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (tissue model: 10 Hz–100 GHz)'),
  eirpW: z.number().positive().describe('Time-averaged EIRP, W'),
  separationM: z.number().min(0).describe(`Separation distance, m (floored at ${SCREENING_MIN_DISTANCE_M} m for the power density)`),
  usePositionKind: z.enum(USE_POSITION_KINDS).describe('Use-position kind: picks the tissue stack (head; trunk for body-worn, hotspot, far-field; limb for extremity)'),
  profilePoints: z.number().int().min(MIN_PROFILE_POINTS).max(MAX_PROFILE_POINTS).default(MIN_PROFILE_POINTS),
});
export type ScreeningDepthProfileInput = z.input<typeof screeningDepthProfileInput>;

export interface RelativeProfilePoint {
  depthM: number;
  /** Local SAR divided by the SAR at the surface, 1. */
  relativeSar: number;
  layerIndex: number;
}

/** The model's absolute figures: given only beyond the reactive near field. */
export interface AbsoluteDepthFigures {
  incidentPowerDensityWPerM2: number;
  sarProfile: PlaneWaveLayersResult['sarProfile'];
  surfaceSarWPerKg: number;
  peakSarWPerKgByLayer: number[];
  averagedSarWPerKg: PlaneWaveLayersResult['averagedSarWPerKg'];
}

export interface ScreeningDepthProfile {
  estimate: 'screening';
  usePositionKind: UsePositionKind;
  stackId: TissueStackId;
  /** Which model it is, in words. */
  stackTitle: string;
  stack: readonly StackLayer[];
  distanceUsedM: number;
  wavelengthM: number;
  /** λ/2π, m. */
  reactiveNearFieldBoundaryM: number;
  /** 'absolute' beyond λ/2π (W/kg), 'relative' closer (surface = 1). */
  scale: 'absolute' | 'relative';
  /** Why the chart shows what it shows, in words. */
  scaleReason: string;
  relativeProfile: RelativeProfilePoint[];
  absolute: AbsoluteDepthFigures | null;
  reflectedFraction: number;
  absorbedFractionByLayer: number[];
  derivation: Derivation;
}

const mm = (m: number) => `${Number((m * 1000).toPrecision(3))} mm`;

export function computeScreeningDepthProfile(input: z.output<typeof screeningDepthProfileInput>): ScreeningDepthProfile {
  const { frequencyHz, eirpW, separationM, usePositionKind, profilePoints } = input;
  const stack = tissueStackFor(usePositionKind);
  const distanceUsedM = Math.max(separationM, SCREENING_MIN_DISTANCE_M);
  const wavelengthM = SPEED_OF_LIGHT_M_PER_S / frequencyHz; // λ = c/f
  const reactiveNearFieldBoundaryM = wavelengthM / (2 * Math.PI); // d = λ/2π (Wheeler 1959; Balanis §4.2, kr = 1)
  // The criterion uses the stated separation, not the floored distance: a contact position stays in the near field.
  const scale = separationM > reactiveNearFieldBoundaryM ? 'absolute' : 'relative';
  const incidentPowerDensityWPerM2 = farFieldPowerDensityWPerM2(eirpW, distanceUsedM);
  const layers = stack.layers.map((l) => ({
    name: l.name,
    tissue: l.tissue,
    thicknessM: l.thicknessM,
  }));
  const r = planeWaveLayers({
    frequencyHz,
    incidentPowerDensityWPerM2,
    layers,
    profilePoints,
  });
  const relativeProfile = r.sarProfile.map((pt) => ({
    depthM: pt.depthM,
    relativeSar: pt.sarWPerKg / r.surfaceSarWPerKg,
    layerIndex: pt.layerIndex,
  }));

  const scaleReason =
    scale === 'absolute'
      ? `The separation ${mm(separationM)} is beyond the reactive near field (λ/2π = ${mm(reactiveNearFieldBoundaryM)} at this frequency), so the far-field power density as a plane wave is a fair model; SAR is shown in W/kg as an estimate.`
      : `The separation ${mm(separationM)} is within the reactive near field (λ/2π = ${mm(reactiveNearFieldBoundaryM)} at this frequency). There the field is neither as strong as the far-field formula says nor a plane wave, so W/kg from this model would mislead; the chart shows only the shape of the absorption, relative to the surface (surface = 1).`;
  const notes = [
    `Model: ${stack.title} as flat layers; a plane wave at normal incidence, reflected and transmitted at each boundary (transmission-line recursion); local SAR = σ|E|²/ρ. It explains how the power divides between the layers; it is not a SAR measurement.`,
    `${TISSUE_STACK_SOURCE}.`,
    scaleReason,
  ];
  if (separationM < SCREENING_MIN_DISTANCE_M) {
    notes.push(`Separation ${formatM(separationM)} floored at ${formatM(SCREENING_MIN_DISTANCE_M)} to keep S = EIRP/(4πR²) finite (common practice choice).`);
  }
  const intermediate: Derivation['intermediate'] = {
    wavelengthM: q(wavelengthM, 'm'),
    reactiveNearFieldBoundaryM: q(reactiveNearFieldBoundaryM, 'm'),
    reflectedFraction: q(r.reflectedFraction, '1'),
  };
  if (scale === 'absolute') {
    intermediate.distanceUsedM = q(distanceUsedM, 'm');
    intermediate.incidentPowerDensityWPerM2 = q(incidentPowerDensityWPerM2, 'W/m²');
  }
  r.layers.forEach((l, i) => {
    const name = stack.layers[i].name;
    intermediate[`${name}RelativePermittivity`] = q(l.relativePermittivity, '1');
    intermediate[`${name}ConductivitySPerM`] = q(l.conductivitySPerM, 'S/m');
    intermediate[`${name}ThicknessM`] = q(l.thicknessM, 'm');
  });
  const result: Derivation['result'] =
    scale === 'absolute'
      ? {
          surfaceSarWPerKg: q(r.surfaceSarWPerKg, 'W/kg'),
          averagedSar1gWPerKg: q(r.averagedSarWPerKg['1g'], 'W/kg'),
          averagedSar10gWPerKg: q(r.averagedSarWPerKg['10g'], 'W/kg'),
        }
      : Object.fromEntries(r.layers.map((l, i) => [`${stack.layers[i].name}PeakRelativeSar`, q(l.peakSarWPerKg / r.surfaceSarWPerKg, '1')]));
  return {
    estimate: 'screening',
    usePositionKind,
    stackId: stack.id,
    stackTitle: stack.title,
    stack: stack.layers,
    distanceUsedM,
    wavelengthM,
    reactiveNearFieldBoundaryM,
    scale,
    scaleReason,
    relativeProfile,
    absolute:
      scale === 'absolute'
        ? {
            incidentPowerDensityWPerM2,
            sarProfile: r.sarProfile,
            surfaceSarWPerKg: r.surfaceSarWPerKg,
            peakSarWPerKgByLayer: r.peakSarWPerKgByLayer,
            averagedSarWPerKg: r.averagedSarWPerKg,
          }
        : null,
    reflectedFraction: r.reflectedFraction,
    absorbedFractionByLayer: r.absorbedFractionByLayer,
    derivation: {
      formula:
        scale === 'absolute'
          ? `λ = c/f; absolute only where d > λ/2π; S_inc = EIRP / (4π R²), R = max(d, 5 mm); plane wave at normal incidence on ${stack.layers.map((l) => l.name).join('/')} (transmission-line recursion); SAR = σ|E|²/ρ`
          : `λ = c/f; d ≤ λ/2π: relative SAR(z) = σ(z)|E(z)|²/ρ(z) ÷ SAR(0), plane wave at normal incidence on ${stack.layers.map((l) => l.name).join('/')} (transmission-line recursion)`,
      inputs: {
        frequencyHz: q(frequencyHz, 'Hz'),
        eirpW: q(eirpW, 'W'),
        separationM: q(separationM, 'm'),
        usePositionKind: q(usePositionKind, 'text'),
      },
      intermediate,
      result,
      source: `FCC OET Bulletin 65 (Edition 97-01) Eq. (3); ${NEAR_FIELD_SOURCE}; plane-wave-layers (Pozar §2.3, Balanis ch. 5; Gabriel 1996 tissues)`,
      notes,
    },
  };
}

/** Plain entry point: validates and applies defaults. */
export function screeningDepthProfile(input: ScreeningDepthProfileInput): ScreeningDepthProfile {
  return computeScreeningDepthProfile(screeningDepthProfileInput.parse(input));
}

export const screeningDepthProfileCalculation = defineCalculation({
  name: 'screening-depth-profile',
  title: 'SAR against depth in a layered tissue stack (screening estimate)',
  description:
    'Far-field incident power density S = EIRP/(4πR²) applied as a plane wave to the tissue stack of the use-position kind: the SAR profile in W/kg beyond the reactive near field (d > λ/2π), its shape relative to the surface closer than that. A screening estimate.',
  input: screeningDepthProfileInput,
  compute: computeScreeningDepthProfile,
  sources: ['FCC OET Bulletin 65 (Edition 97-01) Eq. (3)', NEAR_FIELD_SOURCE, 'Gabriel, Lau & Gabriel 1996, Phys. Med. Biol. 41:2271', TISSUE_STACK_SOURCE],
});
