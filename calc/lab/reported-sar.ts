/**
 * Reported SAR: a measured peak spatial-average SAR scaled up to the maximum tune-up power and
 * to the maximum duty cycle, and its margin to the SAR limit.
 *
 * Sources: FCC KDB 447498 D01 v06 ("reported SAR" = measured SAR scaled to the maximum tune-up
 * power, incl. tolerance) and KDB 865664 D01 v01r04 practice [from memory]; duty-cycle scaling by maximum/measured duty cycle is common practice
 * (KDB 248227 D01 for 802.11 uses 1/duty-cycle) [from memory]. Default limit 1.6 W/kg: 47 CFR
 * §1.1310(c) general population, 1-g (confirmed).
 */
import { z } from 'zod';
import { defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';
import { powerRatioDb } from './quantity';

export const FCC_GENERAL_1G_LIMIT_W_PER_KG = 1.6; // 47 CFR §1.1310(c)

const fraction = z.number().gt(0).lte(1);

export const reportedSarInput = z.object({
  measuredSarWPerKg: z.number().positive().describe('Measured peak spatial-average SAR, W/kg'),
  measuredPowerDbm: z.number().describe('Conducted power measured for the SAR test, dBm'),
  tuneUpPowerDbm: z.number().describe('Maximum tune-up power including tolerance, dBm'),
  dutyCycle: z
    .object({
      measured: fraction.describe('Duty cycle during the SAR measurement, fraction 0–1'),
      maximum: fraction.describe('Maximum duty cycle in use, fraction 0–1'),
    })
    .optional(),
  limitWPerKg: z.number().positive().default(FCC_GENERAL_1G_LIMIT_W_PER_KG).describe('SAR limit, W/kg'),
});

export interface ReportedSarResult {
  reportedSarWPerKg: number;
  /** Total factor applied to the measured SAR (power × duty cycle), ≥ 1. */
  scalingFactor: number;
  powerScalingFactor: number;
  dutyCycleScalingFactor: number;
  powerScalingApplied: boolean;
  dutyCycleScalingApplied: boolean;
  withinLimit: boolean;
  marginToLimit: {
    /** limit − reported, W/kg (negative when over the limit). */
    marginWPerKg: number;
    /** (limit − reported) / limit × 100, % of the limit. */
    marginPercentOfLimit: number;
    /** 10·log10(limit / reported), dB (negative when over the limit). */
    marginDb: number;
  };
}

export function computeReportedSar(input: z.output<typeof reportedSarInput>): WithDerivation<ReportedSarResult> {
  const { measuredSarWPerKg, measuredPowerDbm, tuneUpPowerDbm, dutyCycle, limitWPerKg } = input;
  const notes: string[] = [];

  // Scale factor = 10^((P_tune-up − P_meas)/10); never below 1 (a reported SAR is never scaled down).
  const powerDeltaDb = tuneUpPowerDbm - measuredPowerDbm;
  const powerScalingApplied = powerDeltaDb >= 0;
  const powerScalingFactor = powerScalingApplied ? 10 ** (powerDeltaDb / 10) : 1;
  if (!powerScalingApplied) {
    notes.push(
      `Measured power ${measuredPowerDbm} dBm is above the tune-up power ${tuneUpPowerDbm} dBm: the scale factor ` +
        `${(10 ** (powerDeltaDb / 10)).toFixed(4)} < 1 is not applied (common practice: never scale a measured SAR down, ` +
        'since the device demonstrably reached that power). Check the declared tune-up limit.',
    );
  }

  let dutyCycleScalingFactor = 1;
  let dutyCycleScalingApplied = false;
  if (dutyCycle) {
    const ratio = dutyCycle.maximum / dutyCycle.measured;
    dutyCycleScalingApplied = ratio >= 1;
    dutyCycleScalingFactor = dutyCycleScalingApplied ? ratio : 1;
    if (!dutyCycleScalingApplied) {
      notes.push(`Maximum duty cycle ${dutyCycle.maximum} is below the measured ${dutyCycle.measured}: not scaled down (common practice).`);
    }
  }

  const scalingFactor = powerScalingFactor * dutyCycleScalingFactor;
  const reportedSarWPerKg = measuredSarWPerKg * scalingFactor;
  const marginToLimit = {
    marginWPerKg: limitWPerKg - reportedSarWPerKg,
    marginPercentOfLimit: ((limitWPerKg - reportedSarWPerKg) / limitWPerKg) * 100,
    marginDb: powerRatioDb(limitWPerKg / reportedSarWPerKg),
  };
  const withinLimit = reportedSarWPerKg <= limitWPerKg;
  notes.push('"Reported SAR" as measured SAR scaled to maximum tune-up power follows KDB 447498/865664 practice (from memory).');
  if (dutyCycle) notes.push('Duty-cycle scaling by maximum/measured duty cycle is common practice (from memory).');

  return {
    reportedSarWPerKg,
    scalingFactor,
    powerScalingFactor,
    dutyCycleScalingFactor,
    powerScalingApplied,
    dutyCycleScalingApplied,
    withinLimit,
    marginToLimit,
    derivation: {
      formula: 'SAR_reported = SAR_meas · max(1, 10^((P_tune-up − P_meas)/10)) · max(1, DC_max/DC_meas); ' + 'margin = SAR_limit − SAR_reported; margin_dB = 10·log10(SAR_limit/SAR_reported)',
      inputs: {
        measuredSarWPerKg: q(measuredSarWPerKg, 'W/kg'),
        measuredPowerDbm: q(measuredPowerDbm, 'dBm'),
        tuneUpPowerDbm: q(tuneUpPowerDbm, 'dBm'),
        dutyCycleMeasured: q(dutyCycle?.measured ?? null, '1'),
        dutyCycleMaximum: q(dutyCycle?.maximum ?? null, '1'),
        limitWPerKg: q(limitWPerKg, 'W/kg'),
      },
      intermediate: {
        powerDeltaDb: q(powerDeltaDb, 'dB'),
        powerScalingFactor: q(powerScalingFactor, '1'),
        dutyCycleScalingFactor: q(dutyCycleScalingFactor, '1'),
        scalingFactor: q(scalingFactor, '1'),
      },
      result: {
        reportedSarWPerKg: q(reportedSarWPerKg, 'W/kg'),
        marginWPerKg: q(marginToLimit.marginWPerKg, 'W/kg'),
        marginPercentOfLimit: q(marginToLimit.marginPercentOfLimit, '%'),
        marginDb: q(marginToLimit.marginDb, 'dB'),
        withinLimit: q(withinLimit, 'boolean'),
      },
      source: 'FCC KDB 447498 D01 v06 and KDB 865664 D01 v01r04 (reported SAR scaled to maximum tune-up power; from memory); ' + 'default limit 47 CFR §1.1310(c) 1.6 W/kg (1 g)',
      notes,
    },
  };
}

export type ReportedSarInput = z.input<typeof reportedSarInput>;

/** Plain function for the server: validates (applying defaults) and computes. */
export const reportedSar = plainFunction(reportedSarInput, computeReportedSar);

export const reportedSarCalculation = defineCalculation({
  name: 'reported-sar',
  title: 'Reported SAR and margin to the limit',
  description: 'Scales a measured SAR to the maximum tune-up power and maximum duty cycle (never down) and gives the margin to the SAR limit in W/kg, % of limit and dB.',
  input: reportedSarInput,
  compute: computeReportedSar,
  sources: ['FCC KDB 447498 D01 v06', 'FCC KDB 865664 D01 v01r04', '47 CFR §1.1310(c)'],
});
