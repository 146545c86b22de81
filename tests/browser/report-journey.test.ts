// Journey: the organiser opens the parity report draft of a class, sees the charts, publishes;
// the public page opens signed out on a phone and the PDF and CSV download.
// Runs alone (scripts/test.sh): it records inspections in a demo class and publishes its report.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import type { Browser } from 'playwright-core';
import { PDFDocument } from 'pdf-lib';
import { parse } from 'csv-parse/sync';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';

let browser: Browser;
let classId: string;

before(async () => {
  browser = await launchBrowser();
  // Conforming inspections for the paid entries of the demo RR class (85–95 mm window), inserted directly.
  const [cls] = await query<{ id: string; rule_version_id: string }>(
    `select c.id, v.id as rule_version_id from race_classes c join class_rule_versions v on v.class_id = c.id and v.status = 'published'
      where c.event_id = $1 and c.code = 'RR' order by v.version desc limit 1`,
    [DEMO.meetingId],
  );
  classId = cls.id;
  const [{ id: scrutineerId }] = await query<{ id: string }>('select id from users where email = $1', [
    DEMO.scrutineer,
  ]);
  const entries = await query<{ id: string; boat_id: string; declared_nozzle_mm: number }>(
    `select e.id, e.boat_id, b.declared_nozzle_mm from entries e join boats b on b.id = e.boat_id where e.class_id = $1 and e.status = 'entered'`,
    [classId],
  );
  for (const e of entries) {
    const d = e.declared_nozzle_mm;
    await query(
      `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result)
       values ($1, $2, $3, $4, $5, $6, $7, now(), $8, $9, 'conforms')`,
      [
        DEMO.meetingId,
        e.id,
        e.boat_id,
        classId,
        cls.rule_version_id,
        scrutineerId,
        randomUUID(),
        JSON.stringify({
          nozzle: {
            readings: [d, d + 0.04, d - 0.03].map((x, i) => ({ diameterMm: +x.toFixed(2), angleDeg: i * 60 })),
          },
        }),
        JSON.stringify({ rules: [{ rule: 'nozzle_max', expandedUncertainty: 0.08, verdict: 'conforms' }] }),
      ],
    );
  }
});
after(async () => {
  await browser?.close();
});

test('organiser publishes the RR parity report; the public page, PDF and CSV work signed out on a phone', async () => {
  const org = await newContext(browser);
  const page = await org.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/organise/events/${DEMO.meetingId}/classes/${classId}/report`);
  await page.getByTestId('draft-heading').waitFor();
  // The thrust chart draws one line per boat plus the median boat.
  // Charts are drawn when they come near the screen (components/when-visible.tsx).
  await page.getByTestId('chart-thrust-curves').scrollIntoViewIfNeeded();
  const lines = page.getByTestId('chart-thrust-curves').locator('path.recharts-line-curve');
  await lines.first().waitFor();
  const [{ n }] = await query<{ n: string }>(
    `select count(*) as n from entries where class_id = $1 and status = 'entered'`,
    [classId],
  );
  assert.equal(await lines.count(), Number(n) + 1);
  await page.getByTestId('chart-deviation').scrollIntoViewIfNeeded();
  await page.getByTestId('chart-deviation').locator('.recharts-bar-rectangle').first().waitFor();
  assert.ok((await page.getByTestId('chart-deviation').locator('.recharts-bar-rectangle').count()) >= Number(n) - 1);
  await screenshot(page, 'report-01-draft');

  await page.getByLabel('Note for readers (optional)').fill('First look at River Runner parity.');
  await page.getByRole('button', { name: /Publish as version 1/ }).click();
  await page.getByText(/Version 1 published/).waitFor();
  const link = page.getByTestId('published-versions').getByRole('link', { name: 'Version 1' });
  const href = await link.getAttribute('href');
  assert.match(href ?? '', /^\/reports\//);
  await org.close();

  const phone = await newContext(browser, { ...PHONE, acceptDownloads: true });
  const pub = await phone.newPage();
  const res = await pub.goto(href!);
  assert.equal(res?.status(), 200);
  await pub.getByTestId('report-title').waitFor();
  assert.match(await pub.getByTestId('report-title').innerText(), /River Runner/);
  await pub.getByTestId('chart-thrust-curves').locator('path.recharts-line-curve').first().waitFor();
  await screenshot(pub, 'report-02-public-phone');
  // The uncertainty sections: power evidence per boat, the range nozzle, and who out-thrusts whom.
  await pub.getByTestId('power-evidence-table').waitFor();
  assert.equal(await pub.getByTestId('power-evidence-table').locator('tbody tr').count(), Number(n));
  await pub.getByTestId('odds-matrix').waitFor();
  assert.match(await pub.getByTestId('spread-odds').innerText(), /95 % coverage interval/);

  const pdfDownload = pub.waitForEvent('download');
  await pub.getByTestId('report-pdf').click();
  const pdf = await PDFDocument.load(await fs.readFile((await (await pdfDownload).path())!));
  assert.ok(pdf.getPageCount() >= 1);
  assert.match(pdf.getTitle() ?? '', /RR parity report v1/);

  const csvDownload = pub.waitForEvent('download');
  await pub.getByTestId('report-csv').click();
  const rows = parse(await fs.readFile((await (await csvDownload).path())!, 'utf8'), { columns: true }) as Record<
    string,
    string
  >[];
  assert.equal(rows.length, Number(n));
  await phone.close();
});
