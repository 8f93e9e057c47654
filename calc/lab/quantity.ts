/** Small numeric helpers shared by the measurement-side calculations (calc/lab/). */

/** Finite numbers pass through; Infinity/NaN become null (the caller adds a note saying why). */
export function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** 10·log10 of a power ratio, in dB. */
export function powerRatioDb(ratio: number): number {
  return 10 * Math.log10(ratio);
}
