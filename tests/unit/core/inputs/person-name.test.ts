// The name a person gives (sign-up, a staff invitation, My account). Refused characters: C0 and C1
// controls (Unicode general category Cc) and the explicit bidirectional formatting characters of
// Unicode Standard Annex #9 §2 (U+202A–U+202E embeddings and overrides, U+2066–U+2069 isolates),
// the "Trojan Source" characters of CVE-2021-42574; U+2028/U+2029 are Unicode's line and paragraph
// separators. ZWNJ/ZWJ (U+200C, U+200D) are kept: Unicode Core Specification §23.2 describes them
// as needed to spell words in scripts such as Persian and the Indic scripts ([memory] for the section number).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { ChangeNameInput, personName } from '../../../../lib/core/inputs/auth';

const refused = (v: unknown) => {
  const r = personName.safeParse(v);
  return r.success ? null : r.error.issues[0]?.message;
};

test('a name is trimmed and kept as typed, accents and joiners included', () => {
  assert.equal(personName.parse('  Wren Halloway  '), 'Wren Halloway');
  assert.equal(personName.parse('Zoë Ōtaki-Ngata'), 'Zoë Ōtaki-Ngata');
  assert.equal(personName.parse('می\u200Cخواهم'), 'می\u200Cخواهم');
  assert.equal(personName.parse('x'.repeat(120)), 'x'.repeat(120));
  assert.deepEqual(ChangeNameInput.parse({ name: ' Ada ' }), { name: 'Ada' });
});

test('blank, missing, too long or not text: a message that says what to do', () => {
  assert.equal(refused(''), 'Enter your name.');
  assert.equal(refused('   '), 'Enter your name.');
  assert.equal(refused(undefined), 'Enter your name.');
  assert.equal(refused(42), 'Enter your name.');
  assert.equal(refused('x'.repeat(121)), 'Keep the name under 120 characters.');
});

test('control characters, line separators and bidirectional overrides are refused', () => {
  for (const bad of [
    'Wren\nFake line',
    'Wren\r\nBcc: x',
    'Wren\u0000',
    'Wren\u0085',
    'Wren\u202Eyawollah',
    'Wren\u2066x\u2069',
    'Wren\u2028x',
  ]) {
    assert.equal(refused(bad), 'Use letters, spaces and punctuation only in the name.', JSON.stringify(bad));
  }
});
