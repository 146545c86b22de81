// Characters no text field of Boreline takes: C0 and C1 control characters other than tab, line feed
// and carriage return (NUL among them: PostgreSQL text cannot hold it), and the bidirectional
// embedding, override and isolate controls (Unicode Standard Annex #9), which make a name read
// differently on an official's screen from what was typed ("Trojan Source", CVE-2021-42574).
// Applied to every JSON body the server reads, so each route gets it without asking.

const UNSAFE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/;

export type UnsafeText = { field: string; codePoint: string };

/** The first string in a parsed JSON value holding an unsafe character, with its dotted path; else null. */
export function findUnsafeText(value: unknown, path = ''): UnsafeText | null {
  if (typeof value === 'string') {
    const m = UNSAFE.exec(value);
    return m
      ? { field: path || '(body)', codePoint: `U+${m[0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}` }
      : null;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const hit = findUnsafeText(value[i], path ? `${path}.${i}` : String(i));
      if (hit) return hit;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const keyHit = UNSAFE.test(k) ? { field: path || '(body)', codePoint: 'in a key' } : null;
      if (keyHit) return keyHit;
      const hit = findUnsafeText(v, path ? `${path}.${k}` : k);
      if (hit) return hit;
    }
  }
  return null;
}

/** One line of text (a name, a serial): no line breaks or tabs either. */
export const isSingleLine = (s: string) => !/[\r\n\t]/.test(s);
