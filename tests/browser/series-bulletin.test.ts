// Journey on a phone: the demo series' secretary (the demo organiser) opens the officials' page of the demo series
// class, sees the caution, publishes a technical bulletin through the form (a refused date first, then a good one),
// and every entrant of the class is e-mailed; the public series page lists it. Then the secretary invites a series
// steward from the officials screen and sees the invitation waiting, with its expiry. Demo data is the scenario here, not a
// reference: the figures checked are only those the test itself typed.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { waitForMail } from '../support/mail';

const SERIES = '0b0e0000-0000-4000-8161-000000000001';
const SERIES_CLASS = '0b0e0000-0000-4000-8161-000000000101';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('series secretary: publishes a technical bulletin from the officials page; every entrant of the class is told', async () => {
  const title = `Fuel sample ${randomUUID().slice(0, 6)}`;
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/series/${SERIES}/classes/${SERIES_CLASS}/parity`);
  await page.getByRole('heading', { name: /Parity history: Sprint Sport/ }).waitFor();
  assert.match(await page.getByRole('note').first().innerText(), /licensed officials decide/);
  await page.getByLabel('Title').fill(title);
  await page.getByLabel('Text').fill('A fuel sample may be taken from any boat at the dock after each run.');
  await page.getByRole('button', { name: 'Publish and send' }).click();
  await page.getByText('In effect from').first().waitFor();
  assert.match(await page.locator('#bulletin-effectiveFrom-error').innerText(), /date/);
  await page.getByLabel('In effect from').fill('2027-02-01');
  await page.getByRole('button', { name: 'Publish and send' }).click();
  await page.getByText(/Bulletin \d+ published and sent to \d+ entrant/).waitFor();
  await screenshot(page, 'series-bulletin-01-published');

  const recipients = await query<{ email: string }>(
    `select distinct u.email from entries e join users u on u.id = e.entrant_id join race_classes rc on rc.id = e.class_id
      where rc.series_class_id = $1 and e.status in ('awaiting_payment', 'entered') and u.suspended_at is null`,
    [SERIES_CLASS],
  );
  assert.ok(recipients.length > 0);
  for (const r of recipients) await waitForMail(r.email, { subject: new RegExp(title) });

  await page.goto(`/series/${SERIES}`);
  await page.getByTestId('bulletin').filter({ hasText: title }).waitFor();

  // Appointing an official is an invitation: the secretary sees it waiting, with its expiry, until it is accepted.
  const invited = uniqueEmail('series-official');
  await page.goto(`/series/${SERIES}/officials`);
  await page.getByLabel('E-mail').fill(invited);
  await page.getByRole('button', { name: 'Send invitation' }).click();
  assert.match(
    await page.getByTestId('official-invite-message').filter({ hasText: invited }).innerText(),
    /hold the role once they accept/,
  );
  assert.match(
    await page.getByTestId('series-invitations').locator('li', { hasText: invited }).innerText(),
    /Series steward · expires \w{3} \d{1,2} \w{3} \d{4}/,
  );
  await screenshot(page, 'series-bulletin-02-official-invited');
  await waitForMail(invited, { subject: /invited to/ });
});
