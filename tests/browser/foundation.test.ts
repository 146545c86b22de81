// Journey: landing page, entrant sign-up with a bad field first, sign-out, organiser sign-in and
// navigation, and an entrant refused an organiser page. Screenshots go to test-results/.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import {
  confirmAddressInBrowser,
  launchBrowser,
  newContext,
  screenshot,
  signInWithPassword,
  signOut,
  PHONE,
} from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('landing → sign up as entrant → sign out → organiser → entrant refused an organiser page', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();

  await page.goto('/');
  await assert.doesNotReject(page.getByRole('heading', { level: 1 }).waitFor());
  assert.match(await page.getByRole('heading', { level: 1 }).innerText(), /Technical inspection/);
  await screenshot(page, 'foundation-01-landing');

  await page.getByRole('link', { name: 'Sign up' }).first().click();
  await page.waitForURL('**/sign-up');
  const email = uniqueEmail('journey');
  await page.getByLabel('Your name').fill('Juno Brack');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create account' }).click();
  const pwError = page.locator('[data-field-error="password"]');
  await pwError.waitFor();
  assert.match(await pwError.innerText(), /at least 10 characters/);
  await screenshot(page, 'foundation-02-sign-up-error');

  await page.getByLabel('Password').fill('a-good-long-password');
  await page.getByRole('button', { name: 'Create account' }).click();
  // The address is confirmed from the mailed link with the password chosen at sign-up.
  await confirmAddressInBrowser(page, email, 'a-good-long-password');
  assert.equal(await page.getByTestId('address-state').innerText(), 'confirmed');
  await page.goto('/home');
  const navText = await page.getByTestId('main-nav').innerText();
  assert.match(navText, /Home/);
  assert.doesNotMatch(navText, /Organise/);
  await screenshot(page, 'foundation-03-entrant-home');

  // The entrant tries an organiser URL and is told plainly.
  await page.goto('/organise');
  await page.getByTestId('not-allowed').waitFor();
  await screenshot(page, 'foundation-04-not-allowed');
  await page.goto('/home');
  await signOut(page);

  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  const orgNav = await page.getByTestId('main-nav').innerText();
  assert.match(orgNav, /Organise/);
  assert.doesNotMatch(orgNav, /Administration/);
  await page.getByRole('link', { name: 'Organise' }).click();
  await page.getByTestId('organise-heading').waitFor();
  assert.match(await page.locator('main').innerText(), /Kelda Reach Spring Sprint/);
  await screenshot(page, 'foundation-05-organiser');
  await context.close();
});

test('a wrong password shows a clear message on the sign-in page', async () => {
  const context = await newContext(browser);
  const page = await context.newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(DEMO.entrant);
  await page.getByLabel('Password', { exact: true }).fill('wrong-password-here');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  const err = page.getByTestId('sign-in-error');
  await err.waitFor();
  assert.match(await err.innerText(), /do not match/);
  // Then the right one: signing in costs the phone two requests to next-auth (its CSRF token, then the form), not
  // the four of next-auth/react's client (which also asks for the provider list and then the session).
  const authCalls: string[] = [];
  page.on('request', (r) => {
    const u = new URL(r.url());
    if (u.pathname.startsWith('/api/auth/')) authCalls.push(`${r.method()} ${u.pathname}`);
  });
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL('**/home');
  assert.deepEqual(authCalls, ['GET /api/auth/csrf', 'POST /api/auth/callback/password']);
  await context.close();
});
