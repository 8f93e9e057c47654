/**
 * What a regime module hands the screening loop for one transmitter × use position × market.
 */
import type { Derivation } from '../types';
import type { FccSarScreening, ScreeningTier, UsePositionKind } from './input';
import type { EvaluatedPowers } from './power';
import type { ScreeningRule, Uncovered } from './rule';

export interface RuleContext {
  powers: EvaluatedPowers;
  separationM: number;
  kind: UsePositionKind;
  tier: ScreeningTier;
  fccSarScreening: FccSarScreening;
}

/** A frequency-independent exemption met before any band rule (FCC §1.1307(b)(3)(i)(A)). */
export interface BlanketExemption {
  thresholdMw: number;
  evaluatedPowerMw: number;
  derivation: Derivation;
}

export interface RuleSet {
  rules: ScreeningRule[];
  uncovered: Uncovered;
  /** Notes that hold for the whole combination (why a rule was or was not used). */
  notes: string[];
  blanket?: BlanketExemption;
}

export const isNearBody = (kind: UsePositionKind) => kind !== 'far-field';

/** SAR is the basic restriction up to 6 GHz (47 CFR §1.1310(a); RSS-102; ICNIRP 2020 Table 2); above it, power density. */
export const SAR_MAX_FREQUENCY_HZ = 6e9;
export const sarOrMpe = (frequencyHz: number) => (frequencyHz <= SAR_MAX_FREQUENCY_HZ ? 'evaluate-sar' : 'evaluate-mpe') as 'evaluate-sar' | 'evaluate-mpe';
/** Where no rule applies and only MPE evaluation can follow (one function, not a closure per combination). */
export const evaluateMpe = (): 'evaluate-mpe' => 'evaluate-mpe';
