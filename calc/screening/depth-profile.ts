/**
 * SAR against depth in a default head stack for a transmitter at a use position — a screening
 * estimate, not an assessment: the incident power density is the far-field value
 * S = EIRP/(4πR²) (FCC OET Bulletin 65 Eq. (3)), treated as a plane wave at normal incidence on
 * planar layers (calc/em/plane-wave-layers.ts). Near a real antenna the field is neither far-field
 * nor planar, so this shows how the power divides between the layers, not a compliance figure.
 */
import { z } from 'zod';
import { defineCalculation, type Derivation } from '../types';
import { q } from '../types';
import { planeWaveLayers, type PlaneWaveLayersResult } from '../em/plane-wave-layers';
import { MAX_PROFILE_POINTS, MIN_PROFILE_POINTS } from '../em/plane-wave-layers';
import { farFieldPowerDensityWPerM2 } from '../limits/far-field';
import { formatM } from '../limits/range';
import type { TissueId } from '../em/tissue-properties';

export interface HeadStackLayer {
  name: string;
  tissue: TissueId;
  /** m; null for the semi-infinite last layer. */
  thicknessM: number | null;
}

/**
 * Skin / fat / bone / brain, from the surface inwards. Thicknesses are representative adult values
 * — common practice, from memory (no named source was available here): scalp skin 1.5 mm,
 * subcutaneous fat 1.5 mm, skull (cortical bone) 6 mm, then brain (grey matter) as a half-space.
 * Dielectric properties: Gabriel 1996 Cole-Cole via calc/em/tissue-properties.ts.
 */
export const DEFAULT_HEAD_STACK: readonly HeadStackLayer[] = [
  { name: 'skin', tissue: 'skin-dry', thicknessM: 0.0015 },
  { name: 'fat', tissue: 'fat', thicknessM: 0.0015 },
  { name: 'bone', tissue: 'bone-cortical', thicknessM: 0.006 },
  { name: 'brain', tissue: 'brain-grey-matter', thicknessM: null },
];
export const DEFAULT_HEAD_STACK_SOURCE = 'Layer thicknesses: representative adult head values, common practice (from memory, no named source); tissues: Gabriel, Lau & Gabriel 1996';

/** R is floored here so that S = EIRP/(4πR²) stays finite at contact positions (common practice choice). */
export const SCREENING_MIN_DISTANCE_M = 0.005;

export const screeningDepthProfileInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz (tissue model: 10 Hz–100 GHz)'),
  eirpW: z.number().positive().describe('Time-averaged EIRP, W'),
  separationM: z.number().min(0).describe(`Separation distance, m (floored at ${SCREENING_MIN_DISTANCE_M} m)`),
  profilePoints: z.number().int().min(MIN_PROFILE_POINTS).max(MAX_PROFILE_POINTS).default(MIN_PROFILE_POINTS),
});
export type ScreeningDepthProfileInput = z.input<typeof screeningDepthProfileInput>;

export interface ScreeningDepthProfile {
  estimate: 'screening';
  incidentPowerDensityWPerM2: number;
  distanceUsedM: number;
  stack: readonly HeadStackLayer[];
  sarProfile: PlaneWaveLayersResult['sarProfile'];
  surfaceSarWPerKg: number;
  peakSarWPerKgByLayer: number[];
  averagedSarWPerKg: PlaneWaveLayersResult['averagedSarWPerKg'];
  reflectedFraction: number;
  absorbedFractionByLayer: number[];
  derivation: Derivation;
}

export function computeScreeningDepthProfile(input: z.output<typeof screeningDepthProfileInput>): ScreeningDepthProfile {
  const { frequencyHz, eirpW, separationM, profilePoints } = input;
  const distanceUsedM = Math.max(separationM, SCREENING_MIN_DISTANCE_M);
  const incidentPowerDensityWPerM2 = farFieldPowerDensityWPerM2(eirpW, distanceUsedM);
  const layers = DEFAULT_HEAD_STACK.map((l) => ({ name: l.name, tissue: l.tissue, thicknessM: l.thicknessM }));
  const r = planeWaveLayers({ frequencyHz, incidentPowerDensityWPerM2, layers, profilePoints });
  const notes = [
    'Screening estimate: the far-field power density at the use position’s distance, applied as a normal-incidence plane wave to planar layers. Not a SAR assessment; near an antenna the field is neither far-field nor planar.',
    DEFAULT_HEAD_STACK_SOURCE + '.',
  ];
  if (separationM < SCREENING_MIN_DISTANCE_M) {
    notes.push(`Separation ${formatM(separationM)} floored at ${formatM(SCREENING_MIN_DISTANCE_M)} to keep S = EIRP/(4πR²) finite (common practice choice).`);
  }
  const intermediate: Derivation['intermediate'] = {
    distanceUsedM: q(distanceUsedM, 'm'),
    incidentPowerDensityWPerM2: q(incidentPowerDensityWPerM2, 'W/m²'),
    reflectedFraction: q(r.reflectedFraction, '1'),
  };
  r.layers.forEach((l, i) => {
    intermediate[`${DEFAULT_HEAD_STACK[i].name}RelativePermittivity`] = q(l.relativePermittivity, '1');
    intermediate[`${DEFAULT_HEAD_STACK[i].name}ConductivitySPerM`] = q(l.conductivitySPerM, 'S/m');
    intermediate[`${DEFAULT_HEAD_STACK[i].name}ThicknessM`] = q(l.thicknessM, 'm');
  });
  return {
    estimate: 'screening',
    incidentPowerDensityWPerM2,
    distanceUsedM,
    stack: DEFAULT_HEAD_STACK,
    sarProfile: r.sarProfile,
    surfaceSarWPerKg: r.surfaceSarWPerKg,
    peakSarWPerKgByLayer: r.peakSarWPerKgByLayer,
    averagedSarWPerKg: r.averagedSarWPerKg,
    reflectedFraction: r.reflectedFraction,
    absorbedFractionByLayer: r.absorbedFractionByLayer,
    derivation: {
      formula: 'S_inc = EIRP / (4π R²), R = max(separation, 5 mm); plane wave at normal incidence on skin/fat/bone/brain (transmission-line recursion); SAR = σ|E|²/ρ',
      inputs: { frequencyHz: q(frequencyHz, 'Hz'), eirpW: q(eirpW, 'W'), separationM: q(separationM, 'm') },
      intermediate,
      result: {
        surfaceSarWPerKg: q(r.surfaceSarWPerKg, 'W/kg'),
        averagedSar1gWPerKg: q(r.averagedSarWPerKg['1g'], 'W/kg'),
        averagedSar10gWPerKg: q(r.averagedSarWPerKg['10g'], 'W/kg'),
      },
      source: 'FCC OET Bulletin 65 (Edition 97-01) Eq. (3); plane-wave-layers (Pozar §2.3, Balanis ch. 5; Gabriel 1996 tissues)',
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
  title: 'SAR against depth in a default head stack (screening estimate)',
  description: 'Far-field incident power density S = EIRP/(4πR²) at the use position applied as a plane wave to a skin/fat/bone/brain stack: the SAR profile. A screening estimate.',
  input: screeningDepthProfileInput,
  compute: computeScreeningDepthProfile,
  sources: ['FCC OET Bulletin 65 (Edition 97-01) Eq. (3)', 'Gabriel, Lau & Gabriel 1996, Phys. Med. Biol. 41:2271', DEFAULT_HEAD_STACK_SOURCE],
});
