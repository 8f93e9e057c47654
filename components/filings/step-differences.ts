/**
 * What differs between the step a person was editing and the one someone else saved meanwhile,
 * in words: rows matched by their label (or stored row number), fields named in plain words.
 */
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** Field names as the step's own labels say them (the regulators' terms keep their usual spelling). */
const FIELD_LABELS: Record<string, string> = {
  name: 'name',
  model: 'model number',
  applicant: 'applicant',
  productType: 'product type',
  hardwareVersion: 'hardware version',
  firmwareVersion: 'firmware version',
  fccGranteeCode: 'FCC grantee code',
  fccProductCode: 'FCC product code',
  isedCompanyNumber: 'ISED company number',
  isedUpn: 'ISED UPN',
  hvin: 'HVIN',
  pmn: 'PMN',
  fvin: 'FVIN',
  modelVariants: 'model variants',
  integration: 'host or module',
  modules: 'certified modules',
  conditions: 'grant conditions',
  minSeparationM: 'grant’s minimum separation',
  difference: 'how it differs',
  antennas: 'antennas',
  transmitters: 'transmitters',
  usePositions: 'use positions',
  separations: 'separations',
  simultaneous: 'co-transmission',
  markets: 'markets',
  gainDbi: 'gain (dBi)',
  location: 'where it sits',
  technology: 'technology',
  band: 'band',
  frequencyMinHz: 'lowest frequency',
  frequencyMaxHz: 'highest frequency',
  maxTuneUpPowerDbm: 'maximum tune-up power',
  tuneUpTargetDbm: 'tune-up target',
  tuneUpToleranceDb: 'tune-up tolerance',
  dutyCycle: 'duty factor',
  dutyCyclePreset: 'duty factor preset',
  mode: 'mode',
  modulation: 'modulation',
  bandwidth: 'bandwidth',
  antennaId: 'antenna',
  moreAntennaIds: 'further antennas',
  antennaUse: 'antenna use',
  kind: 'kind',
  separationM: 'separation',
  regime: 'market',
  tier: 'tier',
  fccSarScreening: 'FCC SAR screening method',
  id: 'id',
};

/** A field in the step's own words; an unknown key in plain words (`gainDbi` → "gain dbi"). */
export const words = (key: string) => FIELD_LABELS[key] ?? key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
const singular = (key: string) => {
  const w = words(key);
  return w.endsWith('s') ? w.slice(0, -1) : w;
};
/** Capitalises the first letter, leaving the regulators' upper-case terms as they are. */
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
