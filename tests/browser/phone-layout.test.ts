// Issue 13, item 12: the signed-in screens on a phone (390 x 844, PHONE). Every navigation
// destination reachable, the dock's record action in reach with a section index, touch targets of
// 44 px, one compact safety caution per screen. Screenshots go to test-results/.
//
// Touch target sizes: WCAG 2.2 SC 2.5.8 "Target Size (Minimum)" asks at least 24 x 24 CSS px;
// 44 px is the common practice for touch (also WCAG 2.2 SC 2.5.5 "Target Size (Enhanced)", AAA,
// asks 44 x 44 CSS px) and is what wet, gloved hands at a dock need.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Locator, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { ARTIFACTS, DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { waitForDockForm } from '../support/dock-record';

const WCAG_MIN_PX = 24; // WCAG 2.2 SC 2.5.8
const TOUCH_PX = 44; // WCAG 2.2 SC 2.5.5 (AAA); common practice for touch
const VIEWPORT = PHONE.viewport;

let browser: Browser;
const meeting = new InspectionMeeting();
let entry: TestEntry;

before(async () => {
  browser = await launchBrowser();
  // A meeting of this test's own: a class with a weight minimum and three safety items, so the dock form is at its longest.
  await meeting.create(`Phone Layout Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  const classId = await meeting.addClass(
    'PHN',
    rulesWith({
      weight: { minKg: 680, includesDriver: true, defaultUncertaintyKg: 1 },
      safetyItems: ['helmet', 'kill_switch', 'fire_extinguisher'],
    }),
  );
  entry = await meeting.addEntry(classId);
  // Provisional results, so the demo entrant (who owns the entry) can open the protest form at this meeting.
  const other = await meeting.addEntry(classId, { ownerEmail: DEMO.chief });
  const { res, body } = await meeting.organiser.json(`/api/events/${meeting.eventId}/results`, {
    classId,
    rows: [
      { position: 1, raceNumber: other.raceNumber },
      { position: 2, raceNumber: entry.raceNumber },
    ],
  });
  assert.equal(res.status, 201, JSON.stringify(body));
});
after(async () => {
  await browser?.close();
});

async function box(locator: Locator) {
  const b = await locator.boundingBox();
  assert.ok(b, 'the element is rendered');
  return b;
}

async function phonePage(email: string): Promise<Page> {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, email, DEMO_PASSWORD);
  return page;
}

/** Every link of the main navigation lies wholly inside the phone's viewport, and the navigation does not scroll sideways. */
async function assertNavFits(page: Page, expected: string[]) {
  const nav = page.getByTestId('main-nav');
  const links = nav.getByRole('link');
  const labels = (await links.allInnerTexts()).map((t) => t.trim());
  for (const name of expected)
    assert.ok(labels.includes(name), `"${name}" is in the navigation (${labels.join(', ')})`);
  for (let i = 0; i < (await links.count()); i++) {
    const link = links.nth(i);
    assert.ok(await link.isVisible(), `${labels[i]} is visible`);
    const b = await box(link);
    assert.ok(
      b.x >= 0 && b.x + b.width <= VIEWPORT.width + 0.5,
      `${labels[i]} lies inside the 390 px screen (x ${b.x.toFixed(0)}, width ${b.width.toFixed(0)})`,
    );
    assert.ok(b.height >= TOUCH_PX, `${labels[i]} is ${b.height.toFixed(0)} px tall`);
  }
  const overflow = await page.locator('nav[aria-label="Main"]').evaluate((el) => el.scrollWidth - el.clientWidth);
  assert.ok(overflow <= 0, `the navigation hides ${overflow} px sideways`);
}

test('phone navigation: the organiser and the scrutineer see every destination they have, and each one opens', async () => {
  const org = await phonePage(DEMO.organiser);
  await assertNavFits(org, ['Inspect', 'Stewards', 'Organise']);
  await screenshot(org, 'phone-01-organiser-nav');
  await org.screenshot({ path: `${ARTIFACTS}/phone-01-organiser-nav-viewport.png` });
  // The last destination is reachable with a tap, without scrolling sideways.
  const names = (await org.getByTestId('main-nav').getByRole('link').allInnerTexts()).map((t) => t.trim());
  const last = org.getByTestId('main-nav').getByRole('link', { name: names[names.length - 1], exact: true });
  const href = (await last.getAttribute('href')) ?? '';
  await last.click();
  await org.waitForURL((u) => u.pathname === href);
  assert.equal(
    await org
      .getByTestId('main-nav')
      .getByRole('link', { name: names[names.length - 1], exact: true })
      .getAttribute('aria-current'),
    'page',
  );
  await org.context().close();

  const scr = await phonePage(DEMO.scrutineer);
  await assertNavFits(scr, ['Inspect']);
  await scr.getByTestId('main-nav').getByRole('link', { name: 'Inspect', exact: true }).click();
  await scr.waitForURL('**/inspect');
  await screenshot(scr, 'phone-02-scrutineer-nav');
  await scr.context().close();

  const ent = await phonePage(DEMO.entrant);
  await assertNavFits(ent, ['Home', 'My boats', 'My entries', 'My protests', 'Jet calculator', 'My account']);
  // A tap on a slow link shows at once that the page is coming (My entries has no loading skeleton): the server's
  // answer is held back 1.5 s here, as one bar of signal would.
  let release = () => {};
  await ent.route(
    (u) => u.pathname === '/entries' && u.searchParams.has('_rsc'),
    async (route) => {
      await new Promise<void>((r) => (release = r));
      await route.continue();
    },
  );
  await ent.getByTestId('main-nav').getByRole('link', { name: 'My entries', exact: true }).click();
  const pending = ent.getByTestId('link-pending');
  await pending.waitFor();
  const bar = await box(pending);
  assert.ok(
    bar.y === 0 && bar.width >= VIEWPORT.width - 1,
    `a bar along the top of the screen: ${JSON.stringify(bar)}`,
  );
  assert.equal(await pending.getAttribute('role'), 'status');
  assert.equal(await pending.innerText(), 'Opening the page…', 'said to screen readers');
  await screenshot(ent, 'phone-02b-link-pending');
  release();
  await ent.waitForURL((u) => u.pathname === '/entries');
  await ent.getByRole('heading', { level: 1 }).first().waitFor();
  await pending.waitFor({ state: 'detached' });
  await ent.context().close();
});

test('dock on a phone: Record stays on screen while the top of the form is read, a section link jumps, the verdict comes into view', async () => {
  const page = await phonePage(DEMO.scrutineer);
  await page.goto(`/inspect/${meeting.eventId}?race=${entry.raceNumber}`);
  const form = page.getByTestId('inspection-form');
  await waitForDockForm(page);
  // The top of the form at the top of the screen.
  await form.evaluate((el) => window.scrollTo(0, el.getBoundingClientRect().top + window.scrollY));
  const formHeight = (await box(form)).height;
  assert.ok(formHeight > VIEWPORT.height * 2, `the form is long (${formHeight.toFixed(0)} px), so this matters`);
  const record = page.getByTestId('record-inspection');
  const r = await box(record);
  assert.ok(
    r.y >= 0 && r.y + r.height <= VIEWPORT.height,
    `Record is inside the screen (top ${r.y.toFixed(0)} px of ${VIEWPORT.height})`,
  );
  assert.ok(r.height >= TOUCH_PX);
  await screenshot(page, 'phone-03-dock-form-top');
  await page.screenshot({ path: `${ARTIFACTS}/phone-03-dock-form-top-viewport.png` });

  // The section index: every section one tap away.
  const index = page.getByRole('navigation', { name: 'Sections of the form' });
  for (const name of ['Nozzle', 'Weight', 'Power', 'Safety items', 'Seals', 'Photos and notes']) {
    const link = index.getByRole('link', { name, exact: true });
    assert.ok(await link.isVisible(), `section link ${name}`);
    assert.ok((await box(link)).height >= TOUCH_PX, `section link ${name} is a touch target`);
  }
  await index.getByRole('link', { name: 'Seals', exact: true }).click();
  await page.waitForFunction(() => location.hash === '#dock-seals');
  const seals = await box(page.getByRole('group', { name: 'Seals', exact: true }));
  assert.ok(
    seals.y >= -1 && seals.y < VIEWPORT.height / 2,
    `the Seals section is at the top of the screen (y ${seals.y.toFixed(0)})`,
  );
  const r2 = await box(record);
  assert.ok(r2.y + r2.height <= VIEWPORT.height, 'Record still on screen after the jump');
  await screenshot(page, 'phone-04-dock-seals');
  await page.screenshot({ path: `${ARTIFACTS}/phone-04-dock-seals-viewport.png` });

  // One compact safety caution on the dock screen.
  const notes = page.getByRole('note');
  assert.equal(await notes.count(), 1, 'one safety caution on the dock screen');

  // Record from the bar; the verdict is brought into view.
  for (const [i, d] of [101.5, 101.6, 101.7].entries())
    await page.getByLabel(`Reading ${i + 1} diameter`).fill(String(d));
  await page.getByLabel('I know U (type it)').check();
  await page.getByLabel('Expanded uncertainty U (k = 2)').fill('0.05');
  await page.getByLabel('Weighing 1').fill('690');
  await page.getByLabel('Weighing 2').fill('691');
  await page.getByLabel('Power, as declared or as the evidence shows').fill('220');
  for (const cb of await form.locator('#dock-safety input[type="checkbox"]').all()) await cb.check();
  await record.click();
  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  await page.waitForFunction(() => {
    const el = document.querySelector('[data-testid="verdict"]');
    return !!el && el.getBoundingClientRect().top < window.innerHeight && el.getBoundingClientRect().bottom > 0;
  });
  await screenshot(page, 'phone-05-dock-verdict');
  assert.equal(await page.getByRole('note').count(), 1, 'one safety caution with the verdict');
  await page.context().close();
});

test('touch targets: protest checkboxes and breadcrumbs are at least 44 px; buttons and fields on role screens too', async () => {
  const ent = await phonePage(DEMO.entrant);
  await ent.goto('/protests');
  await ent.getByLabel('Meeting', { exact: true }).selectOption(meeting.eventId);
  const checks = ent.locator('input[name="requestedChecks"]');
  assert.ok((await checks.count()) >= 1);
  for (let i = 0; i < (await checks.count()); i++) {
    const cb = checks.nth(i);
    const b = await box(cb);
    assert.ok(
      b.width >= WCAG_MIN_PX && b.height >= WCAG_MIN_PX,
      `the box itself is ${b.width.toFixed(1)} x ${b.height.toFixed(1)} px (WCAG 2.2 SC 2.5.8: 24)`,
    );
    // The hit area is the whole label row; a tap at its far edge ticks the box.
    const label = cb.locator('xpath=ancestor::label');
    await label.scrollIntoViewIfNeeded();
    const lb = await box(label);
    assert.ok(
      lb.height >= TOUCH_PX && lb.width >= TOUCH_PX,
      `the label row is ${lb.width.toFixed(0)} x ${lb.height.toFixed(0)} px`,
    );
    if (await cb.isEnabled()) {
      const before = await cb.isChecked();
      await ent.mouse.click(lb.x + lb.width - 4, lb.y + lb.height / 2);
      assert.equal(await cb.isChecked(), !before, 'a tap at the far edge of the row toggles the box');
    }
  }
  await screenshot(ent, 'phone-06-protest-checks');
  assert.ok((await ent.getByRole('note').count()) <= 1, 'at most one safety caution on My protests');
  await ent.context().close();

  const org = await phonePage(DEMO.organiser);
  const screens = [
    `/organise/events/${DEMO.meetingId}`,
    `/organise/events/${DEMO.meetingId}/entries`,
    `/organise/events/${DEMO.meetingId}/results`,
    `/stewards/${DEMO.meetingId}`,
    `/inspect/${DEMO.meetingId}/board`,
  ];
  const small: string[] = [];
  for (const url of screens) {
    await org.goto(url);
    // The page streams behind its loading boundary: count the links once the breadcrumb is there.
    await org.getByRole('navigation', { name: 'Breadcrumb' }).waitFor();
    const crumbs = org.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link');
    for (let i = 0; i < (await crumbs.count()); i++) {
      const b = await box(crumbs.nth(i));
      if (b.height < TOUCH_PX || b.width < TOUCH_PX)
        small.push(
          `${url}: breadcrumb "${await crumbs.nth(i).innerText()}" ${b.width.toFixed(0)} x ${b.height.toFixed(0)}`,
        );
    }
    // Buttons, selects and text fields: the controls people tap (inline links in running text are exempt under SC 2.5.8).
    const found = await org.locator('main').evaluate((main) => {
      const out: string[] = [];
      for (const el of main.querySelectorAll<HTMLElement>(
        'button, select, input:not([type="hidden"]):not([type="checkbox"]):not([type="radio"]), textarea',
      )) {
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0) continue; // not shown
        if (r.height < 44)
          out.push(
            `${el.tagName.toLowerCase()} "${(el.textContent || el.getAttribute('aria-label') || el.getAttribute('name') || '').trim().slice(0, 30)}" ${r.width.toFixed(0)} x ${r.height.toFixed(0)}`,
          );
      }
      return out;
    });
    small.push(...found.map((f) => `${url}: ${f}`));
    const notes = await org.getByRole('note').count();
    assert.ok(notes <= 1, `${url} shows ${notes} safety cautions`);
    if (notes === 1) {
      const nb = await box(org.getByRole('note'));
      assert.ok(nb.height <= 110, `${url}: the caution is compact on a phone (${nb.height.toFixed(0)} px tall)`);
    }
  }
  await screenshot(org, 'phone-07-board');
  assert.deepEqual(small, [], 'every control measured is at least 44 px');
  await org.context().close();
});
