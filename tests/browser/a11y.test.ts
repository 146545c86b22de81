// Accessibility sweep: every page each role reaches, on a phone, in the standard theme and in the
// high-contrast "sunlight" theme, checked with axe-core against WCAG 2.2 levels A and AA (the rules
// tagged wcag2a, wcag2aa, wcag21a, wcag21aa, wcag22aa); any serious or critical violation fails.
// The pages run on a meeting of this test's own (a published report, a recorded boat, a tag).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, newContext, PHONE, screenshot, signInWithPassword } from '../support/browser';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { HttpSession } from '../support/http-session';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { waitForDockForm } from '../support/dock-record';
import { SUNLIGHT_CLASS, THEME_COOKIE } from '../../lib/core/theme';

let browser: Browser;
const meeting = new InspectionMeeting();
let classId = '';
let entry: TestEntry;
let publicId = '';
// The demo's invented series and its class (seeders/20261204060000-demo-series.js).
const DEMO_SERIES = '0b0e0000-0000-4000-8161-000000000001';
const DEMO_SERIES_CLASS = '0b0e0000-0000-4000-8161-000000000101';

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`A11y Reach ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  classId = await meeting.addClass('AX', rulesWith());
  entry = await meeting.addEntry(classId);
  await meeting.addEntry(classId);
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const rec = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entry.id, 101.9));
  assert.equal(rec.res.status, 201, JSON.stringify(rec.body));
  const pub = await meeting.organiser.json(`/api/events/${meeting.eventId}/classes/${classId}/report/publish`, {
    note: 'a11y sweep',
  });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  publicId = pub.body.data.publicId;
});
after(async () => {
  await browser?.close();
});

/** A page to check, and a chart on it to scroll to and wait for (charts are drawn near the screen only). */
type Stop = { path: string; chart?: string; ready?: string };

/**
 * Checks each page in both themes with one load: the page arrives in the theme its cookie names (the
 * server puts the class on <html>), is checked, is switched to the other theme as the header's switch
 * does it (class on <html>, cookie for later pages) and is checked again. The next page therefore
 * arrives in the other theme, so server-rendered pages of both themes get the full rule set along the way.
 */
async function sweep(page: Page, context: BrowserContext, stops: Stop[]) {
  let theme = 'standard' as 'standard' | 'sunlight';
  await context.addCookies([{ name: THEME_COOKIE, value: theme, url: BASE_URL }]);
  for (const stop of stops) {
    await page.goto(stop.path);
    await page.locator('h1').first().waitFor();
    if (stop.ready) await page.getByTestId(stop.ready).waitFor();
    if (stop.ready === 'inspection-form') await waitForDockForm(page);
    if (stop.chart) {
      await page.getByTestId(stop.chart).scrollIntoViewIfNeeded();
      await page.getByTestId(stop.chart).locator('svg.recharts-surface').first().waitFor();
    }
    // The theme comes from the server, in the HTML: the class is there before any script runs.
    assert.equal(await hasSunlightClass(page), theme === 'sunlight', `${stop.path} arrived in the ${theme} theme`);
    await expectNoSeriousA11yViolations(page, `${stop.path} (${theme} theme)`);
    theme = theme === 'standard' ? 'sunlight' : 'standard';
    await page.evaluate((c) => document.documentElement.classList.toggle(c), SUNLIGHT_CLASS);
    await context.addCookies([{ name: THEME_COOKIE, value: theme, url: BASE_URL }]);
    assert.equal(await hasSunlightClass(page), theme === 'sunlight');
    // Only colours changed: the colour rules run again (the structure was checked in full above).
    await expectNoSeriousA11yViolations(page, `${stop.path} (${theme} theme, switched on the page)`, {
      only: 'colour',
    });
  }
}

function hasSunlightClass(page: Page) {
  return page.evaluate((c) => document.documentElement.classList.contains(c), SUNLIGHT_CLASS);
}

async function signedInPage(email: string) {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, email, DEMO_PASSWORD);
  return { context, page };
}

test('public pages: no serious or critical axe-core violation in either theme', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await sweep(page, context, [
    { path: '/' },
    { path: '/sign-in' },
    { path: '/sign-up' },
    { path: '/calculator', chart: 'thrust-chart' },
    { path: '/verify' },
    { path: `/reports/${publicId}`, chart: 'chart-thrust-curves' },
    { path: `/t/${entry.token}` },
    { path: `/series/${DEMO_SERIES}` },
    { path: `/no-such-page-${Date.now()}` },
  ]);
  // The header (mark, theme switch, two buttons) fits a 390 px phone: nothing scrolls sideways
  // (WCAG 2.2 SC 1.4.10 Reflow asks for 320 px).
  await page.goto('/');
  const header = page.locator('header').first();
  await header.waitFor();
  const fits = await header.evaluate((h) => ({
    scroll: h.scrollWidth,
    client: h.clientWidth,
    page: document.documentElement.scrollWidth,
  }));
  assert.ok(fits.scroll <= fits.client && fits.page <= 390, JSON.stringify(fits));
  await screenshot(page, 'a11y-landing-phone');
  await context.close();
});

test('scrutineer pages, the dock form included: no serious or critical axe-core violation in either theme', async () => {
  const { context, page } = await signedInPage(DEMO.scrutineer);
  const e = meeting.eventId;
  await sweep(page, context, [
    { path: '/home' },
    { path: '/inspect' },
    { path: `/inspect/${e}` },
    { path: `/inspect/${e}?race=${entry.raceNumber}`, ready: 'inspection-form' },
    { path: `/inspect/${e}/board` },
    { path: `/inspect/${e}/instruments` },
    { path: `/inspect/${e}/seals` },
    { path: `/inspect/${e}/custody` },
    { path: `/inspect/${e}/queue`, ready: 'queue-day' },
    { path: `/inspect/${e}/slots` },
    { path: `/inspect/${e}/incidents` },
    { path: `/inspect/${e}/start-list`, ready: 'start-list' },
    { path: `/inspect/${e}/reports` },
  ]);
  await context.close();
});

test('entrant pages: no serious or critical axe-core violation in either theme', async () => {
  const { context, page } = await signedInPage(DEMO.entrant);
  await sweep(page, context, [
    { path: '/entries' },
    { path: '/boats' },
    { path: '/boats/new' },
    { path: `/boats/${entry.boatId}` },
    { path: `/slot/${meeting.eventId}/${entry.id}` },
    { path: '/protests' },
    { path: '/appeals' },
    { path: '/account' },
  ]);
  await context.close();
});

test('organiser, steward, administrator and appeal body pages: no serious or critical axe-core violation in either theme', async () => {
  const e = meeting.eventId;
  const sweeps: Promise<void>[] = [];
  for (const [email, stops] of [
    [
      DEMO.organiser,
      [
        { path: '/organise' },
        { path: '/organise/events/new' },
        { path: `/organise/events/${e}` },
        { path: `/organise/events/${e}/entries` },
        { path: `/organise/events/${e}/results` },
        { path: `/organise/events/${e}/penalties` },
        { path: `/organise/events/${e}/timing` },
        { path: `/organise/events/${e}/clock` },
        { path: `/organise/events/${e}/classes/${classId}` },
        { path: `/organise/events/${e}/classes/${classId}/report`, chart: 'chart-thrust-curves' },
        { path: `/series/${DEMO_SERIES}/officials` },
      ],
    ],
    [
      DEMO.steward,
      [
        { path: '/stewards' },
        { path: '/series' },
        { path: `/series/${DEMO_SERIES}/classes/${DEMO_SERIES_CLASS}/parity` },
        { path: `/stewards/${e}` },
        { path: `/stewards/${e}/audit` },
        { path: `/stewards/${e}/interests` },
        { path: `/stewards/${e}/penalties` },
      ],
    ],
    [DEMO.admin, [{ path: '/admin' }]],
    [DEMO.appealBody, [{ path: '/appeals' }]],
  ] as const) {
    sweeps.push(
      (async () => {
        const { context, page } = await signedInPage(email);
        await sweep(page, context, [...stops]);
        await context.close();
      })(),
    );
  }
  // The four people's sweeps run side by side (each in its own browser context); every one must pass.
  await Promise.all(sweeps);
});

test('the sunlight switch: pressed state, class on <html> at once, remembered across pages by the server', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await page.goto('/calculator');
  const toggle = page.getByRole('button', { name: 'Sunlight' });
  await toggle.waitFor();
  assert.equal(await toggle.getAttribute('aria-pressed'), 'false');
  await toggle.focus();
  await page.keyboard.press('Enter');
  await page.waitForFunction((c) => document.documentElement.classList.contains(c), SUNLIGHT_CLASS);
  assert.equal(await toggle.getAttribute('aria-pressed'), 'true');
  const cookie = (await context.cookies()).find((c) => c.name === THEME_COOKIE);
  assert.equal(cookie?.value, 'sunlight');
  // The next page arrives with the class already in its HTML (no flash of the standard theme).
  const html = await (await page.request.get('/sign-in')).text();
  assert.match(html, /<html[^>]*class="[^"]*\bsunlight\b/);
  // Body text in the sunlight theme is black on white: 21:1 (WCAG 2.2 SC 1.4.6 asks 7:1 for AAA).
  const colours = await page.evaluate(() => {
    const s = getComputedStyle(document.documentElement);
    return { color: s.color, background: s.backgroundColor };
  });
  assert.deepEqual(colours, { color: 'rgb(0, 0, 0)', background: 'rgb(255, 255, 255)' });
  await page.keyboard.press('Space');
  await page.waitForFunction((c) => !document.documentElement.classList.contains(c), SUNLIGHT_CLASS);
  assert.equal((await context.cookies()).find((c) => c.name === THEME_COOKIE)?.value, 'standard');
  await context.close();
});
