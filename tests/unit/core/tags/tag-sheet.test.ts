// Tag sheets: the PDF opens with pdf-lib, has the right page count, and every QR code in it
// decodes with jsQR (an independent decoder from the npm registry) to that label's tag URL.
// The QR codes are vector rectangles, so this test reads each page's content stream (inflated with
// node:zlib), interprets the few path operators involved (ISO 32000-1 §8.5: re, f, g, q, Q, cm),
// rasterises the module grid and hands the pixels to jsQR: it decodes what is in the PDF, not a
// separately generated image.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import zlib from 'node:zlib';
import jsQR from 'jsqr';
import { PDFArray, PDFDocument, PDFName, PDFRawStream, type PDFPage } from 'pdf-lib';
import { buildSingleTagPdf, buildTagSheetPdf, type TagLabel } from '../../../../lib/core/tags/tag-sheet';

const mm = (v: number) => (v * 72) / 25.4;
// Label sheet dimensions (common practice, no single source): A4 2 x 7 of 99.1 x 38.1 mm, top
// margin 15.15 mm, side 4.65 mm, column gap 2.5 mm; US Letter 2 x 5 of 4 x 2 in, top 0.5 in, side
// 0.156 in, gap 0.188 in.
const A4 = {
  pageW: mm(210),
  pageH: mm(297),
  w: mm(99.1),
  h: mm(38.1),
  top: mm(15.15),
  side: mm(4.65),
  gap: mm(2.5),
  perPage: 14,
};
const LETTER = { pageW: 612, pageH: 792, w: 288, h: 144, top: 36, side: 0.156 * 72, gap: 0.188 * 72, perPage: 10 };

type Rect = { x: number; y: number; w: number; h: number; gray: number };
type Text = { x: number; y: number; text: string };

function contentOf(doc: PDFDocument, page: PDFPage): string {
  const contents = page.node.get(PDFName.of('Contents'));
  const refs = contents instanceof PDFArray ? contents.asArray() : [contents];
  return refs
    .map((ref) => {
      const stream = doc.context.lookup(ref);
      assert.ok(stream instanceof PDFRawStream, 'content stream');
      const filter = stream.dict.get(PDFName.of('Filter'));
      assert.ok(!filter || filter === PDFName.of('FlateDecode'), `unexpected filter ${filter}`);
      return Buffer.from(filter ? zlib.inflateSync(stream.contents) : stream.contents).toString('latin1');
    })
    .join('\n');
}

// WinAnsi codes 0x80-0x9F that the labels may use (ISO 32000-1 Annex D.2); the rest equal Latin-1.
const WINANSI_EXTRA: Record<number, string> = { 0x85: '…', 0x93: '“', 0x94: '”', 0x96: '–', 0x97: '—' };

