/**
 * A package build killed half-way (the whole server process, SIGKILL) leaves no package where
 * packages are read from (only a temporary file in the storage's .tmp folder); after a restart
 * its job shows as failed, the start-up sweep removes the half-written file, and the build can
 * be run again.
 */
import { execFileSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import readline from 'node:readline';
import { describe, expect, it } from 'vitest';
import { createTestApp, signIn } from './support/test-app';
import { INTERRUPTED } from '../../server/jobs/queue';
import { sweepOrphans } from '../../server/storage/sweep';
import { referenceSources } from '../../server/storage/references';
import { createStorages } from '../../server/storage';

/** Every stored object (not temporary files) under a storage area's root. */
const objects = (root: string): string[] =>
  fs.existsSync(root)
    ? fs
        .readdirSync(root, { recursive: true, withFileTypes: true })
        .filter((d) => d.isFile() && !d.parentPath.includes('.tmp'))
        .map((d) => d.name)
    : [];

const ROOT = path.resolve(__dirname, '../..');

describe('a build killed mid-way', () => {
  it('leaves nothing visible, shows failed after a restart, and runs again', async () => {
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-kill-'));
    const packagesDir = path.join(dataDir, 'packages');
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'tests/server/support/package-build-child.ts'), dataDir], { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] });
    const exited = new Promise((resolve) => child.on('exit', resolve));
    // Wait until the zip is being written: the evidence stage has begun and the temporary file has bytes.
    let stage = '';
    readline.createInterface({ input: child.stdout! }).on('line', (line) => {
      const status = JSON.parse(line);
      stage = status.state === 'failed' ? `failed: ${status.error}` : status.stage;
    });
    const building = path.join(packagesDir, '.tmp');
    const partial = () => (fs.existsSync(building) ? fs.readdirSync(building).map((f) => fs.statSync(path.join(building, f)).size) : []);
    while (!(stage === 'evidence' && partial()[0] > 0)) {
      if (stage.startsWith('failed')) throw new Error(stage);
      await new Promise((r) => setTimeout(r, 100));
    }
    // The child is the node process itself (tsx as a loader, no wrapper), so this kills the build.
    // Its exhibit renderers (child processes of its own, if still running) go with it.
    const renderers = execFileSync('ps', ['-o', 'pid=', '--ppid', String(child.pid)], { encoding: 'utf8' })
      .split('\n')
      .filter(Boolean)
      .map(Number);
    child.kill('SIGKILL');
    await exited;
    const alive = (pid: number) => {
      try {
        process.kill(pid, 0);
        return true;
      } catch {
        return false;
      }
    };
    for (let i = 0; i < 50 && renderers.some(alive); i++) await new Promise((r) => setTimeout(r, 100));
    expect(renderers.filter(alive), 'renderers left running').toEqual([]);
    const sizeAtKill = partial()[0];
    await new Promise((r) => setTimeout(r, 500));
    expect(partial()[0], 'nothing writes after the kill').toBe(sizeAtKill);
    expect(fs.readdirSync(building)).toHaveLength(1);
    expect(objects(packagesDir)).toEqual([]);

    const t = await createTestApp({ dataDir });
    try {
      // What server/start.ts does at start-up (with no grace period: nothing else is running).
      const swept = await sweepOrphans(createStorages(t.config), t.handle.db, referenceSources);
      expect(swept.packages?.removedTemporaryFiles).toBe(1);
      expect(fs.readdirSync(building)).toEqual([]);
      const specialist = await signIn(t, 'specialist@fieldfile.test', 'child-password-123');
      const status = await specialist.get('/api/filings/1/versions/1/package/status');
      expect(status.body).toMatchObject({ package: null, job: { state: 'failed', error: INTERRUPTED } });
      expect((await specialist.get('/api/filings/1/versions/1/package')).status).toBe(409);

      const again = await specialist.post('/api/filings/1/versions/1/package');
      expect(again.status).toBe(202);
      expect(again.body.job.id).not.toBe(status.body.job.id);
      const done = await t.packages.queue.result(again.body.job.id);
      expect(done).toMatchObject({ state: 'done' });
      expect(objects(packagesDir)).toEqual([done.result!.sha256]);
      expect((await specialist.get('/api/filings/1/versions/1/package')).status).toBe(200);
    } finally {
      await t.close();
    }
  }, 240_000);
});
