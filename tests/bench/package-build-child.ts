/**
 * Run by the package bench case in its own process, so its peak RSS is the build's alone: opens a
 * fresh demo database, builds the demo filing's package with the evidence listed in argv[2]
 * (JSON: category, fileName, sizeBytes, sha256, path) into byte storage under argv[3], and
 * prints the build time and peak RSS as JSON.
 */
import fs from 'node:fs';
import path from 'node:path';
import { openDatabase } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { seedDemo } from '../../seeds';
import { createLocalDiskStorage } from '../../server/storage';
import { assembleExhibit } from '../../server/services/exhibit-service';
import { buildPackage } from '../../server/services/package-builder';

async function main() {
  const [listFile, outDir] = process.argv.slice(2);
  const list = JSON.parse(fs.readFileSync(listFile, 'utf8')) as { category: string; fileName: string; sizeBytes: number; sha256: string; path: string }[];
  const handle = openDatabase(path.join(outDir, 'bench.db'));
  applyMigrations(handle.db);
  const { organisationId } = await seedDemo(handle.db, 'bench-password-123');
  const sources = { evidence: () => list.map((e) => ({ ...e, categoryId: e.category, title: e.fileName, uploadedAt: '2026-11-30T14:05:00.000Z', open: () => fs.createReadStream(e.path, { highWaterMark: 1 << 20 }) })) };
  const storage = createLocalDiskStorage(path.join(outDir, 'packages'));
  const t0 = process.hrtime.bigint();
  const a = assembleExhibit(handle.db, organisationId, 1, 1, sources)!;
  const built = await buildPackage(a, (zip) => storage.put(zip), { producer: 'Fieldfile bench' });
  const ms = Number(process.hrtime.bigint() - t0) / 1e6;
  console.log(JSON.stringify({ ms, sizeBytes: built.sizeBytes, maxRssMb: process.resourceUsage().maxRSS / 1024 }));
  process.exit(0);
}
void main();
