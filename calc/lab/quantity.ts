/**
 * Small helpers shared by the measurement-side calculations (calc/lab/): building derivation
 * quantities and guarding values that JSON cannot carry (Infinity, NaN).
 */
import type { Quantity } from '../types';

/** A derivation quantity; non-finite numbers become null because JSON cannot carry them. */
export function q(value: number | string | boolean | null, unit: string): Quantity {
  return { value: typeof value === 'number' && !Number.isFinite(value) ? null : value, unit };
}

/** Finite numbers pass through; Infinity/NaN become null (the caller adds a note saying why). */
export function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** 10·log10 of a power ratio, in dB. */
export function powerRatioDb(ratio: number): number {
  return 10 * Math.log10(ratio);
}
