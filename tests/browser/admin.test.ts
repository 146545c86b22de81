// Journey on a phone: the site administrator suspends an account from the people list (a missing
// reason first, refused beside the field), sees it marked with the reason, and lifts the suspension;
// the suspended person's own browser is sent to sign in and told why. Then appoints a person to the appeal
// body and ends the appointment.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { HttpSession } from '../support/http-session';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('admin: suspend an account with a reason, the person is refused, then lift it', async () => {
  const email = uniqueEmail('admin-journey');
  const signup = await new HttpSession().json('/api/accounts', {
    name: 'Wren Halloway',
    email,
    password: 'wren-long-password',
  });
  assert.equal(signup.res.status, 202);

  const person = await (await newContext(browser, PHONE)).newPage();
  await signInWithPassword(person, email, 'wren-long-password');

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.admin, DEMO_PASSWORD);
  await page.getByTestId('main-nav').getByRole('link', { name: 'Administration' }).click();
  await page.waitForURL('**/admin');
  await page.getByLabel('Find a person').fill('wren halloway');
  assert.equal(
    await page
      .getByTestId('people-count')
      .innerText()
      .then((t) => /^Showing 1 of \d+$/.test(t)),
    true,
    'the search narrows the list to one',
  );
  const row = page.locator(`[data-person="${email}"]`);
  await row.getByRole('button', { name: 'Suspend…' }).click();
  await row.getByRole('button', { name: 'Suspend the account' }).click();
  await row.locator('[data-field-error="reason"]').waitFor();
  assert.match(await row.locator('[data-field-error="reason"]').innerText(), /reason/);
  await row.getByLabel('Why is Wren Halloway suspended?').fill('Login shared with a crew member who is not entered.');
  await row.getByRole('button', { name: 'Suspend the account' }).click();
  await row.getByTestId('suspended').waitFor();
  assert.match(await row.getByTestId('suspended').innerText(), /Login shared with a crew member/);
  await page.getByLabel('Find a person').fill('');
  await page.getByLabel('Suspended only').check();
  assert.ok(await row.isVisible(), 'the suspended account is among the suspended');
  await screenshot(page, 'admin-01-suspended');

  // The person's open page: the next navigation finds no session and lands on sign-in.
  await person.goto('/boats');
  await person.waitForURL(/\/sign-in/);
  await person.getByLabel('E-mail').fill(email);
  await person.getByLabel('Password', { exact: true }).fill('wren-long-password');
  await person.getByRole('button', { name: 'Sign in', exact: true }).click();
  await person.getByTestId('sign-in-error').waitFor();
  assert.match(await person.getByTestId('sign-in-error').innerText(), /suspended/);
  await screenshot(person, 'admin-02-person-refused');

  await page.getByLabel('Suspended only').uncheck();
  await row.getByRole('button', { name: 'Lift suspension' }).click();
  await row.getByRole('button', { name: 'Suspend…' }).waitFor();
  assert.equal(await row.getByTestId('suspended').count(), 0);

  // The appeal body: a person whose address is not proven is refused in their row; a proven one is appointed,
  // marked, and the appointment ended.
  await row.getByRole('button', { name: 'Appoint to the appeal body' }).click();
  await row.getByText(/has not proven their address/).waitFor();
  assert.equal(await row.getByTestId('appeal-body-badge').count(), 0);
  const provenEmail = uniqueEmail('admin-appeal-body');
  await new HttpSession().signUpAndConfirm({
    name: 'Tamsin Orrell',
    email: provenEmail,
    password: 'tamsin-long-password',
  });
  await page.reload();
  await page.getByLabel('Find a person').fill('tamsin orrell');
  const member = page.locator(`[data-person="${provenEmail}"]`);
  await member.getByRole('button', { name: 'Appoint to the appeal body' }).click();
  await member.getByTestId('appeal-body-badge').waitFor();
  await screenshot(page, 'admin-03-appeal-body');
  await member.getByRole('button', { name: 'End appeal body appointment' }).click();
  await member.getByRole('button', { name: 'Appoint to the appeal body' }).waitFor();
  assert.equal(await member.getByTestId('appeal-body-badge').count(), 0);
  await context.close();
});
