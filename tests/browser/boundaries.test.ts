// Issue 14, item 5 (route segment boundaries), on a phone: an address that names nothing inside a
// signed-in section gets that section's own not-found card, inside the signed-in shell, with the way
// back to the section's first page; an address Boreline does not know at all gets the root page;
// a section whose page fails (here: PostgreSQL stopped, a real outage) shows a plain message and a
// retry inside the shell, and the retry brings the page back once the database is up again.
// Runs alone (scripts/test.sh): it stops PostgreSQL.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { execFileSync } from 'node:child_process';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

async function signedIn(email: string): Promise<Page> {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, email, DEMO_PASSWORD);
  return page;
}

/** The section's not-found card: its heading, and the link back to the section's first page. */
async function expectSectionNotFound(page: Page, path: string, heading: string, back: { name: string; href: string }) {
  const res = await page.goto(path);
  // RFC 9110 §15.5.5: 404 Not Found. The page's check runs in a layout above its loading.tsx, so the
  // answer is not streamed and keeps its status.
  assert.equal(res?.status(), 404, path);
  const card = page.getByTestId('section-not-found');
  await card.waitFor();
  assert.equal(await card.getByRole('heading', { level: 1 }).innerText(), heading, path);
  assert.equal(await card.getByRole('link', { name: back.name }).getAttribute('href'), back.href, path);
  // Inside the signed-in shell (its header and sign-out stay), not the root's whole-page card.
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
  assert.equal(await page.getByTestId('not-found').count(), 0, `${path}: not the root page`);
  // The framework marks a not-found answer noindex as well (Next.js 16 docs, loading.js "Status codes").
  assert.equal((await page.locator('meta[name="robots"][content*="noindex"]').count()) > 0, true, `${path}: noindex`);
}

test('an unknown meeting under inspect, stewards and organise, and an unknown protest, get their section’s not-found with a way back', async () => {
  const scrutineer = await signedIn(DEMO.scrutineer);
  // Not an id at all: the page answers notFound() before asking who may see the meeting.
  await expectSectionNotFound(scrutineer, '/inspect/no-such-meeting', 'No such meeting to inspect', {
    name: 'Your meetings to inspect',
    href: '/inspect',
  });
  await screenshot(scrutineer, 'boundaries-inspect-not-found-phone');
  await scrutineer.getByTestId('section-not-found').getByRole('link', { name: 'Your meetings to inspect' }).click();
  await scrutineer.waitForURL((u) => u.pathname === '/inspect');
  assert.equal(await scrutineer.getByRole('heading', { level: 1 }).innerText(), 'Inspect');

  const steward = await signedIn(DEMO.steward);
  await expectSectionNotFound(steward, '/stewards/no-such-meeting', 'No such meeting or protest', {
    name: 'Your meetings as a steward',
    href: '/stewards',
  });
  // A protest id that is well formed but names no protest at this meeting.
  await expectSectionNotFound(
    steward,
    `/stewards/${DEMO.meetingId}/protests/${randomUUID()}`,
    'No such meeting or protest',
    { name: 'Your meetings as a steward', href: '/stewards' },
  );

  const organiser = await signedIn(DEMO.organiser);
  await expectSectionNotFound(organiser, '/organise/events/no-such-meeting', 'No such meeting, class or report', {
    name: 'Meetings you organise',
    href: '/organise',
  });

  // Someone else's protest reads exactly like a missing one.
  const entrant = await signedIn(DEMO.entrant);
  await expectSectionNotFound(entrant, `/protests/${randomUUID()}`, 'No such protest among yours', {
    name: 'My protests',
    href: '/protests',
  });
  await screenshot(entrant, 'boundaries-protests-not-found-phone');
});

test('an unknown top-level address, signed in or not, gets the root not-found page (404)', async () => {
  const entrant = await signedIn(DEMO.entrant);
  for (const path of [`/no-such-area-${Date.now()}`, `/inspect/${DEMO.meetingId}/no-such-screen`]) {
    const res = await entrant.goto(path);
    // RFC 9110 §15.5.5: 404 Not Found.
    assert.equal(res?.status(), 404, path);
    await entrant.getByTestId('not-found').waitFor();
    assert.equal(await entrant.getByTestId('section-not-found').count(), 0, `${path}: not a section's card`);
    assert.equal(await entrant.getByRole('link', { name: 'Your home page' }).getAttribute('href'), '/home');
  }
  await screenshot(entrant, 'boundaries-root-not-found-signed-in-phone');
});

// The test database's own cluster (scripts/pg.sh, on this run's PGPORT), as bench:reliability stops it.
const pgCtl = (action: 'start' | 'stop') =>
  execFileSync('bash', ['scripts/pg.sh', 'boreline_test'], {
    env: { ...process.env, PG_ACTION: action },
    stdio: 'pipe',
  });

test('a section whose page fails shows its error card inside the shell, with no detail, and retry recovers', async () => {
  const scrutineer = await signedIn(DEMO.scrutineer);
  await scrutineer.goto('/inspect');
  const board = scrutineer
    .locator(`[data-event-id="${DEMO.meetingId}"]`)
    .getByRole('link', { name: 'Inspection board' });
  await board.waitFor();
  pgCtl('stop');
  try {
    // A navigation inside the section renders only the segments that change, so the signed-in
    // shell stays and the board page's own reads are the ones that fail.
    await board.click();
    const card = scrutineer.getByTestId('section-error');
    await card.waitFor();
    assert.equal(
      await card.getByRole('heading', { level: 1 }).innerText(),
      'The inspection screen could not be loaded',
    );
    assert.equal(await card.getAttribute('role'), 'alert');
    await scrutineer.getByRole('button', { name: 'Sign out' }).waitFor();
    // Nothing of the failure itself reaches the page (OWASP Error Handling Cheat Sheet: no stack
    // traces or internal detail to the user).
    const text = await scrutineer.locator('body').innerText();
    assert.doesNotMatch(text, /ECONNREFUSED|Sequelize|postgres|digest|\bat \S+ \(/i);
    await screenshot(scrutineer, 'boundaries-inspect-error-phone');
  } finally {
    pgCtl('start');
  }
  // The database is back; the pool may need a moment to drop connections the stop closed, so a
  // person might press Try again more than once (polled, at most 10 presses).
  const heading = scrutineer.getByRole('heading', { level: 1, name: 'Inspection board' });
  for (let press = 1; press <= 10 && (await heading.count()) === 0; press++) {
    await scrutineer.getByTestId('section-error').getByRole('button', { name: 'Try again' }).click();
    await heading.waitFor({ timeout: 3000 }).catch(() => undefined);
  }
  await heading.waitFor({ timeout: 1000 });
  assert.equal(await scrutineer.getByTestId('section-error').count(), 0);
  assert.equal(new URL(scrutineer.url()).pathname, `/inspect/${DEMO.meetingId}/board`);
});
