/**
 * Entering lab data by hand and editing co-transmission groups in a real browser, on a phone
 * (390×844) and a wide screen (1440×900). The demo engineer adds a measurement to the tracker with
 * one value out of range, sees the inline message saying what to fix, fixes it, saves, and finds
 * its reported SAR in the results; the specialist adds a group of transmitters that can be on
 * together in one use position (first with one transmitter only: the message asks for two), saves,
 * and finds its sums below. Screenshots go to test-output/screenshots/.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, SCREENSHOT_DIR, screenshot, signInAt, type Session } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

const trackerIdOf = (page: Page) =>
  page.evaluate(async () => {
    const list = (await (await fetch('/api/filings?sort=name')).json()) as { filings: { id: number; device: { model: string } }[] };
    return list.filings.find((f) => f.device.model === 'TH4-LW2')!.id;
  });

async function fill(page: Page, testId: string, value: string) {
  const input = page.getByTestId(testId);
  await input.scrollIntoViewIfNeeded();
  await input.fill(value);
}

async function engineerAddsMeasurement(s: Session, size: 'phone' | 'desktop') {
  const { page } = s;
  await signInAt(page, server.baseUrl, 'engineer@fieldfile.test');
  const id = await trackerIdOf(page);
  const before = await page.evaluate(async (f) => ((await (await fetch(`/api/filings/${f}/measurements`)).json()) as { measurements: { id: string }[] }).measurements, id);
  await page.goto(`${server.baseUrl}/filings/${id}/measurements`);
  await page.getByTestId('lab-measurements-editor').waitFor();

  // A new row opens on the last page with the next free id.
  await page.getByTestId('lab-m-add').click();
  const i = before.length;
  await page.getByTestId(`lab-m-row-${i}`).waitFor();
  const newId = await page.getByTestId(`m-${i}-id`).inputValue();
  expect(before.map((m) => m.id)).not.toContain(newId);
  await page.getByTestId(`m-${i}-tx`).selectOption('LTE-B2');
  await page.getByTestId(`m-${i}-pos`).selectOption('belt-clip');
  await fill(page, `m-${i}-freq`, '1880');
  await fill(page, `m-${i}-sep`, '10');
  await fill(page, `m-${i}-power`, '23.1');
  // The bad value: 930 W/kg typed for 0.93 (a slip of the decimal point).
  await fill(page, `m-${i}-sar1g`, '930');
  await fill(page, `m-${i}-sar10g`, '0.52');
  await page.getByTestId('lab-measurements-save').click();
  const error = page.getByTestId(`m-${i}-sar1g-error`);
  await error.waitFor();
  expect(await error.textContent()).toMatch(/at most 100 W\/kg; check the unit/);
  expect(await page.getByTestId('lab-measurements-status').textContent()).toMatch(/Not saved/);
  await error.scrollIntoViewIfNeeded();
  await screenshot(page, `lab-edit-bad-value-${size}`);
  // Nothing was stored.
  const stored = await page.evaluate(async (f) => ((await (await fetch(`/api/filings/${f}/measurements`)).json()) as { measurements: unknown[] }).measurements.length, id);
  expect(stored).toBe(before.length);

  // Fixed, the message goes; saved, the row's reported SAR appears in the results.
  await fill(page, `m-${i}-sar1g`, '0.93');
  await error.waitFor({ state: 'detached' });
  await page.getByTestId('lab-measurements-save').click();
  await page
    .getByTestId('lab-measurements-status')
    .filter({ hasText: /Saved \d\d:\d\d/ })
    .waitFor();
  const results = await page.evaluate(
    async ({ f, m }) => ((await (await fetch(`/api/filings/${f}/lab-results`)).json()) as { rows: { measurementId: string; reportedSar1gWPerKg: number }[] }).rows.find((r) => r.measurementId === m),
    { f: id, m: newId },
  );
  expect(results).toBeTruthy();
  // LTE Band 2's tune-up limit is above the measured 23.1 dBm, so the reported SAR is scaled up.
  expect(results!.reportedSar1gWPerKg).toBeGreaterThan(0.93);
  const row = page.getByTestId(`lab-row-${newId}`);
  await row.waitFor();
  await row.scrollIntoViewIfNeeded();
  expect(await page.getByTestId(size === 'phone' ? `lab-row-${newId}` : `lab-row-${newId}-sar1g`).textContent()).toContain(String(Number(results!.reportedSar1gWPerKg.toPrecision(3))));
  await screenshot(page, `lab-edit-saved-${size}`);

  // Wide screen: sort by reported 1 g SAR (highest first) and filter by flag.
  if (size === 'desktop') {
    await page.getByTestId('lab-sort-sar1g').click();
    expect(await page.getByTestId('lab-sort-sar1g').getAttribute('aria-sort')).toBe('descending');
    const firstId = await page.locator('[data-testid^="lab-row-"][role="row"]').first().getAttribute('data-testid');
    const highest = await page.evaluate(
      async (f) =>
        ((await (await fetch(`/api/filings/${f}/lab-results`)).json()) as { rows: { measurementId: string; reportedSar1gWPerKg: number | null }[] }).rows.reduce((a, b) =>
          (b.reportedSar1gWPerKg ?? -1) > (a.reportedSar1gWPerKg ?? -1) ? b : a,
        ),
      id,
    );
    expect(firstId).toBe(`lab-row-${highest.measurementId}`);
    await page.getByTestId('lab-filter-flags-flagged').click();
    expect(await page.getByTestId('lab-shown').textContent()).toMatch(/of \d+ rows/);
    await page.getByTestId('lab-table').scrollIntoViewIfNeeded();
    await page.mouse.wheel(0, 500);
    await page.waitForTimeout(300);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, `lab-edit-sticky-${size}.png`) });
  }
}

async function specialistEditsGroup(s: Session, size: 'phone' | 'desktop') {
  const { page } = s;
  await page.context().clearCookies();
  await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
  const id = await trackerIdOf(page);
  const position = size === 'phone' ? 'in-hand' : 'belt-clip';
  const before = await page.evaluate(async (f) => ((await (await fetch(`/api/filings/${f}/co-transmission`)).json()) as { groups: unknown[] }).groups.length, id);
  await page.goto(`${server.baseUrl}/filings/${id}/co-transmission`);
  await page.getByTestId('cotx-editor').waitFor();
  await page.getByTestId(`cotx-${position}-add`).scrollIntoViewIfNeeded();
  await page.getByTestId(`cotx-${position}-add`).click();
  const g = before;
  // One transmitter ticked, with the keyboard: the message asks for two.
  const lte = page.getByTestId(`cotx-group-${g}-LTE-B2`);
  await lte.focus();
  await page.keyboard.press('Space');
  expect(await lte.getAttribute('aria-checked')).toBe('true');
  await page.getByTestId('cotx-save').click();
  const error = page.getByTestId(`cotx-group-${g}-error`);
  await error.waitFor();
  expect(await error.textContent()).toMatch(/at least two transmitters/);
  await error.scrollIntoViewIfNeeded();
  await screenshot(page, `cotx-edit-error-${size}`);

  await page.getByTestId(`cotx-group-${g}-BT-LE`).click();
  await error.waitFor({ state: 'detached' });
  await page.getByTestId('cotx-save').click();
  await page
    .getByTestId('cotx-status')
    .filter({ hasText: /Saved \d\d:\d\d/ })
    .waitFor();
  // The group of this position only is summed there (G<n> numbers every group in order).
  const sum = page.locator(`[data-testid^="cotx-G${g + 1}@${position}@"]`).first();
  await sum.waitFor();
  expect(await sum.textContent()).toMatch(/LTE-B2 \+ BT-LE/);
  expect(await page.locator(`[data-testid^="cotx-G${g + 1}@"]:not([data-testid*="@${position}@"])`).count()).toBe(0);
  await sum.scrollIntoViewIfNeeded();
  await screenshot(page, `cotx-edit-saved-${size}`);
}

const faults = (s: Session) => s.pageErrors.filter((e) => !/status of 422/.test(e));

describe('lab data by hand and co-transmission groups', () => {
  it('on a phone (390×844)', async () => {
    const s = await openBrowser(PHONE);
    try {
      await engineerAddsMeasurement(s, 'phone');
      await specialistEditsGroup(s, 'phone');
      expect(faults(s)).toEqual([]);
      expect(s.externalRequests).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('on a wide screen (1440×900)', async () => {
    const s = await openBrowser(DESKTOP);
    try {
      await engineerAddsMeasurement(s, 'desktop');
      await specialistEditsGroup(s, 'desktop');
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
