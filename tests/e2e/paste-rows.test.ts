/**
 * Rows pasted from a spreadsheet into the transmitter table, in a real browser at 1440×900: a
 * block of three rows with its header (tab-separated, as spreadsheets copy, one decimal comma)
 * is pasted into a cell of the table; the rows are added after the demo tracker's six, the one
 * bad cell is marked in its row with the line and column named; once fixed the step saves and a
 * reload shows the rows. On a phone (390×844) the table is cards and the hint says pasting
 * works on a wide screen. Screenshots go to test-output/screenshots/.
 */
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, freshDemoTracker, openBrowser, PHONE, screenshot, signInAt, waitSaved } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

interface StoredTx {
  id: string;
  frequencyMinHz: number;
  maxTuneUpPowerDbm: number;
  antennaId: string;
}
const stored = (page: Page, id: number) =>
  page.evaluate(
    async (filingId) => ((await (await fetch(`/api/filings/${filingId}`)).json()) as { filing: { data: { radios: { transmitters: StoredTx[] } }; drafts: Record<string, unknown> } }).filing,
    id,
  );

/** What a spreadsheet puts on the clipboard for three rows under their header. */
const BLOCK = [
  'Id\tTechnology\tBand\tLowest (MHz)\tHighest (MHz)\tMax tune-up (dBm)\tDuty (%)\tAntenna',
  'LTE-B5\tLTE\tBand 5\t824\t849\t23\t100\tANT-MAIN',
  'LTE-B13\tLTE\tBand 13\t777\t787\tabc\t100\tANT-MAIN',
  'LTE-B66\tLTE\tBand 66\t1710\t1780\t23,5\t100\tant-div',
].join('\r\n');

/** A paste event carrying `text`, as the browser fires it on the focused element. */
async function pasteInto(page: Page, testId: string, text: string) {
  const target = page.getByTestId(testId);
  await target.click();
  await target.evaluate((el, t) => {
    const data = new DataTransfer();
    data.setData('text/plain', t);
    el.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
  }, text);
}

/** The specialist on the Radios step of a fresh copy of the demo tracker (six transmitters). */
async function openDemoRadios(page: Page): Promise<number> {
  await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
  const id = await freshDemoTracker(page);
  await page.goto(`${server.baseUrl}/filings/${id}/radios`);
  await page.getByTestId('tx-5-id').waitFor();
  return id;
}

describe('paste rows from a spreadsheet into the transmitter table', () => {
  it('on a wide screen (1440×900): adds the rows, marks the bad cell, saves once it is fixed', async () => {
    const s = await openBrowser(DESKTOP);
    try {
      const { page } = s;
      const id = await openDemoRadios(page);
      expect(await page.getByTestId('transmitters-paste-hint').textContent()).toContain('added after the last transmitter; nothing already here is overwritten');

      // Pasted into a cell of the table: the block becomes rows, the cell keeps its own value.
      await pasteInto(page, 'tx-0-band', BLOCK);
      await page.getByTestId('tx-8-id').waitFor();
      expect(await page.getByTestId('tx-0-band').inputValue()).toBe('Band 12');
      const ids = [];
      for (const i of [6, 7, 8]) ids.push(await page.getByTestId(`tx-${i}-id`).inputValue());
      expect(ids).toEqual(['LTE-B5', 'LTE-B13', 'LTE-B66']);
      // The decimal comma is read; the antenna is matched to its label.
      expect(await page.getByTestId('tx-8-power').inputValue()).toBe('23.5');
      expect(await page.getByTestId('tx-8-antenna').inputValue()).toBe('ANT-DIV');

      // The bad cell keeps what was pasted and is marked (icon and word); its row says what to fix.
      expect(await page.getByTestId('tx-7-power').inputValue()).toBe('abc');
      const error = page.getByTestId('tx-7-power-error');
      await error.waitFor();
      expect(await error.textContent()).toBe('Fix');
      expect(await page.getByTestId('transmitters-notes-7').textContent()).toBe('line 3, Max tune-up power: ‘abc’ is not a number in dBm');
      expect(await page.getByTestId('transmitters-notes-6').count()).toBe(0);
      expect(await page.getByTestId('tx-7-power').getAttribute('aria-invalid')).toBe('true');
      const summary = page.getByTestId('transmitters-paste-summary');
      expect(await summary.textContent()).toContain('Added 3 transmitters from lines 2–4 of the pasted rows · 1 cell to fix');
      expect(await summary.textContent()).toContain('Header row recognised: Transmitter id, Technology, Band, Lowest frequency, Highest frequency, Max tune-up power, Duty cycle, Antenna.');
      // The step is invalid: the server keeps it as a draft; the stored radios are untouched.
      await page
        .getByTestId('save-status')
        .filter({ hasText: /problem|fix|draft/i })
        .waitFor({ timeout: 15_000 });
      const before = await stored(page, id);
      expect(before.data.radios.transmitters.map((t) => t.id)).toEqual(['LTE-B12', 'LTE-B11', 'LTE-B2', 'WLAN-2G4', 'WLAN-5G', 'BT-LE']);
      expect(before.drafts.radios).toBeTruthy();
      await error.evaluate((el) => el.scrollIntoView({ block: 'center' }));
      await screenshot(page, 'paste-rows-errors-desktop');
      await summary.evaluate((el) => el.scrollIntoView({ block: 'end' }));
      await screenshot(page, 'paste-rows-summary-desktop');
      // The marked cells and the summary pass axe (no serious or critical finding).
      const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
      expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);

      // Fixed: the note goes, the step saves, the summary says every cell is read.
      await page.getByTestId('tx-7-power').fill('23');
      await error.waitFor({ state: 'detached' });
      expect(await page.getByTestId('transmitters-notes-7').count()).toBe(0);
      await waitSaved(page);
      expect(await summary.textContent()).toContain('every cell read');
      const after = await stored(page, id);
      expect(after.drafts.radios).toBeFalsy();
      expect(after.data.radios.transmitters.slice(6).map((t) => [t.id, t.frequencyMinHz, t.maxTuneUpPowerDbm, t.antennaId])).toEqual([
        ['LTE-B5', 824e6, 23, 'ANT-MAIN'],
        ['LTE-B13', 777e6, 23, 'ANT-MAIN'],
        ['LTE-B66', 1710e6, 23.5, 'ANT-DIV'],
      ]);

      // A reload shows them.
      await page.reload();
      await page.getByTestId('tx-8-id').waitFor();
      expect(await page.getByTestId('tx-7-id').inputValue()).toBe('LTE-B13');
      expect(await page.getByTestId('tx-7-power').inputValue()).toBe('23');
      expect(await page.getByTestId('tx-8-fmin').inputValue()).toBe('1710');
      expect(s.pageErrors.filter((e) => !/status of 422/.test(e))).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('on a phone (390×844): cards, no paste box, a hint that pasting works on a wide screen', async () => {
    const s = await openBrowser(PHONE);
    try {
      const { page } = s;
      await openDemoRadios(page);
      expect(await page.getByTestId('transmitters-paste').count()).toBe(0);
      expect(await page.getByText('Pasting rows from a spreadsheet works on a wide screen.').count()).toBe(1);
      // Cards: each field keeps its visible label.
      expect(await page.getByTestId('transmitters-row-0').textContent()).toContain('transmitter 1 · LTE-B12');
      // No horizontal scrolling on the phone.
      expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
      await page.getByText('Pasting rows from a spreadsheet works on a wide screen.').evaluate((el) => el.scrollIntoView({ block: 'end' }));
      await screenshot(page, 'paste-rows-phone');
      expect(s.pageErrors).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
