/**
 * The real app for HTTP bench cases: a fresh data folder, migrations, the demo seed, a loopback
 * listener and a signed-in specialist's cookie, with one call to take it all down again.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { openDatabase } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/env';
import { seedDemo } from '../../seeds';

const PASSWORD = 'bench-password-for-timing-2026';

export interface BenchServer {
  /** e.g. http://127.0.0.1:41234/api */
  base: string;
  port: number;
  /** The signed-in specialist's session cookie. */
  cookie: string;
  /** The SQLite file the app reads (another connection may open it). */
  dbFile: string;
  /** Signs another demo person in; resolves with their session cookie. */
  login(email: string): Promise<string>;
  post(pathUnderApi: string, body: unknown): Promise<Response>;
  close(): Promise<void>;
}

export async function startBenchServer(env: Record<string, string> = {}): Promise<BenchServer> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-bench-'));
  const config = loadConfig({ NODE_ENV: 'test', FIELDFILE_DATA_DIR: dataDir, ...env });
  const dbFile = path.join(dataDir, 'fieldfile.db');
  const handle = openDatabase(dbFile);
  applyMigrations(handle.db);
  await seedDemo(handle.db, PASSWORD);
  const { app, close } = createApp({ handle, config, mailer: { send: async () => {} }, serveWeb: false });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const port = (server.address() as AddressInfo).port;
  const base = `http://127.0.0.1:${port}/api`;
  const login = async (email: string) => {
    const res = await fetch(`${base}/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: PASSWORD }) });
    return res.headers.get('set-cookie')!.split(';')[0];
  };
  const cookie = await login('specialist@fieldfile.test');
  return {
    base,
    port,
    cookie,
    dbFile,
    login,
    post: (p, body) => fetch(`${base}${p}`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify(body) }),
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      close();
      handle.sqlite.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
