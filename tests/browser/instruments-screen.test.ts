// Issue 13, item 2: a screen for the meeting's measuring instruments. On a phone the chief
// scrutineer opens it from the board, adds a caliper and sees its U; the dock then offers
// "From the instrument used" with it; once retired, the dock no longer offers it.
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

test('chief scrutineer on a phone lists, adds and retires instruments; the dock follows', async () => {
  const meeting = await new InspectionMeeting().create(`Instrument screen ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('IS', rulesWith());
  const entry = await meeting.addEntry(classId);
  const name = `Caliper ${Date.now().toString(36)}`;

  const chiefCtx = await newContext(browser, PHONE);
  const chief = await chiefCtx.newPage();
  await signInWithPassword(chief, DEMO.chief, DEMO_PASSWORD);
  await chief.goto(`/inspect/${meeting.eventId}/board`);
  await chief.getByRole('link', { name: 'Instruments' }).click();
  await chief.waitForURL(`**/inspect/${meeting.eventId}/instruments`);
  await chief.getByRole('heading', { name: 'Measuring instruments' }).waitFor();
  await chief.getByText('None yet').waitFor();
  await chief.getByLabel('Name').fill(name);
  await chief.getByLabel('What it measures').selectOption('length');
  await chief.getByLabel('Error limit a').fill('0.02');
  await chief.getByLabel('Resolution δ').fill('0.01');
  await chief.getByRole('button', { name: 'Add the instrument' }).click();
  const listed = chief.getByTestId('instruments-in-service').locator('li', { hasText: name });
  await listed.waitFor();
  // U = 2·√(a²/3 + δ²/12) = 0.0238 mm for a 0.02 mm, δ 0.01 mm (JCGM 100:2008, k = 2), shown to 0.001 mm.
  assert.match(await listed.innerText(), /U 0\.024 mm/);
  const width = await chief.evaluate(() => document.documentElement.scrollWidth);
  assert.ok(width <= 390, `the screen fits a phone (${width} px wide)`);
  await screenshot(chief, 'instruments-01-added');

  // The dock now offers the instrument.
  const dockCtx = await newContext(browser, PHONE);
  const dock = await dockCtx.newPage();
  await signInWithPassword(dock, DEMO.scrutineer, DEMO_PASSWORD);
  await dock.goto(`/inspect/${meeting.eventId}`);
  // The page streams behind its loading boundary: wait for its heading before looking for the link.
  await dock.getByRole('heading', { level: 1 }).waitFor();
  assert.ok(await dock.getByRole('link', { name: 'Instruments' }).isVisible(), 'linked from the dock');
  await dock.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await dock.getByRole('button', { name: 'Find', exact: true }).click();
  await dock.getByTestId('inspection-form').waitFor();
  assert.equal(await dock.getByLabel('From the instrument used').isEnabled(), true);
  assert.ok(
    (await dock.getByLabel('Instrument used', { exact: true }).locator('option').allInnerTexts()).some((t) =>
      t.startsWith(name),
    ),
  );

  // Retired: kept in the list as retired, no longer offered at the dock.
  await listed.getByRole('button', { name: 'Retire…' }).click();
  await listed.getByRole('button', { name: 'Yes, retire it' }).click();
  await chief.getByTestId('instruments-retired').locator('li', { hasText: name }).waitFor();
  assert.equal(await chief.getByTestId('instruments-in-service').count(), 0);
  await screenshot(chief, 'instruments-02-retired');

  await dock.goto(`/inspect/${meeting.eventId}`);
  await dock.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await dock.getByRole('button', { name: 'Find', exact: true }).click();
  await dock.getByTestId('inspection-form').waitFor();
  assert.equal(
    await dock.getByLabel('From the instrument used').isEnabled(),
    false,
    'a retired instrument is not offered',
  );
  await dock.getByTestId('no-instruments').waitFor();
  await chiefCtx.close();
  await dockCtx.close();
});
