// The running app's scripts are the hinted build (scripts/compile-hints.mjs): every script a page names starts with
// V8's explicit compile hint, `//# allFunctionsCalledOnLoad` on the first line (V8 blog, "Giving V8 a heads-up:
// faster JavaScript startup with explicit compile hints", 2025 [memory]), whichever encoding the client accepts.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL } from '../support/env';

test('every script of the landing page and the calculator begins with the compile hint', async () => {
  const scripts = new Set<string>();
  for (const page of ['/', '/calculator']) {
    const html = await (await fetch(`${BASE_URL}${page}`)).text();
    for (const s of html.match(/\/_next\/static\/chunks\/[\w.-]+\.js/g) ?? []) scripts.add(s);
  }
  assert.ok(scripts.size >= 5, `the pages name their scripts (${scripts.size})`);
  for (const s of scripts) {
    for (const encoding of ['identity', 'gzip', 'br']) {
      // fetch decodes gzip and br itself: the text is the file as built.
      const res = await fetch(`${BASE_URL}${s}`, { headers: { 'accept-encoding': encoding } });
      assert.equal(res.status, 200, s);
      // Brotli copies are made in the background after the server starts (static-compression.test.ts waits for
      // them): until then a br client gets gzip.
      const sent = res.headers.get('content-encoding');
      if (encoding === 'identity') assert.equal(sent, null, s);
      else if (encoding === 'gzip') assert.equal(sent, 'gzip', s);
      else assert.ok(sent === 'br' || sent === 'gzip', `${s}: ${sent}`);
      const text = await res.text();
      assert.ok(text.startsWith('//# allFunctionsCalledOnLoad\n'), `${s} (${encoding}) starts with the hint`);
      assert.ok(text.length > 200, `${s} has its code after the hint`);
      // The suite's build has no browser source maps (next.config.mjs allows them only in a profiling build).
      assert.ok(!text.includes('sourceMappingURL='), `${s} names no source map`);
    }
  }
});
