// Printable boat tags: a QR code (the boat's tag URL) with race number, boat and class, laid out on
// common self-adhesive label sheets, or one tag on its own small page. Framework-free (pdf-lib and
// qrcode only), so it runs in a route handler, a script or a unit test.
import {
  PDFDocument,
  StandardFonts,
  fill,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  setFillingGrayscaleColor,
  type PDFFont,
  type PDFPage,
} from 'pdf-lib';
import QRCode from 'qrcode';
import { AppError } from '../errors';

export type TagLabel = { tagUrl: string; raceNumber: string; boatName: string; className: string };
export type TagSheetFormat = 'a4-2x7' | 'letter-2x5';

const mm = (v: number) => (v * 72) / 25.4; // PDF user space is 1/72 inch (ISO 32000-1 §8.3.2.3)
const inch = (v: number) => v * 72;

type SheetGeometry = {
  pageW: number;
  pageH: number;
  labelW: number;
  labelH: number;
  cols: number;
  rows: number;
  top: number;
  side: number;
  colGap: number;
};

// Both are widely sold label formats; the dimensions are the commonly published ones for each
// (common practice, no single source). They add up exactly to the page: 4.65 + 99.1 + 2.5 + 99.1
// + 4.65 = 210 mm and 15.15 + 7 x 38.1 + 15.15 = 297 mm; 0.156 + 4 + 0.188 + 4 + 0.156 = 8.5 in
// and 0.5 + 5 x 2 + 0.5 = 11 in.
export const TAG_SHEETS: Record<TagSheetFormat, SheetGeometry> = {
  'a4-2x7': {
    pageW: mm(210),
    pageH: mm(297),
    labelW: mm(99.1),
    labelH: mm(38.1),
    cols: 2,
    rows: 7,
    top: mm(15.15),
    side: mm(4.65),
    colGap: mm(2.5),
  },
  'letter-2x5': {
    pageW: inch(8.5),
    pageH: inch(11),
    labelW: inch(4),
    labelH: inch(2),
    cols: 2,
    rows: 5,
    top: inch(0.5),
    side: inch(0.156),
    colGap: inch(0.188),
  },
};

// ISO/IEC 18004 asks for a quiet zone of 4 modules around a QR symbol.
const QUIET_MODULES = 4;
// 'Q' restores up to about 25 % of damaged codewords (ISO/IEC 18004 Table 12) while keeping the
// symbol one or two versions smaller than 'H', so each module prints larger on a 38 mm label.
const QR_LEVEL = 'Q' as const;
// The code takes the label's full height less a small edge margin: about 34.7 mm square (quiet
// zone included) on the 38.1 mm A4 labels, 45 mm at most on larger ones; 30 mm is the floor for
// phones scanning from arm's length at the dock (Boreline's own requirement).
const QR_MAX = mm(45);

const charsets = new WeakMap<PDFFont, Set<number>>();

/**
 * Text the standard fonts can encode (WinAnsi, ISO 32000-1 Annex D): accented letters outside it
 * fall back to their base letter (Ō -> O, ８ -> 8), anything else visible becomes '?', so no name
 * can crash a print.
 */
export function toFontText(font: PDFFont, text: string): string {
  let ok = charsets.get(font);
  if (!ok) charsets.set(font, (ok = new Set(font.getCharacterSet())));
  let out = '';
  // Whitespace becomes one space; invisible controls and format marks (bidi overrides) go.
  for (const ch of String(text)
    .replace(/\s+/g, ' ')
    .replace(/[\p{Cc}\p{Cf}]/gu, '')) {
    if (ok.has(ch.codePointAt(0)!)) {
      out += ch;
      continue;
    }
    const base = ch.normalize('NFKD').replace(/\p{M}/gu, '');
    out += base && Array.from(base).every((c) => ok!.has(c.codePointAt(0)!)) ? base : '?';
  }
  return out.trim();
}

/** Shrinks to minSize, then cuts with an ellipsis, so a long name stays inside its label. */
function fitText(font: PDFFont, text: string, maxWidth: number, size: number, minSize: number) {
  let s = size;
  while (s > minSize && font.widthOfTextAtSize(text, s) > maxWidth) s -= 0.5;
  if (font.widthOfTextAtSize(text, s) <= maxWidth) return { text, size: s };
  const chars = Array.from(text);
  while (chars.length && font.widthOfTextAtSize(`${chars.join('')}…`, s) > maxWidth) chars.pop();
  return { text: `${chars.join('').trimEnd()}…`, size: s };
}

/**
 * Draws the QR code as filled vector rectangles (one per run of dark modules in a row) on a white
 * square that includes the quiet zone: sharp at any printer resolution, pure black on white.
 */
