// The Content Security Policy is one the app passes: visiting the main screens (signed out and
// signed in) logs no CSP violation in Chromium's console. Pages allow scripts only by a fresh nonce
// per response (CSP Level 3 'nonce-…' with 'strict-dynamic'), never 'unsafe-inline'; an injected
// inline script without the nonce does not run.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, signInWithPassword } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('no CSP violations on the main screens', async () => {
  const context = await newContext(browser);
  const page = await context.newPage();
  const violations: string[] = [];
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to/i.test(m.text())) violations.push(m.text());
  });
  for (const path of ['/', '/sign-in', '/sign-up', '/calculator']) {
    await page.goto(path);
    await page.waitForLoadState('networkidle');
  }
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  for (const path of [
    '/home',
    '/organise',
    `/organise/events/${DEMO.meetingId}`,
    `/organise/events/${DEMO.meetingId}/entries`,
    '/boats',
    '/entries',
    '/account',
  ]) {
    await page.goto(path);
    await page.waitForLoadState('networkidle');
  }
  assert.deepEqual(violations, []);

  const first = (await page.goto('/calculator'))!.headers()['content-security-policy'];
  const second = (await page.goto('/calculator'))!.headers()['content-security-policy'];
  const scriptSrc = first.split(';').find((d) => d.trim().startsWith('script-src'))!;
  assert.match(scriptSrc, /'nonce-[A-Za-z0-9+/=]{22,}'/);
  assert.match(scriptSrc, /'strict-dynamic'/);
  assert.doesNotMatch(scriptSrc, /unsafe-inline/);
  assert.notEqual(first, second, 'a fresh nonce for every response');
  // Markup that slipped into the page (an XSS) cannot run its inline handler: that would need
  // 'unsafe-inline', which the old policy had.
  // Instead of waiting a while, wait for the image's own error event: listeners run in the order they were
  // added (DOM Standard, "inner invoke"), so the inline handler, set when the markup was parsed, would have run first.
  const errored = await page.evaluate(
    () =>
      new Promise<boolean>((resolve) => {
        document.body.insertAdjacentHTML(
          'beforeend',
          '<img id="csp-probe" src="/no-such-image.png" onerror="window.__injected = true">',
        );
        document.getElementById('csp-probe')!.addEventListener('error', () => resolve(true), { once: true });
        setTimeout(() => resolve(false), 10_000);
      }),
  );
  assert.equal(errored, true, 'the injected image failed to load (its error event fired)');
  assert.equal(await page.evaluate(() => (window as unknown as { __injected?: boolean }).__injected ?? false), false);
  await context.close();
});
