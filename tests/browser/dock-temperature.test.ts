// Issue 16, item 2: at the dock on a phone the scrutineer records the nozzle's temperature with the
// instrument at the same temperature, and the verdict shows the nozzle's uncertainty budget as a table.
// Worked case (ISO 1:2022 reference 20 °C; aluminium 23e-6 /K and steel 11.5e-6 /K [memory]): both at
// 35 °C reading 102.000 mm give 101.982 mm; with U typed 0.05 mm the budget gives U = 0.050215 mm
// (JCGM 100:2008, 5.1.2; hand computation in tests/unit/core/engine/measurement-thermal.test.ts).
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

test('dock on a phone: nozzle and caliper at 35 °C, the verdict shows the budget table with U 0.0502 mm', async () => {
  const meeting = await new InspectionMeeting().create(`Temperature ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass(
    'TB',
    rulesWith({ nozzle: { maxMm: 102.03, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
  );
  const entry = await meeting.addEntry(classId);

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('inspection-form').waitFor();
  for (const [i, d] of [101.5, 102, 101.8].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  await page.getByLabel('I know U (type it)').check();
  await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
  await page.getByLabel('Nozzle temperature').fill('35');
  await page.getByLabel('Nozzle material').selectOption('aluminium');
  assert.equal(
    await page.getByTestId('instrument-same-temperature').isChecked(),
    true,
    'same as the nozzle by default',
  );
  await page.getByLabel('Power, as declared or as the evidence shows').fill('220');
  await page.getByLabel('Power evidence seen').selectOption('maker_rating');
  await page.getByLabel('Helmet — present and working').check();
  await page.getByTestId('record-inspection').click();

  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-provisional'), 'false', 'decided by the server');
  const nozzle = verdict.locator('[data-rule="nozzle_max"]');
  assert.equal(await nozzle.getAttribute('data-verdict'), 'inconclusive', '102.03 − 0.050215 < 101.982412');
  assert.match(await nozzle.innerText(), /101\.98/);
  const budget = nozzle.getByTestId('uncertainty-budget');
  await budget.locator('summary').click();
  await budget.getByTestId('budget-u').waitFor();
  assert.equal((await budget.getByTestId('budget-u').innerText()).trim(), '0.0502');
  assert.equal(await budget.locator('[data-budget-term]').count(), 4, 'U typed, t (one reading), α_p, α_i');
  assert.ok(await verdict.getByRole('note').first().isVisible(), 'the safety caution is shown with the verdict');
  // Phone-sized: the table scrolls inside its box; the page itself does not grow sideways.
  const widths = await page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
  assert.ok(widths[0] <= widths[1], `page ${widths[0]} px wide in a ${widths[1]} px window`);
  await budget.scrollIntoViewIfNeeded();
  await screenshot(page, 'dock-temperature-budget');
  await context.close();
});
