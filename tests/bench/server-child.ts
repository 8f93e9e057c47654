/**
 * The app in a child process for bench cases that report the server's own memory and CPU: started
 * as `npm start` does (server/start.ts: V8 flags, migrations, demo seed) without the web build,
 * on a free loopback port with a fresh data folder. Memory and CPU are read from /proc (Linux),
 * so the figures are the server's alone, not the bench client's (which parses the answers).
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');
const DEMO_PASSWORD = 'bench-password-for-timing-2026';

export interface ServerChild {
  base: string;
  login(email: string): Promise<string>;
  /** Resident set now and its peak so far (VmRSS, VmHWM), bytes. */
  memory(): { rssBytes: number; peakRssBytes: number };
  /** User + system CPU time used so far, ms. */
  cpuMs(): number;
  close(): Promise<void>;
}

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const probe = net.createServer();
    probe.on('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });

export async function startServerChild(): Promise<ServerChild | string> {
  if (process.platform !== 'linux') return 'the server’s memory is read from /proc (Linux only)';
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-bench-child-'));
  const port = await freePort();
  let log = '';
  // node itself (not the tsx wrapper) so that the child's pid is the server's; extra V8/Node flags
  // for a profile go in BENCH_SERVER_NODE_FLAGS (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof").
  const flags = (process.env.BENCH_SERVER_NODE_FLAGS ?? '').split(/\s+/).filter(Boolean);
  const child = spawn(process.execPath, [...flags, '--import', 'tsx', 'server/start.ts', '--dev'], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      HOST: '127.0.0.1',
      FIELDFILE_DATA_DIR: dataDir,
      FIELDFILE_MAIL_CATCHER_PORT: '0',
      FIELDFILE_DEMO_PASSWORD: DEMO_PASSWORD,
      FIELDFILE_SCRYPT_LOG2N: '14',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d) => (log += d));
  child.stderr!.on('data', (d) => (log += d));
  const base = `http://127.0.0.1:${port}/api`;
  const started = Date.now();
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the server exited (${child.exitCode}):\n${log}`);
    if (Date.now() - started > 120_000) throw new Error(`the server was not ready in 120 s:\n${log}`);
    try {
      if ((await fetch(`${base}/health`)).ok) break;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  const pid = child.pid!;
  const status = () => fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (field: string) => Number(new RegExp(`^${field}:\\s+(\\d+) kB`, 'm').exec(status())?.[1] ?? 0) * 1024;
  const ticks = 100; // USER_HZ on Linux
  return {
    base,
    async login(email) {
      const res = await fetch(`${base}/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
      if (!res.ok) throw new Error(`sign-in answered ${res.status}: ${await res.text()}\n${log}`);
      return res.headers.get('set-cookie')!.split(';')[0];
    },
    memory: () => ({ rssBytes: kb('VmRSS'), peakRssBytes: kb('VmHWM') }),
    cpuMs() {
      const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
      return ((Number(fields[11]) + Number(fields[12])) / ticks) * 1000;
    },
    async close() {
      child.kill('SIGTERM');
      await new Promise((r) => (child.exitCode !== null ? r(null) : child.once('exit', r)));
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
