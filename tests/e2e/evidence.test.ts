/**
 * The Evidence step in a real browser, on the seeded demo filing (its label drawing is missing):
 * an engineer files three files at once — two label drawings and an executable renamed .pdf —
 * sees progress per file, the refused one with its reason, and the required list change. On a
 * phone through the file picker, on a wide screen by dropping the files. Each size gets its own
 * server so each starts from the seeded gap.
 */
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { makePdf } from '../../seeds/documents';
import { DESKTOP, openBrowser, PHONE, screenshot } from './support/browser';
import { startServer } from './support/server';

const PASSWORD = 'fieldfile-demo-2026';
const PNG_1PX = 'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==';
const EXE = Buffer.concat([Buffer.from('4d5a90000300000004000000ffff0000b8000000000000004000000000000000', 'hex'), Buffer.alloc(200)]);

async function files() {
  return [
    { name: 'label-artwork.pdf', mimeType: 'application/pdf', buffer: await makePdf([['TH4-LW2 label artwork']]) },
    { name: 'label-location.png', mimeType: 'image/png', buffer: Buffer.from(PNG_1PX, 'base64') },
    { name: 'label-old.pdf', mimeType: 'application/pdf', buffer: EXE },
  ];
}

async function signIn(page: Page, baseUrl: string, email: string) {
  await page.goto(`${baseUrl}/login`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login'));
}

/** Drops files on the drop area as a desktop file manager would. */
async function dropFiles(page: Page, list: Awaited<ReturnType<typeof files>>) {
  const payload = list.map((f) => ({ name: f.name, type: f.mimeType, base64: f.buffer.toString('base64') }));
  await page.getByTestId('evidence-drop').evaluate((el, items) => {
    const dt = new DataTransfer();
    for (const f of items) {
      const bytes = Uint8Array.from(atob(f.base64), (c) => c.charCodeAt(0));
      dt.items.add(new File([bytes], f.name, { type: f.type }));
    }
    el.dispatchEvent(new DragEvent('dragover', { dataTransfer: dt, bubbles: true, cancelable: true }));
    el.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
  }, payload);
}

async function fileThree(size: 'phone' | 'desktop') {
  const server = await startServer();
  const s = await openBrowser(size === 'phone' ? PHONE : DESKTOP);
  try {
    const { page } = s;
    await signIn(page, server.baseUrl, 'engineer@fieldfile.test');
    await page.goto(`${server.baseUrl}/filings/1/evidence`);
    await page.getByTestId('step-screen-evidence').waitFor();
    const labelState = page.getByTestId('required-state-label-drawing');
    await labelState.filter({ hasText: 'Missing' }).waitFor();
    expect(await page.getByTestId('required-state-tune-up-table').textContent()).toBe('Present');
    // The seeded report disagrees with the filing on Band 2's tune-up power, with its page.
    expect(await page.getByTestId('evidence-findings').textContent()).toContain('Report page 2 gives a tune-up power of 23 dBm for Band 2; the filing’s is 23.5 dBm.');
    await screenshot(page, `evidence-before-${size}`);

    await page.getByTestId('evidence-category').selectOption('label-drawing');
    if (size === 'desktop') await dropFiles(page, await files());
    else await page.getByTestId('evidence-file-input').setInputFiles(await files());

    const rows = page.getByTestId('evidence-upload-row');
    await expect.poll(async () => (await rows.allTextContents()).filter((t) => /Filed|Refused/.test(t)).length, { timeout: 30_000 }).toBe(3);
    const texts = await rows.allTextContents();
    expect(texts.filter((t) => t.includes('Filed'))).toHaveLength(2);
    const refused = texts.find((t) => t.includes('Refused'))!;
    expect(refused).toContain('label-old.pdf');
    expect(refused).toContain('application/x-msdownload');
    expect(refused).toContain('Label drawing takes PDF, PNG image, JPEG image');
    for (const bar of await page.getByRole('progressbar').all()) expect(await bar.getAttribute('aria-valuenow')).toBe('100');

    await rows.last().scrollIntoViewIfNeeded();
    await screenshot(page, `evidence-uploads-${size}`);
    await labelState.filter({ hasText: 'Present' }).waitFor();
    expect(await page.getByTestId('evidence-required-summary').textContent()).toContain('All present');
    // The seven the demo filed, and the two just filed.
    expect(await page.getByTestId('evidence-record').count()).toBe(9);
    await screenshot(page, `evidence-after-${size}`);
    expect(s.pageErrors.filter((e) => !/status of 415/.test(e))).toEqual([]);
    expect(s.externalRequests).toEqual([]);
  } finally {
    await s.close();
    await server.stop();
  }
}

describe('evidence step', () => {
  it('files three files on a phone (390×844): progress per file, one refused with its reason, the gap closes', async () => {
    await fileThree('phone');
  }, 240_000);

  it('the same on a wide screen (1440×900) by dropping the files', async () => {
    await fileThree('desktop');
  }, 240_000);
});
