// Journey on a phone: the steward declares an interest in a boat on the meeting's register, then
// opens a protest against that boat: the page says why they cannot act and offers no steward step
// (the server refuses them too: tests/integration/protest-conflicts.test.ts). That an official
// with an interest must not decide the matter is common practice, no single source.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
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

test('conflict of interest: the steward declares an interest in a boat and the protest against it offers them no step', async () => {
  const meeting = new InspectionMeeting();
  await meeting.create(`Interest Journey ${Date.now()}`, [{ email: DEMO.steward, role: 'steward' }]);
  const classId = await meeting.addClass('CI', rulesWith());
  const lodgers = await meeting.addEntry(classId);
  const target = await meeting.addEntry(classId, { ownerEmail: DEMO.chief });
  const [{ id: lodgerId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  const [{ id: protestId }] = await query<{ id: string }>(
    `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, status, fee_minor, currency, paid_at, window_deadline)
     values ($1, $2, $3, $4, 'CI 2.1 nozzle maximum', 'Measured the nozzle exit at the dock.', 'lodged', 3000, 'NZD', now(), now() + interval '1 hour') returning id`,
    [meeting.eventId, lodgerId, target.id, `journey:${randomUUID()}`],
  );
  assert.ok(lodgers.id);

  const ctx = await newContext(browser, PHONE);
  const page = await ctx.newPage();
  await signInWithPassword(page, DEMO.steward, DEMO_PASSWORD);
  await page.goto(`/stewards/${meeting.eventId}`);
  await page.getByRole('link', { name: 'Declared interests' }).click();
  await page.waitForURL('**/interests');
  // No statement: refused beside the field, nothing stored.
  await page
    .getByLabel('Boat', { exact: true })
    .selectOption({ label: `#${target.raceNumber} ${target.boatName} (CI)` });
  await page.getByRole('button', { name: 'Declare the interest' }).click();
  await page.locator('[data-field-error="statement"]').waitFor();
  assert.equal((await query('select 1 from official_interests where event_id = $1', [meeting.eventId])).length, 0);
  await page.getByLabel('Statement').fill('I am the crew chief of this boat.');
  await page.getByRole('button', { name: 'Declare the interest' }).click();
  const row = page.getByTestId('interest-register').locator('[data-standing="yes"]');
  await row.waitFor();
  assert.match(await row.innerText(), new RegExp(`${target.boatName}[\\s\\S]*I am the crew chief of this boat\\.`));
  await screenshot(page, 'interest-01-declared');

  await page.goto(`/stewards/${meeting.eventId}/protests/${protestId}`);
  const notice = page.getByTestId('viewer-conflict');
  await notice.waitFor();
  assert.match(
    await notice.innerText(),
    /You have an interest in this protest: another steward of this meeting must accept, hear and decide it\.[\s\S]*You declared an interest in boat .*I am the crew chief of this boat\./,
  );
  assert.equal(await page.getByRole('button', { name: 'Accept the protest' }).count(), 0);
  assert.equal(await page.getByRole('button', { name: 'Record the decision' }).count(), 0);
  await screenshot(page, 'interest-02-protest-refused');
  await ctx.close();
});
