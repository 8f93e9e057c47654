/**
 * Builds one submission package: the evidence in folders by category, the exhibit (PDF, DOCX),
 * the results (CSV) and manifest.json, streamed by archiver into a temporary file that the store
 * moves into place only when the zip is complete. Deterministic: a fixed file order, every
 * entry dated with the document date, fixed permissions, PDF/DOCX without any build-time value;
 * already-compressed types are stored and text is deflated. Evidence hashes come from upload
 * time, so the build reads each evidence file once.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { performance } from 'node:perf_hooks';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { ZipArchive } from 'archiver';
import { renderInChild, type ExhibitDocument } from '../jobs/exhibit-render';
import { useNativeCrc32 } from './zip-crc32';
import { youngCollectionEvery } from './young-generation';
import { labCsv, screeningCsv } from '../../templates/exhibit/csv';
import type { AssembledExhibit } from './exhibit-service';

useNativeCrc32();

export const PACKAGE_FORMAT = 'fieldfile.package/1';
const FILE_MODE = 0o644;
/**
 * zlib's fastest level for the text entries. Evidence text (measurement CSVs, S-parameter files)
 * can run to many megabytes, and level 6 spent about 4.5 times the CPU of level 1 to make it
 * about 15 % smaller (20 MB of CSV: 0.75 s against 0.17 s, 7.2 MB against 8.5 MB).
 */
const DEFLATE_LEVEL = 1;
/** A scavenge each time this much evidence has streamed, so dead read buffers go (young-generation.ts). */
const COLLECT_EVERY_BYTES = 4 << 20;

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
  readiness: {
    basis: 'at-signing' | 'current';
    asOf: string;
    ready: boolean;
    counts: { blocking: number; warnings: number; passed: number; notApplicable: number };
    items: { id: string; status: string }[];
  } | null;
  files: ManifestFile[];
}

export interface BuildResult {
  fileName: string;
  sizeBytes: number;
  sha256: string;
  manifestSha256: string;
  manifest: Manifest;
  /** The larger peak resident memory of the two render processes (0 when rendered in process). */
  renderMaxRssMb: number;
  /**
   * Where the time went: each document's render (wall time, while the evidence streamed; when it
   * ended from the build's start; its process's CPU time and peak RSS, when known) and when the
   * zip had taken the last evidence file.
   */
  renders: Record<ExhibitDocument, { ms: number; endMs: number; cpuMs?: number; maxRssMb?: number }>;
  evidenceMs: number;
}

export type Progress = (stage: string, percent: number) => void;

/**
 * The evidence file's bytes, opened only when the zip reaches the file (so one file is open at a
 * time and memory stays flat however many there are), failing the build if their count differs
 * from the size recorded at upload (the manifest states that size and the upload-time hash; the
 * build does not re-hash).
 */
function evidenceStream(e: AssembledExhibit['evidence'][number], onBytes: (n: number) => void): Readable {
  return Readable.from(
    (async function* () {
      let seen = 0;
      for await (const chunk of e.open()) {
        seen += (chunk as Buffer).length;
        onBytes((chunk as Buffer).length);
        yield chunk as Buffer;
      }
      if (seen !== e.sizeBytes) throw new Error(`Evidence file ${e.path} has ${seen} bytes; ${e.sizeBytes} were recorded at upload.`);
    })(),
    { objectMode: false },
  );
}

const slug = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '') || 'device';

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

/** Renders one exhibit document; the server renders in a child process (server/jobs/exhibit-render.ts). */
export type ExhibitRenderer = (document: ExhibitDocument, model: AssembledExhibit['model'], producer: string, signal: AbortSignal) => Promise<{ bytes: Buffer; maxRssMb?: number; cpuMs?: number }>;

export interface BuildOptions {
  producer: string;
  onProgress?: Progress;
  render?: ExhibitRenderer;
}

/**
 * Streams the package zip into `sink` and returns its hashes. The evidence goes into the zip
 * first, while the exhibit's PDF and DOCX are rendered (in child processes); the exhibit, the
 * CSVs and manifest.json (which lists every file's SHA-256) follow. Nothing is visible until the
 * sink has the complete zip; when this throws, the sink keeps nothing.
 */
