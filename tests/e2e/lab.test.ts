/**
 * Lab results in a real browser, on a phone (390×844) and a wide screen (1440×900): the demo
 * engineer imports the lab's CSV with one bad row and sees the bad cell named by line and column
 * (nothing imported), fixes the file and imports it, then finds the highest-reported-SAR table
 * and the out-of-tolerance liquid check (with how to fix it). Screenshots go to
 * test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, screenshot, type Session } from './support/browser';
import { startServer, type RunningServer } from './support/server';

const PASSWORD = 'fieldfile-demo-2026';
let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

const HEADER =
  'transmitter_id,use_position_id,test_position,channel,frequency_mhz,test_separation_mm,measured_power_dbm,tune_up_power_dbm,test_duty_cycle,sar_1g_w_kg,sar_10g_w_kg,drift_db,test_date,peak_x_mm,peak_y_mm';
const rows = (sar: string) => [
  'LTE-B2,belt-clip,"back, 10 mm",18900,1880,10,23.1,,,0.91,0.55,-0.07,2026-11-17,-22,60',
  `LTE-B2,in-hand,"bottom edge, 3 mm",18900,1880,3,23.1,,,,${sar},0.04,2026-11-17,-25,64`,
  'WLAN-2G4,belt-clip,"back, 12 mm",6,2437,12,16.4,,0.98,0.38,0.17,0.06,2026-11-18,30,18',
];
const csv = (sar: string) => Buffer.from([HEADER, ...rows(sar)].join('\n') + '\n');

async function signIn(page: Page, email: string) {
  await page.goto(`${server.baseUrl}/login`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login'));
}

async function importAndCheck(s: Session, size: 'phone' | 'desktop') {
  const { page } = s;
  await signIn(page, 'engineer@fieldfile.test');
  const trackerId = await page.evaluate(async () => {
    const list = (await (await fetch('/api/filings?sort=name')).json()) as { filings: { id: number; device: { model: string } }[] };
    return list.filings.find((f) => f.device.model === 'TH4-LW2')!.id;
  });
  await page.goto(`${server.baseUrl}/filings/${trackerId}/measurements`);
  await page.getByTestId('lab-results').waitFor();
  await page.getByTestId('lab-highest').waitFor();
  await screenshot(page, `lab-measurements-${size}`);

  // A CSV with one bad cell: named by line and column, nothing imported.
  await page.getByTestId('lab-import-file-input').setInputFiles({ name: 'sar-results.csv', mimeType: 'text/csv', buffer: csv('1.6x') });
  const problems = page.getByTestId('lab-import-problems');
  await problems.waitFor();
  expect(await problems.textContent()).toMatch(/line 3, sar_10g_w_kg/);
  expect(await problems.textContent()).toMatch(/“1.6x” is not a number/);
  await page.getByTestId('bad-cell-3-sar_10g_w_kg').waitFor();
  expect(await page.getByTestId('lab-import-submit').count()).toBe(0);
  await page.getByTestId('lab-import-problems').scrollIntoViewIfNeeded();
  await screenshot(page, `lab-import-bad-row-${size}`);

  // The fixed file reads cleanly; importing stores all three rows.
  await page.getByTestId('lab-import-file-input').setInputFiles({ name: 'sar-results.csv', mimeType: 'text/csv', buffer: csv('1.64') });
  await page.getByTestId('lab-import-clean').waitFor();
  await page.getByTestId('lab-import-submit').click();
  await page.getByTestId('lab-import-done').filter({ hasText: '3 measurements imported' }).waitFor();
  await page.getByTestId('lab-measurements').filter({ hasText: 'Measurements (3)' }).waitFor();

  // The highest reported SAR table: FCC extremity is the in-hand LTE Band 2 row, 1.64 × 10^(0.04) = 1.80 W/kg.
  const fccExtremity = page.getByTestId('highest-fcc-extremity');
  await fccExtremity.waitFor();
  expect(await fccExtremity.textContent()).toMatch(/1\.8 W\/kg/);
  expect(await fccExtremity.textContent()).toMatch(/Within limit/);

  // The out-of-tolerance liquid check, with its tolerance and how to fix it.
  const liquid = page.getByTestId('check-row-liquid:L-2450');
  await liquid.scrollIntoViewIfNeeded();
  const text = (await liquid.textContent()) ?? '';
  expect(text).toMatch(/Out of tolerance/);
  expect(text).toMatch(/±5 % of target/);
  expect(text).toMatch(/How to fix/);
  await screenshot(page, `lab-checks-${size}`);

  // A row's "how computed": scaling and margins from the engine's derivation.
  await page.getByTestId(size === 'phone' ? 'lab-how-M2' : 'lab-row-M2').click();
  const sheet = page.getByTestId('lab-how-computed');
  await sheet.waitFor();
  expect(await sheet.textContent()).toMatch(/KDB 447498/);
  await page.waitForTimeout(600); // the sheet slides in
  await screenshot(page, `lab-how-computed-${size}`);
  await page.getByTestId('lab-how-computed-close').click();

  // Co-transmission step.
  await page.goto(`${server.baseUrl}/filings/${trackerId}/co-transmission`);
  await page.getByTestId('co-transmission').waitFor();
  await screenshot(page, `lab-co-transmission-${size}`);
}

const faults = (s: Session) => s.pageErrors.filter((e) => !/status of 422/.test(e));

describe('lab results', () => {
  it('on a phone (390×844): import with a bad row, fix, import, find the checks and the highest SAR', async () => {
    const s = await openBrowser(PHONE);
    try {
      await importAndCheck(s, 'phone');
      expect(faults(s)).toEqual([]);
      expect(s.externalRequests).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('on a wide screen (1440×900): the same, with the full tables', async () => {
    const s = await openBrowser(DESKTOP);
    try {
      await importAndCheck(s, 'desktop');
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