function drawQr(page: PDFPage, text: string, x: number, y: number, size: number) {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: QR_LEVEL });
  const n = modules.size;
  const m = size / (n + 2 * QUIET_MODULES);
  const ops = [
    pushGraphicsState(),
    setFillingGrayscaleColor(1),
    rectangle(x, y, size, size),
    fill(),
    setFillingGrayscaleColor(0),
  ];
  for (let row = 0; row < n; row++) {
    for (let col = 0; col < n; col++) {
      if (!modules.get(row, col)) continue;
      const start = col;
      while (col + 1 < n && modules.get(row, col + 1)) col++;
      // PDF y grows upwards; QR row 0 is the top row.
      ops.push(
        rectangle(x + (QUIET_MODULES + start) * m, y + size - (QUIET_MODULES + row + 1) * m, (col - start + 1) * m, m),
      );
    }
  }
  ops.push(fill(), popGraphicsState());
  page.pushOperators(...ops);
}

type Fonts = { regular: PDFFont; bold: PDFFont };

function drawLabel(page: PDFPage, fonts: Fonts, label: TagLabel, x: number, y: number, w: number, h: number) {
  if (!label.tagUrl) throw new AppError('invalid_label', 400, 'Every tag needs its tag URL.');
  const pad = h * 0.045;
  const qr = Math.min(h - 2 * pad, QR_MAX);
  drawQr(page, label.tagUrl, x + pad, y + (h - qr) / 2, qr);

  const textX = x + pad + qr + mm(3);
  const textW = x + w - pad - textX;
  const line = (font: PDFFont, raw: string, baseline: number, size: number, minSize: number) => {
    const t = fitText(font, toFontText(font, raw) || '—', textW, size, minSize);
    page.drawText(t.text, { x: textX, y: baseline, size: t.size, font });
    return t.size;
  };
  const top = y + h - pad;
  const raceSize = line(fonts.bold, label.raceNumber, top - h * 0.36 * 0.78, h * 0.36, h * 0.2);
  const nameBaseline = top - raceSize * 0.78 - h * 0.16;
  line(fonts.bold, label.boatName, nameBaseline, h * 0.11, h * 0.07);
  line(fonts.regular, label.className, nameBaseline - h * 0.13, h * 0.09, h * 0.065);
  line(fonts.regular, 'Boreline tag — scan at the dock', y + pad + h * 0.01, Math.max(6, h * 0.06), 5);
}

async function newDocument(title: string) {
  const pdf = await PDFDocument.create();
  pdf.setTitle(title);
  pdf.setSubject('Boat inspection tags: QR codes to scan at the dock');
  pdf.setProducer('Boreline');
  pdf.setCreator('Boreline');
  pdf.setCreationDate(new Date());
  const fonts: Fonts = {
    regular: await pdf.embedFont(StandardFonts.Helvetica),
    bold: await pdf.embedFont(StandardFonts.HelveticaBold),
  };
  return { pdf, fonts };
}

/** Label sheets filled left to right, top to bottom; labels past one sheet go on further pages. */
export async function buildTagSheetPdf(input: {
  title: string;
  labels: TagLabel[];
  sheet: TagSheetFormat;
}): Promise<Uint8Array> {
  if (!input.labels.length) throw new AppError('no_labels', 400, 'There are no tags to print.');
  const g = TAG_SHEETS[input.sheet];
  const perPage = g.cols * g.rows;
  const pages = Math.ceil(input.labels.length / perPage);
  const { pdf, fonts } = await newDocument(input.title);
  for (let p = 0; p < pages; p++) {
    const page = pdf.addPage([g.pageW, g.pageH]);
    // In the sheet's top margin, off the labels: which print run and page this is.
    const heading = fitText(
      fonts.regular,
      `${toFontText(fonts.regular, input.title)} — sheet ${p + 1} of ${pages}`,
      g.pageW - 2 * g.side,
      7,
      5,
    );
    page.drawText(heading.text, {
      x: g.side + mm(2),
      y: g.pageH - g.top / 2 - 2,
      size: heading.size,
      font: fonts.regular,
    });
    input.labels.slice(p * perPage, (p + 1) * perPage).forEach((label, i) => {
      const col = i % g.cols;
      const row = Math.floor(i / g.cols);
      const x = g.side + col * (g.labelW + g.colGap);
      const y = g.pageH - g.top - (row + 1) * g.labelH;
      drawLabel(page, fonts, label, x, y, g.labelW, g.labelH);
    });
  }
  return pdf.save();
}

/** One tag on a 100 x 50 mm page (a common label-printer size, common practice). */
export async function buildSingleTagPdf(label: TagLabel): Promise<Uint8Array> {
  const { pdf, fonts } = await newDocument(`Boreline tag ${label.raceNumber} ${label.boatName}`.trim());
  const w = mm(100);
  const h = mm(50);
  drawLabel(pdf.addPage([w, h]), fonts, label, 0, 0, w, h);
  return pdf.save();
}
