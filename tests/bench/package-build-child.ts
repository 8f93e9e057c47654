/**
 * Run by the package bench case in its own process, so its peak RSS is the build's alone: opens
 * a copy of the demo database the bench prepared (argv[4]), builds the demo filing's package with
 * the evidence listed in argv[2] (JSON: category, fileName, sizeBytes, sha256, path) into byte
 * storage under argv[3], and prints as JSON the build time, the zip's size, this process's peak
 * RSS and its RSS before the build, its CPU time, and each render process's time, CPU and peak RSS.
 * The evidence is read the way the server reads it: from byte storage (argv[5], where the bench
 * linked the files under their SHA-256), opened lazily, in the same read size.
 *
 * After the build (its peak RSS taken first) the same bytes go once more through each step on
 * its own, so the bench can print where the build's time goes: reading the evidence, its CRC-32,
 * the deflate of its text files, the zip's SHA-256, writing the zip and the fsync.
 */
import '../../server/runtime-flags'; // first: the server's V8 flags
import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import zlib from 'node:zlib';
import { createHash } from 'node:crypto';
import { openDatabase } from '../../db/client';
import { createLocalDiskStorage } from '../../server/storage';
import { assembleExhibit } from '../../server/services/exhibit-service';
import { EVIDENCE_READ_CHUNK_BYTES, storedEvidenceStream } from '../../server/services/exhibit-sources';
import { buildPackage, storeUncompressed } from '../../server/services/package-builder';

type Listed = { category: string; fileName: string; sizeBytes: number; sha256: string; path: string };

/**
 * Each step of the build on the same bytes, alone, in ms. Reads and writes are synchronous here,
 * so they time the copies themselves and not the waits for a thread on a busy machine.
 */
async function stepsApart(list: Listed[], zipFile: string, scratch: string) {
  const buffer = Buffer.allocUnsafe(EVIDENCE_READ_CHUNK_BYTES);
  const eachChunk = (file: string, fn: (chunk: Buffer) => void) => {
    const fd = fs.openSync(file, 'r');
    let readMs = 0;
    try {
      for (;;) {
        const r0 = performance.now();
        const n = fs.readSync(fd, buffer, 0, buffer.length, null);
        readMs += performance.now() - r0;
        if (n === 0) return readMs;
        fn(buffer.subarray(0, n));
      }
    } finally {
      fs.closeSync(fd);
    }
  };
  let readMs = 0;
  let crcMs = 0;
  let deflateMs = 0;
  for (const e of list) {
    readMs += eachChunk(e.path, (chunk) => {
      const c0 = performance.now();
      zlib.crc32(chunk);
      crcMs += performance.now() - c0;
    });
    if (!storeUncompressed(e.path)) {
      const data = fs.readFileSync(e.path);
      const d0 = performance.now();
      zlib.deflateRawSync(data, { level: 1 });
      deflateMs += performance.now() - d0;
    }
  }
  let sha256Ms = 0;
  let writeMs = 0;
  const hash = createHash('sha256');
  const copy = path.join(scratch, 'copy.zip');
  const out = fs.openSync(copy, 'w');
  eachChunk(zipFile, (chunk) => {
    const h0 = performance.now();
    hash.update(chunk);
    sha256Ms += performance.now() - h0;
    const w0 = performance.now();
    fs.writeSync(out, chunk);
    writeMs += performance.now() - w0;
  });
  const f0 = performance.now();
  fs.fsyncSync(out);
  const fsyncMs = performance.now() - f0;
  fs.closeSync(out);
  fs.rmSync(copy);
  return { readMs, crcMs, deflateMs, sha256Ms, writeMs, fsyncMs };
}

async function main() {
  const [listFile, outDir, seededDb, evidenceStore] = process.argv.slice(2);
  const list = JSON.parse(fs.readFileSync(listFile, 'utf8')) as Listed[];
  fs.copyFileSync(seededDb, path.join(outDir, 'bench.db'));
  const handle = openDatabase(path.join(outDir, 'bench.db'));
  const organisationId = (handle.sqlite.prepare('select id from organisations order by id limit 1').get() as { id: number }).id;
  const uploads = createLocalDiskStorage(evidenceStore);
  const sources = {
    evidence: () => list.map((e) => ({ ...e, categoryId: e.category, title: e.fileName, uploadedAt: '2026-11-30T14:05:00.000Z', open: () => storedEvidenceStream(uploads, e.sha256) })),
  };
  const storage = createLocalDiskStorage(path.join(outDir, 'packages'));
  const rssBeforeMb = process.memoryUsage().rss / 1048576;
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const a = assembleExhibit(handle.db, organisationId, 1, 1, sources)!;
  const built = await buildPackage(a, (zip) => storage.put(zip), { producer: 'Fieldfile bench' });
  const ms = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  const maxRssMb = process.resourceUsage().maxRSS / 1024;
  const zipFile = path.join(outDir, 'packages', built.sha256.slice(0, 2), built.sha256.slice(2, 4), built.sha256);
  const apart = await stepsApart(list, zipFile, outDir);
  console.log(
    JSON.stringify({
      ms,
      cpuMs: (cpu.user + cpu.system) / 1000,
      sizeBytes: built.sizeBytes,
      sha256: built.sha256,
      maxRssMb,
      rssBeforeMb,
      renderMaxRssMb: built.renderMaxRssMb,
      renders: built.renders,
      evidenceMs: built.evidenceMs,
      apart,
    }),
  );
  process.exit(0);
}
void main();
