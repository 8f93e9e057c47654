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
 */
import type { Quantity } from '../types';
import { q } from '../types';
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

export const POWER_FORMULA =
  'P_tune = 10^(P_dBm/10) mW; P_avg = P_tune × duty cycle; EIRP = P_avg × 10^(G_dBi/10); ERP = EIRP − 2.15 dB (÷ 1.64)';

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
