/**
 * In a real browser at 390×844 and 1440×900: a session that ends mid-edit opens the sign-in sheet
 * over the step, keeps the typed value on screen and saves it after signing in again; a wizard
 * step (Markets) is completed with the keyboard alone (skip link, Tab, Space on a checkbox, arrow
 * keys between chips, a visible focus ring); the 40-transmitter screening groups by transmitter
 * with its worst result, a tapped summary count filters it, and on a wide screen every heading
 * sits on its column. Screenshots go to test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fortyBandDeviceFile } from '../bench/cases/screening-page';
import { DESKTOP, freshDemoTracker, openBrowser, PHONE, screenshot, signInAt, waitSaved } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

async function filingData(page: Page, id: number) {
  return page.evaluate(async (fid) => {
    const res = await fetch(`/api/filings/${fid}`);
    const body = (await res.json()) as { filing?: { data: Record<string, Record<string, unknown>> } };
    return { status: res.status, data: body.filing?.data ?? {} };
  }, id);
}

/** The element that has focus: its test id, ARIA checked state and how its focus is drawn. */
async function focused(page: Page) {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    const cs = el ? getComputedStyle(el) : null;
    return {
      testId: el?.getAttribute('data-testid') ?? '',
      id: el?.id ?? '',
      checked: el?.getAttribute('aria-checked') ?? null,
      outlinePx: cs && cs.outlineStyle !== 'none' ? parseFloat(cs.outlineWidth) : 0,
    };
  });
}

/** Presses Tab until the focused element passes `test` (at most `limit` presses). */
async function tabTo(page: Page, test: (f: Awaited<ReturnType<typeof focused>>) => boolean, limit = 120) {
  for (let i = 0; i < limit; i += 1) {
    await page.keyboard.press('Tab');
    const f = await focused(page);
    if (test(f)) return f;
  }
  throw new Error('Tab never reached the element');
}

