/**
 * The powers a screening rule compares, from a transmitter's tune-up power, duty cycle and antenna
 * gain:
 *   P_tune (mW) = N × 10^(P_dBm/10)       (N MIMO streams on one band, each at the tune-up power:
 *                                          their powers add — FCC KDB 662911 D01 sums the outputs'
 *                                          powers in one band, from memory; placing the sum at
 *                                          every antenna is a conservative screening, common
 *                                          practice. N = 1 otherwise.)
 *   P_avg = P_tune × duty cycle           (source-based time-averaged power; FCC KDB 447498 and
 *                                          §1.1307(b)(3) "available maximum time-averaged power")
 *   EIRP = P_avg × 10^(G_dBi/10)          (time-averaged)
 *   ERP  = EIRP / 10^(2.15/10)            (EIRP − 2.15 dB: half-wave dipole gain, calc/em/units.ts)
 * In a use position where the transmitter reduces its power (a power mode), P_dBm is the reduced
 * tune-up power that applies there instead of the maximum (withPowerMode).
 */
import type { Quantity } from '../types';
import { q } from '../types';
import type { PowerModeTrigger, ScreeningPowerMode } from './input';
import { dbiToLinear, dbmToMw, eirpToErpW, HALF_WAVE_DIPOLE_GAIN_DBI } from '../em/units';

export interface EvaluatedPowers {
  tuneUpPowerMw: number;
  timeAveragedPowerMw: number;
  gainLinear: number;
  eirpMw: number;
  erpMw: number;
  /** Derivation pieces shared by every row of this transmitter. */
  inputs: Record<string, Quantity>;
  intermediate: Record<string, Quantity>;
  formula: string;
  notes: string[];
}

export const POWER_FORMULA = 'P_tune = 10^(P_dBm/10) mW; P_avg = P_tune × duty cycle; EIRP = P_avg × 10^(G_dBi/10); ERP = EIRP − 2.15 dB (÷ 1.64)';

const POWER_NOTE =
  'Time-averaged: tune-up power (tolerance included) × duty cycle (source-based time averaging, common practice per FCC KDB 447498); ERP = EIRP − 2.15 dB (half-wave dipole gain 2.15 dBi, IEEE Std 145-2013).';

export const MIMO_NOTE =
  'MIMO: the streams on this band transmit at once, so their tune-up powers add (N × P_tune); the sum is evaluated at each antenna, with its own gain and separation (FCC KDB 662911 D01 sums the outputs’ powers, from memory; a conservative screening, common practice).';

export function evaluatedPowers(maxTuneUpPowerDbm: number, dutyCycle: number, gainDbi: number, streams = 1): EvaluatedPowers {
  const chainPowerMw = dbmToMw(maxTuneUpPowerDbm);
  const tuneUpPowerMw = chainPowerMw * streams;
  const timeAveragedPowerMw = tuneUpPowerMw * dutyCycle;
  const gainLinear = dbiToLinear(gainDbi);
  const eirpMw = timeAveragedPowerMw * gainLinear;
  const erpMw = eirpToErpW(eirpMw);
  const powers: EvaluatedPowers = {
    tuneUpPowerMw,
    timeAveragedPowerMw,
    gainLinear,
    eirpMw,
    erpMw,
    inputs: {
      maxTuneUpPowerDbm: q(maxTuneUpPowerDbm, 'dBm'),
      dutyCycle: q(dutyCycle, '1'),
      antennaGainDbi: q(gainDbi, 'dBi'),
    },
    intermediate: {
      tuneUpPowerMw: q(tuneUpPowerMw, 'mW'),
      timeAveragedPowerMw: q(timeAveragedPowerMw, 'mW'),
      antennaGainLinear: q(gainLinear, '1'),
      eirpMw: q(eirpMw, 'mW'),
      halfWaveDipoleGainDbi: q(HALF_WAVE_DIPOLE_GAIN_DBI, 'dBi'),
      erpMw: q(erpMw, 'mW'),
    },
    formula: POWER_FORMULA,
    notes: [POWER_NOTE],
  };
  if (streams > 1) {
    powers.inputs.mimoStreams = q(streams, '1');
    powers.intermediate.streamPowerMw = q(chainPowerMw, 'mW');
    powers.formula = `P_tune = ${streams} streams × 10^(P_dBm/10) mW; P_avg = P_tune × duty cycle; EIRP = P_avg × 10^(G_dBi/10); ERP = EIRP − 2.15 dB (÷ 1.64)`;
    powers.notes = [POWER_NOTE, MIMO_NOTE];
  }
  return powers;
}

/** What each trigger is, in words, and where the trade's guidance for it is (all from memory). */
export const POWER_MODE_TRIGGER_SOURCES: Record<PowerModeTrigger, { label: string; source: string }> = {
  'hotspot-back-off': {
    label: 'hotspot back-off',
    source: 'FCC KDB 941225 D06 (hotspot mode: SAR at the power the device uses with the hotspot on), from memory',
  },
  'proximity-sensor': {
    label: 'proximity-sensor reduction',
    source: 'FCC KDB 616217 D04 (proximity sensors: reduced power below the triggering distance, sensor coverage and triggering distance tested), from memory',
  },
  'time-averaged-sar': {
    label: 'time-averaged SAR limit',
    source: 'a time-averaged SAR algorithm’s power limit, accepted case by case by the certifying body (FCC KDB inquiry), from memory',
  },
};

/**
 * The powers of a transmitter in a use position where it runs at a reduced tune-up power: the
 * same formula with P_dBm = the reduced power; the derivation keeps the maximum, names the
 * reduced power and its trigger, and says that the result holds only while the reduction does.
 */
export function withPowerMode(powers: EvaluatedPowers, maxTuneUpPowerDbm: number, mode: ScreeningPowerMode): EvaluatedPowers {
  const trigger = POWER_MODE_TRIGGER_SOURCES[mode.trigger];
  return {
    ...powers,
    inputs: {
      ...powers.inputs,
      maxTuneUpPowerDbm: q(maxTuneUpPowerDbm, 'dBm'),
      reducedTuneUpPowerDbm: q(mode.reducedTuneUpPowerDbm, 'dBm'),
      powerMode: q(mode.trigger, 'text'),
    },
    formula: powers.formula.replace('10^(P_dBm/10)', '10^(P_reduced,dBm/10)'),
    notes: [
      ...powers.notes,
      `Power mode: ${trigger.label} — in this use position the transmitter runs at ${mode.reducedTuneUpPowerDbm} dBm instead of its maximum ${maxTuneUpPowerDbm} dBm, and that reduced tune-up power is what is screened (${trigger.source}). The result holds only while the reduction is active in this position; the lab tests it there.`,
    ],
  };
}
