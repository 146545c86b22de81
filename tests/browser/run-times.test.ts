// The organiser imports a timing file on a phone and on a desktop window: the preview shows each line's
// problem before anything is stored, a fixed file is imported, the same file again has nothing new to
// store; then the predicted-against-observed chart draws one dot per boat with its identity line.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

async function meetingWithInspectedBoats() {
  const meeting = new InspectionMeeting();
  await meeting.create(`Timing Screen ${Date.now()}`, []);
  const classId = await meeting.addClass('TS', rulesWith());
  const [rv] = await query<{ id: string }>(
    `select id from class_rule_versions where class_id = $1 and status = 'published' order by version desc limit 1`,
    [classId],
  );
  const [org] = await query<{ id: string }>('select id from users where email = $1', [DEMO.organiser]);
  const boats: TestEntry[] = [];
  for (const [i, kw] of [210, 220, 230, 240].entries()) {
    const e = await meeting.addEntry(classId);
    boats.push(e);
    await query(
      `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result)
       values ($1, $2, $3, $4, $5, $6, $7, now(), $8, $9, 'conforms')`,
      [
        meeting.eventId,
        e.id,
        e.boatId,
        classId,
        rv.id,
        org.id,
        randomUUID(),
        JSON.stringify({
          nozzle: { readings: [100, 100.02, 100.01].map((d, k) => ({ diameterMm: d, angleDeg: k * 60 })) },
          power: { evidenceSeen: true, confirmedKw: kw },
          weight: { readingsKg: [720 + 20 * i] },
        }),
        JSON.stringify([{ rule: 'nozzle_max', expandedUncertainty: 0.05, verdict: 'conforms' }]),
      ],
    );
  }
  return { meeting, boats };
}

for (const [name, options] of [
  ['phone', PHONE],
  ['desktop', { viewport: { width: 1280, height: 900 } }],
] as const) {
  test(`organiser on a ${name}: preview, import, re-import, then the predicted-against-observed chart`, async () => {
    const { meeting, boats } = await meetingWithInspectedBoats();
    const n = (i: number) => boats[i].raceNumber;
    const context = await newContext(browser, options);
    const page = await context.newPage();
    await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
    await page.goto(`/organise/events/${meeting.eventId}/timing`);
    const form = page.getByRole('form', { name: 'Preview a timing file' });
    await form.getByLabel('Course length (m)').fill('400');

    const header = 'race_number,run,elapsed_s,gps_top_speed_kmh';
    const bad = [header, `${n(0)},1,41.2,110`, `9876,1,40.0,`, `${n(1)},1,slow,`].join('\n');
    await form
      .getByLabel('CSV file')
      .setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    await form.getByRole('button', { name: 'Preview' }).click();
    const table = page.getByTestId('run-preview');
    await table.waitFor();
    await page.getByTestId('preview-message').getByText('2 lines refused').waitFor();
    assert.equal(await table.locator('tr[data-status="error"]').count(), 2);
    assert.match(await table.locator('tr[data-status="error"]').first().innerText(), /No entry has race number 9876/);
    assert.match(await table.locator('tr[data-status="error"]').nth(1).innerText(), /elapsed time "slow"/);
    assert.equal(await page.getByRole('button', { name: 'Fix the refused lines first' }).isDisabled(), true);
    await screenshot(page, `run-times-${name}-01-preview-refused`);
    const stored = async () =>
      Number(
        (await query<{ n: string }>('select count(*) as n from run_times where event_id = $1', [meeting.eventId]))[0].n,
      );
    assert.equal(await stored(), 0);

    const good = [
      header,
      ...boats.flatMap((b, i) => [
        `${b.raceNumber},1,${(40 + i).toFixed(2)},${112 - 2 * i}`,
        `${b.raceNumber},2,${(40.4 + i).toFixed(2)},`,
      ]),
    ].join('\n');
    await form
      .getByLabel('CSV file')
      .setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
    await form.getByRole('button', { name: 'Preview' }).click();
    await page.getByRole('button', { name: 'Import 8 runs' }).click();
    await page.getByTestId('import-message').getByText('Stored 8 new runs, 0 corrections; 0 already stored.').waitFor();
    assert.equal(await stored(), 8);
    await page.getByTestId('runs-table').waitFor();
    await expectNoSeriousA11yViolations(page);

    // The same file again: the preview says every line is already stored, and there is nothing to import.
    await form
      .getByLabel('CSV file')
      .setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
    await form.getByRole('button', { name: 'Preview' }).click();
    await page.getByRole('button', { name: 'Nothing new to store' }).waitFor();
    assert.equal(await table.locator('tr[data-status="unchanged"]').count(), 8);
    assert.equal(await stored(), 8);

    await page.goto(`/organise/events/${meeting.eventId}/clock`);
    await page.getByTestId('clock-predictions').waitFor();
    const chart = page.getByTestId('clock-chart');
    await chart.scrollIntoViewIfNeeded();
    await chart.locator('.recharts-scatter-symbol').nth(3).waitFor();
    assert.equal(await chart.locator('.recharts-scatter-symbol').count(), 4, 'one dot per boat');
    assert.equal(await chart.locator('.recharts-reference-line').count(), 1, 'the identity line');
    const box = await chart.boundingBox();
    const width = options.viewport.width;
    assert.ok(
      box && box.width > 200 && box.x >= 0 && box.x + box.width <= width,
      `chart fits the window: ${JSON.stringify(box)}`,
    );
    assert.ok(
      await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth),
      'nothing makes the page scroll sideways',
    );
    assert.match(await page.getByTestId('clock-figures').innerText(), /Pearson r/);
    // A power cap below every boat's power: each boat's predicted time changes, the spread line says so.
    const spread = page.getByTestId('lever-spread');
    const today = await spread.innerText();
    await page.getByLabel('Power cap (kW, as a rev limit)').fill('200');
    await page.waitForFunction((t) => document.querySelector('[data-testid="lever-spread"]')?.textContent !== t, today);
    assert.match(await spread.innerText(), /s today, [\d.]+ s with these levers/);
    // Another impeller for one boat: these boats run on fixed power, so the efficiency factor is what applies, and the
    // boat's row names the change (its effect in seconds is checked in tests/unit/core/timing/impeller-lever.test.ts).
    await page.getByLabel('Boat', { exact: true }).selectOption({ index: 1 });
    await page.getByLabel('Pump efficiency factor (×)').fill('0.9');
    await page.getByRole('region', { name: 'Each boat with the levers' }).getByText('efficiency × 0.9').waitFor();
    await screenshot(page, `run-times-${name}-02-clock`);
    await expectNoSeriousA11yViolations(page);
    await context.close();
  });
}
