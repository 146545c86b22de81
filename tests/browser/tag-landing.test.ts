// Issue 13, item 1, on a phone: a boat's printed tag opened with the phone's own camera (/t/<token>)
// takes a scrutineer of the boat's meeting to the boat's card at the dock, the entrant to their own
// boat, and anyone else to the public card; signing in from that card comes back to the right place.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
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

/** A boat entered at the demo meeting and its current tag; owned by the demo entrant or by someone else. */
async function taggedBoat(ownedByEntrant: boolean) {
  const [b] = await query<{ boatId: string; name: string; token: string; raceNumber: number }>(
    `select b.id as "boatId", b.name, t.token, e.race_number as "raceNumber"
       from entries e join boats b on b.id = e.boat_id join users u on u.id = b.owner_id
       join boat_tags t on t.boat_id = b.id and t.retired_at is null
      where e.event_id = $1 and e.status in ('awaiting_payment', 'entered') and (u.email = $2) = $3 and u.email <> $4
      order by e.race_number desc limit 1`,
    [DEMO.meetingId, DEMO.entrant, ownedByEntrant, DEMO.scrutineer],
  );
  assert.ok(b, 'a tagged demo boat');
  return b;
}

test('tag: a signed-in scrutineer of the meeting lands on the boat’s card at the dock', async () => {
  const boat = await taggedBoat(false);
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/t/${boat.token}`);
  await page.waitForURL((u) => u.pathname === `/inspect/${DEMO.meetingId}`);
  const card = page.getByTestId('boat-card');
  await card.waitFor();
  assert.equal(await card.getByTestId('boat-name').innerText(), boat.name);
  await screenshot(page, 'tag-scrutineer-dock-phone');
  await context.close();
});

test('tag: the entrant lands on their own boat', async () => {
  const boat = await taggedBoat(true);
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.entrant, DEMO_PASSWORD);
  await page.goto(`/t/${boat.token}`);
  await page.waitForURL((u) => u.pathname === `/boats/${boat.boatId}`);
  assert.match(await page.getByTestId('boat-name').innerText(), new RegExp(`^${boat.name}`));
  await screenshot(page, 'tag-entrant-own-boat-phone');
  await context.close();
});

test('tag: anyone sees the public card; signing in from it as a scrutineer comes back to the boat’s card at the dock', async () => {
  const boat = await taggedBoat(false);
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await page.goto(`/t/${boat.token}`);
  const landing = page.getByTestId('tag-landing');
  await landing.waitFor();
  assert.equal(await page.getByTestId('tag-boat-name').innerText(), boat.name);
  assert.ok(await landing.getByLabel(`race number ${boat.raceNumber}`).isVisible(), 'the race number at the meeting');
  await screenshot(page, 'tag-public-card-phone');
  await landing.getByRole('link', { name: 'sign in' }).click();
  await page.waitForURL((u) => u.pathname === '/sign-in');
  await page.getByLabel('E-mail').fill(DEMO.scrutineer);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((u) => u.pathname === `/inspect/${DEMO.meetingId}`, { timeout: 15_000 });
  await page.getByTestId('boat-card').waitFor();
  assert.equal(await page.getByTestId('boat-name').innerText(), boat.name);
  await screenshot(page, 'tag-after-sign-in-dock-phone');
  await context.close();
});

test('tag: a steward of the meeting stays on the public card, with the meeting’s pages instead of a sign-in link', async () => {
  const boat = await taggedBoat(false);
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.steward, DEMO_PASSWORD);
  await page.goto(`/t/${boat.token}`);
  const links = page.getByTestId('tag-official-links');
  await links.waitFor();
  assert.equal(await page.getByRole('link', { name: 'sign in' }).count(), 0, 'no sign-in loop for someone signed in');
  await links.getByRole('link', { name: 'Protests at this meeting' }).click();
  await page.waitForURL((u) => u.pathname === `/stewards/${DEMO.meetingId}`);
  await context.close();
});
