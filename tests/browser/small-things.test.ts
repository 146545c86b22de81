// Issue 13, item 11 (the smaller things), on a phone: an unknown address gets Boreline's own 404 page
// with ways back; the favicon answers with an image; an entrant with no boat is shown the first
// step; a hull number of −7 is refused beside the field; a race number that is taken is answered
// honestly (the next free number after it, both named); the dock's race-number field asks the
// phone for its number pad (HTML Living Standard, the inputmode attribute: "numeric").
// Runs alone (scripts/test.sh): it takes the demo meeting's next free race number.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { HttpSession } from '../support/http-session';
import { query } from '../support/db';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('small things: 404 page, favicon, an entrant’s first step, hull −7 refused, a taken race number answered honestly, numeric race-number field', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();

  // An unknown address: Boreline's own page, still a 404 (RFC 9110 §15.5.5), with links home.
  const missing = await page.goto(`/no-such-page-${Date.now()}`);
  assert.equal(missing?.status(), 404);
  await page.getByTestId('not-found').waitFor();
  assert.equal(await page.getByRole('link', { name: 'Your home page' }).getAttribute('href'), '/home');
  assert.equal(await page.getByRole('link', { name: 'Boreline’s front page' }).getAttribute('href'), '/');
  await screenshot(page, 'not-found-phone');

  // The favicon the page names (or the browser's default address when it names none) is an image.
  const iconHref = await page.evaluate(
    () => document.querySelector<HTMLLinkElement>('link[rel~="icon"]')?.getAttribute('href') ?? '/favicon.ico',
  );
  const icon = await page.request.get(iconHref);
  assert.equal(icon.status(), 200, `${iconHref} answers`);
  assert.match(icon.headers()['content-type'] ?? '', /^image\//);

  // A new entrant's home: the first step, not "no staff role".
  const email = uniqueEmail('first-step');
  await new HttpSession().signUpAndConfirm({ name: 'Tamsin Reed', email, password: 'first-step-password' });
  await signInWithPassword(page, email, 'first-step-password');
  assert.equal(await page.getByTestId('home-greeting').innerText(), 'Hello, Tamsin Reed');
  const first = page.getByTestId('first-step');
  assert.match(await first.innerText(), /Your first step: register your boat/);
  await screenshot(page, 'home-first-step-phone');
  await first.getByRole('link', { name: 'Register a boat' }).click();
  await page.waitForURL('**/boats/new');

  // Hull number −7 (the minus sign U+2212, as a phone types it): refused beside the field, nothing stored.
  await page.getByLabel('Boat name').fill('Minus Heron');
  await page.getByLabel('Hull or sail number').fill('−7');
  await page.getByLabel('Nozzle exit diameter', { exact: true }).fill('101.5');
  await page.getByLabel('Declared power', { exact: true }).fill('220');
  await page.getByRole('button', { name: 'Register the boat' }).click();
  const hullError = page.locator('[data-field-error="hullNumber"]');
  await hullError.waitFor();
  assert.match(await hullError.innerText(), /no minus sign/);
  await screenshot(page, 'hull-minus-refused-phone');
  await page.getByLabel('Hull or sail number').fill('-7');
  await page.getByRole('button', { name: 'Register the boat' }).click();
  await page.locator('[data-field-error="hullNumber"]').waitFor();
  assert.equal(
    (await query(`select 1 from boats b join users u on u.id = b.owner_id where u.email = $1`, [email])).length,
    0,
    'no boat stored',
  );
  await page.getByLabel('Hull or sail number').fill('');
  await page.getByRole('button', { name: 'Register the boat' }).click();
  await page.waitForURL((u) => /^\/boats\/[0-9a-f-]{36}$/.test(u.pathname));

  // A race number that is taken: the next free one after it, and the page says both.
  const [taken] = await query<{ n: number }>(
    `select race_number as n from entries where event_id = $1 order by race_number limit 1`,
    [DEMO.meetingId],
  );
  const [next] = await query<{ n: number }>(
    `select n from generate_series($2::int + 1, 9999) n where not exists (select 1 from entries where event_id = $1 and race_number = n) order by n limit 1`,
    [DEMO.meetingId, taken.n],
  );
  const [cls] = await query<{ id: string; code: string }>(
    `select id, code from race_classes where event_id = $1 and code = 'SS'`,
    [DEMO.meetingId],
  );
  await page.goto(`${new URL(page.url()).pathname}/enter`);
  await page.getByLabel('Meeting', { exact: true }).selectOption(DEMO.meetingId);
  await page.getByLabel('Class', { exact: true }).selectOption(cls.id);
  await page.getByLabel('Race number you would like').fill(String(taken.n));
  await page.getByRole('button', { name: `Enter Minus Heron in ${cls.code}` }).click();
  const note = page.getByTestId('race-number-note');
  await note.waitFor();
  assert.equal(
    await note.innerText(),
    `Race number ${taken.n} is already taken at this meeting, so you have ${next.n}, the next free number.`,
  );
  assert.match(await page.getByTestId('entry-made').locator('h2').innerText(), new RegExp(`race number ${next.n}$`));
  await screenshot(page, 'entry-taken-number-phone');
  await context.close();

  // The dock's race-number field opens the number pad.
  const dock = await newContext(browser, PHONE);
  const scrutineer = await dock.newPage();
  await signInWithPassword(scrutineer, DEMO.scrutineer, DEMO_PASSWORD);
  await scrutineer.goto(`/inspect/${DEMO.meetingId}`);
  const field = scrutineer.getByLabel('Race number or tag code');
  assert.equal(await field.getAttribute('inputmode'), 'numeric');
  assert.equal(await field.getAttribute('pattern'), '[0-9]*');
  await screenshot(scrutineer, 'dock-find-numeric-phone');
  await dock.close();
});
