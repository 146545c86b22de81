// The canonical form of a chained record: RFC 8785, JSON Canonicalization Scheme (JCS), through the
// `canonicalize` package (pinned). Rows come from PostgreSQL as `to_jsonb(row)::text`; JSON.parse would
// round a numeric with more digits than a float64 holds, so `parseRowJson` keeps any number with more than
// 15 significant digits as its PostgreSQL text (a JSON string). 15 is the count an IEEE 754 double always
// carries through decimal -> binary -> decimal (DBL_DIG, ISO C 5.2.4.2.2). Smaller numbers become JS numbers
// and JCS prints them with ECMAScript's Number-to-String (RFC 8785 section 3.2.2.3).
import canonicalize from 'canonicalize';

/** RFC 8785 canonical JSON text of a value (throws on NaN, Infinity, lone surrogates). */
export function canonicalJson(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new Error('value has no JSON form');
  return text;
}

const MAX_EXACT_DIGITS = 15;

function significantDigits(numberText: string): number {
  const mantissa = numberText.replace(/^-/, '').split(/[eE]/)[0].replace('.', '');
  const trimmed = mantissa.replace(/^0+/, '').replace(/0+$/, '');
  return trimmed.length;
}

/**
 * JSON.parse, except that a number with more than 15 significant digits stays a string holding its
 * exact text. A small hand-written parser (strict JSON, RFC 8259) because JSON.parse's reviver does not
 * see a number's source text on Node 20.
 */
export function parseRowJson(text: string): unknown {
  let i = 0;
  const fail = (what: string): never => {
    throw new Error(`invalid JSON at ${i}: ${what}`);
  };
  const ws = () => {
    while (i < text.length && (text[i] === ' ' || text[i] === '\n' || text[i] === '\r' || text[i] === '\t')) i++;
  };
  const value = (): unknown => {
    ws();
    const c = text[i];
    if (c === '{') {
      i++;
      const out: Record<string, unknown> = {};
      ws();
      if (text[i] === '}') {
        i++;
        return out;
      }
      for (;;) {
        ws();
        if (text[i] !== '"') fail('expected a key');
        const key = str();
        ws();
        if (text[i++] !== ':') fail('expected :');
        Object.defineProperty(out, key, { value: value(), enumerable: true, writable: true, configurable: true });
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === '}') {
          i++;
          return out;
        } else fail('expected , or }');
      }
    }
    if (c === '[') {
      i++;
      const out: unknown[] = [];
      ws();
      if (text[i] === ']') {
        i++;
        return out;
      }
      for (;;) {
        out.push(value());
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === ']') {
          i++;
          return out;
        } else fail('expected , or ]');
      }
    }
    if (c === '"') return str();
    if (text.startsWith('true', i)) return ((i += 4), true);
    if (text.startsWith('false', i)) return ((i += 5), false);
    if (text.startsWith('null', i)) return ((i += 4), null);
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i, i + 400));
    if (!m) return fail('unexpected character');
    i += m[0].length;
    return significantDigits(m[0]) > MAX_EXACT_DIGITS ? m[0] : Number(m[0]);
  };
  const str = (): string => {
    const start = i;
    i++;
    while (i < text.length && text[i] !== '"') i += text[i] === '\\' ? 2 : 1;
    if (i >= text.length) fail('unterminated string');
    i++;
    return JSON.parse(text.slice(start, i)) as string;
  };
  const out = value();
  ws();
  if (i !== text.length) fail('trailing characters');
  return out;
}
