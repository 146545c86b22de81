// Journey on phones: the owner opens the boat's logbook from the boat page (nothing wider than the
// screen, the caution shown, no note form for the owner); the chief scrutineer opens it from the
// inspection board, is refused an empty note beside its field, adds a damage note, and the owner
// then reads it with its author.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, rulesWith } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const overflowPx = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

test('logbook: the owner reads it on a phone; the chief scrutineer opens it from the board and adds a note', async () => {
  const meeting = new InspectionMeeting();
  await meeting.create(`Logbook Journey ${Date.now()}`, [{ email: DEMO.chief, role: 'chief_scrutineer' }]);
  const entry = await meeting.addEntry(await meeting.addClass('LJ', rulesWith()));

  const pits = await newContext(browser, PHONE);
  const owner = await pits.newPage();
  await signInWithPassword(owner, DEMO.entrant, DEMO_PASSWORD);
  await owner.goto(`/boats/${entry.boatId}`);
  await owner.getByRole('link', { name: 'Logbook', exact: true }).click();
  await owner.waitForURL(`**/boats/${entry.boatId}/logbook`);
  await owner.getByTestId('logbook-heading').waitFor();
  assert.match(await owner.getByTestId('logbook-heading').innerText(), new RegExp(`Logbook: ${entry.boatName}`));
  await owner.locator('[data-kind="declaration"]').first().waitFor();
  assert.match(await owner.locator('[data-kind="declaration"]').first().innerText(), /Declaration version 1/);
  assert.match(await owner.getByRole('note').innerText(), /licensed officials decide/);
  assert.equal(await owner.getByTestId('log-note-form').count(), 0, 'owners do not write officials’ notes');
  assert.ok((await overflowPx(owner)) <= 0, 'nothing wider than the phone');
  await screenshot(owner, 'logbook-01-owner-phone');

  const dock = await newContext(browser, PHONE);
  const chief = await dock.newPage();
  await signInWithPassword(chief, DEMO.chief, DEMO_PASSWORD);
  await chief.goto(`/inspect/${meeting.eventId}/board`);
  const row = chief.locator(`[data-race-number="${entry.raceNumber}"]`);
  await row.getByRole('link', { name: 'Logbook' }).waitFor();
  await row.getByRole('link', { name: 'Logbook' }).click();
  await chief.waitForURL(`**/boats/${entry.boatId}/logbook`);
  const form = chief.getByTestId('log-note-form');
  await form.waitFor();
  await form.getByRole('button', { name: 'Add the note' }).click();
  await chief.locator('[data-field-error="body"]').waitFor();
  assert.match(await chief.locator('[data-field-error="body"]').innerText(), /Write the note/);

  const text = `Spray rail cracked on the starboard side, taped for the heat ${Date.now()}.`;
  await form.getByLabel('Damage').check();
  await form.getByLabel('Note', { exact: true }).fill(text);
  await form.getByRole('button', { name: 'Add the note' }).click();
  await chief.getByTestId('log-note-message').filter({ hasText: 'Note added to the logbook.' }).waitFor();
  const added = chief.locator('[data-kind="note"]', { hasText: text });
  await added.waitFor();
  const [{ name }] = await query<{ name: string }>('select name from users where email = $1', [DEMO.chief]);
  assert.match(await added.innerText(), new RegExp(`Damage noted by ${name}`));
  assert.ok((await overflowPx(chief)) <= 0, 'nothing wider than the phone');
  await screenshot(chief, 'logbook-02-chief-note');
  await dock.close();

  await owner.reload();
  await owner.locator('[data-kind="note"]', { hasText: text }).waitFor();
  await screenshot(owner, 'logbook-03-owner-reads-note');
  await pits.close();
});
