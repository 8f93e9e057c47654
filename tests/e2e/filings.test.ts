/**
 * The filing wizard in a real browser, against the app as `npm start` serves it: the demo
 * specialist builds a filing from nothing through every step on a phone and on a wide screen,
 * reloads mid-way without losing anything, reads the screening and opens a "how computed" panel;
 * an engineer sees the wizard read-only. Screenshots go to test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, screenshot, signInAt, waitSaved, type Session } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

const signIn = (page: Page, email: string) => signInAt(page, server.baseUrl, email);

async function buildFiling(s: Session, size: 'phone' | 'desktop', deviceName: string) {
  const { page } = s;
  await signIn(page, 'specialist@fieldfile.test');

  // Filings list → New filing.
  await page.goto(`${server.baseUrl}/filings`);
  await page.getByTestId('filings-list').waitFor();
  await screenshot(page, `filings-list-${size}`);
  await page.getByTestId('filings-new').click();
  await page.getByTestId('new-filing-form').waitFor();

  // Device: nothing filled in → the shared schema's messages, inline.
  await page.getByTestId('new-filing-submit').click();
  await expect(page.getByTestId('new-device-name-error').textContent()).resolves.toBe('Enter the device name.');
  await page.getByTestId('new-device-name').fill(deviceName);
  await page.getByTestId('new-device-model').fill(`SB-${size}`);
  await page.getByTestId('new-device-applicant').fill('Northfold Telemetry');
  await page.getByTestId('new-device-productType-wearable').click();
  await screenshot(page, `filing-new-${size}`);
  await page.getByTestId('new-filing-submit').click();
  await page.waitForURL(/\/filings\/\d+\/radios$/);
  const filingUrl = page.url().replace(/\/radios$/, '');

  // Radios: one tap adds a row; frequencies in MHz, power in dBm.
  await page.getByTestId('antennas-add').click();
  await page.getByTestId('antenna-0-gain').fill('2');
  await page.getByTestId('antenna-0-location').fill('Under the display');
  await page.getByTestId('transmitters-add').click();
  await page.getByTestId('tx-0-technology').fill('Bluetooth LE');
  await page.getByTestId('tx-0-band').fill('2.4 GHz ISM');
  await page.getByTestId('tx-0-fmin').fill('2402');
  await page.getByTestId('tx-0-fmax').fill('2480');
  await page.getByTestId('tx-0-power').fill('10');
  await page.getByTestId('tx-0-duty').fill('50');
  await waitSaved(page);
  await screenshot(page, `step-radios-${size}`);

  // A highest frequency below the lowest: not saved, the message on that field, a draft kept.
  await page.getByTestId('tx-0-fmax').fill('2300');
  await page.getByTestId('tx-0-fmax-error').waitFor();
  await page
    .getByTestId('save-status')
    .filter({ hasText: /Not saved/ })
    .waitFor({ timeout: 15_000 });
  await expect(page.getByTestId('tx-0-fmax-error').textContent()).resolves.toBe('The highest frequency must not be below the lowest.');

  // Reload mid-step: the form comes back from the draft, nothing lost, and says so.
  await page.reload();
  await page.getByTestId('step-draft-notice').waitFor();
  expect(await page.getByTestId('tx-0-fmax').inputValue()).toBe('2300');
  expect(await page.getByTestId('tx-0-band').inputValue()).toBe('2.4 GHz ISM');
  expect(await page.getByTestId('tx-0-duty').inputValue()).toBe('50');
  await page.getByTestId('tx-0-fmax-error').waitFor();
  await screenshot(page, `step-radios-draft-${size}`);

  // Fixed: saved, and the stored value is in Hz.
  await page.getByTestId('tx-0-fmax').fill('2480');
  await waitSaved(page);
  const stored = await page.evaluate(
    async (url) => (await (await fetch(`/api/filings/${url.split('/').pop()}`)).json()) as { filing: { data: { radios: { transmitters: { frequencyMaxHz: number; dutyCycle: number }[] } } } },
    filingUrl,
  );
  expect(stored.filing.data.radios.transmitters[0]).toMatchObject({ frequencyMaxHz: 2480e6, dutyCycle: 0.5 });

  // Reload again after a clean save: still there.
  await page.reload();
  expect(await page.getByTestId('tx-0-fmin').inputValue()).toBe('2402');
  expect(await page.getByTestId('tx-0-fmax').inputValue()).toBe('2480');

  // Use positions: the separation in mm.
  await page.getByTestId('step-next').click();
  await page.waitForURL(/\/use-positions$/);
  await page.getByTestId('positions-add').click();
  await page.getByTestId('positions-lacking').waitFor();
  await page.getByTestId('pos-0-sep-ANT-1').fill('4');
  // Reload at once, before the autosave delay is over: the change is sent as the page goes.
  await page.reload();
  await page.getByTestId('pos-0-sep-ANT-1').waitFor();
  expect(await page.getByTestId('pos-0-sep-ANT-1').inputValue()).toBe('4');
  await page.getByTestId('pos-0-sep-ANT-1').fill('4.5');
  await waitSaved(page);
  expect(await page.getByTestId('positions-lacking').count()).toBe(0);
  await screenshot(page, `step-use-positions-${size}`);

  // Markets: FCC (default §1.1307(b)(3) exemption) and the EU.
  await page.getByTestId('step-next').click();
  await page.waitForURL(/\/markets$/);
  await page.getByTestId('market-fcc').click();
  await page.getByTestId('market-eu').click();
  await waitSaved(page);
  await screenshot(page, `step-markets-${size}`);

  // Screening: a summary per market and one row per transmitter × position × market.
  await page.getByTestId('step-next').click();
  await page.waitForURL(/\/screening$/);
  await page.getByTestId('screening-summary').waitFor();
  await page.getByTestId('screening-row-1').waitFor();
  expect(await page.getByTestId('screening-row-2').count()).toBe(0);
  expect(await page.getByTestId('summary-fcc').textContent()).toMatch(/1\s*Combinations/);
  await expect(page.getByTestId('screening-cautions').textContent()).resolves.toMatch(/accredited laboratory’s measurement counts.*certifying body decides/);
  expect(await page.getByTestId('screening-versions').textContent()).toMatch(/Engine .+ rule set/);
  await page.getByTestId('depth-chart').locator('path').first().waitFor();
  await screenshot(page, `step-screening-${size}`);

  // "How computed" for the FCC row's threshold: formula, inputs, source clause, candidates.
  await page.getByTestId('cell-0-threshold').click();
  const panel = page.getByTestId('how-computed');
  await panel.waitFor();
  expect(await panel.getByTestId('how-computed-derivation-formula').textContent()).toMatch(/P_avg|P_th|=/);
  expect(await panel.getByTestId('how-computed-derivation-source').textContent()).toMatch(/§1\.1307\(b\)\(3\)/);
  expect(await panel.textContent()).toMatch(/Frequencies checked in the band/);
  expect(await panel.textContent()).toMatch(/2402 MHz/);
  await page.waitForTimeout(600); // the sheet slides in
  await screenshot(page, `how-computed-${size}`);
  await page.getByTestId('how-computed-close').click();
  await panel.waitFor({ state: 'detached' });

  // The step list shows every device-data step and screening complete (the lab steps wait for measurements).
  await page.goto(filingUrl);
  await page.getByTestId('filing-progress').filter({ hasText: '5 of 8 steps complete' }).waitFor();
  await screenshot(page, `filing-overview-${size}`);
}

/** A 422 from autosave is the server's answer to a field with an error (tested above), not a fault. */
const faults = (s: Session) => s.pageErrors.filter((e) => !/status of 422/.test(e));

