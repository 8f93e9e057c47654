/**
 * The screening page of a 40-transmitter × 8-position × 4-market filing (1 280 combinations) on a
 * phone viewport (390×844) in Chromium, against the production web build served by the real app:
 * the time from navigation to the first rows on screen, under 1 s. Also reports the long tasks
 * (> 100 ms) seen while scrolling the page to its end.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { chromium, type Browser, type Page } from 'playwright-core';
import type { BenchCase } from '../harness';
import { openDatabase } from '../../../db/client';
import { applyMigrations } from '../../../db/migrate';
import { createApp } from '../../../server/app';
import { loadConfig } from '../../../server/env';
import { buildWeb, webBuildIsStale } from '../../../server/web-build';
import { seedDemo } from '../../../seeds';
import { DEVICE_FILE_FORMAT, USE_POSITION_KINDS } from '../../../constants/schemas/device-file';

const PASSWORD = 'bench-password-123';
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** 40 transmitters on 8 antennas from 700 MHz to 5.9 GHz, 8 positions, 4 markets. */
export function fortyBandDeviceFile() {
  const antennas = Array.from({ length: 8 }, (_, i) => ({ id: `A${i + 1}`, gainDbi: -2 + i * 0.5, location: '' }));
  const transmitters = Array.from({ length: 40 }, (_, i) => {
    const minHz = 700e6 + i * 130e6;
    return {
      id: `T${String(i + 1).padStart(2, '0')}`,
      technology: i % 3 ? 'LTE' : 'NR',
      band: `B${i + 1}`,
      frequencyMinHz: minHz,
      frequencyMaxHz: minHz + 40e6,
      maxTuneUpPowerDbm: 8 + (i % 16),
      dutyCycle: 1,
      antennaId: `A${(i % 8) + 1}`,
    };
  });
  const kinds = [...USE_POSITION_KINDS, 'body-worn', 'hotspot', 'head'] as const;
  const usePositions = kinds.map((kind, i) => ({
    id: `P${i + 1}`,
    kind,
    separations: antennas.map((a, j) => ({ antennaId: a.id, separationM: kind === 'far-field' ? 0.2 + j * 0.05 : 0.003 * (i + 1) + 0.001 * j })),
  }));
  return {
    format: DEVICE_FILE_FORMAT,
    device: { name: 'Forty-band handset', model: 'FB-40', applicant: 'Bench', productType: 'phone' },
    markets: [{ regime: 'fcc' }, { regime: 'ised' }, { regime: 'eu' }, { regime: 'icnirp-2020' }],
    antennas,
    transmitters,
    usePositions,
    simultaneous: [],
  };
}

let cleanup: (() => Promise<void>) | undefined;
let longTasks: number[] = [];
let rows = 0;

export const screeningPageCase: BenchCase = {
  name: 'Screening page, 40 tx × 8 positions × 4 markets, phone 390×844: navigation → first rows',
  targetMs: 1000,
  warmupIterations: 1,
  iterations: 5,
  async prepare() {
    if (!fs.existsSync(CHROMIUM)) return `no Chromium at ${CHROMIUM}`;
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-bench-page-'));
    const config = loadConfig({ NODE_ENV: 'test', FIELDFILE_DATA_DIR: dataDir });
    if (webBuildIsStale(config.distDir)) buildWeb(config.distDir);
    const handle = openDatabase(path.join(dataDir, 'fieldfile.db'));
    applyMigrations(handle.db);
    await seedDemo(handle.db, PASSWORD);
    const { app, close } = createApp({ handle, config, mailer: { send: async () => {} }, serveWeb: true });
    const server: Server = await new Promise((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://localhost:${(server.address() as AddressInfo).port}`;
    const browser: Browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--headless', '--no-sandbox', '--disable-gpu'] });
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page: Page = await context.newPage();
    await page.goto(`${base}/login`);
    await page.getByTestId('sign-in-email').fill('specialist@fieldfile.test');
    await page.getByTestId('sign-in-password').fill(PASSWORD);
    await page.getByTestId('sign-in-submit').click();
    await page.waitForURL((u) => !u.pathname.startsWith('/login'));
    const id = await page.evaluate(async (file) => {
      const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(file) });
      return ((await res.json()) as { filing: { id: number } }).filing.id;
    }, fortyBandDeviceFile());
    const url = `${base}/filings/${id}/screening`;
    cleanup = async () => {
      await browser.close();
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      close();
      handle.sqlite.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    };
    // Once, untimed: scroll the page to its end and collect long tasks (> 100 ms) on the way.
    await page.goto(url);
    await page.getByTestId('screening-row-0').waitFor({ timeout: 60_000 });
    rows = Number((await page.getByTestId('screening-shown').textContent())?.match(/\d+/)?.[0] ?? 0);
    longTasks = await page.evaluate(async () => {
      const seen: number[] = [];
      const obs = new PerformanceObserver((list) => list.getEntries().forEach((e) => e.duration > 100 && seen.push(Math.round(e.duration))));
      obs.observe({ type: 'longtask', buffered: false });
      const scroller = [...document.querySelectorAll('div')].find((d) => d.scrollHeight > d.clientHeight + 200 && getComputedStyle(d).overflowY !== 'visible') ?? document.scrollingElement!;
      for (let y = 0; y < scroller.scrollHeight; y += 600) {
        scroller.scrollTop = y;
        await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 16)));
      }
      await new Promise((r) => setTimeout(r, 200));
      obs.disconnect();
      return seen;
    });
    return async () => {
      await page.goto('about:blank');
      await page.goto(url);
      await page.getByTestId('screening-row-0').waitFor({ timeout: 30_000 });
    };
  },
  teardown: () => cleanup?.(),
  describe: () => [`${rows} combinations; rows are drawn a page at a time`, `long tasks over 100 ms while scrolling to the end: ${longTasks.length ? longTasks.join(', ') + ' ms' : 'none'}`],
};
