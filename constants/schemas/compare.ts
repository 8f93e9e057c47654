/** The comparison of two versions of a filing: what changed, and every result that moved because of it. */
import type { VersionState } from './filings';

export interface FieldChange {
  /** The wizard step the field belongs to. */
  step: string;
  /** What the field is, in words ("Transmitter LTE-B2 · maximum tune-up power"). */
  label: string;
  before: string | null;
  after: string | null;
}

export interface ScreeningMove {
  transmitterId: string;
  usePositionId: string;
  regime: string;
  before: { result: string; marginDb: number | null } | null;
  after: { result: string; marginDb: number | null } | null;
}

export interface ChecklistMove {
  id: string;
  title: string;
  severity: 'blocks-signing' | 'warning';
  before: string;
  after: string;
}

export interface MarketMove {
  regime: string;
  before: { combinations: number; exempt: number; needsEvaluation: number };
  after: { combinations: number; exempt: number; needsEvaluation: number };
}

export interface LabMove {
  regime: string;
  usePositionKind: string;
  before: number | null;
  after: number | null;
}

export interface ComparisonDto {
  filingId: number;
  from: { number: number; state: VersionState };
  to: { number: number; state: VersionState };
  fields: FieldChange[];
  impact: { screening: ScreeningMove[]; checklist: ChecklistMove[]; markets: MarketMove[]; lab: LabMove[] };
  cautions: string[];
}