export async function buildPackage(a: AssembledExhibit, sink: ZipSink, opts: BuildOptions): Promise<BuildResult> {
  const render = opts.render ?? renderInChild;
  let last = 0;
  const progress: Progress = (stage, percent) => {
    last = Math.max(last, percent);
    opts.onProgress?.(stage, last);
  };
  const m = a.model;
  const stem = `${slug(m.device.name)}-v${m.versionNumber}`;
  const date = new Date(m.documentDate);
  const entry = (name: string) => ({ name, date, mode: FILE_MODE, store: storeUncompressed(name) });

  const zip = new ZipArchive({ zlib: { level: DEFLATE_LEVEL }, forceLocalTime: false });
  zip.on('warning', (e) => zip.destroy(e));
  // The sink sees the zip's errors through its pipeline; this keeps one raised before the sink has
  // attached (a renderer failing at once, while the store still makes its temporary folder) from
  // being an uncaught 'error' event that ends the process.
  zip.on('error', () => undefined);
  // With evidence the stage is "evidence" until its last byte, by bytes read (the exhibit is
  // rendered meanwhile); without, the stages are the two documents.
  const evidenceBytes = a.evidence.reduce((s, e) => s + e.sizeBytes, 0);
  let read = 0;
  const collect = youngCollectionEvery(COLLECT_EVERY_BYTES);
  const onBytes = (n: number) => {
    collect(n);
    const before = Math.floor((80 * read) / evidenceBytes);
    read += n;
    const after = Math.floor((80 * read) / evidenceBytes);
    if (after !== before) progress('evidence', Math.min(85, 5 + after));
  };
  progress(evidenceBytes ? 'evidence' : 'exhibit-pdf', 2);
  const written = sink(zip);
  // A sink that fails (a short evidence file, a full disk) stops the renderers too.
  const abort = new AbortController();
  written.catch((err: unknown) => abort.abort(err));
  // One evidence file at a time: archiver starts reading a stream as soon as it is appended, so
  // the next file is appended only when the zip has taken the one before.
  const pending = [...a.evidence];
  const started = performance.now();
  let evidenceMs = 0;
  const evidenceQueued = new Promise<void>((resolve) => {
    const next = () => {
      const e = pending.shift();
      if (!e) {
        evidenceMs = performance.now() - started;
        return resolve();
      }
      zip.append(evidenceStream(e, onBytes), entry(e.path));
      zip.once('entry', next);
    };
    next();
  });

  const renders = {} as BuildResult['renders'];
  const timed = async (document: ExhibitDocument) => {
    const t0 = performance.now();
    const r = await render(document, m, opts.producer, abort.signal);
    renders[document] = { ms: performance.now() - t0, endMs: performance.now() - started, cpuMs: r.cpuMs, maxRssMb: r.maxRssMb };
    return r;
  };
  let pdf: { bytes: Buffer; maxRssMb?: number };
  let docx: { bytes: Buffer; maxRssMb?: number };
  try {
    // Both at once, each in its own process: rendered one after the other they took longer than
    // the gigabyte of evidence and so set the build's time; together they fit beside it.
    [pdf, docx] = await Promise.all([
      timed('pdf').then((r) => {
        if (!evidenceBytes) progress('exhibit-docx', 45);
        return r;
      }),
      timed('docx'),
    ]);
  } catch (err) {
    // The other renderer goes too.
    abort.abort(err);
    zip.destroy(err as Error);
    await written.catch(() => undefined);
    throw err;
  }
  if (!evidenceBytes) progress('results', 88);
  const generated: { path: string; category: string; data: Buffer }[] = [
    { path: `exhibit/${stem}-rf-exposure-exhibit.pdf`, category: 'exhibit', data: pdf.bytes },
    { path: `exhibit/${stem}-rf-exposure-exhibit.docx`, category: 'exhibit', data: docx.bytes },
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

  await Promise.race([evidenceQueued, written]);
  for (const g of generated) zip.append(g.data, entry(g.path));
  zip.append(manifestJson, entry('manifest.json'));
  void zip.finalize().catch((e) => zip.destroy(e));
  const { sha256: zipSha256, sizeBytes } = await written;
  progress('finishing', 99);
  return {
    fileName: packageFileName(a),
    sizeBytes,
    sha256: zipSha256,
    manifestSha256: sha256(manifestJson),
    manifest,
    renderMaxRssMb: Math.max(pdf.maxRssMb ?? 0, docx.maxRssMb ?? 0),
    renders,
    evidenceMs,
  };
}
