/**
 * The submission package in a real browser, against the app as `npm start` serves it: the demo
 * approver opens the tracker filing, builds its preview (the version is not signed, so it is
 * marked DRAFT), watches the progress bar, downloads the zip and checks its SHA-256; the first
 * pages of the exhibit PDF are rendered to PNG with pdftoppm; the verify page recognises the
 * hash and names the file a tampered copy changed. At 390×844 and 1440×900; screenshots go to
 * test-output/screenshots/.
 */
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import JSZip from 'jszip';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, SCREENSHOT_DIR, screenshot } from './support/browser';
import { startServer, type RunningServer } from './support/server';

const PASSWORD = 'fieldfile-demo-2026';
let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  await server?.stop();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${server.baseUrl}/login`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login'));
}

describe.each([
  ['phone', PHONE],
  ['desktop', DESKTOP],
] as const)('the package on a %s', (size, viewport) => {
  it('is built with a progress bar, downloaded with its SHA-256, and verified', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signIn(page, 'approver@fieldfile.test');
      await page.goto(`${server.baseUrl}/filings/1`);
      await page.getByTestId('package-card').waitFor();
      await page.getByTestId('package-card').scrollIntoViewIfNeeded();
      await expect(page.getByTestId('package-card').textContent()).resolves.toContain('DRAFT preview');
      await page.getByTestId('package-build').click();
      await page.getByTestId('package-progress').waitFor({ timeout: 30_000 });
      await screenshot(page, `package-progress-${size}`);
      await page.getByTestId('package-ready').waitFor({ timeout: 180_000 });
      await page.getByTestId('package-card').scrollIntoViewIfNeeded();
      await screenshot(page, `package-ready-${size}`);
      const shown = (await page.getByTestId('package-sha256').textContent())!.trim();

      // The download link's response, with the session's cookie, as the browser fetches it.
      const res = await page.request.get(`${server.baseUrl}/api/filings/1/versions/1/package`);
      expect(res.status()).toBe(200);
      const zipBytes = await res.body();
      expect(res.headers()['x-content-sha256']).toBe(shown);
      expect(createHash('sha256').update(zipBytes).digest('hex')).toBe(shown);

      // The exhibit's first pages as PNG, to look at.
      const zip = await JSZip.loadAsync(zipBytes);
      const pdf = await zip.file(/^exhibit\/.*\.pdf$/)[0].async('nodebuffer');
      const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-exhibit-'));
      fs.writeFileSync(path.join(tmp, 'exhibit.pdf'), pdf);
      fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
      execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '4', path.join(tmp, 'exhibit.pdf'), path.join(SCREENSHOT_DIR, `exhibit-${size}-page`)]);
      expect(fs.readdirSync(SCREENSHOT_DIR).filter((f) => f.startsWith(`exhibit-${size}-page`))).toHaveLength(4);
      fs.rmSync(tmp, { recursive: true, force: true });

      // Verify: the hash is recognised; a copy with a changed CSV is caught.
      await page.getByTestId('nav-verify').first().click();
      await page.getByTestId('verify-screen').waitFor();
      await page.getByTestId('verify-hash-submit').click();
      await expect(page.getByTestId('verify-hash-error').textContent()).resolves.toMatch(/64 hexadecimal/);
      await page.getByTestId('verify-hash').fill(shown);
      await page.getByTestId('verify-hash-submit').click();
      await page.getByTestId('verify-result').waitFor();
      await expect(page.getByTestId('verify-verdict').textContent()).resolves.toBe('Matches');
      zip.file('results/screening.csv', 'transmitter_id\r\nLTE-B12\r\n');
      const tamperedPath = path.join(os.tmpdir(), `tampered-${size}.zip`);
      fs.writeFileSync(tamperedPath, await zip.generateAsync({ type: 'nodebuffer' }));
      await page.getByTestId('verify-file-input').setInputFiles(tamperedPath);
      await page.getByTestId('verify-verdict').filter({ hasText: 'Files differ' }).waitFor({ timeout: 30_000 });
      await expect(page.getByTestId('verify-result').textContent()).resolves.toContain('results/screening.csv');
      await screenshot(page, `package-verify-tampered-${size}`);
      fs.rmSync(tamperedPath, { force: true });
      expect(s.pageErrors).toEqual([]);
      expect(s.externalRequests).toEqual([]);
    } finally {
      await s.close();
    }
  }, 300_000);
});
