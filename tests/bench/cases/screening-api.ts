/**
 * Issue 4's target: GET /api/filings/:id/screening for a 20-transmitter × 6-position × 4-market
 * filing, over real HTTP on loopback against the real app and a SQLite file, under 50 ms.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { BenchCase } from '../harness';
import { openDatabase } from '../../../db/client';
import { applyMigrations } from '../../../db/migrate';
import { createApp } from '../../../server/app';
import { loadConfig } from '../../../server/env';
import { seedDemo } from '../../../seeds';
import { DEVICE_FILE_FORMAT, USE_POSITION_KINDS } from '../../../constants/schemas/device-file';

const PASSWORD = 'bench-password-123';

/** 20 transmitters on 5 antennas spread from 700 MHz to 5.8 GHz, 6 positions, 4 markets. */
export function largeDeviceFile() {
  const antennas = Array.from({ length: 5 }, (_, i) => ({ id: `A${i + 1}`, gainDbi: -1 + i, location: '' }));
  const transmitters = Array.from({ length: 20 }, (_, i) => {
    const minHz = 700e6 + i * 250e6;
    return { id: `T${i + 1}`, technology: 'LTE', band: `B${i + 1}`, frequencyMinHz: minHz, frequencyMaxHz: minHz + 60e6, maxTuneUpPowerDbm: 10 + (i % 14), dutyCycle: 1, antennaId: `A${(i % 5) + 1}` };
  });
  const kinds = [...USE_POSITION_KINDS, 'body-worn'] as const;
  const usePositions = kinds.map((kind, i) => ({
    id: `P${i + 1}`,
    kind,
    separations: antennas.map((a, j) => ({ antennaId: a.id, separationM: kind === 'far-field' ? 0.2 + j * 0.1 : 0.002 * (i + j) })),
  }));
  return {
    format: DEVICE_FILE_FORMAT,
    device: { name: 'Bench device', model: 'B-1', applicant: 'Bench', productType: 'phone' },
    markets: [{ regime: 'fcc' }, { regime: 'ised' }, { regime: 'eu' }, { regime: 'icnirp-2020' }],
    antennas,
    transmitters,
    usePositions,
    simultaneous: [],
  };
}

let cleanup: (() => Promise<void>) | undefined;

export const screeningApiCase: BenchCase = {
  name: 'GET /api/filings/:id/screening (20 tx × 6 positions × 4 markets, HTTP + SQLite)',
  targetMs: 50,
  warmupIterations: 5,
  iterations: 60,
  async prepare() {
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-bench-'));
    const config = loadConfig({ NODE_ENV: 'test', FIELDFILE_DATA_DIR: dataDir });
    const handle = openDatabase(path.join(dataDir, 'fieldfile.db'));
    applyMigrations(handle.db);
    await seedDemo(handle.db, PASSWORD);
    const { app, close } = createApp({ handle, config, mailer: { send: async () => {} }, serveWeb: false });
    const server: Server = await new Promise((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api`;
    const login = await fetch(`${base}/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'specialist@fieldfile.test', password: PASSWORD }) });
    const cookie = login.headers.get('set-cookie')!.split(';')[0];
    const imported = await fetch(`${base}/filings/import`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify(largeDeviceFile()) });
    const { filing } = (await imported.json()) as { filing: { id: number } };
    cleanup = async () => {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      close();
      handle.sqlite.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    };
    return async () => {
      const res = await fetch(`${base}/filings/${filing.id}/screening`, { headers: { cookie } });
      const body = (await res.json()) as { rows: unknown[] };
      if (body.rows.length !== 480) throw new Error(`expected 480 rows, got ${body.rows.length}`);
    };
  },
  teardown: () => cleanup?.(),
  describe: () => ['includes session lookup, reading the filing, the engine, storing a new result only when the input changed, and JSON over loopback'],
};