describe('filing wizard', () => {
  it('a specialist builds a filing from nothing on a phone (390×844)', async () => {
    const s = await openBrowser(PHONE);
    try {
      await buildFiling(s, 'phone', 'Stridebeacon wrist tag');
      // One step per screen on a phone: a way back to the step list, no side pane.
      await s.page.goto(`${s.page.url()}/radios`);
      await s.page.getByTestId('back-to-steps').waitFor();
      expect(await s.page.getByTestId('filing-steps-pane').count()).toBe(0);
      expect(s.externalRequests).toEqual([]);
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('the same on a wide screen (1440×900), steps on the left', async () => {
    const s = await openBrowser(DESKTOP);
    try {
      await buildFiling(s, 'desktop', 'Stridebeacon wrist tag wide');
      await s.page.getByTestId('filing-steps-pane').waitFor();
      expect(await s.page.getByTestId('step-state-screening').textContent()).toMatch(/Complete/);
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('imports a device file: a bad one lists every problem with its JSON path, a good one becomes a filing', async () => {
    const s = await openBrowser(DESKTOP);
    const { page } = s;
    try {
      await signIn(page, 'specialist@fieldfile.test');
      await page.goto(`${server.baseUrl}/filings`);
      await page.getByTestId('filings-import').click();
      await page.getByTestId('import-json').waitFor();
      const bad = {
        format: 'fieldfile.device/1',
        device: { name: 'Broken tag', model: 'BT-0', applicant: 'Northfold Telemetry', productType: 'wearable' },
        antennas: [{ id: 'A1', gainDbi: 0 }],
        transmitters: [{ id: 'T1', technology: 'BLE', band: 'ISM', frequencyMinHz: 2480e6, frequencyMaxHz: 2402e6, maxTuneUpPowerDbm: 4, antennaId: 'A9' }],
        usePositions: [{ id: 'P1', kind: 'extremity', separations: [{ antennaId: 'A1', separationM: -0.001 }] }],
      };
      await page.getByTestId('import-json').fill(JSON.stringify(bad, null, 2));
      await page.getByTestId('import-submit').click();
      const problems = page.getByTestId('import-problems');
      await problems.waitFor();
      const text = await problems.textContent();
      expect(text).toMatch(/The device file has \d+ problems?; nothing was created\./);
      expect(text).toContain('transmitters.0.frequencyMaxHz');
      expect(text).toContain('usePositions.0.separations.0.separationM');
      await screenshot(page, 'import-problems-desktop');

      // The demo tracker's own export imports as a new filing.
      const good = await page.evaluate(async () => {
        const list = (await (await fetch('/api/filings?sort=name')).json()) as { filings: { id: number; device: { model: string } }[] };
        const tracker = list.filings.find((f) => f.device.model === 'TH4-LW2')!;
        return (await fetch(`/api/filings/${tracker.id}/device.json`)).text();
      });
      await page.getByTestId('import-json').fill(good);
      await page.getByTestId('import-submit').click();
      // The model already has a filing: a warning first, nothing created; a second press imports.
      await page.getByTestId('import-duplicate').waitFor();
      expect(await page.getByTestId('import-duplicate').textContent()).toMatch(/TH4-LW2.*already a filing/);
      expect(new URL(page.url()).pathname).toBe('/filings/new');
      await page.getByTestId('import-submit').click();
      await page.waitForURL(/\/filings\/\d+$/);
      await page.getByTestId('filing-overview').waitFor();
      expect(await page.getByTestId('filing-progress').textContent()).toMatch(/3 of 8 steps complete/);
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('an engineer reads the demo filing but cannot change it', async () => {
    const s = await openBrowser(DESKTOP);
    const { page } = s;
    try {
      await signIn(page, 'engineer@fieldfile.test');
      await page.goto(`${server.baseUrl}/filings`);
      await page.getByTestId('filings-list').waitFor();
      expect(await page.getByTestId('filings-new').count()).toBe(0);
      expect(await page.getByTestId('filings-import').count()).toBe(0);
      await page.getByText('Trailhound TH-4 rugged tracker').first().click();
      await page.getByTestId('filing-read-only').waitFor();
      await page.getByTestId('step-link-radios').click();
      await page.getByTestId('step-read-only').waitFor();
      // Values as plain text in the table, not greyed-out inputs.
      expect(await page.getByTestId('tx-0-id').textContent()).toBe('LTE-B12');
      expect(await page.getByTestId('tx-0-power').textContent()).toMatch(/^\d+(\.\d+)? dBm$/);
      expect(await page.locator('[data-testid="step-screen-radios"] input').count()).toBe(0);
      expect(await page.getByTestId('transmitters-add').count()).toBe(0);
      expect(await page.getByTestId('save-status').textContent()).toBe('Read only');
      await screenshot(page, 'step-radios-read-only-desktop');
      // The screening is open to read, with its gaps named.
      await page.getByTestId('step-link-screening').click();
      await page.getByTestId('screening-gaps').waitFor();
      // A table is shown, so the step list says the screening is partial, in words.
      await expect(page.getByTestId('step-state-screening').textContent()).resolves.toBe('Partial');
      await expect(page.getByTestId('step-list').textContent()).resolves.toContain('Finish Use positions to screen every combination.');
      await screenshot(page, 'step-screening-demo-desktop');
      // An address that is no filing says so instead of loading for ever.
      for (const bad of ['abc', '999999']) {
        await page.goto(`${server.baseUrl}/filings/${bad}`);
        await page.getByTestId('filing-not-found').waitFor();
      }
      await screenshot(page, 'filing-not-found-desktop');
    } finally {
      await s.close();
    }
  });
});
