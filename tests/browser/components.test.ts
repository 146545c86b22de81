// Components on a phone: an owner registers an impeller on the boat page (bad input keeps what was
// typed and says what is wrong beside the field; a serial already among the owner's components is refused beside the
// serial), moves it to another boat; a scrutineer at the dock finds the boat by that serial.
// Makers and serials are invented for this test.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { HttpSession } from '../support/http-session';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

let browser: Browser;
const meeting = new InspectionMeeting();
const run = randomBytes(3).toString('hex').toUpperCase();
const ownerEmail = uniqueEmail('comp-browser');
const password = 'components-browser-1';
let boatA: TestEntry;
let boatB: TestEntry;

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`Components Browser ${run}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  const classId = await meeting.addClass(`B${run.slice(0, 3)}`, rulesWith());
  await new HttpSession().json('/api/accounts', { name: 'Component Owner', email: ownerEmail, password });
  boatA = await meeting.addEntry(classId, { ownerEmail });
  boatB = await meeting.addEntry(classId, { ownerEmail });
});
after(async () => {
  await browser?.close();
});

test('register, refuse, move on the boat page; find by serial at the dock', async () => {
  const ctx = await newContext(browser, PHONE);
  const page = await ctx.newPage();
  await signInWithPassword(page, ownerEmail, password);
  await page.goto(`/boats/${boatA.boatId}`);
  const section = page.locator('section[aria-labelledby="components"]');
  await section.getByText('No components registered on this boat yet.').waitFor();
  await section.getByText('Register a component').click();
  const form = page.getByRole('form', { name: 'Register a component' });
  await form.getByLabel('Maker').fill('Kestrel Foundry');
  await form.getByLabel('Trim code').fill('T3');
  await form.getByRole('button', { name: 'Register the component' }).click();
  // Nothing typed is lost; the missing serial is named beside its field.
  await form.locator('[data-field-error="serialNumber"]').waitFor();
  assert.equal(await form.getByLabel('Maker').inputValue(), 'Kestrel Foundry');
  await form.getByLabel('Serial number').fill(`BR-${run}`);
  await form.getByRole('button', { name: 'Register the component' }).click();
  await page.getByTestId('component-register-message').getByText(`Registered serial BR-${run}`).waitFor();
  await section.locator(`[data-serial="BR-${run}"]`).waitFor();
  // No sideways scrolling on a phone.
  assert.ok(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1));
  await screenshot(page, 'components-boat-page-phone');

  // The same part registered again on the other boat is refused beside the serial.
  await page.goto(`/boats/${boatB.boatId}`);
  await page.locator('section[aria-labelledby="components"]').getByText('Register a component').click();
  const again = page.getByRole('form', { name: 'Register a component' });
  await again.getByLabel('Maker').fill('Kestrel Foundry');
  await again.getByLabel('Serial number').fill(`br-${run}`);
  await again.getByRole('button', { name: 'Register the component' }).click();
  await again
    .locator('[data-field-error="serialNumber"]')
    .getByText(/already among your components/)
    .waitFor();
  assert.equal(await again.getByLabel('Serial number').inputValue(), `br-${run}`);

  // Moved from boat A to boat B.
  await page.goto(`/boats/${boatA.boatId}`);
  const card = page.locator(`[data-serial="BR-${run}"]`);
  await card.getByText('Move or take off').click();
  await card.getByLabel('Move to').selectOption({ label: boatB.boatName });
  await card.getByRole('button', { name: 'Move', exact: true }).click();
  await page
    .locator('section[aria-labelledby="components"]')
    .getByText('No components registered on this boat yet.')
    .waitFor();
  await page.goto(`/boats/${boatB.boatId}`);
  const moved = page.locator(`[data-serial="BR-${run}"]`);
  await moved.getByText('History (3)').click();
  await moved.getByTestId('component-history').getByText(`Fitted to ${boatB.boatName}`).waitFor();
  await ctx.close();

  // At the dock, the scrutineer types the serial off the impeller.
  const dock = await newContext(browser, PHONE);
  const p = await dock.newPage();
  await signInWithPassword(p, DEMO.scrutineer, DEMO_PASSWORD);
  await p.goto(`/inspect/${meeting.eventId}`);
  await p.getByLabel('Engine, pump or impeller serial').fill(`br-${run}`);
  await p.getByRole('button', { name: 'Find by serial' }).click();
  await p
    .getByTestId('serial-matches')
    .getByText(`Impeller (Kestrel Foundry) serial BR-${run} is on no. ${boatB.raceNumber} ${boatB.boatName}`)
    .waitFor();
  await p.getByTestId('boat-card').getByTestId('boat-name').getByText(boatB.boatName).waitFor();
  // A serial no boat here carries is said beside the field.
  await p.getByLabel('Engine, pump or impeller serial').fill(`NONE-${run}`);
  await p.getByRole('button', { name: 'Find by serial' }).click();
  await p
    .locator('[data-field-error="serial"]')
    .getByText(/No boat entered at this meeting/)
    .waitFor();
  await screenshot(p, 'components-dock-serial-phone');
  await dock.close();
});
