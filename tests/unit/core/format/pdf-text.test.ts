// Wrapping text for the PDFs (lib/core/format/pdf-text.ts): every line fits when measured by pdf-lib
// itself (the reference), nothing is lost, and an unbroken 4,000-character note or 400,000 characters
// of declarations wrap in linear time (a denial-of-service found by an outside test: the old loop was
// roughly cubic in a word's length).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { pdfSafeText, wrapPdfText } from '../../../../lib/core/format/pdf-text';

async function helvetica() {
  const doc = await PDFDocument.create();
  return doc.embedFont(StandardFonts.Helvetica);
}

test('every line fits the width as pdf-lib measures it, and the words come back in order', async () => {
  const font = await helvetica();
  const text = pdfSafeText(
    font,
    'Nozzle exit re-measured after the heat: three two-point readings at 0°, 60° and 120°, largest 101.98 mm. ' +
      'Owner’s note: the impeller was trimmed by the maker in 2025.\nSecond paragraph, short.\n\nAfter a blank line.',
  );
  const width = 200;
  const lines = wrapPdfText(font, text, 9.5, width);
  for (const l of lines) assert.ok(font.widthOfTextAtSize(l, 9.5) <= width + 0.01, `"${l}" fits`);
  assert.equal(lines.join(' ').replace(/\s+/g, ' '), text.replace(/\s+/g, ' ').trim());
  assert.ok(lines.includes(''), 'the blank paragraph is kept');
  assert.ok(!wrapPdfText(font, text, 9.5, width, false).includes(''), 'or dropped when asked');
});

test('an unbroken 4,000-character word is cut by characters into full lines, quickly', async () => {
  const font = await helvetica();
  const word = 'W'.repeat(3999) + 'Z';
  const started = process.hrtime.bigint();
  const lines = wrapPdfText(font, word, 9.5, 507);
  const ms = Number(process.hrtime.bigint() - started) / 1e6;
  assert.equal(lines.join(''), word, 'no character lost');
  for (const l of lines.slice(0, -1)) {
    assert.ok(font.widthOfTextAtSize(l, 9.5) <= 507 + 0.01);
    assert.ok(font.widthOfTextAtSize(l + 'W', 9.5) > 507, 'each cut line is full');
  }
  // Not a timing test of the machine: a bound 100 times above what a linear pass needs, so only a
  // super-linear loop can break it.
  assert.ok(ms < 2000, `${ms} ms`);
  const many = Array.from({ length: 800 }, (_, i) => `${'Q'.repeat(499)}${i % 10}`).join(' ');
  const manyLines = wrapPdfText(font, many, 9.5, 507);
  assert.equal(manyLines.join('').replace(/\s/g, '').length, 800 * 500);
});
