/**
 * In a real browser at 390×844 and 1440×900: the SAR-against-depth chart of the demo tracker uses
 * the stack of the position's kind and switches to a relative profile inside the reactive near
 * field (belt clip, 10 mm at 2.4 GHz < λ/2π ≈ 19.5 mm) and to W/kg beyond it (vehicle dock,
 * 200 mm); a filing is archived by its owner (hidden from the list, read-only), shown with
 * "Show archived" and restored; importing the same device file twice warns before creating a
 * second filing. Screenshots go to test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exemptBadgeNamed } from '../fixtures/exempt-badge';
import { DESKTOP, openBrowser, PHONE, screenshot, signInAt } from './support/browser';
import { startServer, type RunningServer } from './support/server';

let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});

afterAll(async () => {
  await server?.stop();
});

async function trackerId(page: Page): Promise<number> {
  const list = await page.evaluate(
    async () =>
      (await (await fetch('/api/filings')).json()) as {
        filings: { id: number; device: { model: string } }[];
      },
  );
  return list.filings.find((f) => f.device.model === 'TH4-LW2')!.id;
}

describe.each([
  ['phone', PHONE],
  ['desktop', DESKTOP],
] as const)('depth chart and archive (%s)', (size, viewport) => {
  it('the chart names its model and switches from a relative profile to W/kg at λ/2π', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
      const id = await trackerId(page);
      await page.goto(`${server.baseUrl}/filings/${id}/screening`);
      const section = page.getByTestId('depth-section');
      await section.waitFor({ timeout: 60_000 });
      await page.getByTestId('depth-tx').selectOption('WLAN-2G4');
      await page.getByTestId('depth-position').selectOption('belt-clip');
      await page.getByText('Screening estimate: WLAN-2G4 at belt-clip').waitFor();
      await expect(page.getByTestId('depth-model').textContent()).resolves.toMatch(/^Model: Trunk: skin, fat, muscle/);
      await expect(page.getByTestId('depth-scale-reason').textContent()).resolves.toMatch(/within the reactive near field \(λ\/2π = 19\.\d mm/);
      expect(await page.getByTestId('depth-chart').textContent()).toMatch(/Relative SAR \(surface = 1\)/);
      expect(await page.getByTestId('depth-figures').textContent()).not.toMatch(/W\/kg/);
      await expect(page.getByTestId('depth-chart-caption').textContent()).resolves.toMatch(/not a measured SAR/);
      await section.scrollIntoViewIfNeeded();
      await section.screenshot({
        path: await screenshotPath(page, `depth-relative-${size}`),
      });

      await page.getByTestId('depth-position').selectOption('vehicle-dock');
      await page.getByText('Screening estimate: WLAN-2G4 at vehicle-dock').waitFor();
      await expect(page.getByTestId('depth-scale-reason').textContent()).resolves.toMatch(/beyond the reactive near field/);
      expect(await page.getByTestId('depth-chart').textContent()).toMatch(/Local SAR \(W\/kg, log scale\)/);
      expect(await page.getByTestId('depth-figures').textContent()).toMatch(/1 g average \(estimate\).*W\/kg/);
      await section.screenshot({
        path: await screenshotPath(page, `depth-absolute-${size}`),
      });

      await page.getByTestId('depth-position').selectOption('wrist-strap');
      await page
        .getByText('Screening estimate: WLAN-2G4 at wrist-strap')
        .or(page.getByText(/gives no separation/))
        .first()
        .waitFor();
      expect(s.pageErrors.filter((e) => !/status of 422/.test(e))).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('the owner archives a filing (hidden, read-only), finds it with Show archived and restores it; a second import warns', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'specialist@fieldfile.test');
      const name = `Archive badge (${size})`;
      const created = await page.evaluate(async (file) => {
        const res = await fetch('/api/filings/import', {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify(file),
        });
        return (await res.json()) as { filing: { id: number } };
      }, exemptBadgeNamed(name));
      const id = created.filing.id;

      await page.goto(`${server.baseUrl}/filings/${id}`);
      await page.getByTestId('archive-card').waitFor();
      await page.getByTestId('filing-archive').click();
      await page.getByTestId('filing-archive-confirm').click();
      await page.getByTestId('filing-archived').waitFor();
      await page.getByTestId('filing-restore').waitFor();
      await screenshot(page, `filing-archived-${size}`);
      // Read-only on the server too: a step save is refused with the reason.
      const refused = await page.evaluate(async (filingId) => {
        const res = await fetch(`/api/filings/${filingId}/steps/markets`, {
          method: 'PUT',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ markets: [] }),
        });
        return {
          status: res.status,
          body: (await res.json()) as { error: { message: string } },
        };
      }, id);
      expect(refused.status).toBe(409);
      expect(refused.body.error.message).toMatch(/archived and read-only/);

      await page.goto(`${server.baseUrl}/filings`);
      await page.getByTestId('filings-list').waitFor();
      expect(await page.getByTestId(`filing-row-${id}`).count()).toBe(0);
      await page.getByTestId('filings-show-archived').click();
      await page.getByTestId(`filing-archived-${id}`).waitFor();
      expect(page.url()).toMatch(/archived=1/);
      await screenshot(page, `filings-show-archived-${size}`);
      await page.getByTestId(`filing-row-${id}`).click();
      await page.getByTestId('filing-restore').click();
      await page.getByTestId('filing-archive').waitFor();
      expect(await page.getByTestId('filing-archived').count()).toBe(0);

      // The same file again through the import screen: a warning first, then a second filing on request.
      await page.goto(`${server.baseUrl}/filings/new?import=1`);
      await page.getByTestId('import-json').fill(JSON.stringify(exemptBadgeNamed(name)));
      await page.getByTestId('import-submit').click();
      await page.getByTestId('import-duplicate').waitFor();
      expect(await page.getByTestId('import-duplicate').textContent()).toMatch(/already (imported|a filing)/);
      await screenshot(page, `import-duplicate-${size}`);
      await page.getByTestId('import-submit').click();
      await page.waitForURL((u) => /\/filings\/\d+/.test(u.pathname) && !u.pathname.endsWith(`/${id}`));
      expect(s.pageErrors).toEqual([]);
    } finally {
      await s.close();
    }
  });
});

async function screenshotPath(page: Page, name: string) {
  // The section alone, beside the full-page pictures.
  const file = await screenshot(page, `${name}-page`);
  return file.replace(/-page\.png$/, '.png');
}
