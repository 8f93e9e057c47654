/**
 * Submission packages: build (a job on the queue), status, download and verify. A signed
 * version gets the package without DRAFT; any other version gets a preview marked DRAFT on every
 * page. Approvers and specialists download packages; test engineers download previews. Every
 * download is recorded in the audit trail.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { pipeline } from 'node:stream/promises';
import JSZip from 'jszip';
import type { Db } from '../../db/client';
import type { Role } from '../../constants/schemas/roles';
import { conflict, forbidden, notFound, unprocessable } from '../http-error';
import type { JobQueue, JobStatus } from '../jobs/queue';
import * as repo from '../repos/packages-repo';
import * as jobsRepo from '../repos/jobs-repo';
import { recordAudit } from './audit';
import { assembleExhibit, type AssembledExhibit } from './exhibit-service';
import type { ExhibitSources } from './exhibit-sources';
import { buildPackage, PACKAGE_FORMAT, type Manifest } from './package-builder';
import type { ByteStorage } from '../storage';
import type { SignedVersion } from '../context';

export const PACKAGE_JOB = 'package.build';

export interface PackageDeps {
  db: Db;
  queue: JobQueue;
  /** Where finished zips are kept (content-addressed; the row keeps the SHA-256). */
  storage: ByteStorage;
  sources: ExhibitSources;
  /** Stamped as the PDF's producer and in the DOCX, e.g. "Fieldfile 0.1.0". */
  producer: string;
}

export interface PackageActor {
  id: number;
  organisationId: number;
  roles: Role[];
}

const has = (actor: PackageActor, ...roles: Role[]) => roles.some((r) => actor.roles.includes(r));
const kindOf = (a: AssembledExhibit): 'signed' | 'preview' => (a.model.draft ? 'preview' : 'signed');

function requireDownloader(actor: PackageActor, kind: 'signed' | 'preview') {
  if (kind === 'signed' && !has(actor, 'approver', 'specialist')) throw forbidden('Downloading a signed package needs the approver or specialist role.');
  if (kind === 'preview' && !has(actor, 'approver', 'specialist', 'engineer')) throw forbidden('Downloading a preview needs the approver, specialist or engineer role.');
}

function assemble(deps: PackageDeps, organisationId: number, filingId: number, versionNumber: number): AssembledExhibit {
  const a = assembleExhibit(deps.db, organisationId, filingId, versionNumber, deps.sources);
  if (!a) throw notFound(`No version ${versionNumber} of filing ${filingId} in your organisation.`);
  return a;
}

export interface PackageInfo {
  kind: 'signed' | 'preview';
  fileName: string;
  sizeBytes: number;
  sha256: string;
  builtAt: string;
}

export interface PackageStatus {
  filingId: number;
  versionNumber: number;
  /** What a build of this version gives now: the signed package, or a DRAFT preview. */
  kind: 'signed' | 'preview';
  package: PackageInfo | null;
  /** False when the data changed since the stored preview was built (or nothing is built yet). */
  upToDate: boolean;
  job: JobStatus | null;
  canDownload: boolean;
  canBuild: boolean;
}

const info = (row: repo.PackageRow): PackageInfo => ({ kind: row.kind, fileName: row.fileName, sizeBytes: row.sizeBytes, sha256: row.sha256, builtAt: row.builtAt });

export function packageStatus(deps: PackageDeps, actor: PackageActor, filingId: number, versionNumber: number): PackageStatus {
  const a = assemble(deps, actor.organisationId, filingId, versionNumber);
  const kind = kindOf(a);
  const row = repo.findPackage(deps.db, a.version.version.id, kind);
  const job = jobsRepo.latestJobFor(deps.db, PACKAGE_JOB, actor.organisationId, 'versionId', a.version.version.id);
  return {
    filingId,
    versionNumber,
    kind,
    package: row ? info(row) : null,
    upToDate: !!row && row.modelSha256 === a.modelSha256,
    job: job ? (deps.queue.get(job.id) ?? null) : null,
    canDownload: has(actor, 'approver', 'specialist') || (kind === 'preview' && has(actor, 'engineer')),
    canBuild: has(actor, 'approver', 'specialist') || (kind === 'preview' && has(actor, 'engineer')),
  };
}

/** Queues a build of the version's package (or preview) unless one is already queued or running. */
export function startBuild(deps: PackageDeps, actor: PackageActor, filingId: number, versionNumber: number): JobStatus {
  const a = assemble(deps, actor.organisationId, filingId, versionNumber);
  requireDownloader(actor, kindOf(a));
  return enqueueBuild(deps, actor.organisationId, a, actor.id);
}

/**
 * Queues the build of a version's package. A build already queued or running for the version is
 * returned instead of starting another.
 */
