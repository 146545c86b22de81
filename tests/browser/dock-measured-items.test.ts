// Issue 16, items 4 and 5, at the dock on a phone: a class with engine capacity (bore and stroke) and
// ballast as its own measured items, and a nozzle rule checked with a no-go plug gauge. The scrutineer
// fills the bore, stroke and weighing and the gauge check; the server's verdict shows each line.
// Reference: V = 4·(π/4)·86²·86 mm³ = 1998.23 cm³ (geometric cylinder volume, common practice, no source);
// class default U 5 cm³ with no instrument: 1998.23 + 5 > 2000, so ISO 14253-1:2017 leaves it inconclusive,
// and with a maximum of 2010 cm³ it is proven inside (1998.23 + 5 < 2010).
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

test('dock on a phone: engine capacity from bore and stroke, ballast and a plug gauge check are recorded and decided', async () => {
  const meeting = await new InspectionMeeting().create(`Class items ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass(
    'CI',
    rulesWith({
      nozzle: {
        maxMm: 102,
        minMm: null,
        minReadings: 3,
        defaultUncertaintyMm: 0.05,
        checkMethod: 'gauge',
        gaugeNoGoMm: 102,
      },
      measuredItems: [
        {
          key: 'engine_capacity',
          label: 'Engine capacity',
          unit: 'cm³',
          maximum: 2010,
          readings: 1,
          instrumentTypes: ['caliper', 'bore_gauge'],
          defaultUncertainty: 5,
          formula: { kind: 'engine_capacity', cylinders: 4 },
        },
        {
          key: 'ballast',
          label: 'Ballast',
          unit: 'kg',
          minimum: 20,
          readings: 1,
          instrumentTypes: ['scale'],
          defaultUncertainty: 0.5,
          formula: { kind: 'direct' },
        },
      ],
    }),
  );
  const entry = await meeting.addEntry(classId);

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('inspection-form').waitFor();
  for (const [i, d] of [101.5, 101.9, 101.8].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  await page.getByLabel('I know U (type it)').check();
  await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');

  const gauge = page.getByTestId('dock-gauge');
  await gauge.waitFor();
  assert.match(await gauge.innerText(), /no-go plug 102 mm must not enter/);
  await gauge.getByLabel('Gauge’s marking or serial').fill('NG-102 serial P-7');
  await gauge.getByLabel('Passed', { exact: true }).check();

  const engine = page.locator('[data-item="engine_capacity"]');
  await engine.waitFor();
  await engine.getByLabel('Bore 1').fill('86');
  await engine.getByLabel('Stroke 1').fill('86');
  const ballast = page.locator('[data-item="ballast"]');
  assert.match(await ballast.innerText(), /minimum 20 kg/);
  await ballast.getByLabel('Reading 1').fill('21.4');

  await page.getByLabel('Power, as declared or as the evidence shows').fill('220');
  await page.getByLabel('Power evidence seen').selectOption('maker_rating');
  await page.getByLabel('Helmet — present and working').check();
  await page.getByTestId('record-inspection').click();

  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-provisional'), 'false', 'decided by the server');
  const capacity = verdict.locator('[data-rule="item:engine_capacity"]');
  assert.equal(await capacity.getAttribute('data-verdict'), 'conforms');
  assert.match(await capacity.innerText(), /1998\.2 cm³/);
  assert.equal(await verdict.locator('[data-rule="item:ballast"]').getAttribute('data-verdict'), 'conforms');
  const plug = verdict.locator('[data-rule="gauge:nozzle"]');
  assert.equal(await plug.getAttribute('data-verdict'), 'conforms');
  assert.match(await plug.innerText(), /NG-102 serial P-7: passed/);
  assert.equal(await verdict.locator('[data-rule="nozzle_max"]').count(), 0, 'the gauge governs this class');
  assert.ok(await verdict.getByRole('note').first().isVisible(), 'the safety caution is shown with the verdict');
  const widths = await page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
  assert.ok(widths[0] <= widths[1], `page ${widths[0]} px wide in a ${widths[1]} px window`);
  await capacity.scrollIntoViewIfNeeded();
  await screenshot(page, 'dock-measured-items');
  await context.close();
});
