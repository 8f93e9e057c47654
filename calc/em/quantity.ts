import type { Quantity } from '../types';

/** A value with its unit, as carried in a derivation. */
export const q = (value: Quantity['value'], unit: string): Quantity => ({ value, unit });