/** Filled rectangles (in page space, with their grey) and shown text from one content stream. */
function interpret(src: string): { rects: Rect[]; texts: Text[] } {
  const tokens =
    src.match(
      /\((?:\\.|[^\\)])*\)|<[0-9A-Fa-f\s]*>|\/[^\s/[\]()<>]+|[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?|[A-Za-z'"*]+|\[|\]/g,
    ) ?? [];
  const rects: Rect[] = [];
  const texts: Text[] = [];
  let args: string[] = [];
  let gs = { gray: 0, ctm: [1, 0, 0, 1, 0, 0] };
  const stack: (typeof gs)[] = [];
  let path: [number, number, number, number][] = [];
  let tm = [0, 0];
  const num = (i: number) => Number(args[args.length - i]);
  for (const t of tokens) {
    if (!/^[A-Za-z'"*]+$/.test(t) || t === 'true' || t === 'false' || t === 'null') {
      args.push(t);
      continue;
    }
    const [a, b, c, d, e, f] = gs.ctm;
    switch (t) {
      case 'q':
        stack.push({ gray: gs.gray, ctm: [...gs.ctm] });
        break;
      case 'Q':
        gs = stack.pop()!;
        break;
      case 'cm': {
        const m = args.slice(-6).map(Number);
        assert.ok(m[1] === 0 && m[2] === 0, 'no rotation in the QR drawing');
        gs.ctm = [m[0] * a, 0, 0, m[3] * d, m[4] * a + e, m[5] * d + f];
        break;
      }
      case 'g':
        gs.gray = num(1);
        break;
      case 'rg':
        gs.gray = num(3) === num(2) && num(2) === num(1) ? num(1) : -1;
        break;
      case 're': {
        assert.ok(b === 0 && c === 0, 'axis-aligned rectangles');
        path.push([num(4) * a + e, num(3) * d + f, num(2) * a, num(1) * d]);
        break;
      }
      case 'f':
      case 'F':
      case 'f*':
        for (const [x, y, w, h] of path) rects.push({ x, y, w, h, gray: gs.gray });
        path = [];
        break;
      case 'n':
      case 'S':
      case 's':
      case 'B':
      case 'b':
        path = [];
        break;
      case 'Tm':
        tm = [num(2), num(1)];
        break;
      case 'Tj': {
        const hex = args[args.length - 1].replace(/[<>\s]/g, '');
        const text = (hex.match(/../g) ?? [])
          .map((h) => WINANSI_EXTRA[parseInt(h, 16)] ?? String.fromCharCode(parseInt(h, 16)))
          .join('');
        texts.push({ x: tm[0], y: tm[1], text });
        break;
      }
    }
    args = [];
  }
  return { rects, texts };
}

type Symbol = { x: number; y: number; size: number; decoded: string | null };

/** Each white square of 25 mm or more with black modules inside is one QR code: rasterise and decode it. */
function decodeQrCodes(rects: Rect[]): Symbol[] {
  const boxes = rects.filter((r) => r.gray === 1 && Math.abs(r.w - r.h) < 0.01 && r.w >= mm(25));
  return boxes.map((box) => {
    const inside = rects.filter(
      (r) =>
        r !== box &&
        r.x >= box.x - 0.01 &&
        r.y >= box.y - 0.01 &&
        r.x + r.w <= box.x + box.w + 0.01 &&
        r.y + r.h <= box.y + box.h + 0.01,
    );
    assert.ok(inside.length > 0, 'modules inside the white square');
    assert.ok(
      inside.every((r) => r.gray === 0),
      'every module is pure black (high contrast)',
    );
    const m = Math.min(...inside.map((r) => r.h));
    const n = Math.round(box.w / m);
    assert.ok(Math.abs(n * m - box.w) < 0.01, 'the square is a whole number of modules');
    const grid = Array.from({ length: n }, () => new Array<boolean>(n).fill(false));
    for (const r of inside) {
      const col0 = Math.round((r.x - box.x) / m);
      const row0 = Math.round((box.y + box.h - (r.y + r.h)) / m);
      for (let dr = 0; dr < Math.round(r.h / m); dr++)
        for (let dc = 0; dc < Math.round(r.w / m); dc++) grid[row0 + dr][col0 + dc] = true;
    }
    // Quiet zone of 4 modules (ISO/IEC 18004): the outer ring must be empty.
    for (let i = 0; i < n; i++)
      for (const j of [0, 1, 2, 3, n - 4, n - 3, n - 2, n - 1])
        assert.ok(!grid[i][j] && !grid[j][i], 'quiet zone is clear');
    const scale = 4;
    const px = n * scale;
    const rgba = new Uint8ClampedArray(px * px * 4).fill(255);
    for (let y = 0; y < px; y++)
      for (let x = 0; x < px; x++) {
        if (grid[Math.floor(y / scale)][Math.floor(x / scale)]) rgba.fill(0, (y * px + x) * 4, (y * px + x) * 4 + 3);
      }
    return { x: box.x, y: box.y, size: box.w, decoded: jsQR(rgba, px, px)?.data ?? null };
  });
}

const inCell = (p: { x: number; y: number }, cell: { x: number; y: number; w: number; h: number }) =>
  p.x >= cell.x && p.x <= cell.x + cell.w && p.y >= cell.y && p.y <= cell.y + cell.h;

function labels(n: number, prefix = 'https://boreline.example/t/'): TagLabel[] {
  return Array.from({ length: n }, (_, i) => ({
    tagUrl: `${prefix}${(i * 7919 + 104729).toString(36).toUpperCase()}${i}`,
    raceNumber: String(100 + i),
    boatName: `Invented Boat ${i}`,
    className: i % 2 ? 'Unlimited (invented)' : 'Group A (invented)',
  }));
}

/** Opens the PDF and checks every label: its QR decodes to its URL and its texts sit in its cell. */
async function checkSheet(bytes: Uint8Array, input: TagLabel[], sheet: typeof A4) {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false }); // else pdf-lib stamps its own producer on load
  assert.equal(doc.getPageCount(), Math.ceil(input.length / sheet.perPage));
  assert.equal(doc.getProducer(), 'Boreline');
  const perPage = doc.getPages().map((page) => {
    const { width, height } = page.getSize();
    assert.ok(Math.abs(width - sheet.pageW) < 0.01 && Math.abs(height - sheet.pageH) < 0.01, 'page size');
    const { rects, texts } = interpret(contentOf(doc, page));
    return { symbols: decodeQrCodes(rects), texts };
  });
  input.forEach((label, i) => {
    const page = perPage[Math.floor(i / sheet.perPage)];
    const slot = i % sheet.perPage;
    const cell = {
      x: sheet.side + (slot % 2) * (sheet.w + sheet.gap),
      y: sheet.pageH - sheet.top - (Math.floor(slot / 2) + 1) * sheet.h,
      w: sheet.w,
      h: sheet.h,
    };
    const here = page.symbols.filter((s) => inCell(s, cell) && inCell({ x: s.x + s.size, y: s.y + s.size }, cell));
    assert.equal(here.length, 1, `one QR code inside label ${i}`);
    assert.equal(here[0].decoded, label.tagUrl, `label ${i} decodes to its tag URL`);
    assert.ok(here[0].size >= mm(30), `label ${i}: QR at least 30 mm (${(here[0].size / mm(1)).toFixed(1)} mm)`);
    const words = page.texts.filter((t) => inCell(t, cell)).map((t) => t.text);
    for (const expected of [label.raceNumber, 'Boreline tag — scan at the dock'])
      assert.ok(words.includes(expected), `label ${i} shows "${expected}": ${words.join(' | ')}`);
  });
  const symbolCount = perPage.reduce((n, p) => n + p.symbols.length, 0);
  assert.equal(symbolCount, input.length, 'no stray QR codes');
  return { doc, perPage };
}

