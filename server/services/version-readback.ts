/**
 * What a version's uploaded documents say, read back against the filing: the test reports'
 * disagreements (report-readback's compareReport), the separations the user manual states and
 * the antenna-to-edge distances of the antenna drawing. Only current (not replaced) PDFs whose
 * text was read on upload count. The evidence list and the readiness checklist both read it here,
 * so a finding the checklist names is the one the Evidence step lets the engineer explain.
 */
import type { Db } from '../../db/client';
import { MEDIA, type EvidenceCategoryId } from '../../constants/schemas/evidence';
import type { UsePositionKind } from '../../constants/schemas/device-file';
import * as repo from '../repos/evidence-repo';
import { antennaEdgeDistances, compareReport, manualSeparationStatements, type AntennaEdgeDistance, type FilingNumbers, type ManualSeparationStatement, type ReadBackDraft } from './report-readback';

/** Categories whose PDFs are read on upload. */
export const READ_BACK_CATEGORIES: readonly EvidenceCategoryId[] = ['test-report', 'user-manual', 'user-manual-bilingual', 'antenna-drawing'];
const MANUAL_CATEGORIES: readonly EvidenceCategoryId[] = ['user-manual', 'user-manual-bilingual'];

export interface ReadDocument {
  id: number;
  title: string;
  category: EvidenceCategoryId;
  sha256: string;
  mediaType: string;
  replacedById: number | null;
}

/** The filing's numbers a report is compared with. */
export function filingNumbersOf(
  model: string,
  transmitters: readonly { id: string; band: string; maxTuneUpPowerDbm: number }[],
  usePositions: readonly { kind: UsePositionKind; separations: readonly { separationM: number }[] }[],
  highest: readonly { usePositionKind: UsePositionKind; reportedSarWPerKg: number | null }[],
): FilingNumbers {
  // A report prints one highest reported SAR per condition; the filing's is the largest over its
  // markets (the 1 g figure where a market averages over 1 g, which is never below the 10 g one).
  const byKind = new Map<UsePositionKind, number>();
  for (const h of highest) if (h.reportedSarWPerKg !== null) byKind.set(h.usePositionKind, Math.max(byKind.get(h.usePositionKind) ?? 0, h.reportedSarWPerKg));
  return {
    model,
    tuneUps: transmitters.map((t) => ({ transmitterId: t.id, band: t.band, tuneUpPowerDbm: t.maxTuneUpPowerDbm })),
    separations: usePositions.flatMap((p) => p.separations.map((s) => ({ kind: p.kind, separationMm: s.separationM * 1000 }))),
    highestReportedSar: [...byKind].map(([kind, sarWPerKg]) => ({ kind, sarWPerKg })),
  };
}

export interface ReportFinding extends ReadBackDraft {
  evidenceId: number;
  title: string;
  explanation: { reason: string; by: string; at: string } | null;
}

export interface VersionReadBack {
  /** Null when no test report's text is on file. */
  report: ReportFinding[] | null;
  /** Null when no user manual's text is on file. */
  manual: (ManualSeparationStatement & { title: string })[] | null;
  /** Null when no antenna drawing's text is on file. */
  edges: (AntennaEdgeDistance & { title: string })[] | null;
}

const isReadable = (d: ReadDocument) => d.replacedById === null && d.mediaType === MEDIA.pdf;

export function versionReadBack(db: Db, versionId: number, documents: readonly ReadDocument[], numbers: FilingNumbers, antennaIds: readonly string[]): VersionReadBack {
  const current = documents.filter((d) => isReadable(d) && READ_BACK_CATEGORIES.includes(d.category));
  if (!current.length) return { report: null, manual: null, edges: null };
  const texts = new Map(repo.documentTextsFor(db, [...new Set(current.map((d) => d.sha256))]).map((t) => [t.sha256, t]));
  const read = (categories: readonly EvidenceCategoryId[]) => current.filter((d) => categories.includes(d.category) && texts.has(d.sha256)).map((d) => ({ doc: d, text: texts.get(d.sha256)! }));

  const reports = read(['test-report']);
  let report: ReportFinding[] | null = null;
  if (reports.length) {
    const explained = new Map(repo.listExplanations(db, versionId).map((e) => [`${e.row.evidenceId}|${e.row.findingKey}`, { reason: e.row.reason, by: e.userName, at: e.row.at }]));
    report = [];
    for (const { doc, text } of reports) {
      const drafts: ReadBackDraft[] =
        text.status === 'unreadable'
          ? [
              {
                key: 'unreadable',
                kind: 'unreadable',
                page: null,
                message: `“${doc.title}” was stored, but ${text.reason?.replace(/^The PDF/, 'its PDF') ?? 'it could not be read'} Check it by hand.`,
                reportValue: null,
                filingValue: null,
              },
            ]
          : compareReport(text.pages, numbers);
      for (const d of drafts) report.push({ ...d, evidenceId: doc.id, title: doc.title, explanation: explained.get(`${doc.id}|${d.key}`) ?? null });
    }
  }

  const manuals = read(MANUAL_CATEGORIES).filter((m) => m.text.status === 'read');
  const manual = manuals.length ? manuals.flatMap(({ doc, text }) => manualSeparationStatements(text.pages).map((s) => ({ ...s, title: doc.title }))) : null;

  const drawings = read(['antenna-drawing']).filter((m) => m.text.status === 'read');
  const edges = drawings.length ? drawings.flatMap(({ doc, text }) => antennaEdgeDistances(text.pages, antennaIds).map((e) => ({ ...e, title: doc.title }))) : null;

  return { report, manual, edges };
}
