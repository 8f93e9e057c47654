/**
 * Builds one submission package: the exhibit (PDF, DOCX), the results (CSV), the evidence in
 * folders by category and manifest.json, streamed by archiver into a temporary file that the
 * store moves into place only when the zip is complete. Deterministic: a fixed file order, every
 * entry dated with the document date, fixed permissions, PDF/DOCX without any build-time value;
 * already-compressed types are stored and text is deflated. Evidence hashes come from upload
 * time, so the build reads each evidence file once.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { PassThrough, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { ZipArchive } from 'archiver';
import { renderExhibitPdf } from '../../templates/exhibit/pdf';
import { renderExhibitDocx } from '../../templates/exhibit/docx';
import { labCsv, screeningCsv } from '../../templates/exhibit/csv';
import type { AssembledExhibit } from './exhibit-service';

export const PACKAGE_FORMAT = 'fieldfile.package/1';
const FILE_MODE = 0o644;

/** Types that are already compressed (stored as they are); everything else is deflated. */
const STORED_EXTENSIONS = new Set(['pdf', 'png', 'jpg', 'jpeg', 'gif', 'webp', 'heic', 'tif', 'tiff', 'zip', 'docx', 'xlsx', 'pptx', 'gz', 'bz2', 'xz', '7z', 'mp4', 'mov', 'bin', 'dat']);
/** Extensions known to be text, deflated; an unknown type is stored (it is most likely binary). */
const DEFLATED_EXTENSIONS = new Set(['json', 'csv', 'txt', 'xml', 'html', 'htm', 'md', 'log', 's2p', 's1p', 'svg', 'tsv', 'yaml', 'yml']);

export function storeUncompressed(path: string): boolean {
  const ext = path.toLowerCase().split('.').pop() ?? '';
  if (STORED_EXTENSIONS.has(ext)) return true;
  return !DEFLATED_EXTENSIONS.has(ext);
}

export interface ManifestFile {
  path: string;
  sizeBytes: number;
  category: string;
  sha256: string;
}

export interface Manifest {
  format: typeof PACKAGE_FORMAT;
  status: 'signed' | 'draft-preview';
  organisation: string;
  filing: { id: number; version: number; device: AssembledExhibit['model']['device'] };
  documentDate: string;
  engine: { version: string; ruleSetVersion: string; ruleSetDocuments: string[] };
  signature: AssembledExhibit['model']['signature'];
  readiness: { basis: 'at-signing' | 'current'; asOf: string; ready: boolean; counts: { blocking: number; warnings: number; passed: number; notApplicable: number }; items: { id: string; status: string }[] } | null;
  files: ManifestFile[];
}

export interface BuildResult {
  fileName: string;
  sizeBytes: number;
  sha256: string;
  manifestSha256: string;
  manifest: Manifest;
}

export type Progress = (stage: string, percent: number) => void;

/**
 * The evidence file's bytes, failing the build if their count differs from the size recorded at
 * upload (the manifest states that size and the upload-time hash; the build does not re-hash).
 */
function countedStream(e: AssembledExhibit['evidence'][number]): Readable {
  let seen = 0;
  const counter = new PassThrough({
    transform(chunk: Buffer, _enc, done) {
      seen += chunk.length;
      done(null, chunk);
    },
    flush(done) {
      done(seen === e.sizeBytes ? null : new Error(`Evidence file ${e.path} has ${seen} bytes; ${e.sizeBytes} were recorded at upload.`));
    },
  });
  const source = e.open();
  source.on('error', (err) => counter.destroy(err));
  return source.pipe(counter);
}

const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'device';

export function packageFileName(a: AssembledExhibit): string {
  return `${slug(`${a.model.device.name}`)}-v${a.model.versionNumber}${a.model.draft ? '-draft' : ''}.zip`;
}

const sha256 = (b: Buffer | Uint8Array | string) => createHash('sha256').update(b).digest('hex');

/** Where the zip stream goes: byte storage (temporary file, renamed into place when complete) or a file. */
export type ZipSink = (zip: Readable) => Promise<{ sha256: string; sizeBytes: number }>;

