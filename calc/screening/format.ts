/**
 * Memoized text forms of frequencies and distances for derivation notes: a filing screens the same
 * few band edges and separations hundreds of times, and Number#toPrecision dominates otherwise.
 */
import { formatHz as formatHzRaw, formatM as formatMRaw } from '../limits/range';

const MAX_ENTRIES = 4096;

function memo(format: (x: number) => string): (x: number) => string {
  const cache = new Map<number, string>();
  return (x) => {
    let text = cache.get(x);
    if (text === undefined) {
      if (cache.size >= MAX_ENTRIES) cache.clear();
      text = format(x);
      cache.set(x, text);
    }
    return text;
  };
}

export const formatHz = memo(formatHzRaw);
export const formatM = memo(formatMRaw);