export function enqueueBuild(deps: PackageDeps, organisationId: number, a: AssembledExhibit, requestedByUserId: number | null): JobStatus {
  return enqueueVersionBuild(deps, organisationId, { versionId: a.version.version.id, filingId: a.model.filingId, versionNumber: a.model.versionNumber }, requestedByUserId);
}

function enqueueVersionBuild(deps: PackageDeps, organisationId: number, v: { versionId: number; filingId: number; versionNumber: number }, requestedByUserId: number | null): JobStatus {
  const last = jobsRepo.latestJobFor(deps.db, PACKAGE_JOB, organisationId, 'versionId', v.versionId);
  if (last && (last.state === 'queued' || last.state === 'running')) return deps.queue.get(last.id)!;
  return deps.queue.enqueue(PACKAGE_JOB, organisationId, v, requestedByUserId);
}

/** The signing hook (AppContext.onVersionSigned): the signed package is built as soon as the version is signed. */
export function buildOnSigning(deps: PackageDeps): (signed: SignedVersion) => void {
  return (s) => {
    const v = repo.findVersion(deps.db, s.organisationId, s.filingId, s.versionNumber);
    if (!v) throw new Error(`No version ${s.versionNumber} of filing ${s.filingId} to build.`);
    enqueueVersionBuild(deps, s.organisationId, { versionId: v.version.id, filingId: s.filingId, versionNumber: s.versionNumber }, s.signerUserId);
  };
}

/** The queue's handler: assemble, build into a temporary file, move into place, record. */
export function registerPackageJobs(deps: PackageDeps) {
  deps.queue.register(PACKAGE_JOB, async (job) => {
    const { filingId, versionNumber } = job.payload as { filingId: number; versionNumber: number };
    job.report('collecting', 1);
    const a = assemble(deps, job.organisationId, filingId, versionNumber);
    const kind = kindOf(a);
    const built = await buildPackage(a, (zip) => deps.storage.put(zip), { producer: deps.producer, onProgress: job.report });
    const { replaced } = deps.db.transaction((tx) => {
      const r = repo.replacePackage(tx, {
        versionId: a.version.version.id,
        kind,
        fileName: built.fileName,
        storageKey: built.sha256,
        sizeBytes: built.sizeBytes,
        sha256: built.sha256,
        manifestSha256: built.manifestSha256,
        modelSha256: a.modelSha256,
        jobId: job.id,
        builtAt: new Date().toISOString(),
      });
      recordAudit(tx, {
        organisationId: job.organisationId,
        action: 'package.build',
        targetType: 'filing',
        targetId: filingId,
        details: { version: versionNumber, kind, sha256: built.sha256, sizeBytes: built.sizeBytes },
      });
      return r;
    });
    // The replaced zip's bytes go unless another row still points at the same content.
    if (replaced && !repo.allStorageKeys(deps.db).includes(replaced.storageKey)) await deps.storage.delete(replaced.storageKey);
    return { kind, fileName: built.fileName, sha256: built.sha256, sizeBytes: built.sizeBytes };
  });
}

/** The stored package for download; audited. Refuses a preview that no longer matches the data. */
export async function openDownload(deps: PackageDeps, actor: PackageActor, filingId: number, versionNumber: number) {
  const a = assemble(deps, actor.organisationId, filingId, versionNumber);
  const kind = kindOf(a);
  requireDownloader(actor, kind);
  const row = repo.findPackage(deps.db, a.version.version.id, kind);
  if (!row) throw conflict(kind === 'signed' ? 'The signed package is not built yet; start its build and download it when it is done.' : 'No preview is built for this version yet; build one first.');
  if (kind === 'preview' && row.modelSha256 !== a.modelSha256) throw conflict('The data changed since this preview was built; build the preview again.');
  recordAudit(deps.db, {
    organisationId: actor.organisationId,
    actorUserId: actor.id,
    action: 'package.download',
    targetType: 'filing',
    targetId: filingId,
    details: { version: versionNumber, kind, sha256: row.sha256 },
  });
  return { row, stream: await deps.storage.get(row.storageKey) };
}

export type FileCheck = { path: string; status: 'ok' | 'changed' | 'missing' | 'not-in-manifest' };

export interface VerifyResult {
  /** intact: byte-identical or every file matches a manifest Fieldfile issued; differs: a recognised package with changed files; unknown: not a package this Fieldfile issued. */
  verdict: 'intact' | 'differs' | 'unknown';
  signed: boolean;
  message: string;
  sha256: string;
  package: { filingId: number; versionNumber: number; device: string; kind: 'signed' | 'preview'; fileName: string } | null;
  files: FileCheck[];
}

function recognised(deps: PackageDeps, actor: PackageActor, column: 'sha256' | 'manifestSha256', sha256: string) {
  return repo.findPackagesBy(deps.db, column, sha256).find((r) => r.organisationId === actor.organisationId);
}

