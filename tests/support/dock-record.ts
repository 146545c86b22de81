// The dock's record form as the browser tests fill it, and what they read back from the phone's outbox.
import assert from 'node:assert/strict';
import type { Page } from 'playwright-core';
import { DEMO } from './env';
import { query } from './db';
import { SAFETY_ITEMS, type SafetyItem } from '../../lib/core/constants';

type Boat = { entryId: string; raceNumber: number; name: string; boatId: string };

export async function ssBoats(): Promise<{ boats: Boat[]; safety: SafetyItem[] }> {
  const boats = await query<Boat>(
    `select e.id as "entryId", e.race_number as "raceNumber", b.name, b.id as "boatId"
       from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id join users u on u.id = e.entrant_id
      where e.event_id = $1 and c.code = 'SS' and e.status in ('awaiting_payment', 'entered') and u.email <> $2
      order by e.race_number desc limit 5`,
    [DEMO.meetingId, DEMO.scrutineer],
  );
  const [v] = await query<{ rules: { safetyItems: SafetyItem[]; nozzle: { maxMm: number } } }>(
    `select v.rules from class_rule_versions v join race_classes c on c.id = v.class_id
      where c.event_id = $1 and c.code = 'SS' and v.status = 'published' and v.effective_from <= now() order by v.effective_from desc limit 1`,
    [DEMO.meetingId],
  );
  assert.equal(v.rules.nozzle.maxMm, 102, 'the check below is worked for a limit of 102.00 mm');
  return { boats, safety: v.rules.safetyItems };
}

/**
 * The record form open for typing: a form that came in the page's first HTML (?race=, ?tag=) is inert until the
 * page has started, and Playwright would type into it before then without error (an inert field takes no focus).
 */
export async function waitForDockForm(page: Page) {
  await page.locator('[data-testid="inspection-form"] [data-started="yes"]').waitFor();
}

/**
 * Waits until the phone holds its copy of the meeting's entries (IndexedDB, the dock's offline lookup). Polled here:
 * page.waitForFunction does not wait for a promise its function returns.
 */
export async function waitForDockSnapshot(page: Page, eventId: string, timeoutMs = 20_000) {
  const hasSnapshot = () =>
    page.evaluate(async (eventId) => {
      const db = await new Promise<IDBDatabase>((ok, fail) => {
        const r = indexedDB.open('boreline-inspect');
        r.onsuccess = () => ok(r.result);
        r.onerror = () => fail(r.error);
      });
      if (!db.objectStoreNames.contains('snapshots')) return false;
      return new Promise<boolean>((ok) => {
        const r = db.transaction('snapshots').objectStore('snapshots').get(eventId);
        r.onsuccess = () => ok(!!r.result);
        r.onerror = () => ok(false);
      });
    }, eventId);
  const end = Date.now() + timeoutMs;
  while (!(await hasSnapshot())) {
    if (Date.now() > end) throw new Error(`no copy of meeting ${eventId}'s entries on the phone after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Readings with the largest given, U typed as 0.05 mm (or an instrument), weighings and power comfortably inside, every safety item ticked. */
export async function fillRecord(page: Page, largestMm: number, safety: SafetyItem[], instrumentId?: string) {
  await waitForDockForm(page);
  for (const [i, d] of [101.5, largestMm, 101.8].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  if (instrumentId) {
    await page.getByLabel('From the instrument used').check();
    await page.getByLabel('Instrument used', { exact: true }).selectOption(instrumentId);
  } else {
    await page.getByLabel('I know U (type it)').check();
    await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
  }
  await page.getByLabel('Weighing 1').fill('690');
  await page.getByLabel('Weighing 2').fill('691');
  await page.getByLabel('Power, as declared or as the evidence shows').fill('220');
  await page.getByLabel('Power evidence seen').selectOption('maker_rating');
  for (const item of safety) await page.getByLabel(`${SAFETY_ITEMS[item]} — present and working`).check();
  await page.getByTestId('record-inspection').click();
}

export const idbKeys = (page: Page, state: string) =>
  page.evaluate(async (wanted) => {
    const db = await new Promise<IDBDatabase>((ok, no) => {
      const r = indexedDB.open('boreline-inspect');
      r.onsuccess = () => ok(r.result);
      r.onerror = () => no(r.error);
    });
    const all = await new Promise<{ idempotencyKey: string; state: string }[]>((ok) => {
      const r = db.transaction('outbox').objectStore('outbox').getAll();
      r.onsuccess = () => ok(r.result);
    });
    return all.filter((x) => x.state === wanted).map((x) => x.idempotencyKey);
  }, state);