test('A4 2x7: 16 labels on 2 pages, every QR decodes to its own tag URL', async () => {
  const input = labels(16);
  const bytes = await buildTagSheetPdf({
    title: 'Kelda Reach spring meeting (invented) — tags',
    labels: input,
    sheet: 'a4-2x7',
  });
  const { doc } = await checkSheet(bytes, input, A4);
  assert.equal(doc.getTitle(), 'Kelda Reach spring meeting (invented) — tags');
  assert.ok(doc.getSubject());
});

test('US Letter 2x5: 12 labels on 2 pages, every QR decodes', async () => {
  const input = labels(12, 'http://localhost:3000/t/');
  await checkSheet(await buildTagSheetPdf({ title: 'Letter tags', labels: input, sheet: 'letter-2x5' }), input, LETTER);
});

test('30 labels make 3 A4 pages, all 30 codes decode', async () => {
  const input = labels(30);
  await checkSheet(await buildTagSheetPdf({ title: 'Thirty', labels: input, sheet: 'a4-2x7' }), input, A4);
});

test('odd Unicode in names never crashes and is replaced readably', async () => {
  const input: TagLabel[] = [
    {
      tagUrl: 'https://boreline.example/t/UNI1',
      raceNumber: '7',
      boatName: 'Ōtākou Ħ 🚤',
      className: 'Klasse Ü — “Super”',
    },
    { tagUrl: 'https://boreline.example/t/UNI2', raceNumber: '８', boatName: '\u0000\u202Ebad\tname', className: '' },
    {
      tagUrl: 'https://boreline.example/t/UNI3',
      raceNumber: '12',
      boatName: 'A very long invented boat name that cannot possibly fit on a label',
      className: '日本語クラス',
    },
  ];
  const { perPage } = await checkSheet(
    await buildTagSheetPdf({ title: 'Ōtākou 🚤 tags', labels: input, sheet: 'a4-2x7' }),
    input.map((l, i) => (i === 1 ? { ...l, raceNumber: '8' } : l)),
    A4,
  );
  const words = perPage[0].texts.map((t) => t.text);
  assert.ok(words.includes('Otakou ? ?'), words.join(' | '));
  assert.ok(words.includes('Klasse Ü — “Super”'), 'WinAnsi characters are kept as they are');
  assert.ok(words.includes('bad name'), 'controls and a bidi override dropped, the tab made a space');
  assert.ok(
    words.some((w) => w.startsWith('A very long') && w.endsWith('…')),
    'a long name is cut with an ellipsis',
  );
  assert.ok(words.includes('??????'), 'a script the standard font lacks becomes ?');
});

test('a single tag on its own 100 x 50 mm page decodes', async () => {
  const label = labels(1)[0];
  const doc = await PDFDocument.load(await buildSingleTagPdf(label), { updateMetadata: false });
  assert.equal(doc.getPageCount(), 1);
  const page = doc.getPage(0);
  assert.ok(Math.abs(page.getWidth() - mm(100)) < 0.01 && Math.abs(page.getHeight() - mm(50)) < 0.01);
  const symbols = decodeQrCodes(interpret(contentOf(doc, page)).rects);
  assert.equal(symbols.length, 1);
  assert.equal(symbols[0].decoded, label.tagUrl);
  assert.equal(doc.getProducer(), 'Boreline');
});

test('no labels is refused', async () => {
  await assert.rejects(buildTagSheetPdf({ title: 'x', labels: [], sheet: 'a4-2x7' }), /no tags/);
});
