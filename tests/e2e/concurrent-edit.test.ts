/**
 * Two people on one step, in a real browser: the demo specialist has the tracker's Device step
 * open in two windows; one saves, the other's next save is refused as stale and the step says
 * what differs. On a phone the second window keeps its own version; on a wide screen it loads the
 * other one. Either way nothing is overwritten without the person choosing it.
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

interface StoredDevice {
  filing: { data: { device: { hvin?: string | null; pmn?: string | null } } };
}

const storedDevice = async (page: Page) => (await page.evaluate(async () => (await (await fetch('/api/filings/1')).json()) as StoredDevice)).filing.data.device;

async function openDeviceStep(s: Session) {
  // One after the other: the sign-in guard checks one password per address at a time.
  await signInAt(s.page, server.baseUrl, 'specialist@fieldfile.test');
  await s.page.goto(`${server.baseUrl}/filings/1/device`);
  await s.page.getByTestId('device-hvin').waitFor();
}

describe.each([
  ['phone', PHONE, 'mine'],
  ['desktop', DESKTOP, 'theirs'],
] as const)('two windows on one step, %s', (size, viewport, choice) => {
  it(`refuses the stale save, shows what differs, and takes "${choice}"`, async () => {
    const first = await openBrowser(viewport);
    const second = await openBrowser(viewport);
    try {
      await openDeviceStep(first);
      await openDeviceStep(second);

      // The first window saves a hardware version id.
      await first.page.getByTestId('device-hvin').fill(`HW-${size}-first`);
      await waitSaved(first.page);

      // The second window, still on the revision it opened, saves a marketing name: refused.
      await second.page.getByTestId('device-pmn').fill(`Trailhound ${size}`);
      const conflict = second.page.getByTestId('step-conflict');
      await conflict.waitFor({ timeout: 15_000 });
      await expect(conflict.textContent()).resolves.toMatch(/• HVIN.*• PMN/);
      // It comes into view where the person was typing, even far down the form on a phone.
      await second.page.waitForFunction(() => {
        const r = document.querySelector('[data-testid="conflict-mine"]')?.getBoundingClientRect();
        return !!r && r.top >= 0 && r.bottom <= window.innerHeight;
      });
      await screenshot(second.page, `step-conflict-${size}`);
      // Nothing of the second window's was written.
      expect(await storedDevice(first.page)).toMatchObject({ hvin: `HW-${size}-first` });
      expect((await storedDevice(first.page)).pmn ?? '').not.toBe(`Trailhound ${size}`);

      await second.page.getByTestId(`conflict-${choice}`).click();
      if (choice === 'mine') {
        await waitSaved(second.page);
        expect(await storedDevice(second.page)).toMatchObject({ pmn: `Trailhound ${size}` });
      } else {
        await expect(second.page.getByTestId('device-hvin').inputValue()).resolves.toBe(`HW-${size}-first`);
        expect(await storedDevice(second.page)).toMatchObject({ hvin: `HW-${size}-first` });
      }
      await expect(second.page.getByTestId('step-conflict').count()).resolves.toBe(0);
      await screenshot(second.page, `step-conflict-${choice}-${size}`);
      expect([...first.pageErrors, ...second.pageErrors]).toEqual([]);
    } finally {
      await first.close();
      await second.close();
    }
  });
});
