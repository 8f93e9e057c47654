/**
 * Evidence: a filing version's files, each in a category, hashed and type-sniffed on arrival.
 * Engineers and specialists upload, replace and remove; every member reads and downloads. A
 * signed version's evidence never changes (403). The database row is written only once the bytes
 * are in place; bytes nothing references any more are deleted.
 */
import { Readable } from 'node:stream';
import { buffer } from 'node:stream/consumers';
import { fileTypeFromStream } from 'file-type';
import type { Db } from '../../db/client';
import {
  CATEGORY_BY_ID,
  MEDIA,
  MEDIA_LABELS,
  type EvidenceFields,
  type EvidenceList,
  type EvidenceRecord,
  type MediaType,
  type ReadBackFinding,
  type UploadedEvidence,
} from '../../constants/schemas/evidence';
import { EDITABLE_STATES, VERSION_STATE_LABELS, type VersionState } from '../../constants/schemas/filings';
import type { Config } from '../env';
import type { ByteStorage, StoredObject } from '../storage';
import { HttpError, conflict, forbidden, notFound, unprocessable } from '../http-error';
import * as filingsRepo from '../repos/filings-repo';
import * as repo from '../repos/evidence-repo';
import { recordAudit } from './audit';
import { getFiling, type FilingActor } from './filings-service';
import { requiredForVersion } from './evidence-step';
import { extractPdfText } from './report-readback';
import { labDeviceDataOf, readVersionData, screeningKeyOf, screenVersion } from './readiness-service';
import { versionLabResults } from './lab-results-cache';
import { READ_BACK_CATEGORIES, filingNumbersOf, versionReadBack } from './version-readback';

export const canUpload = (actor: FilingActor) => actor.roles.includes('engineer') || actor.roles.includes('specialist');

export const payloadTooLarge = (message: string) => new HttpError(413, 'too_large', message);
export const badUpload = (message: string) => new HttpError(400, 'bad_request', message);
export const unsupportedType = (message: string) => new HttpError(415, 'unsupported_type', message);

const mb = (bytes: number) => `${Number((bytes / 1024 / 1024).toFixed(1))} MB`;

function loadFiling(db: Db, actor: FilingActor, filingId: number) {
  const row = filingsRepo.findFiling(db, actor.organisationId, filingId);
  if (!row) throw notFound('No such filing in your organisation.');
  return row;
}

/** Refuses changes by the wrong role, to a signed version (403) or one under review (409). */
export function requireEvidenceEditable(db: Db, actor: FilingActor, filingId: number) {
  if (!canUpload(actor)) throw forbidden('Only a test engineer or a compliance specialist can file evidence. This needs the engineer or specialist role.');
  const row = loadFiling(db, actor, filingId);
  const state = row.version.state as VersionState;
  if (state === 'signed') throw forbidden(`Version ${row.version.number} is signed; its evidence is frozen. Start a new version to change it.`);
  if (!EDITABLE_STATES.includes(state)) throw conflict(`Version ${row.version.number} is ${VERSION_STATE_LABELS[state].toLowerCase()}; its evidence can no longer change.`);
  return row;
}

/**
 * File names from the user are display names only: the last path segment, without control or
 * bidirectional-override characters, at most FILE_NAME_MAX characters (the extension kept).
 */
