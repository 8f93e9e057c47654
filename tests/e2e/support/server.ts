/**
 * Starts Fieldfile exactly as `npm start` does (server/start.ts: build the web app if stale,
 * migrate, seed, serve) on a free port with a fresh data folder, and stops it afterwards.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../../..');
const READY_TIMEOUT_MS = 220_000;

export interface RunningServer {
  baseUrl: string;
  dataDir: string;
  /** Everything the server printed, for failure messages. */
  output: () => string;
  stop: () => Promise<void>;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.unref();
    probe.on('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

async function waitForHealth(baseUrl: string, child: ChildProcess, output: () => string): Promise<void> {
  const started = Date.now();
  while (Date.now() - started < READY_TIMEOUT_MS) {
    if (child.exitCode !== null) throw new Error(`The server exited with ${child.exitCode} before it was ready:\n${output()}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The server was not ready within ${READY_TIMEOUT_MS / 1000} s:\n${output()}`);
}

export async function startServer(): Promise<RunningServer> {
  const port = await freePort();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-e2e-'));
  const baseUrl = `http://localhost:${port}`;
  let log = '';
  const child = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/start.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      HOST: '127.0.0.1',
      FIELDFILE_DATA_DIR: dataDir,
      FIELDFILE_PUBLIC_URL: baseUrl,
      FIELDFILE_MAIL_CATCHER_PORT: '0',
      FIELDFILE_SCRYPT_LOG2N: '14',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d) => (log += d));
  child.stderr!.on('data', (d) => (log += d));
  const output = () => log;
  try {
    await waitForHealth(baseUrl, child, output);
  } catch (err) {
    child.kill('SIGKILL');
    throw err;
  }
  return {
    baseUrl,
    dataDir,
    output,
    stop: async () => {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null) child.kill('SIGKILL');
      }
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
