/**
 * Power-reduction modes and standard test positions in a real browser, on the demo tracker: the
 * belt clip's proximity-sensor reduction of LTE band 12 is shown under its use position and in
 * screening; a reduced power at the transmitter's maximum is said at the field, a valid one with
 * its trigger is stored; the handset's standard positions are added once. Screenshots at 390×844
 * and 1440×900 go to test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, screenshot, signInAt, type Session } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

/** A fresh copy of the demo tracker (its own export, imported), so each size starts the same. */
async function freshTracker(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const list = (await (await fetch('/api/filings?q=TH4-LW2')).json()) as { filings: { id: number }[] };
    const file = await (await fetch(`/api/filings/${list.filings[list.filings.length - 1].id}/device.json`)).json();
    const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(file) });
    return ((await res.json()) as { filing: { id: number } }).filing.id;
  });
}

type StoredFiling = any;

/** Polls the filing until `ok` holds for its stored data (autosave is debounced). */
async function untilStored(page: Page, id: number, ok: (f: StoredFiling) => boolean) {
  const until = Date.now() + 20_000;
  let last: StoredFiling = null;
  while (Date.now() < until) {
    last = await page.evaluate(async (filingId) => ((await (await fetch(`/api/filings/${filingId}`)).json()) as { filing: unknown }).filing, id);
    if (ok(last)) return last;
    await page.waitForTimeout(400);
  }
  throw new Error(`The filing never got there; last stored: ${JSON.stringify({ positions: last?.data?.['use-positions'], drafts: last?.drafts }).slice(0, 1200)}`);
}

const faults = (s: Session) => s.pageErrors.filter((e) => !/status of 422/.test(e));

async function walk(s: Session, size: 'phone' | 'desktop') {
  const { page } = s;
  await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
  const id = await freshTracker(page);
  await page.goto(`${server.baseUrl}/filings/${id}/use-positions`);

  // The demo's belt clip: LTE band 12 at 20 dBm while the proximity sensor is triggered.
  const beltMore = page.getByTestId('positions-more-0');
  await beltMore.waitFor();
  expect(await beltMore.textContent()).toContain('LTE-B12 20 dBm (proximity sensor)');
  await beltMore.click();
  expect(await page.getByTestId('pos-0-mode-0-tx').inputValue()).toBe('LTE-B12');
  expect(await page.getByTestId('pos-0-mode-0-power').inputValue()).toBe('20');
  expect(await page.getByTestId('pos-0-mode-0-trigger').inputValue()).toBe('proximity-sensor');
  await page.getByTestId('pos-0-power-modes').scrollIntoViewIfNeeded();
  await screenshot(page, `power-modes-belt-clip-${size}`);

  // In the hand: LTE band 2 reduced by a time-averaged SAR limit. At its 23.5 dBm maximum it is no reduction: said at once.
  await page.getByTestId('positions-more-1').click();
  await page.getByTestId('pos-1-add-mode').click();
  await page.getByTestId('pos-1-mode-0-tx').selectOption('LTE-B2');
  await page.getByTestId('pos-1-mode-0-trigger').selectOption('time-averaged-sar');
  await page.getByTestId('pos-1-mode-0-power').fill('23.5');
  const problem = page.getByText('A reduced power must be below LTE-B2’s maximum tune-up power (23.5 dBm).').first();
  await problem.waitFor();
  await problem.scrollIntoViewIfNeeded();
  await screenshot(page, `power-modes-invalid-${size}`);
  await page.getByTestId('pos-1-mode-0-power').fill('20.5');
  await problem.waitFor({ state: 'detached' });
  await untilStored(page, id, (f) => {
    const inHand = f.data['use-positions'].usePositions[1];
    return (
      !f.drafts['use-positions'] && inHand.powerModes?.[0]?.transmitterId === 'LTE-B2' && inHand.powerModes[0].reducedTuneUpPowerDbm === 20.5 && inHand.powerModes[0].trigger === 'time-averaged-sar'
    );
  });

  // Standard positions: a tracker has no usual set; pick the handset's and add it, once.
  const setPicker = page.getByTestId('standard-set');
  await setPicker.scrollIntoViewIfNeeded();
  await setPicker.selectOption('handset');
  expect(await page.getByTestId('standard-left-cheek').textContent()).toContain('against the head, 1 g, 0 mm. Source: FCC KDB 648474 D04');
  await page.getByTestId('standard-positions').scrollIntoViewIfNeeded();
  await screenshot(page, `standard-positions-${size}`);
  await page.getByTestId('standard-positions-add').click();
  await page.getByTestId('standard-positions-all-there').waitFor();
  const stored = await untilStored(page, id, (f) => f.data['use-positions'].usePositions.length === 4 + 11 && !f.drafts['use-positions']);
  const ids = stored.data['use-positions'].usePositions.map((p: { id: string }) => p.id);
  expect(ids.slice(4)).toEqual([
    'left-cheek',
    'left-tilt',
    'right-cheek',
    'right-tilt',
    'body-worn',
    'hotspot-back',
    'hotspot-front',
    'hotspot-top',
    'hotspot-bottom',
    'hotspot-left',
    'hotspot-right',
  ]);
  expect(stored.data['use-positions'].usePositions[8]).toMatchObject({
    id: 'body-worn',
    kind: 'body-worn',
    separations: [
      { antennaId: 'ANT-MAIN', separationM: 0.015 },
      { antennaId: 'ANT-DIV', separationM: 0.015 },
      { antennaId: 'ANT-WLAN', separationM: 0.015 },
    ],
  });

  // Screening names the power mode of the rows that used one.
  await page.goto(`${server.baseUrl}/filings/${id}/screening`);
  const mode = page.getByText('Reduced: proximity sensor').first();
  await mode.waitFor({ timeout: 30_000 });
  await mode.scrollIntoViewIfNeeded();
  await screenshot(page, `power-modes-screening-${size}`);
  const modes = await page.evaluate(async (filingId) => {
    const { rows } = (await (await fetch(`/api/filings/${filingId}/screening`)).json()) as { rows: { transmitterId: string; usePositionId: string; powerMode: string }[] };
    return [...new Set(rows.filter((r) => r.powerMode !== 'full').map((r) => `${r.transmitterId}@${r.usePositionId}: ${r.powerMode}`))];
  }, id);
  expect(modes).toEqual(['LTE-B12@belt-clip: proximity-sensor', 'LTE-B2@in-hand: time-averaged-sar']);
}

describe('power modes and standard positions', () => {
  for (const [label, viewport, size] of [
    ['on a phone (390×844)', PHONE, 'phone'],
    ['on a wide screen (1440×900)', DESKTOP, 'desktop'],
  ] as const) {
    it(label, async () => {
      const s = await openBrowser(viewport);
      try {
        await walk(s, size);
        expect(faults(s)).toEqual([]);
      } finally {
        await s.close();
      }
    });
  }
});
