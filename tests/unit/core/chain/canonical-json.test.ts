// The chain's canonical form against RFC 8785 (JSON Canonicalization Scheme) itself: the examples of
// section 3.2.2 / 3.2.4 (the sample object and its canonical output), 3.2.3 (property sorting by UTF-16
// code units), and Appendix B (IEEE 754 doubles and their JSON text, including the two that must fail).
// The expected texts were typed from the RFC (rfc-editor.org/rfc/rfc8785), not produced by this code.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { canonicalJson, parseRowJson } from '../../../../lib/core/chain/canonical-json';

test('RFC 8785 section 3.2.2 sample input gives the canonical text of section 3.2.4', () => {
  const input = JSON.parse(
    '{"numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],' +
      ' "string": "\\u20ac$\\u000F\\u000aA\'\\u0042\\u0022\\u005c\\\\\\"\\/", "literals": [null, true, false]}',
  );
  const expected =
    '{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],' +
    '"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}';
  assert.equal(canonicalJson(input), expected);
  // Section 3.2.4 also prints the UTF-8 bytes: the Euro sign is e2 82 ac, the rest ASCII.
  const bytes = Buffer.from(canonicalJson(input), 'utf8');
  assert.equal(bytes.length, expected.length + 2);
  assert.equal(bytes.subarray(bytes.indexOf(0xe2), bytes.indexOf(0xe2) + 3).toString('hex'), 'e282ac');
});

test('RFC 8785 section 3.2.3: properties sorted by their UTF-16 code units', () => {
  const input = JSON.parse(
    '{"\\u20ac": "Euro Sign", "\\r": "Carriage Return", "\\ufb33": "Hebrew Letter Dalet With Dagesh",' +
      ' "1": "One", "\\ud83d\\ude00": "Emoji: Grinning Face", "\\u0080": "Control",' +
      ' "\\u00f6": "Latin Small Letter O With Diaeresis"}',
  );
  const text = canonicalJson(input);
  // (JSON.parse would put the integer-like key "1" first again, so the order is read from the text.)
  assert.deepEqual(
    [...text.matchAll(/:"([^"]+)"/g)].map((m) => m[1]),
    [
      'Carriage Return',
      'One',
      'Control',
      'Latin Small Letter O With Diaeresis',
      'Euro Sign',
      'Emoji: Grinning Face',
      'Hebrew Letter Dalet With Dagesh',
    ],
  );
  // Only the control character is escaped (section 3.2.2.2); U+0080 and above stay as UTF-8.
  assert.ok(text.startsWith('{"\\r":"Carriage Return","1":"One","\u0080":"Control","ö":'));
});

test('RFC 8785 Appendix B: IEEE 754 doubles to JSON numbers', () => {
  const cases: Array<[string, string | null]> = [
    ['0000000000000000', '0'],
    ['8000000000000000', '0'],
    ['0000000000000001', '5e-324'],
    ['8000000000000001', '-5e-324'],
    ['7fefffffffffffff', '1.7976931348623157e+308'],
    ['ffefffffffffffff', '-1.7976931348623157e+308'],
    ['4340000000000000', '9007199254740992'],
    ['c340000000000000', '-9007199254740992'],
    ['4430000000000000', '295147905179352830000'],
    ['7fffffffffffffff', null],
    ['7ff0000000000000', null],
    ['44b52d02c7e14af5', '9.999999999999997e+22'],
    ['44b52d02c7e14af6', '1e+23'],
    ['44b52d02c7e14af7', '1.0000000000000001e+23'],
    ['444b1ae4d6e2ef4e', '999999999999999700000'],
    ['444b1ae4d6e2ef4f', '999999999999999900000'],
    ['444b1ae4d6e2ef50', '1e+21'],
    ['3eb0c6f7a0b5ed8c', '9.999999999999997e-7'],
    ['3eb0c6f7a0b5ed8d', '0.000001'],
    ['41b3de4355555553', '333333333.3333332'],
    ['41b3de4355555554', '333333333.33333325'],
    ['41b3de4355555555', '333333333.3333333'],
    ['41b3de4355555556', '333333333.3333334'],
    ['41b3de4355555557', '333333333.33333343'],
    ['becbf647612f3696', '-0.0000033333333333333333'],
    ['43143ff3c1cb0959', '1424953923781206.2'],
  ];
  for (const [hex, expected] of cases) {
    const value = Buffer.from(hex, 'hex').readDoubleBE(0);
    if (expected === null) assert.throws(() => canonicalJson(value), /NaN|Infinity/, hex);
    else assert.equal(canonicalJson(value), expected, hex);
  }
});

test('a lone surrogate has no canonical form (RFC 8785 section 3.2.2.2, I-JSON)', () => {
  assert.throws(() => canonicalJson({ a: '\ud800' }), /surrogate/i);
});

test("PostgreSQL's numbers: up to 15 significant digits parse as numbers, longer ones keep their text", () => {
  // DBL_DIG = 15 (ISO C 5.2.4.2.2): every decimal of 15 significant digits survives a double.
  const row = parseRowJson(
    '{"a": 1.50, "b": 123456789012345, "c": 0.1234567890123456789, "d": -1e-7, "e": [10000000000000001]}',
  );
  assert.deepEqual(row, { a: 1.5, b: 123456789012345, c: '0.1234567890123456789', d: -1e-7, e: ['10000000000000001'] });
  assert.equal(
    canonicalJson(row),
    '{"a":1.5,"b":123456789012345,"c":"0.1234567890123456789","d":-1e-7,"e":["10000000000000001"]}',
  );
  assert.deepEqual(parseRowJson('{"s":"x\\"y\\u00e9","n":null,"t":true,"f":false,"o":{}}'), {
    s: 'x"yé',
    n: null,
    t: true,
    f: false,
    o: {},
  });
  assert.deepEqual(parseRowJson('{"__proto__": 1}'), JSON.parse('{"__proto__": 1}'));
  for (const bad of ['{"a":1', '[1,]', '{"a" 1}', '01', '"x', '{} x', 'nul'])
    assert.throws(() => parseRowJson(bad), /invalid JSON/, bad);
});
