// Journey on phones: the entrant books a scrutineering slot for their entry; the chief scrutineer opens the
// dock queue, sees the boat due, loses the signal, checks it in (saved on the phone), and when the signal
// returns the check-in reaches the server once. The chief scrutineer then records an incident with damage,
// and the list says the boat must be inspected again before its next run; the start list holds it with that
// reason until the organiser records a decision (common practice, no source). Last, the meeting allows several
// classes per boat: the boat, entered in a second class, is recorded at the dock under each class's rules.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import {
  launchBrowser,
  newContext,
  screenshot,
  signInWithPassword,
  PHONE,
  waitForOfflineCopy,
} from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, rulesWith } from '../support/inspection-meeting';
import { waitForDockForm } from '../support/dock-record';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('slot booked by the entrant, checked in offline at the dock, incident forcing re-inspection', async () => {
  const meeting = new InspectionMeeting();
  await meeting.create(`Queue Journey ${Date.now()}`, [{ email: DEMO.chief, role: 'chief_scrutineer' }]);
  await query(
    `update events set time_zone = 'UTC', starts_on = current_date - 1, ends_on = current_date + 1 where id = $1`,
    [meeting.eventId],
  );
  const classId = await meeting.addClass('QJ', rulesWith());
  const entry = await meeting.addEntry(classId);
  const [{ id: chiefId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.chief]);
  // A slot starting in five minutes (its opening through the API and the form is tested in slots.test.ts).
  const [{ id: slotId }] = await query<{ id: string }>(
    `insert into inspection_slots (event_id, class_id, bay, starts_at, ends_at, capacity, grace_minutes, created_by_id)
     values ($1, $2, 'Bay Q', now() + interval '5 minutes', now() + interval '25 minutes', 2, 10, $3) returning id`,
    [meeting.eventId, classId, chiefId],
  );

  // The entrant books it from My entries.
  const pits = await newContext(browser, PHONE);
  const ep = await pits.newPage();
  await signInWithPassword(ep, DEMO.entrant, DEMO_PASSWORD);
  await ep.goto('/entries');
  await ep.locator(`[data-entry-id="${entry.id}"]`).getByRole('link', { name: 'Scrutineering slot' }).click();
  await ep.getByTestId('current-slot').filter({ hasText: 'No slot booked yet' }).waitFor();
  await ep.getByRole('radio', { name: /Bay Q/ }).check();
  await ep.getByRole('button', { name: 'Book' }).click();
  await ep.getByTestId('current-slot').filter({ hasText: 'Booked: Bay Q' }).waitFor();
  await screenshot(ep, 'queue-01-entrant-booked');
  await pits.close();
  const [booking] = await query<{ slot_id: string }>('select slot_id from slot_bookings where entry_id = $1', [
    entry.id,
  ]);
  assert.equal(booking.slot_id, slotId);

  // The chief scrutineer's phone at the dock.
  const dock = await newContext(browser, PHONE);
  const page = await dock.newPage();
  await signInWithPassword(page, DEMO.chief, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}/board`);
  await page.getByRole('link', { name: 'Dock queue' }).click();
  await page.waitForURL('**/queue');
  const row = page.locator(`[data-entry="${entry.id}"]`);
  await row.waitFor();
  assert.equal(await row.getAttribute('data-status'), 'upcoming');
  assert.match(await row.innerText(), /Bay Q[\s\S]*Not yet due/);
  assert.match(await page.getByRole('note').innerText(), /licensed officials/);

  // The dock's service worker has kept this page (we came by a link, so it may not control it yet).
  await waitForOfflineCopy(page);
  await dock.setOffline(true);
  await row.getByRole('button', { name: `Check in no. ${entry.raceNumber}` }).click();
  await page.locator(`[data-entry="${entry.id}"][data-status="arrived"]`).waitFor();
  await page.getByTestId('queue-message').filter({ hasText: '1 check-in(s) waiting to be sent' }).waitFor();
  // Reload with no signal: the page comes from the phone, with the saved queue and the waiting check-in.
  const reloaded = await page.reload();
  assert.equal(reloaded?.headers()['x-served-from'], 'cache', 'the page came from the phone, not the network');
  await page.getByTestId('queue-saved-copy').waitFor();
  await page.locator(`[data-entry="${entry.id}"][data-status="arrived"]`).waitFor();
  await page.getByTestId('queue-message').filter({ hasText: '1 check-in(s) waiting to be sent' }).waitFor();
  await screenshot(page, 'queue-02-offline-checked-in');
  assert.equal(
    (await query('select id from slot_arrivals where entry_id = $1', [entry.id])).length,
    0,
    'nothing reached the server while offline',
  );
  await dock.setOffline(false);
  await page.waitForFunction(
    () => !document.querySelector('[data-testid="queue-message"]')?.textContent?.includes('waiting to be sent'),
    undefined,
    { timeout: 45_000 },
  );
  // Sent once; a reload (which sends the phone's outbox again) stores nothing more.
  await page.reload();
  await page.locator(`[data-entry="${entry.id}"][data-status="arrived"]`).waitFor();
  const arrivals = await query<{ booking_id: string | null }>(
    'select booking_id from slot_arrivals where entry_id = $1',
    [entry.id],
  );
  assert.equal(arrivals.length, 1);
  assert.ok(arrivals[0].booking_id, 'checked in against the booking, not as a walk-in');

  // An incident with damage, recorded on the same phone.
  await page.goto(`/inspect/${meeting.eventId}/incidents`);
  await page.getByLabel('Boat', { exact: true }).selectOption(entry.id);
  const local = new Date(Date.now() - 10 * 60_000).toISOString().slice(0, 16); // the meeting is on UTC
  await page.getByLabel('When (UTC)').fill(local);
  await page.getByLabel('What happened').fill('Hit the pontoon leaving the dock; transom cracked.');
  await page.getByLabel(/Damaged: inspect again/).check();
  await page.getByRole('button', { name: 'Record the incident' }).click();
  await page.getByText('Incident recorded. The boat must be inspected again before its next run.').waitFor();
  const item = page.getByTestId('incident-list').locator('li').first();
  await item.getByTestId('incident-reinspection').waitFor();
  assert.match(await item.innerText(), /transom cracked[\s\S]*must be inspected again before its next run/);
  await screenshot(page, 'queue-03-incident');
  const tasks = await query<{ reason: string }>(
    'select reason from reinspections where entry_id = $1 and done_at is null',
    [entry.id],
  );
  assert.equal(tasks.length, 1);
  assert.match(tasks[0].reason, /transom cracked/);

  // The start list (no pass, no start): the damaged boat is held today, with the incident as the reason.
  await page.goto(`/inspect/${meeting.eventId}/board`);
  await page.getByRole('link', { name: 'Start list' }).click();
  const held = page.locator(`[data-race="${entry.raceNumber}"]`);
  await held.waitFor();
  assert.equal(await held.getAttribute('data-may-start'), 'no');
  assert.match(await held.innerText(), /Not inspected[\s\S]*Re-inspection required: .*transom cracked/);
  assert.match(await page.locator('main').innerText(), /licensed officials decide who starts/);
  await screenshot(page, 'queue-04-start-list-held');
  await dock.close();

  // The organiser lets it start for today with a recorded reason (the chief scrutineer has no such form).
  const office = await newContext(browser, PHONE);
  const op = await office.newPage();
  await signInWithPassword(op, DEMO.organiser, DEMO_PASSWORD);
  await op.goto(`/inspect/${meeting.eventId}/start-list`);
  await op.getByLabel('Boat').selectOption(entry.id);
  await op.getByLabel('May start').check();
  await op.getByLabel('Reason').fill('Transom repaired and seen by the chief scrutineer at the crane');
  await op.getByRole('button', { name: 'Record the decision' }).click();
  const allowed = op.locator(`[data-race="${entry.raceNumber}"][data-may-start="yes"]`);
  await allowed.waitFor();
  assert.match(await allowed.innerText(), /Organiser: may start, “Transom repaired/);
  await screenshot(op, 'queue-05-start-list-organiser');
  await office.close();

  // The meeting allows several classes per boat: the same boat is entered in a second class (narrower nozzle
  // limit), keeping its number. At the dock the chief scrutineer records it under each class in turn; each
  // verdict is judged by that class's limit (ISO 14253-1:2017: 101.8 mm with U = 0.05 mm conforms to at most
  // 102 mm and, beyond 101.6 mm + U, does not conform to at most 101.6 mm).
  const narrow = await meeting.addClass(
    'QK',
    rulesWith({ nozzle: { maxMm: 101.6, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
  );
  await query('update events set several_classes_per_boat = true where id = $1', [meeting.eventId]);
  const [second] = await query<{ id: string }>(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency, paid_at)
     select event_id, $2, boat_id, entrant_id, race_number, 'entered', fee_minor, currency, now() from entries where id = $1
     returning id`,
    [entry.id, narrow],
  );
  const dock2 = await newContext(browser, PHONE);
  const dp = await dock2.newPage();
  await signInWithPassword(dp, DEMO.chief, DEMO_PASSWORD);
  await dp.goto(`/inspect/${meeting.eventId}?race=${entry.raceNumber}`);
  const switcher = dp.getByTestId('class-switcher');
  await switcher.filter({ hasText: 'this card is QJ' }).waitFor();
  const fill = async () => {
    await waitForDockForm(dp);
    for (const [i, d] of [101.5, 101.8, 101.7].entries())
      await dp.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
    await dp.getByLabel('I know U (type it)').check();
    await dp.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
    await dp.getByLabel('Power, as declared or as the evidence shows').fill('220');
    await dp.getByLabel('Power evidence seen').selectOption('maker_rating');
    await dp.getByLabel(/Helmet — present and working/).check();
    await dp.getByTestId('record-inspection').click();
  };
  await fill();
  await dp.locator('[data-testid="verdict"][data-provisional="false"][data-overall="conforms"]').waitFor();
  // After the verdict, the boat's other class is offered while it is still at the dock.
  await switcher.getByRole('button', { name: /Inspect under QK \(not inspected yet\)/ }).click();
  await switcher.filter({ hasText: 'this card is QK' }).waitFor();
  await fill();
  await dp.locator('[data-testid="verdict"][data-provisional="false"][data-overall="does_not_conform"]').waitFor();
  await screenshot(dp, 'queue-06-second-class-verdict');
  const records = await query<{ entry_id: string; overall_result: string }>(
    'select entry_id, overall_result from inspections where boat_id = $1 order by received_at',
    [entry.boatId],
  );
  assert.deepEqual(
    records.map((r) => [r.entry_id, r.overall_result]),
    [
      [entry.id, 'conforms'],
      [second.id, 'does_not_conform'],
    ],
  );
  await dock2.close();
});
