// Issue 13, item 11 (smaller things) and item 12 (publishing progress): the parity report's tables
// follow the unit switch, thrust curves are labelled per boat, a one-boat report says why there is
// no deviation chart, publishing shows progress, the calculator speaks in the form's words, and
// the new-meeting summary points where the errors are.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { HttpSession } from '../support/http-session';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

let browser: Browser;
const meeting = new InspectionMeeting();
let pairClassId = '';
let soloClassId = '';
let pair: TestEntry[] = [];

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`Report Units Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  pairClassId = await meeting.addClass('PR2', rulesWith());
  soloClassId = await meeting.addClass('PR1', rulesWith());
  pair = [await meeting.addEntry(pairClassId), await meeting.addEntry(pairClassId, { declaredPowerKw: 260 })];
  const solo = await meeting.addEntry(soloClassId);
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  // Conforming inspections through the real API (101.9 mm against a 102 mm maximum, U 0.05 mm).
  for (const [e, largest] of [
    [pair[0], 101.9],
    [pair[1], 101.6],
    [solo, 101.9],
  ] as const) {
    const { res, body } = await scrutineer.json(
      `/api/events/${meeting.eventId}/inspections`,
      inspectionBody(e.id, largest),
    );
    assert.equal(res.status, 201, JSON.stringify(body));
  }
});
after(async () => {
  await browser?.close();
});

async function organiserPage(opts = {}): Promise<Page> {
  const page = await (await newContext(browser, opts)).newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  return page;
}

test('parity report: the unit switch changes the tables as well as the charts; every thrust curve is named', async () => {
  const page = await organiserPage();
  await page.goto(`/organise/events/${meeting.eventId}/classes/${pairClassId}/report`);
  const table = page.getByTestId('per-boat-table');
  await table.waitFor();
  const thrustCell = (e: TestEntry) => table.locator(`tr[data-entry="${e.id}"] [data-col="static-thrust"]`);
  const valueOf = async (e: TestEntry) => Number((await thrustCell(e).innerText()).split(' ')[0]);

  await page.getByLabel('Force unit').selectOption('N');
  const inN = await valueOf(pair[0]);
  assert.match(await page.getByTestId('static-thrust-heading').innerText(), /Static thrust N/);
  await page.getByLabel('Force unit').selectOption('kgf');
  await page.waitForFunction(() =>
    /kgf/.test(document.querySelector('[data-testid="static-thrust-heading"]')?.textContent ?? ''),
  );
  const inKgf = await valueOf(pair[0]);
  // 1 kgf = 9.80665 N exactly (standard gravity; NIST SP 811, 2008, appendix B).
  // Shown to 0.1 kgf from a figure rounded to 1 N: within 0.05 + 0.5 / 9.80665 kgf.
  assert.ok(Math.abs(inKgf - inN / 9.80665) <= 0.11, `${inKgf} kgf for ${inN} N`);
  assert.match(await page.getByTestId('chart-thrust-curves').locator('figcaption').innerText(), /kgf/);
  assert.match(await page.getByTestId('class-figures').innerText(), /kgf/);

  await page.getByLabel('Speed unit').selectOption('m/s');
  const jetMs = await table.locator('thead').innerText();
  assert.match(jetMs, /Jet m\/s/);
  await page.getByLabel('Speed unit').selectOption('km/h');
  assert.match(await table.locator('thead').innerText(), /Jet km\/h/);
  // The class's reference speed of 10 m/s is 36 km/h (km/h = m/s x 3.6, exact by definition; NIST SP 811).
  assert.match(await table.locator('thead').innerText(), /at 36 km\/h/);

  // A legend names each boat's line on the thrust chart.
  const legend = page.getByTestId('chart-thrust-curves');
  for (const e of pair) assert.match(await legend.innerText(), new RegExp(`#${e.raceNumber} ${e.boatName}`));
  await screenshot(page, 'report-units-kgf');
  await page.context().close();
});

test('a one-boat report says so in a sentence instead of drawing an empty deviation chart', async () => {
  const page = await organiserPage(PHONE);
  await page.goto(`/organise/events/${meeting.eventId}/classes/${soloClassId}/report`);
  await page.getByTestId('per-boat-table').waitFor();
  assert.equal(await page.getByTestId('chart-deviation').count(), 0, 'no deviation chart for one boat');
  assert.match(await page.getByTestId('deviation-single').innerText(), /Only one boat/);
  await screenshot(page, 'report-one-boat');
  await page.context().close();
});