export function safeDisplayName(raw: string | undefined, max = 200): string {
  let name = (raw ?? '').split(/[/\\]/).pop() ?? '';
  name = name
    .replace(/[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/g, '')
    .replace(/\s+/g, ' ')
    .trim();
  name = name.replace(/^\.+/, '');
  if (!name) return 'file';
  if ([...name].length <= max) return name;
  const dot = name.lastIndexOf('.');
  const ext = dot > 0 && name.length - dot <= 10 ? name.slice(dot) : '';
  return [...name.slice(0, name.length - ext.length)].slice(0, max - ext.length).join('') + ext;
}

/** The media type from the bytes; text (CSV, plain) is recognised as UTF-8 without NULs. */
export async function sniffMediaType(storage: ByteStorage, stored: StoredObject, fileName: string): Promise<{ mime: string; label: string }> {
  // file-type reads a Node stream too (its typings name only web streams).
  const sniffed = await fileTypeFromStream((await storage.get(stored.sha256)) as unknown as Parameters<typeof fileTypeFromStream>[0]);
  if (sniffed) return { mime: sniffed.mime, label: MEDIA_LABELS[sniffed.mime as MediaType] ?? `a .${sniffed.ext} file` };
  const head = stored.head.subarray(0, Math.max(0, stored.head.length - 4));
  const isText =
    !head.includes(0) &&
    (() => {
      try {
        new TextDecoder('utf-8', { fatal: true }).decode(head);
        return true;
      } catch {
        return false;
      }
    })();
  if (isText && stored.sizeBytes > 0) {
    const mime = /\.csv$/i.test(fileName) ? MEDIA.csv : MEDIA.text;
    return { mime, label: MEDIA_LABELS[mime] };
  }
  return { mime: 'application/octet-stream', label: 'unrecognised binary data' };
}

/** Deletes bytes no record references (a refused upload, a removed record). */
export async function discardIfUnreferenced(db: Db, storage: ByteStorage, sha256: string) {
  if (repo.countBySha256(db, sha256) === 0) await storage.delete(sha256);
}

export interface UploadInput {
  stored: StoredObject;
  originalName: string;
  fields: EvidenceFields;
}

/** Files an uploaded object: type and limit checks, then the row (and the audit record). */
export async function recordUpload(db: Db, storage: ByteStorage, config: Config, actor: FilingActor, filingId: number, input: UploadInput): Promise<UploadedEvidence> {
  const { stored, fields } = input;
  try {
    const row = requireEvidenceEditable(db, actor, filingId);
    const versionId = row.version.id;
    const category = CATEGORY_BY_ID[fields.category];
    const fileName = safeDisplayName(input.originalName);
    const sniffed = await sniffMediaType(storage, stored, fileName);
    if (!category.accepts.includes(sniffed.mime as MediaType)) {
      throw unsupportedType(`“${fileName}” is ${sniffed.label} (${sniffed.mime}) by its content; ${category.label} takes ${category.accepts.map((m) => MEDIA_LABELS[m]).join(', ')}.`);
    }
    if (stored.sizeBytes === 0) throw unprocessable('The file is empty.');
    const current = repo.listEvidence(db, versionId).filter((r) => r.row.replacedById === null);
    const duplicateOf = current.filter((r) => r.row.sha256 === stored.sha256).map((r) => r.row.id);
    const used = repo.usedBytes(db, versionId);
    if (!duplicateOf.length && used + stored.sizeBytes > config.evidence.maxFilingBytes) {
      throw payloadTooLarge(`This filing version already holds ${mb(used)} of evidence; ${mb(stored.sizeBytes)} more would pass its limit of ${mb(config.evidence.maxFilingBytes)}.`);
    }
    let replaced: repo.EvidenceRow | undefined;
    if (fields.replaces !== undefined) {
      replaced = repo.findEvidence(db, versionId, fields.replaces);
      if (!replaced || replaced.replacedById !== null) throw unprocessable('The record to replace is not current evidence of this version.', { replaces: 'Pick a current record of this version.' });
    }
    const record = db.transaction((tx) => {
      const inserted = repo.insertEvidence(tx, {
        versionId,
        category: fields.category,
        title: fields.title || fileName,
        note: fields.note ?? '',
        fileName,
        sizeBytes: stored.sizeBytes,
        mediaType: sniffed.mime,
        sha256: stored.sha256,
        documentDate: fields.documentDate ?? null,
        uploadedByUserId: actor.id,
        replacesId: replaced?.id ?? null,
      });
      if (replaced) repo.markReplaced(tx, replaced.id, inserted.id);
      filingsRepo.touchFiling(tx, filingId);
      recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.id,
        action: replaced ? 'evidence.replace' : 'evidence.upload',
        targetType: 'evidence',
        targetId: inserted.id,
        details: { filingId, version: row.version.number, category: fields.category, fileName, sha256: stored.sha256, sizeBytes: stored.sizeBytes, ...(replaced ? { replaces: replaced.id } : {}) },
      });
      return inserted;
    });
    if (READ_BACK_CATEGORIES.includes(fields.category) && sniffed.mime === MEDIA.pdf) await readBack(db, storage, stored.sha256);
    const full = listRecords(db, versionId).find((r) => r.id === record.id)!;
    return {
      record: full,
      duplicateOf,
      notice: duplicateOf.length ? `The same content is already filed in this version as record ${duplicateOf.join(', ')}.` : undefined,
    };
  } catch (err) {
    if (!stored.alreadyStored) await discardIfUnreferenced(db, storage, stored.sha256);
    throw err;
  }
}

/** Reads a PDF's text once per content hash (test reports, user manuals and antenna drawings are read back). */
export async function readBack(db: Db, storage: ByteStorage, sha256: string) {
  if (repo.findDocumentText(db, sha256)) return;
  const data = await buffer(await storage.get(sha256));
  const text = await extractPdfText(data);
  repo.saveDocumentText(db, {
    sha256,
    status: text.status,
    reason: text.status === 'unreadable' ? text.reason : null,
    pageCount: text.pages.length,
    pages: text.pages,
  });
}

function toRecord(r: ReturnType<typeof repo.listEvidence>[number], versionNumber: number, duplicates: Map<string, number[]>): EvidenceRecord {
  const { row } = r;
  return {
    id: row.id,
    versionId: row.versionId,
    versionNumber,
    category: row.category,
    title: row.title,
    note: row.note,
    fileName: row.fileName,
    sizeBytes: row.sizeBytes,
    mediaType: row.mediaType,
    sha256: row.sha256,
    documentDate: row.documentDate,
    uploadedBy: { id: row.uploadedByUserId, name: r.uploaderName },
    uploadedAt: row.uploadedAt,
    replacesId: row.replacesId,
    replacedById: row.replacedById,
    duplicateOf: row.replacedById === null ? (duplicates.get(row.sha256) ?? []).filter((id) => id !== row.id) : [],
    carriedFromVersion: r.carriedFromVersion ?? null,
  };
}

