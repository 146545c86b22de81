// Unsafe characters in JSON bodies (lib/core/inputs/text-safety.ts): NUL and other C0/C1 controls,
// and the bidirectional overrides and isolates of Unicode Standard Annex #9 (the "Trojan Source"
// class, CVE-2021-42574), found with the field's dotted path; ordinary text in any script passes.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { findUnsafeText, isSingleLine } from '../../../../lib/core/inputs/text-safety';

test('controls and direction overrides are found with their path; line breaks, tabs and any script pass', () => {
  assert.deepEqual(findUnsafeText({ name: 'Tussock\u0000' }), { field: 'name', codePoint: 'U+0000' });
  assert.deepEqual(findUnsafeText({ a: [{ b: 'x\u202Ey' }] }), { field: 'a.0.b', codePoint: 'U+202E' });
  assert.deepEqual(findUnsafeText({ a: 'x\u2066y' }), { field: 'a', codePoint: 'U+2066' });
  assert.deepEqual(findUnsafeText({ a: 'x\u0085y' }), { field: 'a', codePoint: 'U+0085' });
  assert.equal(findUnsafeText({ note: 'Line one\nLine two\r\n\tindented', n: 3, ok: true, none: null }), null);
  assert.equal(
    findUnsafeText({ name: 'Māui Te Rere — ŽĆ 東京 عربى' }),
    null,
    'letters of every script and Arabic text itself are fine',
  );
  assert.equal(isSingleLine('Tussock Arrow'), true);
  assert.equal(isSingleLine('Tussock\r\nBcc: x'), false);
});
