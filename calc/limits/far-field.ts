/**
 * Far-field power density and the distance at which it falls to a limit.
 * S = EIRP / (4πR²) — FCC OET Bulletin 65 (Edition 97-01) Eq. (3), in its EIRP form
 * (FCC OET Bulletin 65 Eq. (3)).
 */
import { z } from 'zod';
import { defineCalculation, type Derivation, type Quantity } from '../types';
import { q } from '../types';
import { dbiToLinear } from '../em/units';

const SOURCE = 'FCC OET Bulletin 65 (Edition 97-01) Eq. (3): S = EIRP / (4πR²)';
const FAR_FIELD_NOTES = ['Far-field formula without ground reflection; in the near field (closer than about λ/2π, or 2D²/λ for a large aperture) it is not valid as such (common practice).'];

/** Power density at distance R from an isotropic-equivalent source of the given EIRP, W/m². */
export function farFieldPowerDensityWPerM2(eirpW: number, distanceM: number): number {
  return eirpW / (4 * Math.PI * distanceM ** 2);
}

/** Distance at which S = EIRP/(4πR²) falls to limitWPerM2, m: R = √(EIRP / (4π·S_limit)). */
export function complianceDistanceM(eirpW: number, limitWPerM2: number): number {
  return Math.sqrt(eirpW / (4 * Math.PI * limitWPerM2));
}

const EIRP_FIELDS = { eirpW: z.number().nonnegative().describe('EIRP, W') };
const POWER_GAIN_FIELDS = {
  powerW: z.number().nonnegative().describe('Power into the antenna, W'),
  gainDbi: z.number().min(-60).max(80).describe('Antenna gain, dBi'),
};
/** Either {eirpW, ...extra} or {powerW, gainDbi, ...extra}; strict, so giving both is refused. */
function eirpOrPowerGain<T extends z.ZodRawShape>(extra: T) {
  return z.union([z.object({ ...EIRP_FIELDS, ...extra }).strict(), z.object({ ...POWER_GAIN_FIELDS, ...extra }).strict()]);
}
type EirpSource = { eirpW: number } | { powerW: number; gainDbi: number };

/** EIRP and its derivation inputs from either {eirpW} or {powerW, gainDbi}. */
function resolveEirp(src: EirpSource): { eirpW: number; inputs: Record<string, Quantity>; intermediate: Record<string, Quantity> } {
  if ('eirpW' in src) return { eirpW: src.eirpW, inputs: { eirpW: q(src.eirpW, 'W') }, intermediate: {} };
  const gainLinear = dbiToLinear(src.gainDbi);
  const eirpW = src.powerW * gainLinear;
  return {
    eirpW,
    inputs: { powerW: q(src.powerW, 'W'), gainDbi: q(src.gainDbi, 'dBi') },
    intermediate: { gainLinear: q(gainLinear, '1'), eirpW: q(eirpW, 'W') },
  };
}

export const farFieldPowerDensityInput = eirpOrPowerGain({ distanceM: z.number().positive().describe('Distance from the antenna, m') });

export function computeFarFieldPowerDensity(input: z.output<typeof farFieldPowerDensityInput>) {
  const { distanceM } = input;
  const e = resolveEirp(input);
  const powerDensityWPerM2 = farFieldPowerDensityWPerM2(e.eirpW, distanceM);
  const derivation: Derivation = {
    formula: 'eirpW' in input ? 'S = EIRP / (4π R²)' : 'S = P·G / (4π R²), G = 10^(G_dBi/10)',
    inputs: { ...e.inputs, distanceM: q(distanceM, 'm') },
    intermediate: e.intermediate,
    result: { powerDensityWPerM2: q(powerDensityWPerM2, 'W/m²'), powerDensityMwPerCm2: q(powerDensityWPerM2 / 10, 'mW/cm²') },
    source: SOURCE,
    notes: FAR_FIELD_NOTES,
  };
  return { powerDensityWPerM2, eirpW: e.eirpW, derivation };
}

export const farFieldPowerDensityCalculation = defineCalculation({
  name: 'far-field-power-density',
  title: 'Far-field power density',
  description: 'S = EIRP/(4πR²) at a distance, from {eirpW} or {powerW, gainDbi}.',
  input: farFieldPowerDensityInput,
  compute: computeFarFieldPowerDensity,
  sources: [SOURCE],
});

export const complianceDistanceInput = eirpOrPowerGain({
  limitWPerM2: z.number().positive().describe('Power-density limit, W/m² (e.g. from exposure-limit)'),
});

export function computeComplianceDistance(input: z.output<typeof complianceDistanceInput>) {
  const { limitWPerM2 } = input;
  const e = resolveEirp(input);
  const distanceM = complianceDistanceM(e.eirpW, limitWPerM2);
  const derivation: Derivation = {
    formula: 'R = √(EIRP / (4π · S_limit))',
    inputs: { ...e.inputs, limitWPerM2: q(limitWPerM2, 'W/m²') },
    intermediate: e.intermediate,
    result: { distanceM: q(distanceM, 'm') },
    source: `${SOURCE}, solved for R`,
    notes: FAR_FIELD_NOTES,
  };
  return { distanceM, eirpW: e.eirpW, derivation };
}

export const complianceDistanceCalculation = defineCalculation({
  name: 'compliance-distance',
  title: 'Compliance distance (far field)',
  description: 'Distance at which the far-field power density of an EIRP falls to a limit: R = √(EIRP/(4πS)).',
  input: complianceDistanceInput,
  compute: computeComplianceDistance,
  sources: [SOURCE],
});
