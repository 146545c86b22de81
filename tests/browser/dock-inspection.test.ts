// Journey at the dock on a phone: the scrutineer scans a boat's tag from a photo of its QR code,
// records readings and sees every verdict at once; then, with no signal, records two more boats
// by race number (one after reloading the page from the phone's copy), sees them waiting, and when
// the signal returns exactly two records arrive, once each. Last, a record the server refuses stays
// on the phone as "Needs a fix".
// Reference decisions: the zones of ISO 14253-1:2017 applied to a 102.00 mm limit with U 0.05 mm:
// 101.93 mm conformity proven, 101.97 mm undecided (inconclusive).
// Runs alone (scripts/test.sh): it adds an instrument and records inspections at the demo meeting.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import path from 'node:path';
import QRCode from 'qrcode';
import type { Browser } from 'playwright-core';
import {
  launchBrowser,
  newContext,
  screenshot,
  signInWithPassword,
  PHONE,
  waitForOfflineCopy,
} from '../support/browser';
import { ARTIFACTS, BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { fillRecord, idbKeys, ssBoats, waitForDockSnapshot } from '../support/dock-record';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('dock: scan a tag from a photo, record, see the verdict; offline two records wait and arrive once each', async () => {
  const { boats, safety } = await ssBoats();
  assert.ok(boats.length >= 5, 'five Sprint Sport boats to inspect');
  const [scanned, close, offlineA, offlineB, refused] = boats;
  // An instrument of this test's own, withdrawn later while a record made with it waits offline.
  const [caliper] = await query<{ id: string }>(
    `insert into instruments (event_id, name, quantity, error_limit, resolution) values ($1, $2, 'length', 0.02, 0.01) returning id`,
    [DEMO.meetingId, `Test caliper ${Date.now()}`],
  );
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.getByTestId('main-nav').getByRole('link', { name: 'Inspect' }).click();
  await page.waitForURL('**/inspect');
  await page
    .getByTestId('inspect-meetings')
    .locator(`[data-event-id="${DEMO.meetingId}"]`)
    .getByRole('link', { name: 'Dock screen' })
    .click();
  await page.waitForURL(`**/inspect/${DEMO.meetingId}`);

  // The tag's QR code encodes the tag URL as tagUrl() in lib/server/tags/tokens.ts writes it (that module is
  // server-only), at the error-correction level the printed tag sheet uses (Q, lib/core/tags/tag-sheet.ts).
  const [{ token }] = await query<{ token: string }>(
    'select token from boat_tags where boat_id = $1 and retired_at is null',
    [scanned.boatId],
  );
  const pngPath = path.join(ARTIFACTS, 'dock-tag.png');
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  await QRCode.toFile(pngPath, `${process.env.NEXTAUTH_URL ?? BASE_URL}/t/${token}`, {
    type: 'png',
    width: 480,
    margin: 4,
    errorCorrectionLevel: 'Q',
  });
  await page.getByTestId('scan-photo').setInputFiles(pngPath);
  await page.getByTestId('boat-name').filter({ hasText: scanned.name }).waitFor();
  assert.equal(await page.getByTestId('boat-card').getAttribute('data-entry-id'), scanned.entryId);
  await screenshot(page, 'dock-01-boat-card');

  // Phone-first: text at least 18 px and touch targets at least 48 px where the scrutineer works.
  const measure = (selector: string) =>
    page
      .locator(selector)
      .first()
      .evaluate((el) => ({
        fontPx: parseFloat(getComputedStyle(el).fontSize),
        heightPx: el.getBoundingClientRect().height,
        inputMode: el.getAttribute('inputmode'),
      }));
  const label = await measure('label[for="f-nozzle-readings-0-diameterMm"]');
  const input = await measure('#f-nozzle-readings-0-diameterMm');
  const submit = await measure('[data-testid="record-inspection"]');
  const safetyRow = await measure('[data-testid="inspection-form"] fieldset label:has(input[type="checkbox"])');
  assert.ok(label.fontPx >= 18 && input.fontPx >= 18, `text ${label.fontPx} / ${input.fontPx} px`);
  assert.ok(
    input.heightPx >= 48 && submit.heightPx >= 48 && safetyRow.heightPx >= 48,
    `targets ${input.heightPx} / ${submit.heightPx} / ${safetyRow.heightPx} px`,
  );
  assert.equal(input.inputMode, 'decimal');

  await fillRecord(page, 101.93, safety);
  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-provisional'), 'false', 'decided by the server');
  assert.equal(
    await verdict.locator('[data-rule="nozzle_max"]').getAttribute('data-verdict'),
    'conforms',
    '101.93 mm: conformity proven (ISO 14253-1:2017)',
  );
  assert.equal(await verdict.getAttribute('data-overall'), 'conforms');
  assert.ok(await verdict.getByRole('note').isVisible(), 'the safety caution is shown with the verdict');
  const [stored] = await query<{ overall_result: string; results: { rules: unknown[] } }>(
    'select overall_result, results from inspections where entry_id = $1 order by received_at desc limit 1',
    [scanned.entryId],
  );
  assert.equal(stored.overall_result, 'conforms');
  assert.equal(await verdict.locator('[data-rule]').count(), stored.results.rules.length, 'every rule is shown');
  await screenshot(page, 'dock-02-verdict');

  // A reading within U of the limit: inconclusive, and the screen asks for a better instrument.
  await page.getByRole('button', { name: 'Next boat' }).click();
  await page.getByLabel('Race number or tag code').fill(String(close.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await fillRecord(page, 101.97, safety);
  await page.getByTestId('measure-again').waitFor();
  assert.match(await page.getByTestId('measure-again').innerText(), /Measure again with a better instrument/);
  // Before racing the entrant must prove conformity (ISO 14253-1:2017, clause 5 [memory for the clause number]):
  // an inconclusive result is not accepted.
  assert.equal(await page.getByTestId('verdict-burden').getAttribute('data-burden'), 'conformity');
  assert.match(await page.getByTestId('verdict-burden').innerText(), /entrant must prove conformity/);
  assert.match(await page.getByTestId('measure-again').innerText(), /Not accepted until then/);
  assert.equal(await verdict.getAttribute('data-overall'), 'inconclusive');
  await screenshot(page, 'dock-03-inconclusive');
  await page.getByRole('button', { name: 'Next boat' }).click();

  // The phone keeps a copy of the entries for offline use.
  await waitForDockSnapshot(page, DEMO.meetingId);
  // …and its service worker has kept the dock screen itself (we came by a link, so it may not control this page yet).
  await waitForOfflineCopy(page);

  await context.setOffline(true);
  await page.getByTestId('connection').filter({ hasText: 'Offline' }).waitFor();
  await page.getByLabel('Race number or tag code').fill(String(offlineA.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('offline-card').waitFor();
  await fillRecord(page, 101.93, safety);
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-provisional'), 'true', 'worked out on the phone');
  await page.getByTestId('waiting-heading').filter({ hasText: 'Waiting to send (1)' }).waitFor();

  // Reload with no signal: the service worker serves the dock screen, the outbox is still there.
  const reloaded = await page.reload();
  assert.equal(reloaded?.headers()['x-served-from'], 'cache', 'the page came from the phone, not the network');
  await page.getByRole('heading', { name: 'Dock inspection' }).waitFor();
  await page.getByTestId('waiting-heading').filter({ hasText: 'Waiting to send (1)' }).waitFor();
  await page.getByLabel('Race number or tag code').fill(String(offlineB.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await page.getByTestId('offline-card').waitFor();
  await fillRecord(page, 101.93, safety);
  await page.getByTestId('waiting-heading').filter({ hasText: 'Waiting to send (2)' }).waitFor();
  await screenshot(page, 'dock-04-offline-waiting');
  const keys = await idbKeys(page, 'waiting');
  assert.equal(keys.length, 2);
  const stored0 = await query<{ n: string }>('select count(*) as n from inspections where idempotency_key = any($1)', [
    keys,
  ]);
  assert.equal(stored0[0].n, '0', 'nothing reached the server while offline');

  await context.setOffline(false);
  await page.getByTestId('waiting-heading').filter({ hasText: 'Waiting to send (0)' }).waitFor({ timeout: 30_000 });
  for (const key of keys) await page.locator(`[data-testid="sent-list"] [data-key="${key}"]`).waitFor();
  await screenshot(page, 'dock-05-sent');
  // Another round of sending (a reload runs the outbox again) must not repeat them.
  await page.reload();
  await page.getByTestId('waiting-heading').filter({ hasText: 'Waiting to send (0)' }).waitFor();
  const rows = await query<{ idempotency_key: string; entry_id: string; n: string }>(
    'select idempotency_key, entry_id, count(*) over (partition by idempotency_key) as n from inspections where idempotency_key = any($1)',
    [keys],
  );
  assert.equal(rows.length, 2, 'exactly two records arrived');
  assert.ok(
    rows.every((r) => r.n === '1'),
    'each once',
  );
  assert.deepEqual(new Set(rows.map((r) => r.entry_id)), new Set([offlineA.entryId, offlineB.entryId]));

  // A record the server refuses (its instrument was withdrawn while the phone was offline) stays on
  // the phone as "Needs a fix" with the server's message; nothing is stored and nothing is dropped.
  await context.setOffline(true);
  await page.getByLabel('Race number or tag code').fill(String(refused.raceNumber));
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await fillRecord(page, 101.93, safety, caliper.id);
  await page.getByTestId('waiting-heading').filter({ hasText: 'Waiting to send (1)' }).waitFor();
  const [refusedKey] = await idbKeys(page, 'waiting');
  await query('update instruments set retired_at = now() where id = $1', [caliper.id]);
  await context.setOffline(false);
  await page.getByTestId('needs-fix-heading').filter({ hasText: 'Needs a fix (1)' }).waitFor({ timeout: 30_000 });
  assert.match(await page.getByTestId('needs-fix-list').innerText(), /not on this meeting’s list/);
  assert.deepEqual(await idbKeys(page, 'needs_fix'), [refusedKey]);
  assert.equal(
    (await query<{ n: string }>('select count(*) as n from inspections where idempotency_key = $1', [refusedKey]))[0].n,
    '0',
  );
  await screenshot(page, 'dock-06-needs-fix');
  await context.close();
});
