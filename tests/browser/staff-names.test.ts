// Issue 13, item 10, on a phone: a person invited to a meeting's staff gives their name on accepting,
// the home page greets them by it, and anyone can change their name on My account (a blank name is
// refused beside the field).
// Runs alone (scripts/test.sh): it adds staff to the demo meeting.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { HttpSession } from '../support/http-session';
import { firstLink, waitForMail } from '../support/mail';
import { query } from '../support/db';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('names: an invited dock hand gives a name on accepting, is greeted by it, and changes it on My account', async () => {
  const organiser = new HttpSession();
  assert.equal((await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD)).status, 200);
  const email = uniqueEmail('newdockhand');
  const invited = await organiser.json(`/api/events/${DEMO.meetingId}/invitations`, { email, role: 'scrutineer' });
  assert.equal(invited.res.status, 201, JSON.stringify(invited.body));
  const link = new URL(firstLink(await waitForMail(email, { subject: /invited/ })));

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await page.goto(link.pathname);
  const name = page.getByLabel('Your name', { exact: true });
  await name.waitFor();
  await page.getByRole('button', { name: 'Accept and sign in' }).click();
  const error = page.locator('[data-field-error="name"]');
  await error.waitFor();
  assert.equal(await error.innerText(), 'Enter your name.');
  assert.equal(
    (await query('select 1 from staff_invitations where email = $1 and accepted_at is null', [email])).length,
    1,
    'not accepted without a name',
  );
  await screenshot(page, 'invite-name-refused-phone');
  await name.fill('  Wren Halloway ');
  await page.getByRole('button', { name: 'Accept and sign in' }).click();
  await page.waitForURL('**/home');
  assert.equal(await page.getByTestId('home-greeting').innerText(), 'Hello, Wren Halloway');
  await screenshot(page, 'home-greets-by-name-phone');

  await page.goto('/account');
  assert.equal(await page.getByTestId('account-name').innerText(), 'Wren Halloway');
  const field = page.getByLabel('Your name', { exact: true });
  await field.fill('   ');
  await page.getByRole('button', { name: 'Save name' }).click();
  const refused = page.locator('[data-field-error="name"]');
  await refused.waitFor();
  assert.equal(await refused.innerText(), 'Enter your name.');
  assert.deepEqual(
    await query('select name from users where email = $1', [email]),
    [{ name: 'Wren Halloway' }],
    'a blank name changes nothing',
  );
  await page.getByLabel('Your name', { exact: true }).fill('Wren A. Halloway');
  await page.getByRole('button', { name: 'Save name' }).click();
  await page.getByTestId('name-result').filter({ hasText: 'Saved' }).waitFor();
  await page.getByTestId('account-name').filter({ hasText: 'Wren A. Halloway' }).waitFor();
  await screenshot(page, 'account-name-changed-phone');
  assert.deepEqual(await query('select name from users where email = $1', [email]), [{ name: 'Wren A. Halloway' }]);
  await page.goto('/home');
  assert.equal(await page.getByTestId('home-greeting').innerText(), 'Hello, Wren A. Halloway');
  await context.close();
});
