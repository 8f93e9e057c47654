/**
 * Evidence: the categories a filing's exhibits are filed in (our own names), the types each
 * accepts, the upload fields, and the shapes the API answers with. Shared by the client and
 * the server (GET /api/schema/evidence-categories.json is built from EVIDENCE_CATEGORIES).
 */
import { z } from 'zod';

/** Media types, as sniffed from the bytes (file-type) or, for plain text, recognised as UTF-8 text. */
export const MEDIA = {
  pdf: 'application/pdf',
  png: 'image/png',
  jpeg: 'image/jpeg',
  heic: 'image/heic',
  tiff: 'image/tiff',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  docx: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
  csv: 'text/csv',
  text: 'text/plain',
} as const;
export type MediaType = (typeof MEDIA)[keyof typeof MEDIA];

export const MEDIA_LABELS: Record<MediaType, string> = {
  [MEDIA.pdf]: 'PDF',
  [MEDIA.png]: 'PNG image',
  [MEDIA.jpeg]: 'JPEG image',
  [MEDIA.heic]: 'HEIC photo',
  [MEDIA.tiff]: 'TIFF image',
  [MEDIA.xlsx]: 'Excel workbook (XLSX)',
  [MEDIA.docx]: 'Word document (DOCX)',
  [MEDIA.csv]: 'CSV text',
  [MEDIA.text]: 'plain text',
};

export const EVIDENCE_CATEGORY_IDS = [
  'test-report',
  'report-appendix',
  'calibration-certificate',
  'check-records',
  'setup-photos',
  'antenna-drawing',
  'tune-up-table',
  'user-manual',
  'user-manual-bilingual',
  'label-drawing',
  'applicant-declaration',
  'exemption-analysis',
  'other',
] as const;
export type EvidenceCategoryId = (typeof EVIDENCE_CATEGORY_IDS)[number];

export interface EvidenceCategory {
  id: EvidenceCategoryId;
  label: string;
  /** What belongs here, in a sentence. */
  description: string;
  accepts: readonly MediaType[];
  /** Several files may make up this exhibit (a report in parts, a set of photos). */
  multiple: boolean;
  /** Asks for the document's date (a calibration date, a signature date). */
  dateLabel?: string;
  /** Fieldfile writes this exhibit itself from the filing; it is not uploaded. */
  writtenByFieldfile?: boolean;
}

const IMAGES = [MEDIA.png, MEDIA.jpeg, MEDIA.heic, MEDIA.tiff] as const;

export const EVIDENCE_CATEGORIES: readonly EvidenceCategory[] = [
  { id: 'test-report', label: 'RF-exposure test report', description: 'The lab’s SAR or MPE test report; a long report may come in several parts.', accepts: [MEDIA.pdf], multiple: true },
  { id: 'report-appendix', label: 'Report appendices', description: 'SAR plots, area and zoom scans, system-check plots that accompany the report.', accepts: [MEDIA.pdf, ...IMAGES], multiple: true },
  {
    id: 'calibration-certificate',
    label: 'Calibration certificates',
    description: 'Probe, reference dipole and measurement electronics certificates, each with its calibration date.',
    accepts: [MEDIA.pdf],
    multiple: true,
    dateLabel: 'Calibration date',
  },
  {
    id: 'check-records',
    label: 'Liquid and system check records',
    description: 'Tissue-simulating liquid measurements and system checks with their dates.',
    accepts: [MEDIA.pdf, MEDIA.xlsx, MEDIA.csv],
    multiple: true,
    dateLabel: 'Check date',
  },
  { id: 'setup-photos', label: 'Test setup photos', description: 'Photos of the device in each tested position.', accepts: [MEDIA.pdf, ...IMAGES], multiple: true },
  { id: 'antenna-drawing', label: 'Antenna location drawing', description: 'Where each antenna sits, with antenna-to-edge distances.', accepts: [MEDIA.pdf, MEDIA.png, MEDIA.jpeg], multiple: true },
  { id: 'tune-up-table', label: 'Tune-up power table', description: 'Declared maximum tune-up power and tolerance per mode and band.', accepts: [MEDIA.pdf, MEDIA.xlsx, MEDIA.csv], multiple: false },
  { id: 'user-manual', label: 'User-manual excerpt', description: 'The manual pages with the separation-distance and RF-exposure statements.', accepts: [MEDIA.pdf, MEDIA.docx], multiple: true },
  {
    id: 'user-manual-bilingual',
    label: 'User-manual excerpt, English and French',
    description: 'The separation-distance and RF-exposure statements in English and French, as Canada asks.',
    accepts: [MEDIA.pdf, MEDIA.docx],
    multiple: true,
  },
  { id: 'label-drawing', label: 'Label drawing', description: 'The product label artwork and where it sits on the device.', accepts: [MEDIA.pdf, MEDIA.png, MEDIA.jpeg], multiple: false },
  { id: 'applicant-declaration', label: 'Applicant declarations', description: 'Declarations and attestations signed by the applicant.', accepts: [MEDIA.pdf], multiple: true, dateLabel: 'Signed on' },
  {
    id: 'exemption-analysis',
    label: 'Exemption analysis',
    description: 'Why every transmitter is exempt from testing; Fieldfile writes it from the screening.',
    accepts: [],
    multiple: false,
    writtenByFieldfile: true,
  },
  {
    id: 'other',
    label: 'Other supporting document',
    description: 'Anything else a reviewer may ask for.',
    accepts: [MEDIA.pdf, ...IMAGES, MEDIA.xlsx, MEDIA.docx, MEDIA.csv, MEDIA.text],
    multiple: true,
  },
];

