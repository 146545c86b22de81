// Declared engine and pump curves on a phone: the owner types an engine curve one point a line, is told
// beside the box which point is wrong (nothing typed is lost), fixes it, picks an impeller from the
// meeting's catalogue, and sees the declaration's new version. Curves and names are invented for this test.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { HttpSession } from '../support/http-session';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { query } from '../support/db';

let browser: Browser;
const meeting = new InspectionMeeting();
const run = randomBytes(3).toString('hex').toUpperCase();
const ownerEmail = uniqueEmail('curves-browser');
const password = 'curves-browser-1';
let boat: TestEntry;

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`Curves Browser ${run}`, []);
  const classId = await meeting.addClass(`C${run.slice(0, 3)}`, rulesWith());
  await new HttpSession().json('/api/accounts', { name: 'Curve Owner', email: ownerEmail, password });
  boat = await meeting.addEntry(classId, { ownerEmail });
  const added = await meeting.organiser.json(`/api/events/${meeting.eventId}/pump-catalogue`, {
    maker: `Invented Jets ${run}`,
    model: 'Mixed 212',
    trimCode: 'T3',
    impellerDiameterMm: 212,
    curve: [
      { flowCoefficient: 0.08, headCoefficient: 6, efficiency: 0.8 },
      { flowCoefficient: 0.16, headCoefficient: 5.5, efficiency: 0.85 },
    ],
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
});
after(async () => {
  await browser?.close();
});

const clubOf = async (eventId: string) =>
  (
    await query<{ name: string }>(
      'select o.name from events e join organisations o on o.id = e.organisation_id where e.id = $1',
      [eventId],
    )
  )[0].name;

test('an owner declares the engine curve and a catalogue impeller on a phone', async () => {
  const ctx = await newContext(browser, PHONE);
  const page = await ctx.newPage();
  await signInWithPassword(page, ownerEmail, password);
  await page.goto(`/boats/${boat.boatId}`);
  const section = page.locator('section[aria-labelledby="curves"]');
  await section.getByTestId('declared-performance').getByText('(none)').waitFor();
  await section.getByText('Declare the curves').click();
  const form = page.getByRole('form', { name: 'Engine and pump curves' });
  await form.getByLabel('Engine power').selectOption('points');
  // rpm must increase: the second point goes back down.
  await form.getByLabel('Engine curve').fill('6000 280\n5000 220\n7000 300');
  await form.getByLabel('Jet pump').selectOption('catalogue');
  await form.getByLabel('Impeller').selectOption({
    // Each impeller names its meeting and the club running it (two meetings may share a name).
    label: `Invented Jets ${run} Mixed 212 trim T3, 212 mm (Curves Browser ${run}, ${await clubOf(meeting.eventId)})`,
  });
  await form.getByRole('button', { name: 'Save the curves' }).click();
  await form
    .locator('[data-field-error="engine.curve"]')
    .getByText(/^Point 2: rpm must increase/)
    .waitFor();
  assert.equal(await form.getByLabel('Engine curve').inputValue(), '6000 280\n5000 220\n7000 300');
  // axe-core (WCAG 2.2 AA tags) on the open form with its error showing.
  await expectNoSeriousA11yViolations(page, 'boat page, curves form with an error');

  await form.getByLabel('Engine curve').fill('5000 220\n6000 280\n7000 300');
  await form.getByRole('button', { name: 'Save the curves' }).click();
  await page.getByTestId('performance-message').getByText('Saved; the declaration has a new version.').waitFor();
  await section
    .getByTestId('declared-performance')
    .getByText(`engine curve 3 points to 7000 rpm, pump Invented Jets ${run} Mixed 212 trim T3`)
    .waitFor();
  await page
    .getByTestId('declaration-versions')
    .getByText(/engine and pump curves \(none\) →/)
    .waitFor({ state: 'attached' });
  // No sideways scrolling on a phone.
  assert.ok(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1));
  await screenshot(page, 'declared-curves-phone');
  await ctx.close();
});

test('the organiser adds an impeller to the meeting’s catalogue on a phone; a bad curve line is named', async () => {
  const ctx = await newContext(browser, PHONE);
  const page = await ctx.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/organise/events/${meeting.eventId}`);
  const form = page.getByRole('form', { name: 'Add an impeller to the catalogue' });
  await form.getByLabel('Maker').fill(`Phone Jets ${run}`);
  await form.getByLabel('Impeller model').fill('Axial 180');
  await form.getByLabel('Impeller diameter').fill('180');
  await form.getByLabel('Pump curve').fill('0.1 5 0.8\n0.2 four 0.9');
  await form.getByRole('button', { name: 'Add to the catalogue' }).click();
  await form.locator('[data-field-error="curve"]').getByText('Line 2:', { exact: false }).waitFor();
  assert.equal(await form.getByLabel('Maker').inputValue(), `Phone Jets ${run}`);
  await form.getByLabel('Pump curve').fill('0.1 5 0.8\n0.2 4 0.9');
  await form.getByRole('button', { name: 'Add to the catalogue' }).click();
  await page.getByTestId('catalogue-message').getByText('Added to the catalogue').waitFor();
  await page.getByTestId('pump-catalogue').getByText(`Phone Jets ${run} Axial 180`).waitFor();
  assert.ok(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1));
  await expectNoSeriousA11yViolations(page, 'organiser meeting page with the pump catalogue');
  await ctx.close();
});
