/**
 * Filtering and sorting the measurements of the lab results (pure, so it is tested without a
 * screen): by use position, market and flag; sorted by a column either way. With a market chosen
 * the margin is that market's; otherwise the smallest margin over the filing's markets.
 */
import type { CheckKind, LabCheck, LabRow } from '../../calc/lab/lab-results';

export const ALL = 'all';
export const FLAGGED = 'flagged';
export const NO_FLAGS = 'none';

export interface LabFilter {
  usePositionId: string;
  regime: string;
  /** all, flagged (any flag that is not a pass), none (no flags), or a check kind that is flagged. */
  flag: string;
}
export const NO_LAB_FILTER: LabFilter = { usePositionId: ALL, regime: ALL, flag: ALL };
export const isLabFiltered = (f: LabFilter) => f.usePositionId !== ALL || f.regime !== ALL || f.flag !== ALL;

export const LAB_SORT_KEYS = ['id', 'transmitter', 'position', 'frequency', 'scale', 'sar1g', 'sar10g', 'margin', 'flags'] as const;
export type LabSortKey = (typeof LAB_SORT_KEYS)[number];
export interface LabSort {
  key: LabSortKey;
  descending: boolean;
}
export const DEFAULT_LAB_SORT: LabSort = { key: 'id', descending: false };

const flagged = (f: LabCheck) => f.status !== 'pass';

/** A row's flags for the market shown: another market's limit flag is left out when one market is chosen. */
export function flagsFor(row: LabRow, regime: string): LabCheck[] {
  if (regime === ALL) return row.flags;
  return row.flags.filter((f) => f.kind !== 'limit' || f.id.endsWith(`:${regime}`));
}

/** The margin (dB) shown for a row: the market's, or the smallest over every market; null when not measured. */
export function marginFor(row: LabRow, regime: string): number | null {
  const margins = row.margins.filter((m) => (regime === ALL || m.regime === regime) && m.marginDb !== null).map((m) => m.marginDb!);
  return margins.length ? Math.min(...margins) : null;
}

export function filterLabRows(rows: readonly LabRow[], f: LabFilter): LabRow[] {
  return rows.filter((r) => {
    if (f.usePositionId !== ALL && r.usePositionId !== f.usePositionId) return false;
    if (f.regime !== ALL && !r.margins.some((m) => m.regime === f.regime)) return false;
    const flags = flagsFor(r, f.regime).filter(flagged);
    if (f.flag === FLAGGED) return flags.length > 0;
    if (f.flag === NO_FLAGS) return flags.length === 0;
    if (f.flag !== ALL) return flags.some((x) => x.kind === f.flag);
    return true;
  });
}

/** Worst first: a failing flag weighs more than any number of warnings. */
const flagWeight = (r: LabRow, regime: string) => flagsFor(r, regime).reduce((w, x) => w + (x.status === 'fail' ? 1000 : x.status === 'warning' ? 1 : 0), 0);

/** Sorted copy; values that are missing (not measured) go last either way; ties keep the lab's order. */
export function sortLabRows(rows: readonly LabRow[], sort: LabSort, regime: string = ALL): LabRow[] {
  const value = (r: LabRow): number | string | null => {
    switch (sort.key) {
      case 'id':
        return null;
      case 'transmitter':
        return r.transmitterId;
      case 'position':
        return r.usePositionId;
      case 'frequency':
        return r.frequencyHz;
      case 'scale':
        return r.scalingFactor;
      case 'sar1g':
        return r.reportedSar1gWPerKg;
      case 'sar10g':
        return r.reportedSar10gWPerKg;
      case 'margin':
        return marginFor(r, regime);
      case 'flags':
        return flagWeight(r, regime);
    }
  };
  const indexed = rows.map((r, i) => ({ r, i, v: value(r) }));
  indexed.sort((a, b) => {
    if (a.v === null && b.v === null) return sort.key === 'id' && sort.descending ? b.i - a.i : a.i - b.i;
    if (a.v === null) return 1;
    if (b.v === null) return -1;
    const c = typeof a.v === 'number' && typeof b.v === 'number' ? a.v - b.v : String(a.v).localeCompare(String(b.v), 'en', { numeric: true });
    return (sort.descending ? -c : c) || a.i - b.i;
  });
  return indexed.map((x) => x.r);
}

/** The kinds of flag present among the rows (for the flag filter), in a fixed order. */
export function flaggedKinds(rows: readonly LabRow[]): CheckKind[] {
  const kinds = new Set<CheckKind>();
  for (const r of rows) for (const f of r.flags) if (flagged(f)) kinds.add(f.kind);
  return [...kinds].sort();
}
