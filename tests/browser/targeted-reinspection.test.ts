// Issue 13, item 7: targeted re-inspections on a phone at the dock. A protest that asks for the
// nozzle only is re-inspected: only the nozzle is decided and the screen says so (the unweighed
// weight, the unconfirmed power and the unticked helmet are not called inconclusive); each value
// names its kind; a fourth reading gets an angle (180°/n spread); and a full inspection that does
// not conform shows no "measure again" banner under it.
// Reference decisions: the zones of ISO 14253-1:2017 applied to a 102.00 mm limit with U 0.05 mm:
// 101.93 mm conformity proven, 101.97 mm neither proven (inconclusive).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { HttpSession } from '../support/http-session';
import { query } from '../support/db';
import { InspectionMeeting, rulesWith } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

async function find(page: Page, raceNumber: number) {
  await page.getByLabel('Race number or tag code').fill(String(raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('inspection-form').waitFor();
}

test('a nozzle-only protest re-check decides the nozzle only and says so; value kinds; no contradictory banner', async () => {
  const meeting = await new InspectionMeeting().create(`Targeted re-check ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  // Weight minimum, power band and a helmet, so that a nozzle-only re-check has other checks to leave alone.
  const classId = await meeting.addClass(
    'RC',
    rulesWith({
      weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 },
      power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
    }),
  );
  const protested = await meeting.addEntry(classId);
  const other = await meeting.addEntry(classId);

  // An accepted protest asking for the nozzle only (lodging and paying are tested in the protest
  // tests); the steward orders the re-inspection through the real API.
  const [lodger] = await query<{ id: string }>('select id from users where email = $1', [DEMO.organiser]);
  const [protest] = await query<{ id: string }>(
    `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, requested_checks, status, fee_minor, currency, window_deadline, paid_at)
     values ($1, $2, $3, $4, 'RC 2.1 nozzle maximum', 'The nozzle looks larger than the limit.', '["nozzle_diameter"]'::jsonb, 'accepted', 3000, 'NZD', now() + interval '1 hour', now())
     returning id`,
    [meeting.eventId, lodger.id, protested.id, `entry:${protested.id}:rc 2.1 nozzle maximum`],
  );
  const steward = new HttpSession();
  await steward.signInWithPassword(DEMO.steward, DEMO_PASSWORD);
  const ordered = await steward.json(`/api/protests/${protest.id}/reinspection`, {
    reason: 'Measure the nozzle exit.',
  });
  assert.equal(ordered.res.status, 201, JSON.stringify(ordered.body));

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await find(page, protested.raceNumber);
  assert.match(
    await page.getByTestId('reinspection-scope').innerText(),
    /ordered to check the nozzle exit diameter only/,
  );

  // A fourth reading gets an angle: the spread becomes 180°/4 = 45° (common practice, no source).
  await page.getByRole('button', { name: 'Add a reading' }).click();
  const angles = [];
  for (let i = 1; i <= 4; i++) angles.push(await page.getByLabel(`Reading ${i} angle`).inputValue());
  assert.deepEqual(angles, ['0', '45', '90', '135']);
  for (const [i, d] of [101.5, 101.93, 101.8, 101.7].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  await page.getByLabel('I know U (type it)').check();
  await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
  await screenshot(page, 'reinspection-01-form');
  // Not weighed, no power evidence ticked, helmet not ticked: none of it is part of this re-check.
  await page.getByTestId('record-inspection').click();
  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-provisional'), 'false', 'decided by the server');
  assert.deepEqual(
    await verdict.locator('[data-rule]').evaluateAll((els) => els.map((e) => e.getAttribute('data-rule'))),
    ['nozzle_max'],
  );
  assert.equal(
    await verdict.getAttribute('data-overall'),
    'conforms',
    '101.93 mm: conformity proven (ISO 14253-1:2017)',
  );
  assert.match(await page.getByTestId('verdict-scope').innerText(), /nozzle exit diameter only/);
  assert.equal(
    await verdict.locator('[data-rule="nozzle_max"] [data-value-kind]').innerText(),
    'measured 101.93 mm · ',
  );
  assert.equal(await page.getByTestId('measure-again').count(), 0);
  assert.ok(await verdict.getByRole('note').isVisible(), 'the safety caution is shown with the verdict');
  await screenshot(page, 'reinspection-02-verdict');
  const [stored] = await query<{
    overall_result: string;
    results: { scope: string[] | null; rules: { rule: string }[] };
    done: Date | null;
  }>(
    `select i.overall_result, i.results, r.done_at as done from inspections i join reinspections r on r.inspection_id = i.id where r.protest_id = $1`,
    [protest.id],
  );
  assert.equal(stored.overall_result, 'conforms');
  assert.deepEqual(stored.results.scope, ['nozzle']);
  assert.deepEqual(
    stored.results.rules.map((r) => r.rule),
    ['nozzle_max'],
  );
  assert.ok(stored.done, 'the task is done');

  // A full inspection: nozzle within U of the limit (inconclusive), helmet not ticked (does not
  // conform). Overall "Does not conform", with no "measure again" banner under it; the power
  // without evidence is labelled declared, not measured.
  await page.getByRole('button', { name: 'Next boat' }).click();
  await find(page, other.raceNumber);
  assert.equal(await page.getByTestId('reinspection-scope').count(), 0);
  for (const [i, d] of [101.5, 101.97, 101.8].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  await page.getByLabel('I know U (type it)').check();
  await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
  await page.getByLabel('Weighing 1').fill('690');
  await page.getByLabel('Power, as declared or as the evidence shows').fill('220');
  await page.getByTestId('record-inspection').click();
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-overall'), 'does_not_conform');
  assert.equal(await verdict.locator('[data-rule="nozzle_max"]').getAttribute('data-verdict'), 'inconclusive');
  assert.equal(await page.getByTestId('measure-again').count(), 0, 'no "measure again" under "Does not conform"');
  assert.equal(
    await verdict.locator('[data-rule="power_band"] [data-value-kind]').getAttribute('data-value-kind'),
    'declared',
  );
  assert.match(await verdict.locator('[data-rule="power_band"]').innerText(), /declared 220\.0 kW/);
  assert.equal(
    await verdict.locator('[data-rule="weight_min"] [data-value-kind]').getAttribute('data-value-kind'),
    'measured',
  );
  await screenshot(page, 'reinspection-03-full-does-not-conform');
  await context.close();
});
