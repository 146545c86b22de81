// Journey: /verify checks a bundle in Chromium without uploading it (issue 24, item 4). The bundle is made
// in the test from invented rows (tests/support/chain-bundle.ts: SHA-256, RFC 8785, Ed25519 per RFC 8032
// through node:crypto); the page must verify it with the browser's WebCrypto, and name record 4 of the same
// bundle with one record changed. No request leaves the page while it checks.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, PHONE } from '../support/browser';
import { bundleText, makeBundle } from '../support/chain-bundle';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('a bundle verifies in the browser, a changed one names its record, nothing is uploaded', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await page.goto('/verify');
  await page.waitForLoadState('networkidle');
  const sent: string[] = [];
  page.on('request', (r) => sent.push(`${r.method()} ${r.url()}`));

  const { lines } = makeBundle();
  const file = (text: string) => ({
    name: 'bundle.jsonl',
    mimeType: 'application/x-ndjson',
    buffer: Buffer.from(text),
  });
  await page.getByLabel('Export bundle').setInputFiles(file(bundleText(lines)));
  const result = page.getByTestId('verify-result');
  await result.waitFor();
  assert.match(await result.innerText(), /Verified: 6 records \(0 withheld\), 1 files, 1 signed checkpoints/);
  assert.ok((await result.innerText()).includes(String(lines[1].fingerprint)), 'the key fingerprint is shown');

  const changed = structuredClone(lines);
  const fourth = changed.find((l) => l.type === 'record' && l.seq === 4)!;
  (fourth.row as Record<string, unknown>).overall_result = 'does_not_conform';
  await page.getByLabel('Export bundle').setInputFiles(file(bundleText(changed)));
  await page.getByText('Not verified').waitFor();
  assert.match(await result.innerText(), /First record that differs: number 4, inspections insp-4/);
  assert.deepEqual(sent, [], 'the page sends nothing while it checks');
  await context.close();
});
