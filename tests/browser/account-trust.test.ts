// In Chromium, as people use it: no redirect off the site after signing in, whatever callbackUrl
// says (OWASP Unvalidated Redirects and Forwards Cheat Sheet); a password change that asks for the
// current password and ends the other device's session; "sign out everywhere".
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { BASE_URL, DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { HttpSession } from '../support/http-session';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

// callbackUrl exactly as it would sit in a link (already percent-encoded where shown).
const EVASIONS = {
  backslash: '/\\attacker.invalid/x',
  tab: '/%09/attacker.invalid/x',
  'double slash': '//attacker.invalid/x',
  absolute: 'https://attacker.invalid/x',
  encoded: '%2F%5Cattacker.invalid%2Fx',
};

test('after signing in, every callbackUrl evasion stays on the site', async () => {
  const appHost = new URL(BASE_URL).host;
  for (const [name, raw] of Object.entries(EVASIONS)) {
    const context = await newContext(browser, PHONE);
    const left: string[] = [];
    await context.route(
      (url) => url.hostname.endsWith('attacker.invalid'),
      (route) => {
        left.push(route.request().url());
        return route.abort();
      },
    );
    const page = await context.newPage();
    await page.goto(`/sign-in?callbackUrl=${raw}`);
    await page.getByLabel('E-mail').fill(DEMO.entrant);
    await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL((u) => u.pathname !== '/sign-in', { timeout: 15_000 });
    await page.waitForLoadState('networkidle');
    assert.equal(new URL(page.url()).host, appHost, `${name}: stayed on the site (${page.url()})`);
    assert.deepEqual(left, [], `${name}: no request left for the attacker's host`);
    await context.close();
  }
});

async function signedInPage(email: string, password: string): Promise<Page> {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, email, password);
  return page;
}

test('a password change asks for the current password, keeps this device signed in and ends the other', async () => {
  const email = uniqueEmail('pw-change');
  await new HttpSession().signUpAndConfirm({ name: 'Ros Tallis', email, password: 'first-long-password' });
  const phone = await signedInPage(email, 'first-long-password');
  const laptop = await signedInPage(email, 'first-long-password');

  await phone.goto('/account');
  await phone.getByLabel('Current password').fill('not-my-password');
  await phone.getByLabel('New password').fill('second-long-password');
  await phone.getByRole('button', { name: 'Save password' }).click();
  const currentError = phone.locator('[data-field-error="currentPassword"]');
  await currentError.waitFor();
  assert.match(await currentError.innerText(), /not your current password/);

  await phone.getByLabel('Current password').fill('first-long-password');
  await phone.getByLabel('New password').fill('second-long-password');
  // The form signs this device back in with the new password: wait for that sign-in's answer, not a fixed pause.
  const signedBackIn = phone.waitForResponse(
    (r) => r.request().method() === 'POST' && new URL(r.url()).pathname === '/api/auth/callback/password',
    { timeout: 15_000 },
  );
  await phone.getByRole('button', { name: 'Save password' }).click();
  await phone.getByTestId('password-result').filter({ hasText: 'Password changed' }).waitFor();
  await screenshot(phone, 'account-01-password-changed');
  await (await signedBackIn).finished();
  await phone.goto('/boats');
  assert.equal(new URL(phone.url()).pathname, '/boats', 'this device is still signed in');

  await laptop.goto('/boats');
  await laptop.waitForURL((u) => u.pathname === '/sign-in');
  await laptop.context().close();

  // Sign out everywhere: this device and any other.
  const tablet = await signedInPage(email, 'second-long-password');
  await phone.goto('/account');
  await phone.getByRole('button', { name: 'Sign out everywhere' }).click();
  await phone.waitForURL((u) => u.pathname === '/sign-in');
  await tablet.goto('/entries');
  await tablet.waitForURL((u) => u.pathname === '/sign-in');
  await phone.context().close();
  await tablet.context().close();
});
