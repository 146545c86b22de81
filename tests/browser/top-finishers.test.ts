// Journey on a phone: after provisional results, the chief scrutineer calls the top finishers of a
// class for post-race inspection from the board (post-race checks of the first finishers are
// common practice, no single source): the picker chooses them from the latest results version and
// fills in the reason; one task per boat is stored, and asking again makes no second task.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
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

test('chief scrutineer: top finishers from the provisional results → one post-race task each', async () => {
  const meeting = new InspectionMeeting();
  await meeting.create(`Top Finishers Meeting ${Date.now()}`, [{ email: DEMO.chief, role: 'chief_scrutineer' }]);
  const classId = await meeting.addClass('TF', rulesWith());
  const entries = [];
  for (let i = 0; i < 4; i++) entries.push(await meeting.addEntry(classId));
  // Finishing order: the third boat won, then the first, then the fourth, then the second.
  const order = [entries[2], entries[0], entries[3], entries[1]];
  const published = await meeting.organiser.json(`/api/events/${meeting.eventId}/results`, {
    classId,
    rows: order.map((e, i) => ({ position: i + 1, raceNumber: e.raceNumber })),
    note: 'heat 1',
  });
  assert.equal(published.res.status, 201, JSON.stringify(published.body));

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.chief, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}/board`);
  await page.getByLabel('Results of class').selectOption(classId);
  await page.getByLabel('How many').fill('2');
  await page.getByRole('button', { name: 'Choose them' }).click();
  assert.equal(
    await page.getByTestId('top-finishers-note').innerText(),
    `Chosen: no. ${order[0].raceNumber}, no. ${order[1].raceNumber}.`,
  );
  assert.match(
    await page.getByLabel(/^Why/).inputValue(),
    /^Post-race check: top 2 in TF \(provisional results, version 1\)$/,
  );
  assert.match(await page.getByRole('heading', { name: /Ask for re-inspection/ }).innerText(), /2 chosen/);
  await screenshot(page, 'top-finishers-01-chosen');
  await page.getByRole('button', { name: 'Ask for re-inspection' }).click();
  await page.getByText('Re-inspection asked for 2 boats.').waitFor();

  const tasks = await query<{ entry_id: string; reason: string }>(
    'select entry_id, reason from reinspections where event_id = $1 and done_at is null order by entry_id',
    [meeting.eventId],
  );
  assert.deepEqual(tasks.map((t) => t.entry_id).sort(), [order[0].id, order[1].id].sort());
  assert.ok(tasks.every((t) => t.reason === 'Post-race check: top 2 in TF (provisional results, version 1)'));

  // Asking again for the top three adds only the third: an open task is kept, not doubled.
  await page.getByLabel('How many').fill('3');
  await page.getByRole('button', { name: 'Choose them' }).click();
  await page.getByRole('button', { name: 'Ask for re-inspection' }).click();
  await page.getByText('Re-inspection asked for 3 boats.').waitFor();
  const after3 = await query<{ entry_id: string }>(
    'select entry_id from reinspections where event_id = $1 and done_at is null',
    [meeting.eventId],
  );
  assert.equal(after3.length, 3);
  await page.getByTestId('reinspection-list').waitFor();
  await screenshot(page, 'top-finishers-02-asked');
  await context.close();
});
