/**
 * The pages of one filing in the order a person walks them: the wizard's steps, then the readiness
 * checklist and the review (where the version is sent for review, returned or signed). Also the
 * words the step list and the comment forms use for them. Pure, so the app tests read it directly.
 */
import { STEP_LABELS, WIZARD_STEPS, type FilingDetail, type VersionState, type WizardStep } from '../../constants/schemas/filings';
import type { ReviewThreadDto } from '../../constants/schemas/review';
import { regimeShort } from './labels';

export const REVIEW_PAGES = ['readiness', 'review'] as const;
export type ReviewPage = (typeof REVIEW_PAGES)[number];
export const FILING_PAGES = [...WIZARD_STEPS, ...REVIEW_PAGES] as const;
export type FilingPage = (typeof FILING_PAGES)[number];

export const PAGE_LABELS: Record<FilingPage, string> = { ...STEP_LABELS, readiness: 'Readiness', review: 'Review and signing' };

export const isFilingPage = (s: string | undefined): s is FilingPage => !!s && (FILING_PAGES as readonly string[]).includes(s);
export const isWizardStep = (s: string | undefined): s is WizardStep => !!s && (WIZARD_STEPS as readonly string[]).includes(s);

/** Which page of a filing a path shows: a page, the overview, or the comparison of two versions. */
export function pageOfPath(pathname: string): FilingPage | 'overview' | 'compare' {
  const last = pathname.split('?')[0].split('/').filter(Boolean).pop() ?? '';
  if (last === 'compare') return 'compare';
  return isFilingPage(last) ? last : 'overview';
}

/** The page before and after this one (null at either end). */
export function neighbours(page: FilingPage): { prev: FilingPage | null; next: FilingPage | null } {
  const i = FILING_PAGES.indexOf(page);
  return { prev: i > 0 ? FILING_PAGES[i - 1] : null, next: i < FILING_PAGES.length - 1 ? FILING_PAGES[i + 1] : null };
}

/** "2 block signing · 1 warning", or that nothing is left. */
export function readinessWords(counts: { blocking: number; warnings: number }): string {
  const parts: string[] = [];
  if (counts.blocking) parts.push(`${counts.blocking} block${counts.blocking === 1 ? 's' : ''} signing`);
  if (counts.warnings) parts.push(`${counts.warnings} warning${counts.warnings === 1 ? '' : 's'}`);
  return parts.length ? parts.join(' · ') : 'Nothing blocks signing';
}

/** What the version's state means for the people on it, in one sentence. */
export const REVIEW_STATE_WORDS: Record<VersionState, string> = {
  draft: 'A draft: the specialist edits it and asks for review when nothing blocks signing.',
  'in-review': 'In review: the data is read-only while an approver reads it, comments, and returns it or signs.',
  returned: 'Returned: the approver asked for changes. The specialist fixes them, answers the comments and asks for review again.',
  signed: 'Signed and frozen: nothing in this version changes. A change starts the next version.',
};

/** The comment threads about one step (the overview's threads with a step of "overview"). */
export const threadsOn = (threads: ReviewThreadDto[], step: string) => threads.filter((t) => t.step === step);

/** Rows a comment can be about on a step: the labels a person typed, as they appear on the step. */
export function rowChoices(data: FilingDetail['data'], step: string): { value: string; label: string }[] {
  switch (step) {
    case 'radios':
      return [...data.radios.transmitters.map((t) => ({ value: t.id, label: `Transmitter ${t.id}` })), ...data.radios.antennas.map((a) => ({ value: a.id, label: `Antenna ${a.id}` }))];
    case 'use-positions':
      return data['use-positions'].usePositions.map((p) => ({ value: p.id, label: `Use position ${p.id}` }));
    case 'markets':
      return data.markets.markets.map((m) => ({ value: m.regime, label: `Market ${regimeShort(m.regime)}` }));
    case 'screening':
      return data.radios.transmitters.map((t) => ({ value: t.id, label: `Rows of ${t.id}` }));
    default:
      return [];
  }
}
