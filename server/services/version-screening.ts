/**
 * A version's screening as the checklist, the comparison, the evidence list and the lab results
 * read it: every row's verdict and figures without its derivation and candidate frequencies (the
 * Screening step and the exhibit show those, from their own reads). The working is most of a
 * screening's memory; kept in a cache it would outlive the request and be copied by every
 * young-generation collection until promoted, which costs a cold comparison more than the reads.
 */
import type { ScreeningOutput, ScreeningRow } from '../../calc/screening/screen';

export type VersionScreeningRow = Omit<ScreeningRow, 'derivation' | 'candidates'>;

export interface VersionScreening extends Omit<ScreeningOutput, 'rows' | 'derivation'> {
  rows: VersionScreeningRow[];
}

export function versionScreeningOf({ rows, derivation: _d, ...rest }: ScreeningOutput): VersionScreening {
  return { ...rest, rows: rows.map(({ derivation: _r, candidates: _c, ...row }) => row) };
}
