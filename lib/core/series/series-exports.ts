// The governing body's exports of a series: standings, penalties and appeals as CSV (RFC 4180 quoting,
// spreadsheet formula injection neutralised by csvCell) and as a plain tabular PDF (pdf-lib). Pure: the
// server hands it what the caller may see.
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { csvCell } from '../entries/entries-csv';
import { pdfSafeText, wrapPdfText } from '../format/pdf-text';
import { SERIES_CAUTION } from './series-caution';

export type ExportTable = { title: string; subtitle: string; notes: string[]; columns: string[]; rows: unknown[][] };

export function tableToCsv(t: ExportTable): string {
  const lines = [t.columns.map(csvCell).join(',')];
  for (const r of t.rows) lines.push(r.map(csvCell).join(','));
  return lines.join('\r\n') + '\r\n';
}

const A4_LANDSCAPE: [number, number] = [841.89, 595.28];
const M = 36;
const INK = rgb(0.043, 0.086, 0.125);
const MUTE = rgb(0.32, 0.38, 0.43);

type Ctx = { doc: PDFDocument; page: PDFPage; y: number; font: PDFFont; bold: PDFFont };

function line(
  ctx: Ctx,
  text: string,
  size: number,
  font: PDFFont,
  color = INK,
  x = M,
  width = A4_LANDSCAPE[0] - 2 * M,
) {
  for (const l of wrapPdfText(font, pdfSafeText(font, text), size, width)) {
    if (ctx.y - size - 3 < M) {
      ctx.page = ctx.doc.addPage(A4_LANDSCAPE);
      ctx.y = A4_LANDSCAPE[1] - M;
    }
    ctx.page.drawText(l, { x, y: ctx.y - size, size, font, color });
    ctx.y -= size + 3;
  }
}

/** The table on A4 landscape pages: title, subtitle, notes, the caution, then one wrapped row per line. */
export async function tableToPdf(t: ExportTable, printedAt: Date): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(t.title);
  doc.setCreator('Boreline');
  doc.setProducer('Boreline');
  doc.setCreationDate(printedAt);
  const ctx: Ctx = {
    doc,
    page: doc.addPage(A4_LANDSCAPE),
    y: A4_LANDSCAPE[1] - M,
    font: await doc.embedFont(StandardFonts.Helvetica),
    bold: await doc.embedFont(StandardFonts.HelveticaBold),
  };
  line(ctx, t.title, 16, ctx.bold);
  line(ctx, `${t.subtitle} (printed ${printedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC)`, 9, ctx.font, MUTE);
  for (const n of t.notes) line(ctx, n, 8, ctx.font, MUTE);
  line(ctx, SERIES_CAUTION, 8, ctx.font, MUTE);
  ctx.y -= 6;
  const width = (A4_LANDSCAPE[0] - 2 * M) / t.columns.length;
  const row = (cells: unknown[], font: PDFFont) => {
    const wrapped = cells.map((c) =>
      wrapPdfText(font, pdfSafeText(font, c === null || c === undefined ? '' : String(c)), 8, width - 4),
    );
    const h = Math.max(1, ...wrapped.map((w) => w.length)) * 10 + 2;
    if (ctx.y - h < M) {
      ctx.page = ctx.doc.addPage(A4_LANDSCAPE);
      ctx.y = A4_LANDSCAPE[1] - M;
    }
    wrapped.forEach((w, i) =>
      w.forEach((l, j) => ctx.page.drawText(l, { x: M + i * width, y: ctx.y - 8 - j * 10, size: 8, font, color: INK })),
    );
    ctx.y -= h;
  };
  row(t.columns, ctx.bold);
  for (const r of t.rows) row(r, ctx.font);
  if (!t.rows.length) line(ctx, 'Nothing to list.', 9, ctx.font, MUTE);
  return doc.save();
}
