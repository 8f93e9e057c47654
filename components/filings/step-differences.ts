/**
 * What differs between the step a person was editing and the one someone else saved meanwhile,
 * in words: rows matched by their label (or stored row number), fields named in plain words.
 */
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** `gainDbi` → "gain dbi"; `usePositions` → "use positions". */
export const words = (key: string) => key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
const singular = (key: string) => {
  const w = words(key);
  return w.endsWith('s') ? w.slice(0, -1) : w;
};
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

type Row = Record<string, unknown>;
const rowKey = (r: Row, i: number) => (typeof r.rowId === 'number' ? `#${r.rowId}` : typeof r.id === 'string' ? `id:${r.id}` : `at:${i}`);
const rowName = (r: Row, i: number) => (typeof r.id === 'string' && r.id ? `“${r.id}”` : `row ${i + 1}`);

function rowDifferences(key: string, mine: Row[], theirs: Row[]): string[] {
  const out: string[] = [];
  const label = capital(singular(key));
  const theirsByKey = new Map(theirs.map((r, i) => [rowKey(r, i), r]));
  const mineKeys = new Set(mine.map(rowKey));
  mine.forEach((r, i) => {
    const other = theirsByKey.get(rowKey(r, i)) ?? (typeof r.id === 'string' ? theirs.find((t) => t.id === r.id) : undefined);
    if (!other) {
      out.push(`${label} ${rowName(r, i)}: only in yours`);
      return;
    }
    const fields = [...new Set([...Object.keys(r), ...Object.keys(other)])].filter((f) => f !== 'rowId' && !same(r[f], other[f]));
    if (fields.length) out.push(`${label} ${rowName(r, i)}: ${fields.map(words).join(', ')}`);
  });
  theirs.forEach((r, i) => {
    if (!mineKeys.has(rowKey(r, i)) && !(typeof r.id === 'string' && mine.some((m) => m.id === r.id))) out.push(`${label} ${rowName(r, i)}: only in theirs`);
  });
  return out;
}

export function stepDifferences(mine: unknown, theirs: unknown): string[] {
  if (!isRecord(mine) || !isRecord(theirs)) return same(mine, theirs) ? [] : ['The whole step'];
  const out: string[] = [];
  for (const key of new Set([...Object.keys(mine), ...Object.keys(theirs)])) {
    const a = mine[key];
    const b = theirs[key];
    if (same(a, b)) continue;
    if (Array.isArray(a) && Array.isArray(b) && [...a, ...b].every(isRecord)) out.push(...rowDifferences(key, a as Row[], b as Row[]));
    else out.push(capital(words(key)));
  }
  return out;
}
