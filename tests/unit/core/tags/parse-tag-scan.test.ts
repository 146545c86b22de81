// What the dock's scanner (or a person typing from the sticker) read, as a tag token
// (lib/core/tags/parse-tag-scan.ts). A tag's token is 18 random bytes in base64url: 24 characters
// of the URL-safe alphabet A-Z a-z 0-9 - _ (RFC 4648 section 5), printed as …/t/TOKEN.
// The parser accepts 8 to 64 characters of that alphabet, bare or as the last path segment of a URL.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import { parseTagScan } from '../../../../lib/core/tags/parse-tag-scan';

const TOKEN = randomBytes(18).toString('base64url'); // as a tag is made: 24 characters (RFC 4648 section 5)

test('a bare token is itself; surrounding whitespace from a scanner or a paste is dropped', () => {
  assert.equal(TOKEN.length, 24, '18 bytes are 24 base64url characters (RFC 4648: 4 characters per 3 bytes)');
  assert.equal(parseTagScan(TOKEN), TOKEN);
  assert.equal(parseTagScan(`  ${TOKEN}\n`), TOKEN);
  assert.equal(parseTagScan(`\t${TOKEN}\r\n`), TOKEN);
  assert.equal(parseTagScan('Ab-_09zZ'), 'Ab-_09zZ', 'every character class of the alphabet');
  assert.equal(parseTagScan('abcdefgh'), 'abcdefgh', 'case is kept');
  assert.equal(parseTagScan('ABCDEFGH'), 'ABCDEFGH');
});

test('a tag URL gives its token, with or without a trailing slash, query or fragment', () => {
  for (const text of [
    `https://boreline.example/t/${TOKEN}`,
    `https://boreline.example/t/${TOKEN}/`,
    `https://boreline.example/t/${TOKEN}?utm_source=sticker`,
    `https://boreline.example/t/${TOKEN}/?a=1&b=2`,
    `https://boreline.example/t/${TOKEN}#top`,
    `http://127.0.0.1:3000/t/${TOKEN}`,
    `https://boreline.example/base/path/t/${TOKEN}`,
    `/t/${TOKEN}`,
    `  https://boreline.example/t/${TOKEN}  `,
  ])
    assert.equal(parseTagScan(text), TOKEN, text);
});

test('the host is not checked: a URL from another host that ends in /t/TOKEN gives the token (the server decides whether it is a tag)', () => {
  assert.equal(parseTagScan(`https://elsewhere.invalid/t/${TOKEN}`), TOKEN);
  // Only the token reaches the lookup: nothing of the other host is kept.
  assert.equal(parseTagScan(`https://elsewhere.invalid/t/${TOKEN}?next=https://x.invalid`), TOKEN);
});

test('URLs without the tag path, or with more after the token, are not tokens', () => {
  for (const text of [
    `https://boreline.example/${TOKEN}`,
    `https://boreline.example/boats/${TOKEN}`,
    `https://boreline.example/t/${TOKEN}/extra`,
    `https://boreline.example/t/`,
    `https://boreline.example/t`,
    `https://boreline.example/T/${TOKEN}`, // the path is case-sensitive (RFC 3986 section 6.2.2.1)
    `https://boreline.example/t/${TOKEN}//`,
    'https://boreline.example/',
  ])
    assert.equal(parseTagScan(text), null, text);
});

test('too short, too long or outside the alphabet: null', () => {
  assert.equal(parseTagScan(''), null);
  assert.equal(parseTagScan('   '), null);
  assert.equal(parseTagScan('abcdefg'), null, '7 characters');
  assert.equal(parseTagScan('a'.repeat(8)), 'a'.repeat(8), '8 characters');
  assert.equal(parseTagScan('a'.repeat(64)), 'a'.repeat(64), '64 characters');
  assert.equal(parseTagScan('a'.repeat(65)), null, '65 characters');
  assert.equal(parseTagScan(`/t/${'a'.repeat(65)}`), null, '65 characters in a URL');
  for (const text of [
    'abc def gh',
    'abcd.efgh',
    'abcd+efgh',
    'abcd/efgh',
    'abcd=efgh', // '+', '/', '=' are base64, not base64url (RFC 4648 sections 4 and 5)
    'abcd%41efgh',
    'äbcdefgh',
    'ａｂｃｄｅｆｇｈ',
    'abcdefgh\u0000',
    "abcd'efgh",
    '<script>x</script>',
    `${TOKEN} ${TOKEN}`,
    `${TOKEN}\n${TOKEN}`,
  ])
    assert.equal(parseTagScan(text), null, JSON.stringify(text));
});

test('garbage and very long input: null, quickly', () => {
  const inputs = [
    'x'.repeat(1_000_000),
    '/t/'.repeat(300_000),
    `/t/${'a'.repeat(1_000_000)}!`,
    `${'a/t/'.repeat(200_000)}!`,
    `/t/${'a'.repeat(500_000)}?${'#'.repeat(500_000)}\n`,
  ];
  for (const text of inputs) {
    const started = performance.now();
    assert.equal(parseTagScan(text), null);
    // Linear-time matching: a megabyte takes milliseconds; a second is far beyond that (common practice, no source).
    assert.ok(
      performance.now() - started < 1000,
      `${text.length} characters took ${Math.round(performance.now() - started)} ms`,
    );
  }
});