export const CATEGORY_BY_ID = Object.fromEntries(EVIDENCE_CATEGORIES.map((c) => [c.id, c])) as Record<EvidenceCategoryId, EvidenceCategory>;
export const UPLOADABLE_CATEGORIES = EVIDENCE_CATEGORIES.filter((c) => !c.writtenByFieldfile);

export const EVIDENCE_TITLE_MAX = 200;
export const EVIDENCE_NOTE_MAX = 2000;
export const FILE_NAME_MAX = 200;
export const EXPLANATION_MAX = 1000;
/** Defaults; the server reads FIELDFILE_EVIDENCE_MAX_FILE_BYTES and _MAX_FILING_BYTES. */
export const DEFAULT_MAX_FILE_BYTES = 100 * 1024 * 1024;
export const DEFAULT_MAX_FILING_BYTES = 2 * 1024 * 1024 * 1024;

export const zEvidenceFields = z.strictObject({
  category: z.enum(UPLOADABLE_CATEGORIES.map((c) => c.id) as [EvidenceCategoryId, ...EvidenceCategoryId[]], { error: `Pick a category: ${UPLOADABLE_CATEGORIES.map((c) => c.id).join(', ')}.` }),
  title: z.string().trim().max(EVIDENCE_TITLE_MAX, `Keep the title under ${EVIDENCE_TITLE_MAX} characters.`).optional(),
  note: z.string().trim().max(EVIDENCE_NOTE_MAX, `Keep the note under ${EVIDENCE_NOTE_MAX} characters.`).optional(),
  documentDate: z.iso.date({ error: 'Give the date as YYYY-MM-DD.' }).optional(),
  /** Replace this earlier record (it stays in the version's history). */
  replaces: z.coerce.number().int().positive().optional(),
});
export type EvidenceFields = z.output<typeof zEvidenceFields>;

export const zExplainFinding = z.strictObject({
  reason: z.string().trim().min(3, 'Say why the difference is acceptable.').max(EXPLANATION_MAX, `Keep the reason under ${EXPLANATION_MAX} characters.`),
});

export interface EvidenceRecord {
  id: number;
  versionId: number;
  versionNumber: number;
  category: EvidenceCategoryId;
  title: string;
  note: string;
  fileName: string;
  sizeBytes: number;
  mediaType: string;
  sha256: string;
  documentDate: string | null;
  uploadedBy: { id: number; name: string };
  uploadedAt: string;
  /** The earlier record this one replaced. */
  replacesId: number | null;
  /** Set when a later upload replaced this one (then it is history, not current). */
  replacedById: number | null;
  /** Other current records in this filing version with the same content. */
  duplicateOf: number[];
  /** Came into this version from an earlier one (same bytes, no copy). */
  carriedFromVersion: number | null;
}

export const FINDING_KINDS = ['unreadable', 'tune-up-power', 'reported-sar', 'separation', 'model'] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];

export interface ReadBackFinding {
  /** Stable within a document and filing data: explanations are keyed by it. */
  key: string;
  evidenceId: number;
  kind: FindingKind;
  /** 1-based page of the report, when the finding has one. */
  page: number | null;
  message: string;
  reportValue: string | null;
  filingValue: string | null;
  explanation: { reason: string; by: string; at: string } | null;
}

export interface RequiredCategory {
  category: EvidenceCategoryId;
  /** Why this filing needs it. */
  reason: string;
  present: boolean;
  evidenceIds: number[];
  writtenByFieldfile: boolean;
}

export interface EvidenceList {
  filingId: number;
  version: { id: number; number: number; state: string };
  editable: boolean;
  records: EvidenceRecord[];
  history: EvidenceRecord[];
  required: RequiredCategory[];
  findings: ReadBackFinding[];
  limits: { maxFileBytes: number; maxFilingBytes: number; usedBytes: number };
}

/** POST /api/filings/:id/evidence answers 201 with this. */
export interface UploadedEvidence {
  record: EvidenceRecord;
  duplicateOf: number[];
  notice?: string;
}
