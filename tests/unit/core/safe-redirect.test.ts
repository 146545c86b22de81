// Redirect targets after sign-in: only paths on the app's own origin. The evasions are those of the
// OWASP Unvalidated Redirects and Forwards Cheat Sheet; how a browser reads them (tabs and newlines
// stripped, "\" as "/" in http(s) URLs) is the WHATWG URL Standard's basic URL parser, which Node's
// URL implements too.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { safeRedirectPath } from '../../../lib/core/safe-redirect';

const APP = 'http://localhost:3100';

test('same-origin paths are kept, re-serialised', () => {
  assert.equal(safeRedirectPath('/inspect/abc?x=1#top', APP), '/inspect/abc?x=1#top');
  assert.equal(safeRedirectPath('/t/AbC_12', APP), '/t/AbC_12');
  assert.equal(safeRedirectPath('http://localhost:3100/boats', APP), '/boats', 'an absolute URL on our own origin');
  assert.equal(
    safeRedirectPath('/%2F%2Fevil.example', APP),
    '/%2F%2Fevil.example',
    'encoded slashes stay one path segment',
  );
});

test('every way out to another host falls back to home', () => {
  const evasions = [
    '//attacker.invalid/x',
    '/\\attacker.invalid/x',
    '\\\\attacker.invalid/x',
    '/\t/attacker.invalid/x',
    '/\n/attacker.invalid/x',
    ' //attacker.invalid',
    'https://attacker.invalid/x',
    'http://localhost:3101/x',
    'https://localhost:3100/x',
    'javascript:alert(1)',
    'data:text/html,hi',
    '/.//attacker.invalid',
    '///attacker.invalid',
  ];
  for (const raw of evasions) assert.equal(safeRedirectPath(raw, APP), '/home', JSON.stringify(raw));
});

test('nothing usable: the fallback', () => {
  assert.equal(safeRedirectPath(undefined, APP), '/home');
  assert.equal(safeRedirectPath(['/a'], APP), '/home');
  assert.equal(safeRedirectPath('', APP, '/'), '/');
  assert.equal(safeRedirectPath(`/${'a'.repeat(3000)}`, APP), '/home');
});
