// A phone-sized journey through crew and dated gear (issue 21, items 1 and 2): the entrant names a
// driver with a helmet dated yesterday in the meeting's zone and sees it called expired; a navigator of
// 15 without a guardian's consent is refused beside the consent field; at the dock the scrutineer
// confirms each item and the expired helmet stays a finding, with the safety caution, and signs the
// driver on for the day; the chief
// scrutineer's board lists the boat before it arrives. The day rule (valid through the end of its date in
// the meeting's zone) and 18 as the age of consent are common practice, no source. Pacific/Kiritimati is
// UTC+14:00 (IANA tz database). Accessibility: axe-core with WCAG 2.2 A/AA rules (tests/support/a11y.ts).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, PHONE, screenshot, signInWithPassword } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const ZONE = 'Pacific/Kiritimati';
const dayInZone = (offsetDays = 0) =>
  new Intl.DateTimeFormat('en-CA', { timeZone: ZONE }).format(new Date(Date.now() + offsetDays * 86_400_000));
const yearsBefore = (day: string, years: number) => `${Number(day.slice(0, 4)) - years}${day.slice(4)}`;

let browser: Browser;
const meeting = new InspectionMeeting();
let entry: TestEntry;
let classId: string;

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`Crew Reach ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.chief, role: 'chief_scrutineer' },
  ]);
  await query('update events set starts_on = $2, ends_on = $3, time_zone = $4 where id = $1', [
    meeting.eventId,
    dayInZone(-1),
    dayInZone(1),
    ZONE,
  ]);
  classId = await meeting.addClass('CG', rulesWith({ safetyItems: ['helmet'] }));
  entry = await meeting.addEntry(classId);
});
after(async () => {
  await browser?.close();
});

test('entrant, dock and board: crew and dated gear on a phone', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.entrant, DEMO_PASSWORD);
  await page.goto('/entries');
  const card = page.locator(`li[data-entry-id="${entry.id}"]`);
  await card.getByTestId('crew-findings').waitFor();
  assert.match((await card.getByTestId('crew-findings').textContent()) ?? '', /No driver is named/);
  await card.getByText('Change the crew and gear').click();
  const person = card.getByTestId('crew-member').first();
  await person.getByLabel('Name').fill('Rua Tester');
  await person.getByLabel('Date of birth').fill(yearsBefore(dayInZone(-1), 30));
  await person.getByLabel('Licence issued by').fill('Invented Racing Body');
  await person.getByLabel('Licence grade').fill('A');
  await person.getByLabel('Licence number').fill('IRB-5521');
  await person.getByLabel('Licence expires on').fill('2030-12-31');
  await person.getByLabel('Medical certificate expires on').fill('2030-12-31');
  const helmet = person.getByTestId('gear-row').first();
  await helmet.getByLabel('Standard').fill('Invented Std 7');
  await helmet.getByLabel('Serial').fill('HM-BR-1');
  await helmet.getByLabel('Expires on').fill(dayInZone(-1));
  await card.getByRole('button', { name: 'Save the crew and gear' }).click();
  await card.getByTestId('crew-form-message').getByText('Saved').waitFor();
  await card.locator('[data-testid="crew-findings"][data-state="findings"]').waitFor();
  const findings = (await card.getByTestId('crew-findings').textContent()) ?? '';
  assert.match(findings, /helmet HM-BR-1: expires on .*, past/);

  // A navigator of 15 without consent is refused beside the consent field; nothing is lost.
  await card.getByRole('button', { name: 'Add a person' }).click();
  const young = card.getByTestId('crew-member').nth(1);
  await young.getByLabel('Role').selectOption('navigator');
  await young.getByLabel('Name').fill('Tama Tester');
  await young.getByLabel('Date of birth').fill(yearsBefore(dayInZone(-1), 15));
  await young.getByRole('button', { name: 'Remove this item' }).click();
  await card.getByRole('button', { name: 'Save the crew and gear' }).click();
  const refusal = young.locator('.field-error', { hasText: "record a parent's or guardian's consent" });
  await refusal.waitFor();
  assert.equal(await young.getByLabel('Parent or guardian (under 18)').getAttribute('aria-invalid'), 'true');
  const [{ n }] = await query<{ n: string }>('select count(*) as n from entry_crew_members where entry_id = $1', [
    entry.id,
  ]);
  assert.equal(Number(n), 1, 'the refused save stored nothing');
  await expectNoSeriousA11yViolations(page, 'entries with the crew form');
  await screenshot(page, 'crew-entrant-phone');
  await context.close();

  // The dock: the scrutineer confirms the helmet; it is still expired, shown with the caution.
  const dockContext = await newContext(browser, PHONE);
  const dock = await dockContext.newPage();
  await signInWithPassword(dock, DEMO.scrutineer, DEMO_PASSWORD);
  await dock.goto(`/inspect/${meeting.eventId}?race=${entry.raceNumber}`);
  const panel = dock.getByTestId('gear-dock');
  await panel.waitFor();
  assert.match((await panel.getByTestId('gear-dock-findings').textContent()) ?? '', /HM-BR-1/);
  await panel.getByLabel('Seen, as declared').check();
  await panel.getByRole('button', { name: 'Record the gear check' }).click();
  await panel.getByTestId('gear-check-message').getByText('Gear check recorded').waitFor();
  assert.equal(await panel.getByTestId('gear-dock-state').first().textContent(), '✓ seen today');
  assert.equal(await panel.locator('[data-testid="gear-dock-findings"]').getAttribute('data-state'), 'findings');
  assert.match((await panel.getByTestId('gear-dock-caution').textContent()) ?? '', /licensed officials decide/);
  assert.equal(await dock.getByRole('note').count(), 1, 'one safety caution on the dock screen (the form’s)');
  await panel.getByRole('button', { name: 'Sign Rua Tester on for today' }).click();
  await panel.getByTestId('crew-sign-on').getByText('✓ signed on today').waitFor();
  await expectNoSeriousA11yViolations(dock, 'dock with the gear panel');
  await screenshot(dock, 'crew-dock-phone');
  await dockContext.close();

  // The organiser accepts grade B only in this class: the driver's grade A becomes a finding.
  const orgContext = await newContext(browser, PHONE);
  const org = await orgContext.newPage();
  await signInWithPassword(org, DEMO.organiser, DEMO_PASSWORD);
  await org.goto(`/organise/events/${meeting.eventId}/classes/${classId}`);
  const reqs = org.getByTestId('crew-requirements-form');
  await reqs.waitFor();
  await reqs.getByLabel('Licence grades accepted').fill('B');
  await reqs.getByRole('button', { name: 'Save the crew requirements' }).click();
  await reqs.getByTestId('crew-requirements-message').getByText('Saved').waitFor();
  await orgContext.close();

  // The chief scrutineer's board lists the boat with the expired helmet.
  const boardContext = await newContext(browser, PHONE);
  const board = await boardContext.newPage();
  await signInWithPassword(board, DEMO.chief, DEMO_PASSWORD);
  await board.goto(`/inspect/${meeting.eventId}/board`);
  const row = board.locator(`[data-testid="crew-board-row"][data-entry-id="${entry.id}"]`);
  await row.waitFor();
  assert.match((await row.textContent()) ?? '', /HM-BR-1/);
  assert.match((await row.textContent()) ?? '', /licence grade A is not accepted here \(accepted: B\)/);
  await boardContext.close();
});
