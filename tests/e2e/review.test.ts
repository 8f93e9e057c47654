/**
 * Review and signing in a real browser, against the app as `npm start` serves it, at 390×844 and
 * 1440×900: the specialist is refused review on the demo tracker with its blocking items named;
 * on a ready badge they ask for review → the approver comments on a transmitter row and returns
 * it → the specialist fixes the tune-up power, answers and resolves, and asks again → the approver
 * signs, first with a wrong password (an error on the field; the session is untouched), then the
 * right one → editing starts version 2 → the comparison shows the change and the results it moved.
 * The filing is seeded through the public API. Screenshots go to test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePdf } from '../../seeds/documents';
import { EXEMPT_EVIDENCE, exemptBadgeNamed } from '../fixtures/exempt-badge';
import { DESKTOP, openBrowser, PHONE, screenshot, signInAt, waitSaved } from './support/browser';
import { startServer, type RunningServer } from './support/server';

const PASSWORD = 'fieldfile-demo-2026';
let server: RunningServer;

beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  await server?.stop();
});

/** Signs the current person out through the API and the next one in on the sign-in page. */
async function switchTo(page: Page, email: string) {
  const out = await page.request.post(`${server.baseUrl}/api/auth/logout`, { data: {} });
  expect(out.ok()).toBe(true);
  await signInAt(page, server.baseUrl, email, PASSWORD);
}

const text = async (page: Page, testID: string) => ((await page.getByTestId(testID).first().textContent()) ?? '').replace(/\s+/g, ' ');

async function reviewState(page: Page, id: number, state: string) {
  await page.goto(`${server.baseUrl}/filings/${id}/review`);
  await page.getByTestId('review-state').filter({ hasText: state }).waitFor();
}

