// Issue 16, items 4 and 5, in the class rules editor: the organiser chooses how the nozzle limits are
// checked (the explanation of a plug gauge against two-point readings is beside the choice), adds a
// measured item of the class's own (engine capacity from bore and stroke), sees a refusal beside the
// field, and saves. ISO 14405-1:2016 distinguishes the two-point size from the inscribed size a plug
// gauge tests; the figures here are invented.
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

test('rules editor on a phone: gauge method explained, an engine capacity item added, refused without a limit, then saved', async () => {
  const meeting = await new InspectionMeeting().create(`Rules items ${Date.now()}`, []);
  const classId = await meeting.addClass('RI', rulesWith(), { publish: false });
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/organise/events/${meeting.eventId}/classes/${classId}`);

  const method = page.getByTestId('nozzle-method');
  await method.waitFor();
  assert.match(await method.getByTestId('gauge-explanation').innerText(), /oval exit .* passes the gauge check/);
  await method.getByLabel(/^Both must pass/).check();
  await method.getByLabel('No-go plug gauge (against the maximum)').fill('102');

  const items = page.getByTestId('measured-items');
  await items.getByRole('button', { name: 'Add a measured item' }).click();
  const item = items.getByTestId('measured-item');
  await item.waitFor();
  await item.getByLabel('Name', { exact: true }).fill('Engine capacity');
  await item.getByLabel('Key', { exact: true }).fill('engine_capacity');
  await item.getByLabel('Value from').selectOption('engine_capacity');
  await item.getByLabel('Cylinders').fill('4');
  await item.getByLabel(/^Default expanded uncertainty/).fill('5');
  await item.getByLabel('Caliper', { exact: true }).check();
  const save = page.getByRole('button', { name: /Save draft v1/ });
  await save.click();
  // No maximum or minimum: refused, the message beside the item's field, nothing saved.
  await item.getByText('Set a maximum or a minimum (or both).').waitFor();

  await item.getByLabel(/^Maximum/).fill('2000');
  await save.click();
  await page.getByText('Draft v1 saved.').waitFor();
  const { body } = await meeting.organiser
    .fetch(`/api/events/${meeting.eventId}/classes/${classId}/rules`)
    .then(async (r) => ({ body: await r.json() }));
  const rules = body.data.versions[0].rules;
  assert.equal(rules.nozzle.checkMethod, 'both');
  assert.equal(rules.nozzle.gaugeNoGoMm, 102);
  assert.deepEqual(rules.measuredItems, [
    {
      key: 'engine_capacity',
      label: 'Engine capacity',
      unit: 'cm³',
      minimum: null,
      maximum: 2000,
      readings: 1,
      instrumentTypes: ['caliper'],
      decisionRule: null,
      defaultUncertainty: 5,
      note: '',
      formula: { kind: 'engine_capacity', cylinders: 4 },
    },
  ]);
  // Saving again keeps the item (the form always sends what the editor holds).
  await page.reload();
  await page.getByTestId('measured-item').waitFor();
  assert.equal(
    await page.getByTestId('measured-item').getByLabel('Key', { exact: true }).inputValue(),
    'engine_capacity',
  );
  const widths = await page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
  assert.ok(widths[0] <= widths[1], `page ${widths[0]} px wide in a ${widths[1]} px window`);
  await screenshot(page, 'rules-measured-items');
  await context.close();
});
