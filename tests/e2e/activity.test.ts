/**
 * The admin's activity view in a real browser at 390×844 and 1440×900, against the app as
 * `npm start` serves it (with its demo: a gateway signed by the approver, a badge in review):
 * the kind, filing and person pickers narrow the list, the filters stay in the address across a
 * reload, a combination that matches nothing says so, and clearing brings everything back.
 * Screenshots go to test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, screenshot, signInAt } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  await server?.stop();
});

const entries = async (page: Page) => (await page.getByTestId('activity-entry').allTextContents()).map((t) => t.replace(/\s+/g, ' '));

/** Waits until every listed entry passes the check (the list refetches after each pick). */
async function waitForEntries(page: Page, check: (texts: string[]) => boolean) {
  await expect.poll(async () => check(await entries(page)), { timeout: 15_000 }).toBe(true);
}

describe.each([
  ['phone', PHONE],
  ['desktop', DESKTOP],
] as const)('the activity view on a %s', (size, viewport) => {
  it('narrows by kind, filing and person, keeps the filters in the address, and clears them', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'admin@fieldfile.test');
      await page.goto(`${server.baseUrl}/activity`);
      await page.getByTestId('activity-entry').first().waitFor();
      const everything = (await entries(page)).length;

      // Kind: signatures — the demo gateway's version 1, signed by the approver.
      await page.getByTestId('activity-filter-kind').selectOption({ label: 'Signatures' });
      await waitForEntries(page, (t) => t.length > 0 && t.every((e) => e.includes('Signatures')));
      expect((await entries(page)).join('\n')).toMatch(/Signed a version — Jonas Weber/);
      expect(page.url()).toContain('kind=signature');

      // Filing: the gateway; then every kind of its entries.
      await page.getByTestId('activity-filter-filing').selectOption({ label: 'Kestrel K1 site gateway (KS1-G)' });
      await page.getByTestId('activity-filter-kind').selectOption({ label: 'Every kind' });
      await waitForEntries(page, (t) => t.length >= 3 && t.every((e) => e.includes('Kestrel K1 site gateway')));
      const gateway = (await entries(page)).join('\n');
      expect(gateway).toMatch(/Asked for review/);
      expect(gateway).toMatch(/Started a new version/);

      // Person: the approver, on the same filing.
      await page.getByTestId('activity-filter-person').selectOption({ label: 'Jonas Weber' });
      await waitForEntries(page, (t) => t.length > 0 && t.every((e) => e.includes('Jonas Weber') && e.includes('Kestrel K1 site gateway')));
      await screenshot(page, `activity-filtered-${size}`);

      // The filters are in the address: a reload shows the same view.
      const url = page.url();
      expect(url).toMatch(/filing=\d+/);
      expect(url).toMatch(/person=\d+/);
      await page.reload();
      await waitForEntries(page, (t) => t.length > 0 && t.every((e) => e.includes('Jonas Weber') && e.includes('Kestrel K1 site gateway')));
      expect(await page.getByTestId('activity-filter-person').inputValue()).not.toBe('');

      // A combination that matches nothing says so.
      await page.getByTestId('activity-filter-kind').selectOption({ label: 'Lab data' });
      await page.getByTestId('activity-empty').waitFor();
      expect(await page.getByTestId('activity-empty').textContent()).toContain('Nothing recorded matches these filters.');
      await screenshot(page, `activity-empty-${size}`);

      // Clearing brings every entry back.
      await page.getByTestId('activity-filter-clear').click();
      await waitForEntries(page, (t) => t.length >= everything);
      expect(await page.getByTestId('activity-filter-clear').count()).toBe(0);
      expect(page.url()).not.toContain('kind=');
    } finally {
      await s.close();
    }
  }, 180_000);
});
