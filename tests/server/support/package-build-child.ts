/**
 * Run as a child process by tests/server/package-kill.test.ts: starts a package build in the data
 * folder given as argv[2] whose evidence stream never ends, and prints each progress report as a
 * JSON line, so the test can kill the process in the middle of writing the zip.
 */
import path from 'node:path';
import { Readable } from 'node:stream';
import { openDatabase } from '../../../db/client';
import { applyMigrations } from '../../../db/migrate';
import { seedDemo } from '../../../seeds';
import { createInProcessQueue } from '../../../server/jobs/queue';
import { createLocalDiskStorage } from '../../../server/storage';
import { assembleExhibit } from '../../../server/services/exhibit-service';
import { enqueueBuild, registerPackageJobs, type PackageDeps } from '../../../server/services/package-service';

async function main() {
  const dataDir = process.argv[2];
  const handle = openDatabase(path.join(dataDir, 'fieldfile.db'));
  applyMigrations(handle.db);
  const { organisationId } = await seedDemo(handle.db, 'child-password-123');
  const endless = () =>
    new Readable({
      read() {
        setTimeout(() => this.push(Buffer.alloc(64 * 1024, 1)), 20);
      },
    });
  const deps: PackageDeps = {
    db: handle.db,
    queue: createInProcessQueue(handle.db),
    storage: createLocalDiskStorage(path.join(dataDir, 'packages')),
    sources: {
      evidence: () => [
        {
          categoryId: 'test-report',
          category: 'RF-exposure test report',
          title: 'Endless',
          fileName: 'endless.bin',
          sizeBytes: 64 << 20,
          sha256: '0'.repeat(64),
          uploadedAt: '2026-11-30T14:05:00.000Z',
          open: endless,
        },
      ],
    },
    producer: 'Fieldfile test',
  };
  registerPackageJobs(deps);
  const job = enqueueBuild(deps, organisationId, assembleExhibit(handle.db, organisationId, 1, 1, deps.sources)!, null);
  deps.queue.subscribe(job.id, (s) => console.log(JSON.stringify(s)));
}
void main();
