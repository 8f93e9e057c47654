/**
 * Debian's Chromium driven by playwright-core: a fresh profile per context, no downloaded
 * browser, no network beyond the app under test.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const SCREENSHOT_DIR = path.resolve(__dirname, '../../../test-output/screenshots');

const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export const PHONE = { width: 390, height: 844 } as const;
export const DESKTOP = { width: 1440, height: 900 } as const;

export interface Session {
  context: BrowserContext;
  page: Page;
  /** Requests that left localhost (there should be none: fonts and code are shipped). */
  externalRequests: string[];
  /** Console errors and uncaught page errors. */
  pageErrors: string[];
  close: () => Promise<void>;
}

export async function openBrowser(viewport: { width: number; height: number }): Promise<Session> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-chromium-'));
  const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_PATH, args: ARGS, viewport });
  const externalRequests: string[] = [];
  const pageErrors: string[] = [];
  await context.route('**/*', (route) => {
    const url = new URL(route.request().url());
    if (url.hostname === 'localhost' || url.hostname === '127.0.0.1' || url.protocol === 'data:') return route.continue();
    externalRequests.push(url.href);
    return route.abort();
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.on('pageerror', (e) => pageErrors.push(e.message));
  page.on('console', (m) => {
    // 4xx answers the tests provoke (no session, wrong password, duplicate invite) are not faults.
    if (m.type() === 'error' && !/status of (401|403|404|409|422)/.test(m.text())) pageErrors.push(m.text());
  });
  return {
    context,
    page,
    externalRequests,
    pageErrors,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  // Let web fonts and the last layout pass settle, so the picture shows what a person sees.
  await page.evaluate(() => document.fonts.ready);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in on the sign-in page with the demo password and waits to leave it. */
export async function signInAt(page: Page, baseUrl: string, email: string, password = 'fieldfile-demo-2026') {
  await page.goto(`${baseUrl}/login`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login'));
}

/** Autosave is debounced: wait until the indicator says the last change is stored. */
export async function waitSaved(page: Page) {
  await page
    .getByTestId('save-status')
    .filter({ hasText: /^Saved \d\d:\d\d$/ })
    .waitFor({ timeout: 15_000 });
}

/** A fresh copy of the demo tracker (its own export, imported), so a walk starts from the demo as seeded. */
export async function freshDemoTracker(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const list = (await (await fetch('/api/filings?q=TH4-LW2')).json()) as { filings: { id: number }[] };
    const file = await (await fetch(`/api/filings/${list.filings[list.filings.length - 1].id}/device.json`)).json();
    const res = await fetch('/api/filings/import', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(file) });
    return ((await res.json()) as { filing: { id: number } }).filing.id;
  });
}
