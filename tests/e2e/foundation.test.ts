/**
 * Sign-in, roles, the sign-in gate and invitations in a real browser, against the app as
 * `npm start` serves it (production web build + API on one port, fresh data folder, demo seed).
 * Every screen is photographed at 390×844 and 1440×900 into test-output/screenshots/.
 */
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DESKTOP, openBrowser, PHONE, screenshot, type Session } from './support/browser';
import { startServer, type RunningServer } from './support/server';

const PASSWORD = process.env.FIELDFILE_DEMO_PASSWORD ?? 'fieldfile-demo-2026';
const SIZES = [
  ['phone', PHONE],
  ['desktop', DESKTOP],
] as const;
const DEMO = [
  { role: 'admin', email: 'admin@fieldfile.test', roleLabel: 'Admin' },
  { role: 'specialist', email: 'specialist@fieldfile.test', roleLabel: 'Compliance specialist' },
  { role: 'engineer', email: 'engineer@fieldfile.test', roleLabel: 'Test engineer' },
  { role: 'approver', email: 'approver@fieldfile.test', roleLabel: 'Approver' },
] as const;

let server: RunningServer;
const open: Session[] = [];

async function browser(viewport: { width: number; height: number }): Promise<Session> {
  const s = await openBrowser(viewport);
  open.push(s);
  return s;
}

async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
}

