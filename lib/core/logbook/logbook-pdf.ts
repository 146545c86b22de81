// A boat's logbook on paper (pdf-lib): the boat, when it was printed, the meetings, the components on
// it now, the timeline oldest first (as a log is read), the caution, and lines for the owner's and an
// official's signatures. Pure: the route hands it what the viewer may see.
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { pdfSafeText as safe, wrapPdfText } from '../format/pdf-text';
import { formatCalendarDate, formatDay, formatTime } from '../format/time';
import { describeComponent, groupLogbookItems, listSealsOnComponents } from './timeline';
import type { LogbookItem, LogbookRecord } from './logbook-record';

const A4: [number, number] = [595.28, 841.89];
const M = 44;
const INK = rgb(0.043, 0.086, 0.125);
const MUTE = rgb(0.32, 0.38, 0.43);
const FLARE = rgb(0.91, 0.42, 0.06);
const FAIL = rgb(0.7, 0.1, 0.1);

export const LOGBOOK_CAUTION =
  "Safety first. Jet boat racing can injure and kill. Boreline supports the checks; it never replaces them. The governing body's rules, local regulations and the judgement of licensed officials decide every verdict and every safety matter.";

type Ctx = { doc: PDFDocument; page: PDFPage; y: number; font: PDFFont; bold: PDFFont };
type Style = { size?: number; bold?: boolean; color?: ReturnType<typeof rgb>; indent?: number };

function newPage(ctx: Ctx) {
  ctx.page = ctx.doc.addPage(A4);
  ctx.y = A4[1] - M;
}

/** Writes text wrapped by words (a long word is cut by characters), turning the page when full. */
function write(ctx: Ctx, s: string, o: Style = {}) {
  const size = o.size ?? 9.5;
  const font = o.bold ? ctx.bold : ctx.font;
  const indent = o.indent ?? 0;
  const width = A4[0] - 2 * M - indent;
  const out = wrapPdfText(font, safe(font, s), size, width);
  for (const l of out) {
    if (ctx.y - size - 3 < M) newPage(ctx);
    ctx.page.drawText(l, { x: M + indent, y: ctx.y - size, size, font, color: o.color ?? INK });
    ctx.y -= size + 3;
  }
}

const gap = (ctx: Ctx, h = 6) => {
  ctx.y -= h;
};

function itemBlock(ctx: Ctx, item: LogbookItem) {
  if (ctx.y - 40 < M) newPage(ctx);
  const mark = item.finding ? ` [SEAL ${item.finding.toUpperCase()}]` : '';
  write(ctx, item.when, { size: 8, color: MUTE });
  write(ctx, `${item.title}${mark}`, {
    bold: true,
    color: item.finding || item.verdict === 'does_not_conform' ? FAIL : INK,
  });
  for (const l of item.lines) write(ctx, l, { indent: 10 });
  gap(ctx, 4);
}

function signatureLine(ctx: Ctx, who: string) {
  if (ctx.y - 60 < M) newPage(ctx);
  gap(ctx, 28);
  const y = ctx.y;
  ctx.page.drawLine({ start: { x: M, y }, end: { x: M + 300, y }, thickness: 0.8, color: INK });
  ctx.page.drawLine({ start: { x: M + 330, y }, end: { x: A4[0] - M, y }, thickness: 0.8, color: INK });
  ctx.y -= 4;
  write(ctx, `${who}: signature and name`, { size: 8, color: MUTE });
  ctx.page.drawText('Date', { x: M + 330, y: ctx.y + 3, size: 8, font: ctx.font, color: MUTE });
}

/** The printable logbook; `items` are the timeline the viewer may see, `printedAt` the moment of printing. */
export async function buildLogbookPdf(opts: {
  record: LogbookRecord;
  items: LogbookItem[];
  printedAt: Date;
  timeZone: string;
  printedBy: string;
}): Promise<Uint8Array> {
  const { record, items, printedAt, timeZone } = opts;
  const doc = await PDFDocument.create();
  const boatLabel = `${record.boat.name}${record.boat.hullNumber ? ` #${record.boat.hullNumber}` : ''}`;
  doc.setTitle(`Boat logbook: ${boatLabel}`);
  doc.setSubject(`The technical logbook of ${boatLabel}, printed ${printedAt.toISOString()}`);
  doc.setCreator('Boreline');
  doc.setProducer('Boreline');
  doc.setCreationDate(printedAt);
  const ctx: Ctx = {
    doc,
    page: doc.addPage(A4),
    y: A4[1] - M,
    font: await doc.embedFont(StandardFonts.Helvetica),
    bold: await doc.embedFont(StandardFonts.HelveticaBold),
  };

  write(ctx, 'Boat logbook', { size: 20, bold: true });
  write(ctx, boatLabel, { size: 14 });
  write(ctx, `Printed ${formatTime(printedAt, timeZone)} by ${opts.printedBy}`, { size: 8.5, color: MUTE });
  gap(ctx);
  write(ctx, LOGBOOK_CAUTION, { size: 8.5, color: FLARE });
  gap(ctx);

  write(ctx, `Meetings (${record.meetings.length})`, { size: 12, bold: true });
  if (record.meetings.length === 0) write(ctx, 'Not entered at any meeting yet.');
  for (const m of record.meetings)
    write(
      ctx,
      `${m.name}, ${formatCalendarDate(m.startsOn)}: ${m.entries.map((e) => `no. ${e.raceNumber} ${e.classCode} (${e.status.replace(/_/g, ' ')})`).join(', ')}`,
    );
  gap(ctx);
  write(ctx, `Components on the boat now (${record.components.length})`, { size: 12, bold: true });
  if (record.components.length === 0) write(ctx, 'None registered.');
  const seals = listSealsOnComponents(record);
  for (const c of record.components) {
    write(ctx, `${describeComponent(c)}${c.trimCode ? `, trim ${c.trimCode}` : ''}${c.notes ? ` (${c.notes})` : ''}`);
    for (const s of seals.get(c.id) ?? [])
      write(
        ctx,
        `Seal ${s.sealNumber}${s.position ? ` (${s.position})` : ''}: ${s.state}, ${formatDay(s.at, timeZone)}`,
        {
          indent: 10,
        },
      );
  }
  gap(ctx);

  write(ctx, `Timeline, oldest first (${items.length} entries)`, { size: 12, bold: true });
  if (items.length === 0) write(ctx, 'Nothing recorded yet.');
  for (const g of groupLogbookItems(items, record.meetings)) {
    gap(ctx, 4);
    write(ctx, g.label, { size: 10.5, bold: true, color: MUTE });
    for (const item of g.items) itemBlock(ctx, item);
  }

  gap(ctx, 10);
  write(ctx, 'Signed as a true copy of the record on the date written beside each signature.', { size: 9 });
  signatureLine(ctx, 'Owner');
  signatureLine(ctx, 'Official (name and role)');
  gap(ctx, 8);
  write(ctx, `Produced by Boreline for boat ${record.boat.id}.`, { size: 7.5, color: MUTE });
  return doc.save();
}
