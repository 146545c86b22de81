// At the dock on a phone: the boat's engine carries a register seal applied at an earlier
// inspection; the form lists it to be checked, the scrutineer marks it broken, and the verdict
// shows the finding on its own line with the caution that officials decide. That a broken
// scrutineering seal means the component is no longer in its verified state is common practice,
// no source. The meeting, boat, engine and seal numbers are invented for this test.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { HttpSession } from '../support/http-session';
import { InspectionMeeting, inspectionBody, rulesWith } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('dock: a seal on the boat is listed, checked as broken, and the verdict shows the finding', async () => {
  const meeting = await new InspectionMeeting().create(`Seal Dock Meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('SDK', rulesWith());
  const entry = await meeting.addEntry(classId);
  const [{ id: scrutineerId }] = await query<{ id: string }>('select id from users where email = $1', [
    DEMO.scrutineer,
  ]);
  const serial = `SN-${randomBytes(3).toString('hex')}`;
  const [engine] = await query<{ id: string }>(
    `insert into boat_components (kind, maker, model, serial_number, boat_id, created_by_id)
     values ('engine', 'Test Motor Works', 'TM-4', $1, $2, $3) returning id`,
    [serial, entry.boatId, scrutineerId],
  );
  const prefix = `B${randomBytes(3).toString('hex').toUpperCase()}-`;
  const batch = await meeting.organiser.json(`/api/events/${meeting.eventId}/seal-batches`, {
    prefix,
    firstNumber: 1,
    lastNumber: 3,
  });
  assert.equal(batch.res.status, 201, JSON.stringify(batch.body));
  const number = `${prefix}1`;
  // Applied at an earlier inspection (through the API, as the dock sends it).
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const applied = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(entry.id, 101.5, {
      capturedAt: new Date(Date.now() - 3_600_000).toISOString(),
      seals: { applied: [{ number, componentId: engine.id, position: 'rocker cover' }] },
    }),
  );
  assert.equal(applied.res.status, 201, JSON.stringify(applied.body));

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('inspection-form').waitFor();
  // The card and the form both name the seal on the engine.
  await page.getByTestId('card-seals').locator(`[data-seal="${number}"]`).waitFor();
  const sealBox = page.getByTestId('dock-seals').locator(`[data-seal="${number}"]`);
  assert.match(
    await sealBox.innerText(),
    new RegExp(`Seal ${number} on the engine Test Motor Works TM-4, serial ${serial}`),
  );

  for (const [i, d] of [101.5, 101.6, 101.7].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  await page.getByLabel('I know U (type it)').check();
  await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
  await page.getByLabel('Power evidence seen').selectOption('maker_rating');
  await page.getByLabel('Helmet — present and working').check();
  await sealBox.getByLabel('Broken').check();
  await page.getByTestId('record-inspection').click();

  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="verdict"]')?.getAttribute('data-provisional') === 'false',
  );
  assert.equal(await verdict.getAttribute('data-overall'), 'does_not_conform');
  const line = verdict.locator(`[data-rule="seal:${number}"]`);
  assert.equal(await line.getAttribute('data-verdict'), 'does_not_conform');
  assert.match(await line.innerText(), new RegExp(`Seal ${number} on the engine .* was found broken`));
  assert.match(await verdict.getByTestId('verdict-power-evidence').innerText(), /Maker’s rating/);
  assert.ok(await verdict.getByRole('note').isVisible(), 'the safety caution beside the verdict');
  await screenshot(page, 'seals-dock-broken');

  const events = await query<{ action: string }>(
    `select e.action from seal_events e join seals s on s.id = e.seal_id where s.number = $1 order by e.created_at`,
    [number],
  );
  assert.deepEqual(
    events.map((e) => e.action),
    ['applied', 'broken'],
  );
  await context.close();
});
