import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import fs from 'node:fs';
import path from 'node:path';
import { ARTIFACTS, BASE_URL } from './env';
import { waitForMail, firstLink } from './mail';

// Debian's Chromium driven by playwright-core (no downloaded browser).
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };

export async function newContext(
  browser: Browser,
  opts: Parameters<Browser['newContext']>[0] = {},
): Promise<BrowserContext> {
  return browser.newContext({ baseURL: BASE_URL, ...opts });
}

export async function screenshot(page: Page, name: string) {
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: true });
}

export async function signInWithPassword(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL('**/home');
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL((u) => u.pathname === '/');
}

/** Confirms a new account's address as its owner does: the mailed link, then the sign-up password. */
export async function confirmAddressInBrowser(page: Page, email: string, password: string) {
  await page.getByTestId('sign-up-sent').waitFor();
  const mail = await waitForMail(email, { subject: /Confirm your e-mail address/ });
  await page.goto(firstLink(mail));
  await page.getByLabel('Your password').fill(password);
  await page.getByRole('button', { name: 'Confirm and sign in' }).click();
  await page.waitForURL('**/account?confirmed=1');
}

/**
 * Waits until the service worker has kept the page now shown (its offline copy is in a cache). Polled from here:
 * Playwright's waitForFunction does not wait for a promise its function returns (a pending promise is truthy).
 */
export async function waitForOfflineCopy(page: Page, timeoutMs = 20_000) {
  const end = Date.now() + timeoutMs;
  while (!(await page.evaluate(async () => (await caches.match(location.href)) !== undefined))) {
    if (Date.now() > end) throw new Error(`no offline copy of ${page.url()} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