function listRecords(db: Db, versionId: number, versionNumber = 0): EvidenceRecord[] {
  const rows = repo.listEvidence(db, versionId);
  const duplicates = new Map<string, number[]>();
  for (const r of rows) if (r.row.replacedById === null) duplicates.set(r.row.sha256, [...(duplicates.get(r.row.sha256) ?? []), r.row.id]);
  return rows.map((r) => toRecord(r, versionNumber, duplicates));
}

/** Read-back findings of the version's current test reports against the filing's numbers (the ones the checklist reads). */
function findings(db: Db, row: filingsRepo.FilingRow, records: EvidenceRecord[]): ReadBackFinding[] {
  if (!records.some((r) => r.replacedById === null && r.category === 'test-report' && r.mediaType === MEDIA.pdf)) return [];
  const v = readVersionData(db, row.version, row.filing.deviceId);
  const { data } = v;
  const lab = versionLabResults(db, row.version.id, labDeviceDataOf(v), { screening: screenVersion(v), screeningKey: screeningKeyOf(v) });
  const numbers = filingNumbersOf(data.device.model, data.radios.transmitters, data['use-positions'].usePositions, lab?.results?.highest ?? []);
  const report =
    versionReadBack(
      db,
      row.version.id,
      records,
      numbers,
      data.radios.antennas.map((a) => a.id),
    ).report ?? [];
  return report.map(({ tuneUp: _t, title: _title, ...f }) => f);
}

export function listEvidence(db: Db, config: Config, actor: FilingActor, filingId: number): EvidenceList {
  const row = loadFiling(db, actor, filingId);
  const records = listRecords(db, row.version.id, row.version.number);
  const current = records.filter((r) => r.replacedById === null);
  const state = row.version.state as VersionState;
  return {
    filingId,
    version: { id: row.version.id, number: row.version.number, state },
    editable: canUpload(actor) && EDITABLE_STATES.includes(state),
    records: current,
    history: records.filter((r) => r.replacedById !== null),
    required: requiredForVersion(db, row.version.id, getFiling(db, actor, filingId)),
    findings: findings(db, row, records),
    limits: { ...config.evidence, usedBytes: repo.usedBytes(db, row.version.id) },
  };
}

/** The bytes of any record of the filing (current or history, any version), audited. */
export async function openEvidenceFile(db: Db, storage: ByteStorage, actor: FilingActor, filingId: number, evidenceId: number) {
  loadFiling(db, actor, filingId);
  const row = repo.findEvidenceInFiling(db, filingId, evidenceId);
  if (!row) throw notFound('No such evidence in this filing.');
  const stream: Readable = await storage.get(row.sha256);
  recordAudit(db, {
    organisationId: actor.organisationId,
    actorUserId: actor.id,
    action: 'evidence.download',
    targetType: 'evidence',
    targetId: row.id,
    details: { filingId, fileName: row.fileName, sha256: row.sha256 },
  });
  return { row, stream };
}

export async function removeEvidence(db: Db, storage: ByteStorage, actor: FilingActor, filingId: number, evidenceId: number) {
  const filing = requireEvidenceEditable(db, actor, filingId);
  const row = repo.findEvidence(db, filing.version.id, evidenceId);
  if (!row) throw notFound('No such evidence in the current version of this filing.');
  db.transaction((tx) => {
    repo.deleteEvidence(tx, row.id);
    filingsRepo.touchFiling(tx, filingId);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'evidence.delete',
      targetType: 'evidence',
      targetId: row.id,
      details: { filingId, version: filing.version.number, category: row.category, fileName: row.fileName, sha256: row.sha256 },
    });
  });
  await discardIfUnreferenced(db, storage, row.sha256);
}

export function explainFinding(db: Db, config: Config, actor: FilingActor, filingId: number, evidenceId: number, findingKey: string, reason: string) {
  const filing = requireEvidenceEditable(db, actor, filingId);
  const list = listEvidence(db, config, actor, filingId);
  const finding = list.findings.find((f) => f.evidenceId === evidenceId && f.key === findingKey);
  if (!finding) throw notFound('No such read-back finding on this evidence.');
  db.transaction((tx) => {
    repo.upsertExplanation(tx, { versionId: filing.version.id, evidenceId, findingKey, reason, userId: actor.id });
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'evidence.finding-explain',
      targetType: 'evidence',
      targetId: evidenceId,
      details: { filingId, findingKey, reason },
    });
  });
  return listEvidence(db, config, actor, filingId);
}
