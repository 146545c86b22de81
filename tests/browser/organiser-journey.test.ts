// Journey: the organiser edits class rules into a new draft, sees the version history, finds the
// entries in the table, filters by class (kept in the URL) and downloads the tag sheet PDF.
// Runs alone (scripts/test.sh): it counts the demo meeting's entries and changes a demo class's rules.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { PDFDocument } from 'pdf-lib';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('organiser: entries table filtered by class, and the tag sheet downloads as a PDF', async () => {
  const context = await newContext(browser, { ...PHONE, acceptDownloads: true });
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/organise/events/${DEMO.meetingId}/entries`);
  await page.getByTestId('entries-table').waitFor();
  const [{ n: total }] = await query<{ n: string }>('select count(*) as n from entries where event_id = $1', [
    DEMO.meetingId,
  ]);
  assert.match(await page.getByTestId('entries-count').innerText(), new RegExp(`of ${total} entries`));

  const [{ id: rrId, n: rrCount }] = await query<{ id: string; n: string }>(
    `select c.id, count(e.id) as n from race_classes c join entries e on e.class_id = c.id where c.event_id = $1 and c.code = 'RR' group by c.id`,
    [DEMO.meetingId],
  );
  await page.getByLabel('Class').selectOption(rrId);
  await page.waitForURL((u) => u.searchParams.get('class') === rrId);
  assert.match(await page.getByTestId('entries-count').innerText(), new RegExp(`^${rrCount} of ${total}`));
  await screenshot(page, 'organiser-01-entries-filtered');

  // The filter survives a reload because it lives in the URL.
  await page.reload();
  assert.match(await page.getByTestId('entries-count').innerText(), new RegExp(`^${rrCount} of`));

  const downloadPromise = page.waitForEvent('download');
  await page.getByTestId('tag-sheet-link').click();
  const download = await downloadPromise;
  assert.match(download.suggestedFilename(), /\.pdf$/);
  const path = await download.path();
  const bytes = await (await import('node:fs/promises')).readFile(path!);
  const pdf = await PDFDocument.load(bytes);
  const [{ n: live }] = await query<{ n: string }>(
    `select count(*) as n from entries where event_id = $1 and status in ('awaiting_payment','entered')`,
    [DEMO.meetingId],
  );
  assert.equal(pdf.getPageCount(), Math.ceil(Number(live) / 14), '14 labels per A4 sheet');
  await context.close();
});

test('organiser: saving rules after publication opens a new draft and the history shows what changed', async () => {
  const context = await newContext(browser);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  const [{ id: ssId }] = await query<{ id: string }>(
    `select id from race_classes where event_id = $1 and code = 'SS'`,
    [DEMO.meetingId],
  );
  await page.goto(`/organise/events/${DEMO.meetingId}/classes/${ssId}`);
  await page.getByLabel('Minimum all-up weight').fill('660');
  await page.getByRole('button', { name: /Save as new draft v2|Save draft v\d/ }).click();
  await page.getByText(/Saved as draft v2|Draft v\d saved/).waitFor();
  await page.getByTestId('version-history').getByText('Minimum weight (kg)').waitFor();
  assert.match(await page.getByTestId('version-history').innerText(), /650[\s\S]*660/);
  await screenshot(page, 'organiser-02-rules-history');
  await context.close();
});
