import type { PDFFont } from 'pdf-lib';

/**
 * Text a standard PDF font can draw: those fonts speak WinAnsi only, so accents are taken off and
 * anything else becomes '?' (an odd name never crashes a PDF); line breaks are kept as '\n' and tabs
 * become spaces. Used by every PDF Boreline prints.
 */
export function pdfSafeText(font: PDFFont, text: string): string {
  return [
    ...text
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/\r\n?/g, '\n')
      .replace(/[\t\v\f]/g, ' '),
  ]
    .map((ch) => {
      // Line breaks stay for the wrapper (wrapPdfText splits paragraphs on them).
      if (ch === '\n') return ch;
      try {
        font.encodeText(ch);
        return ch;
      } catch {
        return '?';
      }
    })
    .join('');
}

/**
 * Lines of `text` (already passed through pdfSafeText) that fit `width` points at `size`: wrapped at
 * white space, a word longer than a line cut by characters. Linear in the text's length: each
 * character's width is measured once per call (kerning left out, so a line is never wider than
 * measured by pdf-lib by more than its kerning, which only narrows Helvetica and Times pairs).
 * `keepBlank` keeps empty lines (an empty paragraph); otherwise blank lines are dropped.
 */
export function wrapPdfText(font: PDFFont, text: string, size: number, width: number, keepBlank = true): string[] {
  const widths = new Map<string, number>();
  const w = (ch: string) => {
    let x = widths.get(ch);
    if (x === undefined) {
      x = font.widthOfTextAtSize(ch, size);
      widths.set(ch, x);
    }
    return x;
  };
  const measure = (s: string) => {
    let total = 0;
    for (const ch of s) total += w(ch);
    return total;
  };
  const out: string[] = [];
  const push = (line: string) => {
    if (keepBlank || line.trim()) out.push(line);
  };
  for (const para of text.split('\n')) {
    let cur = '';
    let curW = 0;
    for (const token of para.split(/(\s+)/)) {
      if (token === '') continue;
      const tw = measure(token);
      if (curW + tw <= width) {
        cur += token;
        curW += tw;
        continue;
      }
      if (cur.trim()) out.push(cur.trimEnd());
      cur = token.trimStart();
      curW = measure(cur);
      // A word wider than the line: cut it by characters, at least one per line.
      while (curW > width) {
        const chars = [...cur];
        let n = 0;
        let lineW = 0;
        while (n < chars.length && (n === 0 || lineW + w(chars[n]) <= width)) lineW += w(chars[n++]);
        out.push(chars.slice(0, n).join(''));
        cur = chars.slice(n).join('');
        curW -= lineW;
      }
    }
    push(cur.trimEnd());
  }
  return out;
}
