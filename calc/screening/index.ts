/**
 * Screening (issue 4): which transmitters are exempt at each use position and market, and which
 * need SAR or MPE evaluation, with the evaluated power, threshold, margin and derivation.
 */
import type { Calculation } from '../types';
import { defineCalculation } from '../types';
import { screeningInput, type ScreeningInputRaw } from './input';
import { SCREENING_SOURCES, screenParsed, type ScreeningOutput } from './screen';
import { screeningDepthProfileCalculation } from './depth-profile';

export * from './input';
export { evaluatedPowers, POWER_FORMULA, POWER_MODE_TRIGGER_SOURCES, withPowerMode, type EvaluatedPowers } from './power';
export { METHOD_LABELS, type MethodId, type ScreeningResult } from './rule';
export {
  SCREENING_CAUTIONS,
  SCREENING_SOURCES,
  screenParsed,
  summarizeScreening,
  type ScreeningCandidate,
  type ScreeningCounts,
  type ScreeningGap,
  type ScreeningOutput,
  type ScreeningPowerModeName,
  type ScreeningRow,
  type ScreeningSummary,
} from './screen';
export * from './depth-profile';
export * from './tissue-stacks';
export * from './module-conditions';

/** Screens a device; validates the input (throws the zod error on a malformed one). */
export function screenDevice(input: ScreeningInputRaw): ScreeningOutput {
  return screenParsed(screeningInput.parse(input));
}

export const screeningCalculation = defineCalculation({
  name: 'screening',
  title: 'RF-exposure screening of a device',
  description:
    'For every transmitter × use position × market: the applicable exemption rule (FCC §1.1307(b)(3), KDB 447498 test exclusion, RSS-102, EN 62479, reference levels), evaluated power, threshold at the band’s most restrictive frequency, result and margin.',
  input: screeningInput,
  compute: screenParsed,
  sources: SCREENING_SOURCES,
});

export const screeningCalculations: Calculation[] = [screeningCalculation, screeningDepthProfileCalculation] as Calculation[];
