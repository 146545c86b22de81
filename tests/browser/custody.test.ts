// Journey on a phone: at the dock the scrutineer opens "Parts in custody", types a race number that
// does not exist (refused beside the field), then bags an impeller; the steward, on another phone,
// releases it to the crew with a note, and the list shows who had it and when. The entrant sees the
// part as held on My entries until it is released.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, rulesWith } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('custody: scrutineer bags a part at the dock, steward releases it', async () => {
  const meeting = new InspectionMeeting();
  await meeting.create(`Custody Journey ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  const entry = await meeting.addEntry(await meeting.addClass('CJ', rulesWith()));

  const dock = await newContext(browser, PHONE);
  const page = await dock.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.getByRole('link', { name: 'Parts in custody' }).click();
  await page.waitForURL('**/custody');
  await page.getByLabel('Race number').fill('9999');
  await page.getByLabel('Part', { exact: true }).fill('Impeller, bent leading edge');
  await page.getByRole('button', { name: 'Take into custody' }).click();
  await page.locator('[data-field-error="raceNumber"]').waitFor();
  assert.match(await page.locator('[data-field-error="raceNumber"]').innerText(), /No boat has race number 9999/);
  await page.getByLabel('Race number').fill(String(entry.raceNumber));
  await page.getByLabel('Part', { exact: true }).fill('Impeller, bent leading edge');
  await page.getByLabel('Seal or bag number').fill('BAG-0520');
  await page.getByRole('button', { name: 'Take into custody' }).click();
  const item = page.locator('[data-held="yes"]').first();
  await item.waitFor();
  assert.match(
    await item.innerText(),
    new RegExp(`no\\. ${entry.raceNumber}[\\s\\S]*Impeller, bent leading edge · seal/bag BAG-0520`),
  );
  assert.equal(await item.getByRole('button', { name: 'Release…' }).count(), 0, 'a scrutineer cannot release');
  assert.match(await page.getByRole('note').innerText(), /licensed officials/);
  await screenshot(page, 'custody-01-taken');
  // Back at the dock, the boat's card says what is held.
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('parts-held').waitFor();
  assert.match(
    await page.getByTestId('parts-held').innerText(),
    /Held by the officials: Impeller, bent leading edge \(seal\/bag BAG-0520\)/,
  );
  await dock.close();

  // The entrant sees on My entries that the part is held, and by whom to ask.
  const pits = await newContext(browser, PHONE);
  const ep = await pits.newPage();
  await signInWithPassword(ep, DEMO.entrant, DEMO_PASSWORD);
  await ep.goto('/entries');
  const held0 = ep.locator(`[data-entry-id="${entry.id}"]`).getByTestId('parts-held');
  assert.match(
    await held0.innerText(),
    /Impeller, bent leading edge \(seal\/bag BAG-0520\), since .*\(Pacific\/Auckland\)/,
  );
  await screenshot(ep, 'custody-02-entrant-sees');

  const office = await newContext(browser, PHONE);
  const sp = await office.newPage();
  await signInWithPassword(sp, DEMO.steward, DEMO_PASSWORD);
  await sp.goto(`/stewards/${meeting.eventId}`);
  await sp.getByRole('link', { name: 'Parts in custody' }).click();
  await sp.waitForURL('**/custody');
  const held = sp.locator('[data-held="yes"]').first();
  await held.getByRole('button', { name: 'Release…' }).click();
  await held.getByLabel('Released to').fill('Crew chief of no. ' + entry.raceNumber);
  await held.getByLabel('Note').fill('Photographed and measured; nothing pending.');
  await held.getByRole('button', { name: 'Release the part' }).click();
  const released = sp.getByTestId('released').first();
  await released.waitFor();
  assert.match(
    await released.innerText(),
    /Released to Crew chief of no\. \d+ by .*: Photographed and measured; nothing pending\./,
  );
  await screenshot(sp, 'custody-03-released');
  await office.close();
  await ep.reload();
  assert.equal(
    await ep.locator(`[data-entry-id="${entry.id}"]`).getByTestId('parts-held').count(),
    0,
    'released: no longer listed as held',
  );
  await pits.close();
});
