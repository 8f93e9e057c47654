/**
 * The device record in a real browser: renaming an antenna or a transmitter on the demo tracker
 * changes its label only (the separations under Use positions stay, the co-transmission
 * combinations follow, the export re-imports), and a removal asks first and says what goes with
 * it. The grant identity: an invalid FCC grantee code is answered under its field, a valid one is
 * stored in capitals; a certified module's grant with its minimum separation reaches screening;
 * a transmitter's tune-up target ± tolerance and a duty-factor preset with its source.
 * Screenshots at 390×844 and 1440×900 go to test-output/screenshots/.
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
    const file = (await (await fetch(`/api/filings/${filingId}/device.json`)).json()) as { simultaneous: string[][]; antennas: { id: string }[]; transmitters: { moreAntennaIds: string[] }[] };
    const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(file) });
    return { status: res.status, simultaneous: file.simultaneous, antennas: file.antennas.map((a) => a.id), lteB2More: file.transmitters[2].moreAntennaIds };
  }, id);
  expect(roundTrip).toEqual({
    status: 201,
    simultaneous: [
      ['LTE-B2', 'WIFI-2G4'],
      ['LTE-B12', 'WLAN-5G', 'BT-LE'],
    ],
    antennas: ['ANT-TOP', 'ANT-DIV', 'ANT-WLAN'],
    lteB2More: ['ANT-TOP'],
  });

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
  expect(antennaEffects).toContain('LTE-B2 no longer uses it as a further antenna');
  await page.getByTestId('antennas-confirm-remove-no').click();
  // Remove the transmitter for real.
  await page.getByTestId('transmitters-remove-2').click();
  await page.getByTestId('transmitters-confirm-remove-yes').click();
  await waitSaved(page);
  expect(await page.getByTestId('tx-2-id').inputValue()).toBe('WIFI-2G4');
  const after = await page.evaluate(async (filingId) => ((await (await fetch(`/api/filings/${filingId}`)).json()) as { filing: { simultaneous: string[][] } }).filing.simultaneous, id);
  expect(after).toEqual([['LTE-B12', 'WLAN-5G', 'BT-LE']]);
}

type StoredFiling = any;

/** Polls the filing until `ok` holds for its stored data (autosave is debounced). */
async function untilStored(page: Page, id: number, ok: (f: StoredFiling) => boolean) {
  const until = Date.now() + 20_000;
  let last: StoredFiling = null;
  while (Date.now() < until) {
    last = await page.evaluate(async (filingId) => ((await (await fetch(`/api/filings/${filingId}`)).json()) as { filing: unknown }).filing, id);
    if (ok(last)) return;
    await page.waitForTimeout(400);
  }
  throw new Error(`The filing never got there; last stored: ${JSON.stringify({ device: last?.data?.device, drafts: last?.drafts }).slice(0, 800)}`);
}

