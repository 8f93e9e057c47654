/**
 * Duty factors the trade uses for a transmitter's time-averaged power, each with its source.
 * Picking one fills the transmitter's duty cycle; the figure stays editable (typing another
 * value leaves the preset).
 *
 * - LTE TDD: the share of a 10 ms radio frame in which the device may transmit, from the
 *   uplink-downlink configurations of 3GPP TS 36.211 Table 4.2-2 (D = downlink, S = special,
 *   U = uplink subframe, 1 ms = 30720·Ts each). A special subframe's uplink part (UpPTS) is
 *   counted at its longest, 5120·Ts (Table 4.2-1, extended cyclic prefix), so the figure is the
 *   upper bound of the configuration: uplink share = (n_U·30720 + n_S·5120) / 307200.
 * - GSM/GPRS: a TDMA frame has 8 timeslots (3GPP TS 45.002 §4.3); a device using k uplink slots
 *   transmits k/8 of the time (multislot classes, TS 45.002 Annex B — clause numbers from memory).
 * - Push-to-talk two-way radios: 50 % (talk half the time) is common practice; it is, from
 *   memory, the factor FCC KDB 643646 D01 applies to occupational PTT radios.
 */

export interface DutyFactorPreset {
  key: string;
  label: string;
  /** 0 < d ≤ 1 */
  dutyCycle: number;
  source: string;
  /** What the figure assumes, in words. */
  basis: string;
}

/** 3GPP TS 36.211 Table 4.2-2: uplink-downlink configuration → subframes 0…9. */
export const LTE_TDD_CONFIGURATIONS: Record<number, string> = {
  0: 'DSUUUDSUUU',
  1: 'DSUUDDSUUD',
  2: 'DSUDDDSUDD',
  3: 'DSUUUDDDDD',
  4: 'DSUUDDDDDD',
  5: 'DSUDDDDDDD',
  6: 'DSUUUDSUUD',
};
/** Samples (Ts) in a 1 ms subframe and the longest UpPTS (TS 36.211 §4, Table 4.2-1). */
export const TS_PER_SUBFRAME = 30720;
export const UPPTS_MAX_TS = 5120;

/** Uplink share of a TDD pattern: U subframes whole, each S subframe's UpPTS at its longest. */
export function tddUplinkShare(pattern: string): number {
  const u = [...pattern].filter((c) => c === 'U').length;
  const s = [...pattern].filter((c) => c === 'S').length;
  return (u * TS_PER_SUBFRAME + s * UPPTS_MAX_TS) / (pattern.length * TS_PER_SUBFRAME);
}

const TDD_SOURCE = '3GPP TS 36.211 Table 4.2-2 (uplink-downlink configurations), UpPTS from Table 4.2-1';
const GSM_SOURCE = '3GPP TS 45.002 (8 timeslots per TDMA frame; clause from memory)';

export const DUTY_FACTOR_PRESETS: readonly DutyFactorPreset[] = [
  { key: 'continuous', label: 'Continuous (100 %)', dutyCycle: 1, source: 'No time averaging', basis: 'The transmitter can be on all the time.' },
  {
    key: 'ptt-50',
    label: 'Push-to-talk (50 %)',
    dutyCycle: 0.5,
    source: 'Common practice for push-to-talk radios (from memory: FCC KDB 643646 D01)',
    basis: 'Talking half the time at most.',
  },
  ...Object.entries(LTE_TDD_CONFIGURATIONS).map(([n, pattern]) => {
    const share = tddUplinkShare(pattern);
    return {
      key: `lte-tdd-${n}`,
      label: `LTE TDD configuration ${n} (${(share * 100).toFixed(1)} %)`,
      // Rounded up to 0.01 %, so the stored figure never undercounts the share.
      dutyCycle: Math.ceil(share * 1e4 - 1e-9) / 1e4,
      source: TDD_SOURCE,
      basis: `Frame ${pattern}: ${[...pattern].filter((c) => c === 'U').length} uplink subframes of 10, plus the special subframes’ longest UpPTS.`,
    };
  }),
  ...[1, 2, 3, 4].map((k) => ({
    key: `gsm-${k}-slot`,
    label: `GSM/GPRS ${k} uplink slot${k === 1 ? '' : 's'} (${(k * 12.5).toFixed(1)} %)`,
    dutyCycle: k / 8,
    source: GSM_SOURCE,
    basis: `${k} of the 8 timeslots of a TDMA frame.`,
  })),
];

export const findDutyFactorPreset = (key: string) => DUTY_FACTOR_PRESETS.find((p) => p.key === key);
export const DUTY_FACTOR_PRESET_KEYS = DUTY_FACTOR_PRESETS.map((p) => p.key);
