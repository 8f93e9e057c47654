/**
 * Run by the package bench case in its own process, so its peak RSS is the build's alone: opens
 * a copy of the demo database the bench prepared (argv[4]), builds the demo filing's package with
 * the evidence listed in argv[2] (JSON: category, fileName, sizeBytes, sha256, path) into byte
 * storage under argv[3], and prints as JSON the build time, the zip's size, this process's peak
 * RSS and its RSS before the build, and the render processes' peak RSS.
 */
import fs from 'node:fs';
import path from 'node:path';
import { openDatabase } from '../../db/client';
import { createLocalDiskStorage } from '../../server/storage';
import { assembleExhibit } from '../../server/services/exhibit-service';
import { buildPackage } from '../../server/services/package-builder';

async function main() {
  const [listFile, outDir, seededDb] = process.argv.slice(2);
  const list = JSON.parse(fs.readFileSync(listFile, 'utf8')) as { category: string; fileName: string; sizeBytes: number; sha256: string; path: string }[];
  fs.copyFileSync(seededDb, path.join(outDir, 'bench.db'));
  const handle = openDatabase(path.join(outDir, 'bench.db'));
  const organisationId = (handle.sqlite.prepare('select id from organisations order by id limit 1').get() as { id: number }).id;
  const sources = {
    evidence: () => list.map((e) => ({ ...e, categoryId: e.category, title: e.fileName, uploadedAt: '2026-11-30T14:05:00.000Z', open: () => fs.createReadStream(e.path) })),
  };
  const storage = createLocalDiskStorage(path.join(outDir, 'packages'));
  const rssBeforeMb = process.memoryUsage().rss / 1048576;
  const t0 = process.hrtime.bigint();
  const a = assembleExhibit(handle.db, organisationId, 1, 1, sources)!;
  const built = await buildPackage(a, (zip) => storage.put(zip), { producer: 'Fieldfile bench' });
  const ms = Number(process.hrtime.bigint() - t0) / 1e6;
  console.log(JSON.stringify({ ms, sizeBytes: built.sizeBytes, maxRssMb: process.resourceUsage().maxRSS / 1024, rssBeforeMb, renderMaxRssMb: built.renderMaxRssMb }));
  process.exit(0);
}
void main();