async function identity(s: Session, size: 'phone' | 'desktop') {
  const { page } = s;
  await signIn(page, 'specialist@fieldfile.test');
  const id = await freshTracker(page);
  await page.goto(`${server.baseUrl}/filings/${id}/device`);
  const grantee = page.getByTestId('device-fccGranteeCode');
  await grantee.waitFor();
  expect(await grantee.inputValue()).toBe('2BHRW');
  expect(await page.getByTestId('device-fcc-id').textContent()).toContain('FCC ID 2BHRWTH4LW2');
  expect(await page.getByTestId('device-ic-number').textContent()).toContain('IC: 27861H-TH4LW2');
  expect(await page.getByTestId('device-hvin').inputValue()).toBe('TH4-LW2-C');

  // A four-character code that starts with a letter is no grantee code: said under the field.
  await grantee.fill('HRIX');
  const error = page.getByTestId('device-fccGranteeCode-error');
  await error.waitFor();
  expect(await error.textContent()).toContain('starts with a letter has 3 characters; this one has 4');
  await error.evaluate((el) => el.scrollIntoView({ block: 'center' }));
  await screenshot(page, `device-identity-invalid-${size}`);
  // Fixed, in small letters: stored in capitals.
  await grantee.fill('hrq');
  await error.waitFor({ state: 'detached' });
  await untilStored(page, id, (f) => f.data.device.fccGranteeCode === 'HRQ' && !f.drafts.device);
  expect(await page.getByTestId('device-fcc-id').textContent()).toContain('FCC ID HRQTH4LW2');

  // A host with a certified module inside: its grant and a 20 mm minimum separation.
  await page.getByTestId('device-integration-host-with-module').click();
  await page.getByTestId('modules-add').click();
  await page.getByTestId('module-0-name').fill('Kestrel KM-7 LTE module');
  await page.getByTestId('module-0-fccGranteeCode').fill('XKM');
  await page.getByTestId('module-0-fccProductCode').fill('KM7-LTE');
  await page.getByTestId('module-0-minSeparation').fill('20');
  await untilStored(page, id, (f) => f.data.device.integration === 'host-with-module' && f.data.device.modules.length === 1 && f.data.device.modules[0].minSeparationM === 0.02);
  await page.getByTestId('modules').scrollIntoViewIfNeeded();
  await screenshot(page, `device-identity-${size}`);

  // Radios: the first transmitter's tune-up target ± tolerance, its module; a push-to-talk preset on Bluetooth.
  await page.goto(`${server.baseUrl}/filings/${id}/radios`);
  await page.getByTestId('transmitters-more-0').click();
  expect(await page.getByTestId('tx-0-target').inputValue()).toBe('23');
  expect(await page.getByTestId('tx-0-tolerance').inputValue()).toBe('1');
  expect(await page.getByTestId('tx-0-upper').textContent()).toContain('Upper bound 24 dBm');
  await page.getByTestId('tx-0-tolerance').fill('1.5');
  await page.getByTestId('tx-0-upper').filter({ hasText: 'Upper bound 24.5 dBm' }).waitFor();
  await page.getByTestId('tx-0-module').selectOption('MOD-1');
  await page.getByTestId('transmitters-more-5').click();
  await page.getByTestId('tx-5-duty-preset').selectOption('ptt-50');
  expect(await page.getByTestId('tx-5-duty-source').textContent()).toMatch(/Common practice/);
  expect(await page.getByTestId('tx-5-duty').inputValue()).toBe('50');
  await untilStored(page, id, (f) => {
    const t = f.data.radios.transmitters;
    return t[0].maxTuneUpPowerDbm === 24.5 && t[0].tuneUpToleranceDb === 1.5 && t[0].moduleId === 'MOD-1' && t[5].dutyCyclePreset === 'ptt-50' && t[5].dutyCycle === 0.5;
  });
  await page.getByTestId('transmitters-details-0').scrollIntoViewIfNeeded();
  await screenshot(page, `device-radios-details-${size}`);

  // LTE band 2 switches between ANT-DIV and ANT-MAIN.
  await page.getByTestId('transmitters-more-2').click();
  expect(await page.getByTestId('tx-2-antenna-ANT-MAIN').getAttribute('aria-checked')).toBe('true');
  expect(await page.getByTestId('tx-2-antenna-ANT-WLAN').getAttribute('aria-checked')).toBe('false');
  expect(await page.getByTestId('tx-2-more-antennas').textContent()).toContain('Switched: one antenna at a time');
  await page.getByTestId('tx-2-more-antennas').scrollIntoViewIfNeeded();
  await screenshot(page, `device-radios-antennas-${size}`);

  // Screening says where a use position is closer than the module's grant allows.
  await page.goto(`${server.baseUrl}/filings/${id}/screening`);
  const conditions = page.getByTestId('screening-module-conditions');
  await conditions.waitFor({ timeout: 30_000 });
  expect(await conditions.textContent()).toContain('closer than the 20 mm module MOD-1');
  await conditions.scrollIntoViewIfNeeded();
  await screenshot(page, `device-screening-conditions-${size}`);
}

/** The same walk on a phone and on a wide screen, each in a fresh browser with no page errors. */
function atBothSizes(title: string, walk: (s: Session, size: 'phone' | 'desktop') => Promise<void>) {
  describe(title, () => {
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
}

atBothSizes('device record: grant identity, module grant, tune-up and duty factor', identity);
atBothSizes('device record: renames and removals', renameAndRemove);
