// Issue 13, item 8: figures are rounded to what their measurement supports, on the phone at the
// dock (boat card, pre-filled power field) and in the organiser's entries CSV. A power declared as
// 530 hp is stored in kW at full precision: 530 × 745.69987158227022 W (NIST SP 811 Appendix B.8)
// = 395.22093193860326 kW, shown as 395.2 kW (0.1 kW, lib/core/format/figures.ts).
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

const HP_530_KW = (530 * 745.69987158227022) / 1000; // NIST SP 811 Appendix B.8

test('dock on a phone: a power declared in hp shows and pre-fills as 395.2 kW; the CSV carries 395.2', async () => {
  const meeting = await new InspectionMeeting().create(`Figures ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('FG', rulesWith());
  const entry = await meeting.addEntry(classId, { declaredPowerKw: HP_530_KW });

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('boat-name').filter({ hasText: entry.boatName }).waitFor();
  const card = await page.getByTestId('boat-card').innerText();
  assert.doesNotMatch(card, /395\.22/, 'no conversion digits on the card');
  assert.equal((await page.getByTestId('card-power').innerText()).trim(), '395.2 kW declared');
  assert.equal((await page.getByTestId('card-nozzle').innerText()).trim(), '101.50 mm declared');
  const power = page.getByLabel('Power, as declared or as the evidence shows');
  assert.equal(await power.inputValue(), '395.2', 'the field is pre-filled as the card shows it');
  assert.match(await page.locator('#f-power-declaredKw-hint').innerText(), /Declared by the entrant: 395\.2 kW/);
  await screenshot(page, 'figures-01-dock-card');
  await context.close();

  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/entries/export`);
  assert.equal(res.status, 200);
  const csv = await res.text();
  assert.doesNotMatch(csv, /395\.22/);
  const [header, row] = csv.trim().split('\r\n');
  const cells = Object.fromEntries(header.split(',').map((h, i) => [h, row.split(',')[i]]));
  assert.equal(cells.declared_power_kw, '395.2');
});
