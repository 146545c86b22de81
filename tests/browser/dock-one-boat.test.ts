// Journey: a scrutineer opens one boat's dock page from a link (/inspect/<meeting>?race=N, as the board's links do)
// on a phone. The card and form are in the page's first HTML; once the page has started, what is typed stays (no
// hydration error, nothing reset). The phone keeps the plain dock, never the boat's page (its HTML holds a card as
// the server saw it): with no signal, the same link gives the plain dock, which finds the boat in the phone's copy
// of the entries and says so. Offline use of the dock is the app's own promise (README); no outside source.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, PHONE, screenshot, signInWithPassword } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { waitForDockForm, waitForDockSnapshot } from '../support/dock-record';

let browser: Browser;
const meeting = new InspectionMeeting();
let entry: TestEntry;

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`One boat ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  entry = await meeting.addEntry(await meeting.addClass('OB', rulesWith()));
});
after(async () => {
  await browser?.close();
});

const pageKeys = (page: Page) =>
  page.evaluate(async () => (await (await caches.open('boreline-pages')).keys()).map((r) => r.url));

test('one boat from a link: card and form at once, typing kept; offline the plain dock finds it in the phone copy', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(e.message));
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);

  const link = `/inspect/${meeting.eventId}?race=${entry.raceNumber}`;
  await page.goto(link);
  const card = page.getByTestId('boat-card');
  await card.waitFor();
  assert.equal(await card.getAttribute('data-entry-id'), entry.id);
  assert.equal(await page.getByTestId('boat-name').innerText(), entry.boatName);
  // Inert until the page has started (the HTML's form: tests/integration/dock-card-first-html.test.ts), then open.
  await waitForDockForm(page);
  const reading = page.getByLabel('Reading 1 diameter');
  await reading.fill('101.93');
  await page.waitForTimeout(500);
  assert.equal(await reading.inputValue(), '101.93', 'what was typed stays after the page has started');
  assert.equal(await page.getByTestId('record-inspection').isEnabled(), true);
  await screenshot(page, 'dock-one-boat-01-card');
  assert.deepEqual(
    errors.filter((e) => /hydrat|did not match|Minified React error/i.test(e)),
    [],
    'no hydration error',
  );

  // The worker controls the page after its first visit; the link again, then what the phone kept.
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 20_000 });
  await page.goto(link);
  await card.waitFor();
  const plain = new URL(`/inspect/${meeting.eventId}`, page.url()).href;
  const deadline = Date.now() + 20_000;
  while (!(await pageKeys(page)).includes(plain)) {
    assert.ok(Date.now() < deadline, `the plain dock was kept (kept: ${(await pageKeys(page)).join(', ')})`);
    await page.waitForTimeout(200);
  }
  assert.deepEqual(
    (await pageKeys(page)).filter((u) => /[?&](race|tag)=/.test(u)),
    [],
    "no boat's page is kept",
  );
  await waitForDockSnapshot(page, meeting.eventId);

  await context.setOffline(true);
  await page.goto(link);
  await page.getByTestId('offline-card').waitFor();
  assert.match(await page.getByTestId('offline-card').innerText(), /from this phone’s copy of the entries/);
  assert.equal(await page.getByTestId('boat-name').innerText(), entry.boatName);
  await screenshot(page, 'dock-one-boat-02-offline');
  await context.setOffline(false);
  await context.close();
});