test('publishing a report shows progress, disables the button and announces the result', async () => {
  const page = await organiserPage(PHONE);
  await page.goto(`/organise/events/${meeting.eventId}/classes/${pairClassId}/report`);
  // Hold the request for a moment so the pending state can be read reliably (the real one takes seconds).
  await page.route('**/report/publish', async (route) => {
    await new Promise((r) => setTimeout(r, 1_500));
    await route.continue();
  });
  const button = page.getByRole('button', { name: /Publish as version 1/ });
  await button.click();
  const progress = page.getByTestId('publish-progress');
  await progress.getByRole('progressbar').waitFor();
  assert.match(await progress.innerText(), /Publishing version 1/);
  assert.equal(await progress.getAttribute('aria-live'), 'polite');
  assert.ok(
    await page.getByRole('button', { name: 'Publishing…' }).isDisabled(),
    'the button is disabled while publishing',
  );
  await screenshot(page, 'report-publishing');
  // The page has other forms with their own messages: read the publish form's.
  const message = page.locator('form').filter({ has: progress }).getByTestId('form-message');
  await message.filter({ hasText: /\S/ }).waitFor({ timeout: 60_000 });
  assert.match(await message.innerText(), /Version 1 published/);
  assert.equal(await message.getAttribute('aria-live'), 'polite', 'the result is announced');
  assert.equal(await progress.getByRole('progressbar').count(), 0, 'the progress is gone when done');
  await page.context().close();
});

test('calculator: messages name the field as the form labels it; temperature range as the hint says; text in a number field', async () => {
  const page = await (await newContext(browser, PHONE)).newPage();
  await page.goto('/calculator');
  const a = page.getByRole('group', { name: 'Set-up 1' });
  const power = a.getByLabel('Shaft power', { exact: true });
  const errorOf = (id: string | null) => page.locator(`[data-field-error="${id}"]`);
  await power.fill('-5');
  await errorOf(await power.getAttribute('id'))
    .filter({ hasText: 'Shaft power must be greater than 0.' })
    .waitFor();
  await power.fill('abc');
  await errorOf(await power.getAttribute('id'))
    .filter({ hasText: 'Shaft power must be a number, for example 250.' })
    .waitFor();
  await power.fill('250');

  const temperature = a.getByLabel('Water temperature', { exact: true });
  const hint = await page.locator(`[id="${await temperature.getAttribute('id')}-hint"]`).innerText();
  assert.match(hint, /10–25 °C/);
  await temperature.fill('40');
  const tError = errorOf(await temperature.getAttribute('id'));
  await tError.waitFor();
  // The ITTC fresh-water table (ITTC procedure 7.5-02-01-03, 2011 [memory]) is held for 10–25 °C in lib/core/engine/water.ts (ITTC_TEMPERATURE_RANGE_C).
  assert.equal(
    await tError.innerText(),
    'Water temperature must be between 10 and 25 °C (the ITTC water table); for colder or warmer water, enter a density override.',
  );
  await temperature.fill('25');
  await page.waitForFunction(
    (id) => !document.querySelector(`[data-field-error="${id}"]`),
    await temperature.getAttribute('id'),
  );
  await screenshot(page, 'calculator-messages');
  await page.context().close();
});

test('new meeting: the summary points up to the fields marked above it', async () => {
  const page = await organiserPage(PHONE);
  await page.goto('/organise/events/new');
  await page.getByLabel('Meeting name').fill('');
  await page.getByRole('button', { name: 'Create meeting' }).click();
  const message = page.getByTestId('form-message');
  await page.waitForFunction(() => (document.querySelector('[data-testid="form-message"]')?.textContent ?? '') !== '');
  const text = await message.innerText();
  assert.doesNotMatch(text, /below/);
  const firstError = page.locator('[data-field-error]').first();
  const [e, m] = [await firstError.boundingBox(), await message.boundingBox()];
  assert.ok(e && m && e.y < m.y, 'the errors are above the summary');
  assert.match(text, /above/);
  await page.context().close();
});
