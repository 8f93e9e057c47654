/**
 * Validity ranges and band helpers shared by the limit and exemption rules.
 *
 * Every rule in calc/limits/ is tabulated over a stated range (of frequency, of separation);
 * outside it the rule says nothing, so we throw a CalcRangeError that names the range instead of
 * extrapolating. The band helpers let a caller (the screening service) evaluate a transmitter's
 * band at its most restrictive frequency: both edges and every breakpoint of the rule inside it.
 */
import { CalcRangeError } from '../types';

export interface Interval {
  min: number;
  max: number;
  /** Whether min (max) itself belongs to the range; default true. */
  minInclusive?: boolean;
  maxInclusive?: boolean;
}

export function inInterval(value: number, r: Interval): boolean {
  const aboveMin = r.minInclusive === false ? value > r.min : value >= r.min;
  const belowMax = r.maxInclusive === false ? value < r.max : value <= r.max;
  return aboveMin && belowMax;
}

/** Human-readable frequency: 300 MHz, 1.5 GHz, 100 kHz. */
export function formatHz(frequencyHz: number): string {
  const units: [number, string][] = [
    [1e9, 'GHz'],
    [1e6, 'MHz'],
    [1e3, 'kHz'],
  ];
  for (const [scale, unit] of units) {
    if (Math.abs(frequencyHz) >= scale) return `${+(frequencyHz / scale).toPrecision(6)} ${unit}`;
  }
  return `${frequencyHz} Hz`;
}

/** Human-readable distance in cm or mm. */
export function formatM(distanceM: number): string {
  return distanceM >= 0.01 ? `${+(distanceM * 100).toPrecision(6)} cm` : `${+(distanceM * 1000).toPrecision(6)} mm`;
}

function describe(r: Interval, format: (v: number) => string): string {
  const lo = r.minInclusive === false ? `above ${format(r.min)}` : `${format(r.min)}`;
  const hi = r.maxInclusive === false ? `below ${format(r.max)}` : `${format(r.max)} inclusive`;
  return r.minInclusive === false || r.maxInclusive === false ? `${lo} and ${hi}` : `${lo} to ${hi}`;
}

/**
 * Throws a CalcRangeError naming the valid range (and the rule) when `value` lies outside it.
 * `kind` picks the formatting: frequency (Hz) or distance (m).
 */
export function requireInRange(field: string, value: number, r: Interval, kind: 'frequency' | 'distance', rule: string, hint = ''): void {
  if (inInterval(value, r)) return;
  const format = kind === 'frequency' ? formatHz : formatM;
  const message = `${field} = ${format(value)} is outside the range of ${rule}: valid ${describe(r, format)}.` + (hint ? ` ${hint}` : '');
  throw new CalcRangeError(message, [{ path: [field], message }]);
}

/**
 * Frequencies at which a piecewise-monotone rule must be evaluated over a band [minHz, maxHz]:
 * the two edges and every breakpoint strictly inside, ascending and without repeats.
 */
export function candidateFrequenciesHz(minHz: number, maxHz: number, breakpointsHz: readonly number[]): number[] {
  if (!(minHz <= maxHz)) throw new RangeError(`band: minimum ${minHz} Hz is above maximum ${maxHz} Hz`);
  const inside = breakpointsHz.filter((f) => f > minHz && f < maxHz);
  return [...new Set([minHz, ...inside, maxHz])].sort((a, b) => a - b);
}

/**
 * The lowest threshold over the candidate frequencies of a band, with the frequency that gives it.
 * Only exact when the rule is monotone between breakpoints (true of the FCC SAR and MPE rules, the
 * RSS-102 table and formulas; see kdbCriticalFrequenciesHz for the KDB rule beyond 50 mm).
 */
export function mostRestrictiveInBand(
  minHz: number,
  maxHz: number,
  breakpointsHz: readonly number[],
  threshold: (frequencyHz: number) => number,
): { frequencyHz: number; threshold: number; evaluatedHz: number[] } {
  const evaluatedHz = candidateFrequenciesHz(minHz, maxHz, breakpointsHz);
  let best = { frequencyHz: evaluatedHz[0], threshold: threshold(evaluatedHz[0]) };
  for (const f of evaluatedHz.slice(1)) {
    const t = threshold(f);
    if (t < best.threshold) best = { frequencyHz: f, threshold: t };
  }
  return { ...best, evaluatedHz };
}