/** A cookie-keeping client of the API, for setting the stage without clicking through it. */
function apiClient() {
  let cookie = '';
  return async (method: string, path: string, body?: unknown) => {
    const res = await fetch(`${server.baseUrl}${path}`, {
      method,
      headers: { ...(body ? { 'content-type': 'application/json' } : {}), ...(cookie ? { cookie } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    const set = res.headers.get('set-cookie');
    if (set) cookie = set.split(';')[0];
    const text = await res.text();
    return { status: res.status, body: text ? JSON.parse(text) : undefined };
  };
}

/** A new member of the demo organisation with a password of their own, made through the API. */
async function newMember(name: string, email: string, password: string) {
  const admin = apiClient();
  expect((await admin('POST', '/api/auth/login', { email: 'admin@fieldfile.test', password: PASSWORD })).status).toBe(200);
  expect((await admin('POST', '/api/users', { email, name, roles: ['engineer'] })).status).toBe(201);
  const listed = (await admin('GET', '/api/outbox')).body.messages as { id: number; to: string }[];
  const message = (await admin('GET', `/api/outbox/${listed.find((m) => m.to.includes(email))!.id}`)).body.message as { text: string };
  const token = decodeURIComponent(message.text.match(/set-password\?token=([^\s]+)/)![1]);
  expect((await apiClient()('POST', '/api/auth/set-password', { token, password })).status).toBe(200);
}

/** The reset link the server printed for this address (no SMTP in the tests: the catcher keeps the mail). */
async function printedResetLink(email: string): Promise<string> {
  const pattern = new RegExp(`password reset link for ${email.replace(/[.+]/g, '\\$&')} \\(no SMTP configured\\): (\\S+)`);
  for (let i = 0; i < 200; i++) {
    const found = server.output().match(pattern);
    if (found) return found[1];
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no reset link printed for ${email}:\n${server.output().slice(-2000)}`);
}

/** The shipped fonts the browser has loaded (a face loads once some text uses it). */
async function loadedFonts(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    await document.fonts.ready;
    return [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family.replace(/"/g, ''));
  });
}

beforeAll(async () => {
  server = await startServer();
});

afterEach(async () => {
  for (const s of open.splice(0)) {
    expect(s.externalRequests, 'requests that left the machine').toEqual([]);
    expect(s.pageErrors, 'errors in the page').toEqual([]);
    await s.close();
  }
});

afterAll(async () => {
  await server?.stop();
});

describe.each(SIZES)('at %s size', (size, viewport) => {
  it('each demo user signs in, sees what their role allows, and signs out', async () => {
    const { page } = await browser(viewport);
    await page.goto(`${server.baseUrl}/`);
    await page.waitForURL(/\/login$/);
    await page.getByTestId('sign-in-form').waitFor();
    expect(await loadedFonts(page)).toEqual(expect.arrayContaining(['Atkinson-Regular', 'Atkinson-Medium', 'Atkinson-SemiBold']));
    const heading = page.getByRole('heading', { name: 'Sign in' });
    await expect(heading.evaluate((el) => getComputedStyle(el).fontFamily)).resolves.toMatch(/^"?Atkinson-SemiBold/);
    // The shipped fonts are WOFF2 files from our own origin.
    const fontFiles = await page.evaluate(() =>
      performance
        .getEntriesByType('resource')
        .map((e) => e.name)
        .filter((n) => /\.(woff2|ttf|otf)\b/.test(n)),
    );
    expect(fontFiles.length).toBeGreaterThan(0);
    for (const f of fontFiles) expect(f).toMatch(/\.woff2\b/);
    const licence = await fetch(`${server.baseUrl}/licences/OFL-AtkinsonHyperlegibleNext.txt`);
    await expect(licence.text()).resolves.toContain('SIL Open Font License, Version 1.1');
    await screenshot(page, `sign-in-${size}`);

    for (const user of DEMO) {
      await signIn(page, user.email);
      await page.waitForURL(/\/filings$/);
      await page.getByTestId(size === 'phone' ? 'bottom-bar' : 'sidebar').waitFor();
      // Admin destinations show only to admins (the server refuses them to others anyway).
      expect(await page.getByTestId('nav-people').count()).toBe(user.role === 'admin' ? 1 : 0);
      expect(await page.getByTestId('nav-outbox').count()).toBe(user.role === 'admin' ? 1 : 0);
      await screenshot(page, `home-${user.role}-${size}`);

      await page.getByTestId('nav-profile').click();
      await page.waitForURL(/\/profile$/);
      await expect(page.getByTestId('profile-email').textContent()).resolves.toBe(user.email);
      await expect(page.getByTestId('profile-roles').textContent()).resolves.toContain(user.roleLabel);
      if (user.role === 'approver') await screenshot(page, `profile-${size}`);
      await page.getByTestId('sign-out').click();
      await page.waitForURL(/\/login$/);
      await page.getByTestId('sign-in-form').waitFor();
    }

    // Signed out means signed out: the app is closed again.
    await page.goto(`${server.baseUrl}/profile`);
    await page.waitForURL(/\/login\?next=%2Fprofile$/);
  });

  it('shows a wrong password as an inline error that names neither part', async () => {
    const { page } = await browser(viewport);
    await page.goto(`${server.baseUrl}/login`);
    await signIn(page, 'engineer@fieldfile.test', 'not-the-password');
    const error = page.getByTestId('sign-in-error');
    await error.waitFor();
    await expect(error.textContent()).resolves.toBe('The e-mail or password is not right.');
    expect(new URL(page.url()).pathname).toBe('/login');

    // The shared schema's messages show before anything is sent.
    await page.getByTestId('sign-in-email').fill('engineer-at-fieldfile');
    await page.getByTestId('sign-in-submit').click();
    await expect(page.getByTestId('sign-in-email-error').textContent()).resolves.toBe('Enter a valid e-mail address, like name@example.com.');
    await screenshot(page, `sign-in-error-${size}`);
  });

  it('sends a protected URL to sign-in and back to it afterwards', async () => {
    const { page } = await browser(viewport);
    await page.goto(`${server.baseUrl}/users`);
    await page.waitForURL(/\/login\?next=%2Fusers$/);
    await page.getByTestId('sign-in-needed-notice').waitFor();
    await signIn(page, 'admin@fieldfile.test');
    await page.waitForURL(/\/users$/);
    await page.getByTestId('users-list').getByTestId('user-row-engineer-fieldfile-test').waitFor();
    await screenshot(page, `users-${size}`);

    await page.getByTestId('nav-activity').click();
    await page.getByTestId('activity-entry').first().waitFor();
    await expect(page.getByTestId('activity-screen').textContent()).resolves.toContain('Signed in');
    await screenshot(page, `activity-${size}`);
  });

  it('tells a non-admin who opens /users that the page needs the admin role', async () => {
    const { page } = await browser(viewport);
    await page.goto(`${server.baseUrl}/login?next=%2Fusers`);
    await signIn(page, 'specialist@fieldfile.test');
    await page.waitForURL(/\/users$/);
    await page.getByTestId('needs-role').waitFor();
    await expect(page.getByTestId('needs-role').textContent()).resolves.toContain('This page needs the admin role');
    await screenshot(page, `needs-role-${size}`);
  });

  it('lets an admin invite someone, who sets a password from the mailed link and signs in', async () => {
    const invitee = { name: `Noor Quill ${size}`, email: `noor.${size}@example.test` };

    // The admin invites.
    const admin = await browser(viewport);
    await admin.page.goto(`${server.baseUrl}/login`);
    await signIn(admin.page, 'admin@fieldfile.test');
    await admin.page.waitForURL(/\/filings$/);
    await admin.page.getByTestId('nav-people').click();
    await admin.page.getByTestId('invite-form').waitFor();
    await admin.page.getByTestId('invite-submit').click();
    await expect(admin.page.getByTestId('invite-role-error').textContent()).resolves.toBe('Pick at least one role.');
    await admin.page.getByTestId('invite-name').fill(invitee.name);
    await admin.page.getByTestId('invite-email').fill(invitee.email);
    await admin.page.getByTestId('invite-role-engineer').click();
    await admin.page.getByTestId('invite-role-approver').click();
    await admin.page.getByTestId('invite-submit').click();
    await admin.page.getByTestId('invite-sent').waitFor();
    const slug = invitee.email.replace(/[^a-z0-9]+/gi, '-');
    await expect(admin.page.getByTestId(`user-state-${slug}`).textContent()).resolves.toBe('Invitation pending');

    // Inviting the same address again lands on the e-mail field.
    await admin.page.getByTestId('invite-name').fill('Someone Else');
    await admin.page.getByTestId('invite-email').fill(invitee.email);
    await admin.page.getByTestId('invite-role-engineer').click();
    await admin.page.getByTestId('invite-submit').click();
    await expect(admin.page.getByTestId('invite-email-error').textContent()).resolves.toBe('Someone with this e-mail is already a member.');
    await screenshot(admin.page, `users-invited-${size}`);

    // The invitation is in the outbox, with its link.
    await admin.page.getByTestId('nav-outbox').click();
    await admin.page.waitForURL(/\/outbox$/);
    const item = admin.page.locator('[data-testid^="outbox-item-"]', { hasText: invitee.email }).first();
    await item.waitFor();
    await expect(admin.page.getByRole('heading', { name: 'Sent mail' }).isVisible()).resolves.toBe(true);
    await screenshot(admin.page, `outbox-${size}`);
    await item.click();
    await admin.page.waitForURL(/\/outbox\/\d+$/);
    const link = admin.page.getByTestId('outbox-message-link');
    await link.waitFor();
    await expect(admin.page.getByTestId('outbox-message-body').textContent()).resolves.toContain(`Hello ${invitee.name}`);
    // The HTML part is rendered (not shown as source) in a frame that runs no scripts.
    const htmlFrame = admin.page.getByTestId('outbox-message-html');
    await expect(htmlFrame.getAttribute('sandbox')).resolves.not.toContain('allow-scripts');
    await expect(admin.page.frameLocator('[data-testid="outbox-message-html"]').locator('body').textContent()).resolves.toContain(invitee.name);
    await screenshot(admin.page, `outbox-message-${size}`);
    const href = await link.getAttribute('href');
    expect(href).toMatch(new RegExp(`^${server.baseUrl}/set-password\\?token=[\\w%-]+$`));

    // The invitee, in their own browser, opens the link.
    const invited = await browser(viewport);
    const { page } = invited;
    await page.goto(href!);
    await page.getByTestId('set-password-owner').waitFor();
    await expect(page.getByTestId('set-password-owner').textContent()).resolves.toContain(invitee.email);
    await page.getByTestId('set-password-password').fill('short');
    await page.getByTestId('set-password-confirm').fill('different');
    await page.getByTestId('set-password-submit').click();
    await expect(page.getByTestId('set-password-password-error').textContent()).resolves.toBe('Use at least 12 characters.');
    await expect(page.getByTestId('set-password-confirm-error').textContent()).resolves.toBe('The two passwords differ.');
    await screenshot(page, `set-password-${size}`);

    const newPassword = `quill ${size} harbour lantern`;
    await page.getByTestId('set-password-password').fill(newPassword);
    await page.getByTestId('set-password-confirm').fill(newPassword);
    await page.getByTestId('set-password-submit').click();
    await page.waitForURL(/\/login\?/);
    await page.getByTestId('password-set-notice').waitFor();
    await expect(page.getByTestId('sign-in-email').inputValue()).resolves.toBe(invitee.email);
    await screenshot(page, `password-set-${size}`);
    await page.getByTestId('sign-in-password').fill(newPassword);
    await page.getByTestId('sign-in-submit').click();
    await page.waitForURL(/\/filings$/);
    await page.getByTestId('nav-profile').click();
    await expect(page.getByTestId('profile-name').textContent()).resolves.toBe(invitee.name);
    await expect(page.getByTestId('profile-roles').textContent()).resolves.toMatch(/Test engineer.*Approver/s);

    // The link worked once.
    await page.getByTestId('sign-out').click();
    await page.waitForURL(/\/login$/);
    await page.goto(href!);
    await page.getByTestId('set-password-link-dead').waitFor();

    // The admin sees them active now.
    await admin.page.goto(`${server.baseUrl}/users`);
    await expect(admin.page.getByTestId(`user-state-${slug}`).textContent()).resolves.toBe('Active');
  });

  it('lets someone who forgot their password get a link by mail, choose a new one, then change it in the profile', async () => {
    const person = { name: `Rowan Tisdale ${size}`, email: `rowan.${size}@example.test` };
    const first = `birch ${size} canal tapestry`;
    const second = `saffron ${size} ledger puffin`;
    const third = `glacier ${size} violin thimble`;
    await newMember(person.name, person.email, first);
    // A session elsewhere, which the new password will end.
    const elsewhere = apiClient();
    expect((await elsewhere('POST', '/api/auth/login', { email: person.email, password: first })).status).toBe(200);

    const { page } = await browser(viewport);
    await page.goto(`${server.baseUrl}/login`);
    await page.getByTestId('sign-in-email').fill(person.email);
    await page.getByTestId('forgot-password-link').click();
    await page.waitForURL(/\/forgot-password\?email=/);
    await expect(page.getByTestId('forgot-password-email').inputValue()).resolves.toBe(person.email);
    await screenshot(page, `forgot-password-${size}`);
    await page.getByTestId('forgot-password-submit').click();
    const sent = page.getByTestId('forgot-password-sent');
    await sent.waitFor();
    await expect(sent.textContent()).resolves.toContain('If an account uses this address, a link to choose a new password is on its way to it.');
    await screenshot(page, `forgot-password-sent-${size}`);

    const link = await printedResetLink(person.email);
    expect(link).toMatch(new RegExp(`^${server.baseUrl}/reset-password\\?token=[\\w%-]+$`));
    await page.goto(link);
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
    await expect(page.getByTestId('set-password-owner').textContent()).resolves.toContain(person.email);
    await page.getByTestId('set-password-password').fill('Password2024!');
    await page.getByTestId('set-password-confirm').fill('Password2024!');
    await page.getByTestId('set-password-submit').click();
    const weak = page.getByTestId('set-password-password-error');
    await weak.waitFor();
    await expect(weak.textContent()).resolves.toMatch(/^Too easy to guess\./);
    await screenshot(page, `reset-password-weak-${size}`);
    await page.getByTestId('set-password-password').fill(second);
    await page.getByTestId('set-password-confirm').fill(second);
    await page.getByTestId('set-password-submit').click();
    await page.waitForURL(/\/login\?/);
    await expect(page.getByTestId('password-set-notice').textContent()).resolves.toContain('Every other session of the account was signed out.');
    await expect(page.getByTestId('sign-in-email').inputValue()).resolves.toBe(person.email);
    await screenshot(page, `password-reset-done-${size}`);
    expect((await elsewhere('GET', '/api/auth/me')).status).toBe(401);

    // The link worked once.
    await page.goto(link);
    await page.getByTestId('set-password-link-dead').waitFor();

    // Signed in with the new password, the person changes it in the profile.
    await page.goto(`${server.baseUrl}/login`);
    await signIn(page, person.email, second);
    await page.waitForURL(/\/filings$/);
    await page.getByTestId('nav-profile').click();
    await page.waitForURL(/\/profile$/);
    await page.getByTestId('change-password-current').fill(first);
    await page.getByTestId('change-password-new').fill(third);
    await page.getByTestId('change-password-confirm').fill(third);
    await page.getByTestId('change-password-submit').click();
    const wrong = page.getByTestId('change-password-current-error');
    await wrong.waitFor();
    await expect(wrong.textContent()).resolves.toBe('That is not your current password.');
    await page.getByTestId('profile-password').scrollIntoViewIfNeeded();
    await screenshot(page, `change-password-wrong-${size}`);
    await page.getByTestId('change-password-current').fill(second);
    await page.getByTestId('change-password-submit').click();
    await page.getByTestId('change-password-done').waitFor();
    await expect(page.getByTestId('change-password-current').inputValue()).resolves.toBe('');
    await screenshot(page, `change-password-done-${size}`);

    await page.getByTestId('sign-out').click();
    await page.waitForURL(/\/login$/);
    await signIn(page, person.email, third);
    await page.waitForURL(/\/filings$/);
  });
});