/** A sink that writes the zip to a new file (for the bench and tests), hashing it on the way. */
export function fileSink(file: string): ZipSink {
  return async (zip) => {
    const hash = createHash('sha256');
    let sizeBytes = 0;
    zip.on('data', (chunk: Buffer) => {
      hash.update(chunk);
      sizeBytes += chunk.length;
    });
    await pipeline(zip, fs.createWriteStream(file, { flags: 'wx' }));
    return { sha256: hash.digest('hex'), sizeBytes };
  };
}

/**
 * Streams the package zip into `sink` and returns its hashes. Nothing is visible until the sink
 * has the complete zip; when this throws, the sink keeps nothing.
 */
export async function buildPackage(a: AssembledExhibit, sink: ZipSink, opts: { producer: string; onProgress?: Progress }): Promise<BuildResult> {
  const progress = opts.onProgress ?? (() => {});
  const m = a.model;
  const stem = `${slug(m.device.name)}-v${m.versionNumber}`;
  progress('exhibit-pdf', 5);
  const pdf = Buffer.from(await renderExhibitPdf(m, { producer: opts.producer }));
  progress('exhibit-docx', 25);
  const docx = await renderExhibitDocx(m, { producer: opts.producer });
  progress('results', 35);
  const generated: { path: string; category: string; data: Buffer }[] = [
    { path: `exhibit/${stem}-rf-exposure-exhibit.pdf`, category: 'exhibit', data: pdf },
    { path: `exhibit/${stem}-rf-exposure-exhibit.docx`, category: 'exhibit', data: docx },
    { path: 'results/screening.csv', category: 'results', data: Buffer.from(screeningCsv(m)) },
    { path: 'results/lab-sar.csv', category: 'results', data: Buffer.from(labCsv(m)) },
  ];
  const files: ManifestFile[] = [
    ...generated.map((g) => ({ path: g.path, sizeBytes: g.data.length, category: g.category, sha256: sha256(g.data) })),
    ...a.evidence.map((e) => ({ path: e.path, sizeBytes: e.sizeBytes, category: `evidence/${e.categoryId}`, sha256: e.sha256 })),
  ];
  const manifest: Manifest = {
    format: PACKAGE_FORMAT,
    status: m.draft ? 'draft-preview' : 'signed',
    organisation: m.organisation,
    filing: { id: m.filingId, version: m.versionNumber, device: m.device },
    documentDate: m.documentDate,
    engine: { version: m.screening.engineVersion, ruleSetVersion: m.screening.ruleSetVersion, ruleSetDocuments: m.screening.ruleSetDocuments },
    signature: m.signature,
    readiness: m.readiness && {
      basis: m.readiness.basis,
      asOf: m.readiness.asOf,
      ready: m.readiness.ready,
      counts: m.readiness.counts,
      items: m.readiness.items.map((i) => ({ id: i.id, status: i.status })),
    },
    files,
  };
  const manifestJson = Buffer.from(`${JSON.stringify(manifest, null, 2)}\n`);

  const date = new Date(m.documentDate);
  const zip = new ZipArchive({ zlib: { level: 6 }, forceLocalTime: false });
  const evidenceBytes = a.evidence.reduce((s, e) => s + e.sizeBytes, 0);
  zip.on('progress', (p) => {
    if (evidenceBytes) progress('evidence', Math.min(98, 40 + Math.floor((58 * Math.max(0, p.fs.processedBytes)) / evidenceBytes)));
  });
  zip.on('warning', (e) => zip.destroy(e));
  const written = sink(zip);
  const entry = (name: string) => ({ name, date, mode: FILE_MODE, store: storeUncompressed(name) });
  zip.append(manifestJson, entry('manifest.json'));
  for (const g of generated) zip.append(g.data, entry(g.path));
  progress('evidence', 40);
  for (const e of a.evidence) zip.append(countedStream(e), entry(e.path));
  void zip.finalize().catch((e) => zip.destroy(e));
  const { sha256: zipSha256, sizeBytes } = await written;
  progress('finishing', 99);
  return { fileName: packageFileName(a), sizeBytes, sha256: zipSha256, manifestSha256: sha256(manifestJson), manifest };
}
