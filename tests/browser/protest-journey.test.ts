// Journey: the organiser publishes provisional results on the results screen; the demo entrant
// lodges a protest on a phone (a missing ground first), pays the fee on the payment fake's page and
// adds a photo (a PNG made with pngjs, its SHA-256 checked against node:crypto); the steward accepts
// it, orders a re-inspection and decides it upheld; the entrant sees the decision and the refund,
// and the decision PDF opens with pdf-lib. Refund on upheld is common practice, no single source.
// Runs alone (scripts/test.sh): it publishes results and decides a protest at the demo meeting.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import { PDFDocument } from 'pdf-lib';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { ARTIFACTS, DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { extractPdfText } from '../support/pdf-text';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('results published → entrant lodges and pays → photo evidence intact → steward accepts, orders a re-inspection, upholds → entrant sees the refund and the PDF', async () => {
  // Confirmed entries of one class at the demo meeting: the entrant's own boat and two others.
  const [own] = await query<{ id: string; class_id: string; race_number: number }>(
    `select e.id, e.class_id, e.race_number from entries e join users u on u.id = e.entrant_id where u.email = $1 and e.event_id = $2 and e.status = 'entered' limit 1`,
    [DEMO.entrant, DEMO.meetingId],
  );
  assert.ok(own, 'the demo entrant has a confirmed entry (seeders/20261201000200-demo-classes-boats-entries.js)');
  const others = await query<{ id: string; race_number: number; boat: string }>(
    `select e.id, e.race_number, b.name as boat from entries e join boats b on b.id = e.boat_id join users u on u.id = e.entrant_id
      where e.class_id = $1 and e.status = 'entered' and u.email <> $2 order by e.race_number limit 2`,
    [own.class_id, DEMO.entrant],
  );
  assert.equal(others.length, 2);
  const target = others[0];

  const staff = await newContext(browser);
  const office = await staff.newPage();
  await signInWithPassword(office, DEMO.organiser, DEMO_PASSWORD);
  await office.goto(`/organise/events/${DEMO.meetingId}/results`);
  await office.locator('#results-class').selectOption(own.class_id);
  const numbers = [target.race_number, own.race_number, others[1].race_number];
  for (const [i, n] of numbers.entries())
    await office.getByLabel(`Race number ${i + 1}`, { exact: true }).fill(String(n));
  await office.getByRole('button', { name: 'Publish provisional results' }).click();
  const windowNote = office
    .locator(`section[data-class]`)
    .filter({ has: office.getByTestId('results-table') })
    .getByTestId('results-window');
  await windowNote.waitFor();
  assert.match(await windowNote.innerText(), /Protest window open until .* UTC\+1[23]:00 \(Pacific\/Auckland\)/);
  await screenshot(office, 'protest-01-results-published');
  await staff.close();

  const phone = await newContext(browser, PHONE);
  const page = await phone.newPage();
  await signInWithPassword(page, DEMO.entrant, DEMO_PASSWORD);
  await page.getByTestId('main-nav').getByRole('link', { name: 'My protests' }).click();
  await page.waitForURL('**/protests');
  await page.getByLabel('Meeting', { exact: true }).selectOption(DEMO.meetingId);
  await page.getByLabel('Boat protested').selectOption(target.id);
  const deadline = page.getByTestId('deadline');
  await deadline.waitFor();
  assert.match(await deadline.innerText(), /Protest by .* \(Pacific\/Auckland\)/);
  await page.getByTestId('time-left').waitFor();
  await page.getByLabel('Rule', { exact: true }).fill('SS 2.1 nozzle exit diameter maximum');
  await page.getByLabel('Nozzle exit diameter').check();
  await page.getByRole('button', { name: 'Lodge and pay the fee' }).click();
  const groundsError = page.locator('[data-field-error="grounds"]');
  await groundsError.waitFor();
  assert.match(await groundsError.innerText(), /Write the grounds/);
  assert.equal(
    (await query('select 1 from protests where against_entry_id = $1', [target.id])).length,
    0,
    'nothing stored for the refused form',
  );
  await screenshot(page, 'protest-02-lodge-form-error');
  await page
    .getByLabel('Grounds', { exact: true })
    .fill(`Boat #${target.race_number} looked over the nozzle limit at the dock after heat 1.`);
  await page.getByRole('button', { name: 'Lodge and pay the fee' }).click();
  await page.waitForURL(/\/pay\/cs_/);
  assert.match(await page.locator('body').innerText(), /50\.00/);
  await screenshot(page, 'protest-03-payment-page');
  await page.getByRole('button', { name: 'Pay now' }).click();
  await page.waitForURL(/\/protests\/[0-9a-f-]{36}\?paid=1/);
  const protestId = new URL(page.url()).pathname.split('/').pop()!;
  await page
    .getByTestId('payment-banner')
    .filter({ hasText: 'Fee received — your protest is lodged' })
    .waitFor({ timeout: 20_000 });
  assert.equal(await page.getByTestId('protest-status').getAttribute('data-status'), 'lodged');

  const img = new PNG({ width: 16, height: 12 });
  for (let i = 0; i < img.data.length; i += 4) img.data.set([200, (i / 4) % 255, 40, 255], i);
  const photo = PNG.sync.write(img);
  await page
    .getByLabel('Photo, PDF or video')
    .setInputFiles({ name: 'nozzle-dock.png', mimeType: 'image/png', buffer: photo });
  await page.getByRole('button', { name: 'Add the file' }).click();
  const item = page.getByTestId('evidence-list').locator('li[data-kind="file"]');
  await item.waitFor();
  assert.equal(await item.getByTestId('integrity').getAttribute('data-integrity'), 'intact');
  assert.equal(
    await item.getByTestId('evidence-sha256').innerText(),
    createHash('sha256').update(photo).digest('hex'),
    'SHA-256 by node:crypto',
  );
  await screenshot(page, 'protest-04-lodged-with-evidence');

  const desk = await newContext(browser);
  const sp = await desk.newPage();
  await signInWithPassword(sp, DEMO.steward, DEMO_PASSWORD);
  await sp.getByTestId('main-nav').getByRole('link', { name: 'Stewards' }).click();
  // The steward may sit at several meetings (other tests add some): open the demo meeting's queue.
  await sp.locator(`[data-event-id="${DEMO.meetingId}"]`).getByRole('link', { name: 'Protests', exact: true }).click();
  await sp.getByTestId('queue-lodged').locator(`[data-protest-id="${protestId}"]`).getByRole('link').click();
  await sp.waitForURL(`**/stewards/${DEMO.meetingId}/protests/${protestId}`);
  assert.match(await sp.getByRole('note').first().innerText(), /licensed officials/);
  await sp.getByRole('button', { name: 'Accept the protest' }).click();
  await sp.locator('#reinspection-reason').fill('Measure the nozzle exit diameter at four points, 45 degrees apart.');
  await sp.getByRole('button', { name: 'Order the re-inspection' }).click();
  await sp.getByTestId('reinspections').locator('li').waitFor();
  const [task] = await query<{ entry_id: string }>('select entry_id from reinspections where protest_id = $1', [
    protestId,
  ]);
  assert.equal(task.entry_id, target.id, 'the task is for the protested boat and names the protest');
  await screenshot(sp, 'protest-05-steward-accepted');
  // A hearing set for the day after tomorrow (the form reads the time in the meeting's zone, up to 14 hours
  // ahead of UTC, so "tomorrow" by UTC's date can already be past there): deciding before it asks once for confirmation.
  const tomorrow = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);
  await sp.getByLabel(/^Date and time/).fill(`${tomorrow}T10:00`);
  await sp.getByLabel('Place').fill('Clubhouse meeting room');
  await sp.getByRole('button', { name: 'Schedule and tell the parties' }).click();
  await sp.getByRole('form', { name: 'Schedule the hearing' }).getByText('Schedule the hearing: done.').waitFor();
  await sp.getByLabel('Upheld (fee refunded)').check();
  await sp
    .locator('#decision-reasons')
    .fill('The re-inspection found the largest two-point diameter above the class maximum.');
  await sp.locator('#decision-penalty').fill('Excluded from the results of heat 1.');
  await sp.getByRole('button', { name: 'Record the decision' }).click();
  const confirm = sp.getByTestId('confirm-first');
  await confirm.waitFor();
  assert.match(await confirm.innerText(), /has not come yet/);
  assert.equal(await sp.getByTestId('decision').count(), 0, 'nothing recorded before the steward confirms');
  await sp.getByRole('button', { name: 'Record it before the hearing time' }).click();
  await sp.getByTestId('decision').waitFor();
  assert.match(await sp.getByTestId('decision').innerText(), /Decision: Upheld/);
  await screenshot(sp, 'protest-06-steward-decided');
  await desk.close();

  await page.reload();
  const decision = page.getByTestId('decision');
  await decision.waitFor();
  assert.match(await decision.innerText(), /Excluded from the results of heat 1\./);
  assert.match(await page.getByTestId('fee-outcome').innerText(), /50\.00 NZD is refunded/);
  assert.match(await page.getByTestId('refund').innerText(), /refunded \(refund re_/);
  assert.match(
    await page.getByTestId('appeal-deadline').innerText(),
    /Notice of appeal is due by .* \(Pacific\/Auckland\)/,
  );
  assert.match(await page.getByTestId('decision-caution').innerText(), /appealed/);
  await screenshot(page, 'protest-07-entrant-sees-decision');
  const pdf = await page.request.get(`/api/protests/${protestId}/decision.pdf`);
  assert.equal(pdf.status(), 200);
  const bytes = new Uint8Array(await pdf.body());
  fs.writeFileSync(path.join(ARTIFACTS, 'protest-08-decision.pdf'), bytes); // kept for people to read
  const doc = await PDFDocument.load(bytes);
  assert.ok(doc.getPageCount() >= 1);
  const text = (await extractPdfText(bytes)).join('\n');
  assert.match(text, /UPHELD/);
  assert.ok(text.includes(createHash('sha256').update(photo).digest('hex')), 'the evidence hash is in the PDF');
  const [row] = await query<{ status: string; refund_id: string | null }>(
    'select status, refund_id from protests where id = $1',
    [protestId],
  );
  assert.equal(row.status, 'upheld');
  assert.match(row.refund_id ?? '', /^re_/);
  await phone.close();
});
