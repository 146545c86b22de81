// The Content Security Policy is one the app passes: visiting the main screens (signed out and
// signed in) logs no CSP violation in Chromium's console.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, signInWithPassword } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';

let browser: Browser;
before(async () => { browser = await launchBrowser(); });
after(async () => { await browser?.close(); });

test('no CSP violations on the main screens', async () => {
  const context = await newContext(browser);
  const page = await context.newPage();
  const violations: string[] = [];
  page.on('console', (m) => { if (/Content Security Policy|Refused to/i.test(m.text())) violations.push(m.text()); });
  for (const path of ['/', '/sign-in', '/sign-up', '/calculator']) {
    await page.goto(path);
    await page.waitForLoadState('networkidle');
  }
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  for (const path of ['/home', '/organise', `/organise/events/${DEMO.meetingId}`, `/organise/events/${DEMO.meetingId}/entries`, '/boats', '/entries', '/account']) {
    await page.goto(path);
    await page.waitForLoadState('networkidle');
  }
  assert.deepEqual(violations, []);
  await context.close();
});