describe.each([
  ['phone', PHONE],
  ['desktop', DESKTOP],
] as const)('a professional’s screens (%s)', (size, viewport) => {
  it('a session that ends mid-edit keeps the typed value and saves it after signing in again', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
      const id = await freshDemoTracker(page);
      await page.goto(`${server.baseUrl}/filings/${id}/device`);
      const field = page.getByTestId('device-hardwareVersion');
      await field.waitFor();
      // The session ends elsewhere (signed out on the server); this tab does not know yet.
      expect(await page.evaluate(async () => (await fetch('/api/auth/logout', { method: 'POST' })).status)).toBe(204);
      const typed = `HW rev ${size}`;
      await field.fill(typed);

      const sheet = page.getByTestId('session-sheet');
      await sheet.waitFor({ timeout: 15_000 });
      // Over the same screen: the step and what was typed are still there.
      expect(new URL(page.url()).pathname).not.toMatch(/^\/login/);
      expect(await page.getByTestId('device-hardwareVersion').inputValue()).toBe(typed);
      expect((await filingData(page, id)).status).toBe(401);
      // The picture after the sheet's slide-in has finished (the checks above do not wait for it).
      await sheet.getByTestId('sign-in-password').waitFor();
      await page.waitForTimeout(500);
      await screenshot(page, `session-sheet-${size}`);

      const email = sheet.getByTestId('sign-in-email');
      if (!(await email.inputValue())) await email.fill('specialist@fieldfile.test');
      await sheet.getByTestId('sign-in-password').fill('fieldfile-demo-2026');
      await sheet.getByTestId('sign-in-password').press('Enter');
      await sheet.waitFor({ state: 'hidden', timeout: 15_000 });
      await waitSaved(page);
      expect(await page.getByTestId('device-hardwareVersion').inputValue()).toBe(typed);
      const after = await filingData(page, id);
      expect(after.status).toBe(200);
      expect(after.data.device!.hardwareVersion).toBe(typed);
      expect(s.pageErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
    } finally {
      await s.close();
    }
  }, 120_000);

  it('completes the Markets step with the keyboard alone', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
      const id = await freshDemoTracker(page);
      await page.goto(`${server.baseUrl}/filings/${id}/markets`);
      await page.getByTestId('markets').waitFor();
      const before = ((await filingData(page, id)).data.markets!.markets as { regime: string }[]).map((m) => m.regime);
      const unchecked = await page.locator('[role="checkbox"][data-testid^="market-"][aria-checked="false"]').first().getAttribute('data-testid');
      expect(unchecked).toMatch(/^market-[a-z0-9-]+$/);
      const regime = unchecked!.slice('market-'.length);
      expect(before).not.toContain(regime);

      // The first stop is the skip link; it moves focus to the main area.
      await page.keyboard.press('Tab');
      expect((await focused(page)).testId).toBe('skip-link');
      await page.keyboard.press('Enter');
      expect((await focused(page)).id).toBe('main-content');

      // Tab to the market, Space ticks it; the focus ring is drawn, not a 1 px colour change.
      const box = await tabTo(page, (f) => f.testId === unchecked);
      expect(box.outlinePx).toBeGreaterThanOrEqual(2);
      await page.keyboard.press('Space');
      expect((await focused(page)).checked).toBe('true');

      // Its tier chips are one tab stop; the arrow key moves to the next tier and picks it.
      const chip = await tabTo(page, (f) => f.testId.startsWith(`market-${regime}-tier-`), 10);
      expect(chip.checked).toBe('true');
      await page.keyboard.press('ArrowRight');
      const picked = await focused(page);
      expect(picked.testId).not.toBe(chip.testId);
      expect(picked.checked).toBe('true');
      await waitSaved(page);
      await screenshot(page, `keyboard-markets-${size}`);

      const saved = (await filingData(page, id)).data.markets!.markets as { regime: string; tier: string }[];
      const market = saved.find((m) => m.regime === regime);
      expect(market?.tier).toBe(picked.testId.slice(`market-${regime}-tier-`.length));
      expect(saved.map((m) => m.regime)).toEqual(expect.arrayContaining(before));
    } finally {
      await s.close();
    }
  }, 120_000);

  it('the 40-transmitter screening: a tapped count filters, one card per transmitter with its worst result', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
      const id = await page.evaluate(async (file) => {
        const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(file) });
        return ((await res.json()) as { filing: { id: number } }).filing.id;
      }, fortyBandDeviceFile());
      await page.goto(`${server.baseUrl}/filings/${id}/screening`);
      await page.getByTestId('screening-row-0').waitFor({ timeout: 60_000 });
      expect(await page.getByTestId('screening-shown').textContent()).toBe('1280 combinations');

      if (size === 'desktop') {
        // Every heading sits on its column (within a pixel), left and right edges.
        const offsets = await page.evaluate(() => {
          const table = document.querySelector('[data-testid="screening-table"]')!;
          const heads = [...table.querySelectorAll('[role=columnheader]')];
          const cells = [...table.querySelector('[data-testid="screening-row-0"]')!.children];
          return heads.map((h, i) => {
            const a = h.getBoundingClientRect();
            const b = cells[i]!.getBoundingClientRect();
            return Math.max(Math.abs(a.left - b.left), Math.abs(a.right - b.right));
          });
        });
        expect(offsets).toHaveLength(9);
        expect(Math.max(...offsets)).toBeLessThanOrEqual(1);
      }

      await page.getByTestId('summary-fcc-evaluate-sar').click();
      const shown = (await page.getByTestId('screening-shown').textContent())!;
      const matching = Number(shown.match(/^(\d+) of 1280 combinations match$/)?.[1]);
      expect(matching).toBeGreaterThan(0);
      expect(matching).toBeLessThan(1280);

      await page.getByRole('radio', { name: 'By transmitter' }).click();
      await page.getByTestId('screening-group-0').waitFor();
      const groups = await page.locator('[data-testid^="screening-group-"][role="listitem"]').count();
      expect(groups).toBeGreaterThan(0);
      expect(groups).toBeLessThanOrEqual(40);
      expect(await page.getByTestId('screening-group-0-toggle').getAttribute('aria-expanded')).toBe('false');
      expect(await page.getByTestId('screening-group-0-worst').textContent()).toMatch(/^Worst: P\d · FCC, margin /);
      await page.getByTestId('screening-group-0-toggle').click();
      await page.getByTestId('g0-screening-row-0').waitFor();
      expect(await page.getByTestId('screening-group-0-toggle').getAttribute('aria-expanded')).toBe('true');
      await screenshot(page, `screening-by-transmitter-${size}`);
    } finally {
      await s.close();
    }
  }, 180_000);
});