const describe = (r: NonNullable<ReturnType<typeof recognised>>) => ({
  filingId: r.filingId,
  versionNumber: r.versionNumber,
  device: `${r.deviceName} (${r.deviceModel})`,
  kind: r.pkg.kind,
  fileName: r.pkg.fileName,
});

export function verifyHash(deps: PackageDeps, actor: PackageActor, sha256: string): VerifyResult {
  const hit = recognised(deps, actor, 'sha256', sha256);
  if (!hit) return { verdict: 'unknown', signed: false, sha256, package: null, files: [], message: 'No package with this SHA-256 was issued by Fieldfile in your organisation.' };
  const d = describe(hit);
  return {
    verdict: 'intact',
    signed: hit.pkg.kind === 'signed',
    sha256,
    package: d,
    files: [],
    message: `This is the ${hit.pkg.kind === 'signed' ? 'signed package' : 'DRAFT preview'} of filing ${d.filingId}, version ${d.versionNumber} (${d.device}), byte for byte.`,
  };
}

/** A job of the actor's organisation (another organisation's job is as good as missing: 404). */
export function requireOrganisationJob(deps: PackageDeps, actor: PackageActor, jobId: number) {
  const row = jobsRepo.findJob(deps.db, jobId);
  if (!row || row.organisationId !== actor.organisationId) throw notFound('No such job in your organisation.');
  return row;
}

export const VERIFY_MAX_BYTES = 512 * 1024 * 1024;

/** Checks an uploaded zip: the whole file's hash first, then the manifest and every file in it. */
export async function verifyZip(deps: PackageDeps, actor: PackageActor, filePath: string): Promise<VerifyResult> {
  const hash = createHash('sha256');
  await pipeline(fs.createReadStream(filePath), hash);
  const sha256 = hash.digest('hex');
  const whole = verifyHash(deps, actor, sha256);
  if (whole.verdict === 'intact') return whole;

  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(await fs.promises.readFile(filePath));
  } catch {
    throw unprocessable('This file is not a zip archive; upload the package .zip as it was downloaded.');
  }
  const manifestEntry = zip.file('manifest.json');
  if (!manifestEntry) return { ...whole, message: 'This zip has no manifest.json, so it is not a Fieldfile package.' };
  const manifestBytes = await manifestEntry.async('nodebuffer');
  let manifest: Manifest;
  try {
    manifest = JSON.parse(manifestBytes.toString('utf8')) as Manifest;
  } catch {
    return { ...whole, message: 'manifest.json in this zip is not valid JSON, so it is not a Fieldfile package.' };
  }
  if (manifest.format !== PACKAGE_FORMAT || !Array.isArray(manifest.files)) return { ...whole, message: `manifest.json is not in the ${PACKAGE_FORMAT} format.` };

  const files: FileCheck[] = [];
  const listed = new Set<string>();
  for (const f of manifest.files) {
    listed.add(f.path);
    const entry = zip.file(f.path);
    if (!entry) {
      files.push({ path: f.path, status: 'missing' });
      continue;
    }
    const h = createHash('sha256');
    await pipeline(entry.nodeStream('nodebuffer'), h);
    files.push({ path: f.path, status: h.digest('hex') === f.sha256 ? 'ok' : 'changed' });
  }
  for (const name of Object.keys(zip.files).sort()) {
    if (!zip.files[name].dir && name !== 'manifest.json' && !listed.has(name)) files.push({ path: name, status: 'not-in-manifest' });
  }
  const bad = files.filter((f) => f.status !== 'ok');
  const hit = recognised(deps, actor, 'manifestSha256', createHash('sha256').update(manifestBytes).digest('hex'));
  if (!hit) {
    return {
      verdict: 'unknown',
      signed: false,
      sha256,
      package: null,
      files,
      message: `Its manifest (filing ${manifest.filing?.id}, version ${manifest.filing?.version}) was not issued by Fieldfile in your organisation: the manifest itself was changed, or the package comes from elsewhere.`,
    };
  }
  const d = describe(hit);
  const what = hit.pkg.kind === 'signed' ? 'signed package' : 'DRAFT preview';
  return {
    verdict: bad.length ? 'differs' : 'intact',
    signed: hit.pkg.kind === 'signed' && !bad.length,
    sha256,
    package: d,
    files,
    message: bad.length
      ? `The ${what} of filing ${d.filingId}, version ${d.versionNumber}, but ${bad.length} file${bad.length === 1 ? '' : 's'} differ${bad.length === 1 ? 's' : ''} from its manifest.`
      : `The ${what} of filing ${d.filingId}, version ${d.versionNumber}: every file matches its manifest (the zip container itself was rewritten).`,
  };
}
