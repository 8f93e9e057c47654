/**
 * The device record in a real browser: renaming an antenna or a transmitter on the demo tracker
 * changes its label only (the separations under Use positions stay, the co-transmission
 * combinations follow, the export re-imports), and a removal asks first and says what goes with
 * it. Screenshots at 390×844 and 1440×900 go to test-output/screenshots/.
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

/** A fresh copy of the demo tracker (its own export, imported), so each size starts the same. */
async function freshTracker(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const list = (await (await fetch('/api/filings?q=TH4-LW2')).json()) as { filings: { id: number }[] };
    const file = await (await fetch(`/api/filings/${list.filings[list.filings.length - 1].id}/device.json`)).json();
    const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(file) });
    return ((await res.json()) as { filing: { id: number } }).filing.id;
  });
}

const faults = (s: Session) => s.pageErrors.filter((e) => !/status of 422/.test(e));

async function renameAndRemove(s: Session, size: 'phone' | 'desktop') {
  const { page } = s;
  await signIn(page, 'specialist@fieldfile.test');
  const id = await freshTracker(page);
  await page.goto(`${server.baseUrl}/filings/${id}/radios`);
  await page.getByTestId('antenna-0-id').waitFor();
  expect(await page.getByTestId('antenna-0-id').inputValue()).toBe('ANT-MAIN');

  // Rename the main antenna: typed letter by letter, passing through labels of no antenna.
  await page.getByTestId('antenna-0-id').fill('');
  await page.getByTestId('antenna-0-id').pressSequentially('ANT-TOP');
  await waitSaved(page);
  expect(await page.getByTestId('tx-0-antenna').inputValue()).toBe('ANT-TOP');
  expect(await page.getByTestId('tx-1-antenna').inputValue()).toBe('ANT-TOP');
  expect(await page.getByTestId('tx-2-antenna').inputValue()).toBe('ANT-DIV');

  // Rename a transmitter that is in a co-transmission combination.
  await page.getByTestId('tx-3-id').fill('WIFI-2G4');
  await waitSaved(page);
  await screenshot(page, `device-rename-radios-${size}`);

  // Under Use positions the renamed antenna keeps every separation (demo: 10, 0, 4, 200 mm).
  await page.goto(`${server.baseUrl}/filings/${id}/use-positions`);
  await page.getByTestId('pos-0-sep-ANT-TOP').waitFor();
  const seps = [];
  for (let i = 0; i < 4; i++) seps.push(await page.getByTestId(`pos-${i}-sep-ANT-TOP`).inputValue());
  expect(seps).toEqual(['10', '0', '4', '200']);
  await screenshot(page, `device-rename-positions-${size}`);

  // The export names the new labels and imports again.
  const roundTrip = await page.evaluate(async (filingId) => {
    const file = (await (await fetch(`/api/filings/${filingId}/device.json`)).json()) as { simultaneous: string[][]; antennas: { id: string }[] };
    const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(file) });
    return { status: res.status, simultaneous: file.simultaneous, antennas: file.antennas.map((a) => a.id) };
  }, id);
  expect(roundTrip).toEqual({ status: 201, simultaneous: [['LTE-B2', 'WIFI-2G4'], ['LTE-B12', 'WLAN-5G', 'BT-LE']], antennas: ['ANT-TOP', 'ANT-DIV', 'ANT-WLAN'] });

  // Removing a transmitter asks first and names the combination that goes with it.
  await page.goto(`${server.baseUrl}/filings/${id}/radios`);
  await page.getByTestId('tx-2-id').waitFor();
  await page.getByTestId('transmitters-remove-2').click();
  const effects = page.getByTestId('transmitters-confirm-remove-effects');
  await effects.waitFor();
  expect(await effects.textContent()).toContain('the co-transmission combination LTE-B2 + WIFI-2G4');
  await page.waitForTimeout(400); // the sheet slides in
  await screenshot(page, `device-remove-confirm-${size}`);
  // "Keep it" keeps it.
  await page.getByTestId('transmitters-confirm-remove-no').click();
  await effects.waitFor({ state: 'detached' });
  expect(await page.getByTestId('tx-2-id').inputValue()).toBe('LTE-B2');
  // Removing an antenna names its separations and the transmitters left without one.
  await page.getByTestId('antennas-remove-0').click();
  const antennaEffects = await page.getByTestId('antennas-confirm-remove-effects').textContent();
  expect(antennaEffects).toContain('its separation in 4 use positions (belt-clip, in-hand, wrist-strap, vehicle-dock)');
  expect(antennaEffects).toContain('transmitters LTE-B12, LTE-B11 are left without an antenna');
  await page.getByTestId('antennas-confirm-remove-no').click();
  // Remove the transmitter for real.
  await page.getByTestId('transmitters-remove-2').click();
  await page.getByTestId('transmitters-confirm-remove-yes').click();
  await waitSaved(page);
  expect(await page.getByTestId('tx-2-id').inputValue()).toBe('WIFI-2G4');
  const after = await page.evaluate(async (filingId) => ((await (await fetch(`/api/filings/${filingId}`)).json()) as { filing: { simultaneous: string[][] } }).filing.simultaneous, id);
  expect(after).toEqual([['LTE-B12', 'WLAN-5G', 'BT-LE']]);
}

describe('device record: renames and removals', () => {
  it('on a phone (390×844)', async () => {
    const s = await openBrowser(PHONE);
    try {
      await renameAndRemove(s, 'phone');
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('on a wide screen (1440×900)', async () => {
    const s = await openBrowser(DESKTOP);
    try {
      await renameAndRemove(s, 'desktop');
      expect(faults(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