describe.each([
  ['phone', PHONE],
  ['desktop', DESKTOP],
] as const)('review and signing on a %s', (size, viewport) => {
  it('goes from asking for review to a signed version 1, a version 2 and the comparison', async () => {
    const s = await openBrowser(viewport);
    try {
      const { page } = s;
      await signInAt(page, server.baseUrl, 'specialist@fieldfile.test', PASSWORD);

      // The demo tracker has blocking items: asking for review is refused, naming them.
      await page.goto(`${server.baseUrl}/filings/1`);
      await page.getByTestId('overview-readiness').waitFor();
      await page.getByTestId('request-review-blocked').waitFor();
      expect(await text(page, 'request-review-blocked')).toMatch(/Not ready for review: \d+ items? blocks? signing/);
      expect(await page.getByTestId('request-review').first().isDisabled()).toBe(true);
      expect(Number(await text(page, 'overview-blocking-count').then((t) => /\d+/.exec(t)![0]))).toBeGreaterThan(0);
      await page.getByTestId('overview-review').scrollIntoViewIfNeeded();
      await screenshot(page, `review-overview-blocked-${size}`);

      // A ready badge, imported through the API…
      const created = await page.request.post(`${server.baseUrl}/api/filings/import`, { data: exemptBadgeNamed(`Wren W2 badge (${size})`) });
      expect(created.status()).toBe(201);
      const id = (await created.json()).filing.id as number;
      // …with the evidence it needs, uploaded as a lab script would.
      for (const [category, title, lines] of EXEMPT_EVIDENCE) {
        const up = await page.request.post(`${server.baseUrl}/api/filings/${id}/evidence`, {
          multipart: { category, title, file: { name: `${category}.pdf`, mimeType: 'application/pdf', buffer: await makePdf([lines], title) } },
        });
        expect(up.status()).toBe(201);
      }
      await page.goto(`${server.baseUrl}/filings/${id}`);
      await page.getByTestId('overview-blocking-count').filter({ hasText: '0' }).waitFor();
      expect(await text(page, 'overview-review-state')).toContain('Draft');
      // Readiness and review are steps of the filing: the step list links to them.
      await page.getByTestId('step-link-readiness').first().click();
      await page.getByTestId('readiness-screen').waitFor();
      expect(await text(page, 'readiness-verdict')).toContain('Ready to sign');
      await screenshot(page, `review-readiness-${size}`);
      await page.getByTestId('step-next').click();
      await page.getByTestId('review-screen').waitFor();
      await page.getByTestId('request-review').click();
      await page.getByTestId('review-state').filter({ hasText: 'In review' }).waitFor();

      // The approver comments on the transmitter's row of the Radios step, then returns the version.
      await switchTo(page, 'approver@fieldfile.test');
      await page.goto(`${server.baseUrl}/filings/${id}/radios`);
      const comments = page.getByTestId('step-comments');
      await comments.waitFor();
      await comments.getByText('Transmitter BT-LE', { exact: true }).click();
      await comments.getByTestId('new-thread-body').fill('The test report gives 5 dBm as the tune-up maximum for BT-LE, not 4 dBm. Which is right?');
      await comments.getByTestId('new-thread-add').click();
      await comments.getByTestId('threads-count').filter({ hasText: '1 thread, 1 open.' }).waitFor();
      // Our own words for the states, on the step's read-only notice too.
      expect(await page.locator('body').innerText()).not.toMatch(/changes requested/i);
      await screenshot(page, `review-comment-${size}`);
      await page.goto(`${server.baseUrl}/filings/${id}/review`);
      await page.getByTestId('return-form').waitFor();
      // The exhibit as it would go out, a DRAFT preview while the version is unsigned.
      await expect(page.getByTestId('package-card').textContent()).resolves.toContain('DRAFT preview');
      // Every step to read in place, read-only, with its comments.
      await page.getByTestId('read-step-radios-toggle').click();
      await page.getByTestId('read-step-radios').getByTestId('step-read-only').waitFor();
      expect(await page.getByTestId('read-step-radios').getByTestId('step-threads-radios').textContent()).toContain('1 thread, 1 open.');
      await page.getByTestId('read-step-radios').scrollIntoViewIfNeeded();
      await screenshot(page, `review-read-step-${size}`);
      await page.getByTestId('review-actions').scrollIntoViewIfNeeded();
      await screenshot(page, `review-approver-in-review-${size}`);
      await page.getByTestId('return-version').click();
      await page.getByTestId('review-state').filter({ hasText: 'Returned' }).waitFor();
      expect(await page.locator('body').innerText()).not.toMatch(/changes requested/i);

      // The specialist fixes the power, answers and resolves the comment, and asks again.
      await switchTo(page, 'specialist@fieldfile.test');
      await page.goto(`${server.baseUrl}/filings/${id}`);
      await page.getByTestId('overview-review-state').filter({ hasText: 'Returned' }).waitFor();
      expect(await text(page, 'overview-threads')).toContain('1 comment thread, 1 open.');
      await page.getByTestId('step-link-radios').first().click();
      await page.getByTestId('step-comments').waitFor();
      await page.getByTestId('tx-0-power').fill('5');
      await waitSaved(page);
      const thread = page.getByTestId('step-comments').locator('[data-testid$="-reply"]');
      await thread.fill('You are right: 5 dBm, as in the report. Changed on this step.');
      await page.getByTestId('step-comments').locator('[data-testid$="-send"]').click();
      await page.getByTestId('step-comments').getByText('You are right: 5 dBm, as in the report. Changed on this step.').waitFor();
      await page.getByTestId('step-comments').locator('[data-testid$="-resolve"]').click();
      await page.getByTestId('step-comments').getByTestId('threads-count').filter({ hasText: '1 thread, 0 open.' }).waitFor();
      await page.getByTestId('step-comments').scrollIntoViewIfNeeded();
      await screenshot(page, `review-answered-${size}`);
      await page.goto(`${server.baseUrl}/filings/${id}/review`);
      await page.getByTestId('request-review').filter({ hasText: 'Ask for review again' }).click();
      await page.getByTestId('review-state').filter({ hasText: 'In review' }).waitFor();

      // The approver signs: a wrong password is an error on the field, and the session stays.
      await switchTo(page, 'approver@fieldfile.test');
      await reviewState(page, id, 'In review');
      await page.getByTestId('sign-password').fill('not-the-password');
      await page.getByTestId('sign-version').click();
      await page.getByTestId('sign-password-error').filter({ hasText: 'That password is not right.' }).waitFor();
      expect(await page.getByTestId('session-sheet').isVisible()).toBe(false);
      expect(await text(page, 'review-state')).toContain('In review');
      await page.getByTestId('sign-form').scrollIntoViewIfNeeded();
      await screenshot(page, `review-wrong-password-${size}`);
      await page.getByTestId('sign-password').fill(PASSWORD);
      await page.getByTestId('sign-version').click();
      await page.getByTestId('review-state').filter({ hasText: 'Signed' }).waitFor();
      await page.getByTestId('signature-v1').waitFor();
      expect(await text(page, 'signature-hash-v1')).toMatch(/SHA-256 [0-9a-f]{64}/);
      await page.getByTestId('signature-v1').scrollIntoViewIfNeeded();
      await screenshot(page, `review-signed-${size}`);
      // The package on the review page now builds the signed exhibit, without DRAFT.
      await page.getByTestId('package-card').filter({ hasText: 'Signed version' }).waitFor();
      await page.getByTestId('package-card').scrollIntoViewIfNeeded();
      await screenshot(page, `review-signed-package-${size}`);

      // Editing the signed filing starts version 2; the changed power shows in the comparison.
      await switchTo(page, 'specialist@fieldfile.test');
      await page.goto(`${server.baseUrl}/filings/${id}`);
      await page.getByTestId('start-next-version').click();
      await page.getByTestId('overview-version-2').waitFor();
      expect(await text(page, 'overview-review-state')).toContain('Draft');
      await page.goto(`${server.baseUrl}/filings/${id}/radios`);
      await page.getByTestId('tx-0-power').fill('8');
      await waitSaved(page);
      await page.goto(`${server.baseUrl}/filings/${id}`);
      await page.getByTestId('overview-compare-v2').click();
      await page.getByTestId('compare-screen').waitFor();
      await page.getByTestId('compare-fields').filter({ hasText: '8 dBm' }).waitFor();
      const fields = await text(page, 'compare-fields');
      expect(fields).toContain('Changed fields (1)');
      expect(fields).toContain('Transmitter BT-LE · maximum tune-up power');
      expect(fields).toContain('5 dBm');
      expect(await text(page, 'compare-screening')).not.toContain('No screening result moved');
      expect(await text(page, 'compare-summary')).toMatch(/1 field changed; [1-9]\d* results? moved/);
      await screenshot(page, `review-compare-${size}`);

      expect(s.externalRequests).toEqual([]);
      expect(s.pageErrors).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
