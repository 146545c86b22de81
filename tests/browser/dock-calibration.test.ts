// Issue 16, item 1 at the dock, on a phone: an instrument whose calibration certificate is past its
// due date is listed but cannot be chosen, the screen says why and names the usable instrument of the
// same quantity to use instead; it is never preselected. (That an overdue instrument is not used is
// common practice, no source.)
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { HttpSession } from '../support/http-session';
import { InspectionMeeting, rulesWith } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const ZONE = 'Pacific/Auckland';
const dayInZone = (offsetDays: number) =>
  new Intl.DateTimeFormat('en-CA', { timeZone: ZONE }).format(new Date(Date.now() + offsetDays * 86_400_000));
const PDF = new TextEncoder().encode('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << >>\n%%EOF\n');

test('on a phone the dock lists an overdue instrument disabled, says why and names the one to use', async () => {
  const meeting = await new InspectionMeeting().create(`Dock calibration ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('DC', rulesWith());
  const entry = await meeting.addEntry(classId);
  const chiefApi = new HttpSession();
  await chiefApi.signInWithPassword(DEMO.chief, DEMO_PASSWORD);
  const tag = Date.now().toString(36);
  const add = async (name: string, certificate: { calibratedOn: string; dueOn: string; number: string }) => {
    // "A…" sorts first, so the overdue one would be the default if it were not refused.
    const added = await chiefApi.json(`/api/events/${meeting.eventId}/instruments`, {
      name,
      quantity: 'length',
      errorLimit: 0.02,
      resolution: 0.01,
    });
    assert.equal(added.res.status, 201, JSON.stringify(added.body));
    const form = new FormData();
    for (const [k, v] of Object.entries({ ...certificate, laboratory: 'Invented Gauge Works' })) form.set(k, v);
    form.set('file', new Blob([PDF as BlobPart], { type: 'application/pdf' }), 'certificate.pdf');
    const res = await chiefApi.fetch(`/api/events/${meeting.eventId}/instruments/${added.body.data.id}/certificates`, {
      method: 'POST',
      body: form,
    });
    assert.equal(res.status, 201, await res.text());
    return added.body.data.id as string;
  };
  const overdueName = `A overdue caliper ${tag}`;
  const goodName = `B calibrated caliper ${tag}`;
  const overdueId = await add(overdueName, { calibratedOn: dayInZone(-400), dueOn: dayInZone(-10), number: 'OD-1' });
  const goodId = await add(goodName, { calibratedOn: dayInZone(-20), dueOn: dayInZone(300), number: 'OK-1' });

  const ctx = await newContext(browser, PHONE);
  const dock = await ctx.newPage();
  await signInWithPassword(dock, DEMO.scrutineer, DEMO_PASSWORD);
  await dock.goto(`/inspect/${meeting.eventId}`);
  await dock.getByRole('heading', { level: 1 }).waitFor();
  await dock.getByLabel('Race number or tag code').fill(String(entry.raceNumber));
  await dock.getByRole('button', { name: 'Find', exact: true }).click();
  await dock.getByTestId('inspection-form').waitFor();

  const choice = dock.getByLabel('Instrument used', { exact: true });
  await choice.waitFor();
  assert.equal(await choice.locator(`option[value="${overdueId}"]`).isDisabled(), true, 'the overdue one is disabled');
  assert.equal(await choice.locator(`option[value="${goodId}"]`).isDisabled(), false);
  assert.equal(await choice.inputValue(), goodId, 'the usable one is preselected, never the overdue one');
  const why = dock.getByTestId('refused-length-instruments').locator(`[data-refused-instrument="${overdueId}"]`);
  await why.waitFor();
  const text = await why.innerText();
  assert.match(text, new RegExp(`${overdueName} cannot be chosen: calibration overdue since .*\\(certificate OD-1\\)`));
  assert.match(text, new RegExp(`Use ${goodName} instead\\.`));
  const width = await dock.evaluate(() => document.documentElement.scrollWidth);
  assert.ok(width <= 390, `the dock fits a phone (${width} px wide)`);
  await screenshot(dock, 'dock-calibration-01-overdue-disabled');
  await ctx.close();
});

test('on a phone the chief scrutineer records a failed check and the instrument shows out of use today', async () => {
  const meeting = await new InspectionMeeting().create(`Check screen ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
  ]);
  const chiefApi = new HttpSession();
  await chiefApi.signInWithPassword(DEMO.chief, DEMO_PASSWORD);
  const name = `Caliper to check ${Date.now().toString(36)}`;
  const added = await chiefApi.json(`/api/events/${meeting.eventId}/instruments`, {
    name,
    quantity: 'length',
    errorLimit: 0.02,
    resolution: 0.01,
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));

  const ctx = await newContext(browser, PHONE);
  const page = await ctx.newPage();
  await signInWithPassword(page, DEMO.chief, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}/instruments`);
  const item = page.getByTestId('instruments-in-service').locator('li', { hasText: name });
  await item.waitFor();
  await item.locator('[data-calibration-status="no_certificate"]').waitFor();
  await item.getByRole('button', { name: 'Record today’s check…' }).click();
  await item.getByLabel('Reference used').fill('Gauge block 100 mm, set B');
  await item.getByLabel('Its nominal value').fill('100');
  await item.getByLabel('Instrument reading').fill('100.09');
  // The result is left to the server, which decides from the caliper's ±0.02 mm error limit: 0.09 mm off fails.
  assert.equal(await item.getByLabel('Result').inputValue(), 'decide');
  await item.getByRole('button', { name: 'Record the check' }).click();
  const out = item.locator('[data-calibration-status="failed_check"]');
  await out.waitFor();
  assert.match(await out.innerText(), /Out of use today: failed its check/);
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  assert.ok(width <= 390, `the screen fits a phone (${width} px wide)`);
  await screenshot(page, 'instruments-03-failed-check');
  await ctx.close();
});
