/**
 * Regulatory limits and exemption rules: registry entries and the plain functions the screening
 * service calls directly (band edges and breakpoints).
 */
import type { Calculation } from '../types';
import { exposureLimitCalculation } from './exposure-limits';
import { sarLimitCalculation } from './sar-limits';
import { fcc1mwExemptionCalculation, fccMpeExemptionCalculation, fccSarExemptionCalculation } from './fcc-exemptions';
import { kdbSarTestExclusionCalculation } from './kdb-447498';
import { isedRfExemptionCalculation, isedSarExemptionCalculation } from './ised-exemptions';
import { euLowPowerExclusionCalculation } from './eu-low-power';
import { complianceDistanceCalculation, farFieldPowerDensityCalculation } from './far-field';
import { mpeSumOfRatiosCalculation } from './sum-of-ratios';

export * from './exposure-limits';
export * from './sar-limits';
export * from './fcc-exemptions';
export * from './kdb-447498';
export * from './ised-exemptions';
export * from './eu-low-power';
export * from './far-field';
export * from './sum-of-ratios';
export * from './range';
export * from './verdict';

export const limitCalculations: Calculation[] = [
  exposureLimitCalculation,
  sarLimitCalculation,
  fccSarExemptionCalculation,
  fccMpeExemptionCalculation,
  fcc1mwExemptionCalculation,
  kdbSarTestExclusionCalculation,
  isedSarExemptionCalculation,
  isedRfExemptionCalculation,
  euLowPowerExclusionCalculation,
  farFieldPowerDensityCalculation,
  complianceDistanceCalculation,
  mpeSumOfRatiosCalculation,
] as Calculation[];
