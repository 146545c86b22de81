// The published parity report as a PDF (pdf-lib): header with rule version and model
// assumptions with their sources, class figures, the two charts drawn as vectors, one table row
// per boat (paged), the boats left out with the reason, and the safety and official-decision caution.
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { pdfSafeText as safe } from '../format/pdf-text';
import type { PublishedReportDto } from './report-dto';
import { formatTime } from '../format/time';
import { clockReportLines } from './clock-report-lines';
import type { Checkpoint } from '../chain/bundle-format';
import { checkpointLines } from '../chain/checkpoint-lines';

const A4: [number, number] = [595.28, 841.89];
const M = 40;
const INK = rgb(0.043, 0.086, 0.125);
const MUTE = rgb(0.32, 0.38, 0.43);
const TIDE = rgb(0.09, 0.3, 0.44);
const FLARE = rgb(0.91, 0.42, 0.06);
const LINE = rgb(0.84, 0.82, 0.76);

const f1 = (x: number, d = 1) => (Number.isFinite(x) ? x.toFixed(d) : '—');

type Ctx = { doc: PDFDocument; page: PDFPage; y: number; font: PDFFont; bold: PDFFont };

function newPage(ctx: Ctx) {
  ctx.page = ctx.doc.addPage(A4);
  ctx.y = A4[1] - M;
}
function ensure(ctx: Ctx, h: number) {
  if (ctx.y - h < M) newPage(ctx);
}
function text(
  ctx: Ctx,
  s: string,
  opts: { size?: number; bold?: boolean; color?: ReturnType<typeof rgb>; x?: number } = {},
) {
  const size = opts.size ?? 10;
  ensure(ctx, size + 4);
  ctx.page.drawText(safe(opts.bold ? ctx.bold : ctx.font, s), {
    x: opts.x ?? M,
    y: ctx.y - size,
    size,
    font: opts.bold ? ctx.bold : ctx.font,
    color: opts.color ?? INK,
  });
  ctx.y -= size + 4;
}
function wrap(ctx: Ctx, s: string, size = 9, width = A4[0] - 2 * M) {
  const words = s.split(/\s+/);
  let line = '';
  for (const w of words) {
    const next = line ? `${line} ${w}` : w;
    if (ctx.font.widthOfTextAtSize(safe(ctx.font, next), size) > width) {
      text(ctx, line, { size });
      line = w;
    } else line = next;
  }
  if (line) text(ctx, line, { size });
}

function drawCurves(ctx: Ctx, r: PublishedReportDto) {
  const curves = r.results.curves;
  if (!curves) return;
  const h = 180,
    w = A4[0] - 2 * M - 30;
  ensure(ctx, h + 40);
  text(ctx, 'Thrust against boat speed (N); the median boat in orange', { bold: true });
  const x0 = M + 30,
    y0 = ctx.y - h;
  const all = [...Object.values(curves.byEntry).flat(), ...curves.reference];
  const tMax = Math.max(...all) * 1.05;
  const vMax = curves.speedsMs[curves.speedsMs.length - 1];
  const px = (v: number) => x0 + (v / vMax) * w;
  const py = (t: number) => y0 + (Math.max(0, t) / tMax) * h;
  ctx.page.drawRectangle({ x: x0, y: y0, width: w, height: h, borderColor: LINE, borderWidth: 0.5 });
  for (let i = 0; i <= 4; i++) {
    const t = (tMax * i) / 4;
    ctx.page.drawText(f1(t / 1000, 1) + 'k', { x: M, y: py(t) - 3, size: 6, font: ctx.font, color: MUTE });
  }
  for (let v = 0; v <= vMax; v += 10)
    ctx.page.drawText(`${v}`, { x: px(v) - 3, y: y0 - 9, size: 6, font: ctx.font, color: MUTE });
  const poly = (ys: number[], color: ReturnType<typeof rgb>, thickness: number) => {
    for (let i = 1; i < ys.length; i++) {
      ctx.page.drawLine({
        start: { x: px(curves.speedsMs[i - 1]), y: py(ys[i - 1]) },
        end: { x: px(curves.speedsMs[i]), y: py(ys[i]) },
        color,
        thickness,
      });
    }
  };
  for (const ys of Object.values(curves.byEntry)) poly(ys, TIDE, 0.4);
  poly(curves.reference, FLARE, 1.6);
  ctx.y = y0 - 16;
  text(ctx, 'boat speed (m/s)', { size: 7, color: MUTE, x: x0 + w / 2 - 20 });
}

function drawDeviationBars(ctx: Ctx, r: PublishedReportDto) {
  const boats = r.results.parity?.boats ?? [];
  if (boats.length === 0) return;
  const rowH = Math.max(4, Math.min(12, 300 / boats.length));
  const h = rowH * boats.length;
  ensure(ctx, Math.min(h, 700) + 30);
  text(ctx, 'Static thrust deviation from the class median (%), whiskers = ±2u', { bold: true });
  const maxDev = Math.max(
    1,
    ...boats.map((b) => Math.abs(b.deviationFromMedianPercent) + 2 * b.uDeviationFromMedianPercent),
  );
  const cx = M + 270,
    half = 200;
  const top = ctx.y;
  ctx.page.drawLine({
    start: { x: cx, y: top },
    end: { x: cx, y: top - Math.min(h, top - M) },
    color: INK,
    thickness: 0.5,
  });
  for (const b of boats) {
    ensure(ctx, rowH);
    const y = ctx.y - rowH / 2;
    const dx = (b.deviationFromMedianPercent / maxDev) * half;
    ctx.page.drawRectangle({
      x: Math.min(cx, cx + dx),
      y: y - rowH * 0.35,
      width: Math.abs(dx),
      height: rowH * 0.7,
      color: b.deviationFromMedianPercent >= 0 ? TIDE : FLARE,
    });
    const u = ((2 * b.uDeviationFromMedianPercent) / maxDev) * half;
    ctx.page.drawLine({ start: { x: cx + dx - u, y }, end: { x: cx + dx + u, y }, color: INK, thickness: 0.6 });
    if (rowH >= 7)
      ctx.page.drawText(safe(ctx.font, b.label).slice(0, 40), {
        x: M,
        y: y - 3,
        size: Math.min(7, rowH - 1),
        font: ctx.font,
        color: INK,
      });
    ctx.y -= rowH;
  }
  ctx.y -= 8;
}

const COLS: [string, number][] = [
  ['No.', 28],
  ['Boat', 86],
  ['Model', 24],
  ['kW', 36],
  ['Nozzle mm', 52],
  ['T0 N ± u', 72],
  ['vj0 m/s', 44],
  ['Dev %', 50],
  ['Cross m/s', 50],
  ['Eq. nozzle', 52],
];

function drawTable(ctx: Ctx, r: PublishedReportDto) {
  const boats = r.results.parity?.boats ?? [];
  const inputs = new Map(r.inputs.boats.map((b) => [b.entryId, b]));
  const header = () => {
    ensure(ctx, 30);
    let x = M;
    for (const [h, w] of COLS) {
      ctx.page.drawText(h, { x, y: ctx.y - 9, size: 8, font: ctx.bold, color: INK });
      x += w;
    }
    ctx.y -= 13;
    ctx.page.drawLine({
      start: { x: M, y: ctx.y + 2 },
      end: { x: A4[0] - M, y: ctx.y + 2 },
      color: LINE,
      thickness: 0.5,
    });
  };
  text(ctx, 'Per boat', { bold: true, size: 11 });
  header();
  for (const b of boats) {
    if (ctx.y - 11 < M) {
      newPage(ctx);
      header();
    }
    const i = inputs.get(b.id)!;
    const cells = [
      String(i.raceNumber),
      i.boatName,
      r.results.modelUsed?.[b.id]?.model === 'matched' ? 'match' : 'fixed',
      f1(b.powerKw, 0),
      f1(b.nozzleDiameterMm, 2),
      // A static figure where the pump cavitates is an upper bound.
      `${r.results.modelUsed?.[b.id]?.points?.[0]?.cavitating ? '<= ' : ''}${f1(b.staticThrustN, 0)} ± ${f1(b.uStaticThrustN, 0)}`,
      f1(b.staticJetVelocityMs, 2),
      `${b.deviationFromMedianPercent >= 0 ? '+' : ''}${f1(b.deviationFromMedianPercent, 2)}`,
      b.crossoverWithMedianMs === null ? (b.isReferenceBoat ? 'median' : '—') : f1(b.crossoverWithMedianMs, 1),
      f1(b.equalisingNozzleDiameterMm, 2),
    ];
    let x = M;
    cells.forEach((c, k) => {
      ctx.page.drawText(safe(ctx.font, c).slice(0, k === 1 ? 18 : 20), {
        x,
        y: ctx.y - 8,
        size: 7.5,
        font: ctx.font,
        color: INK,
      });
      x += COLS[k][1];
    });
    ctx.y -= 11;
  }
  ctx.y -= 6;
}

/** `timeZone`: the meeting's zone, in which the publication time is printed (named, as on every screen). */
export async function buildReportPdf(
  r: PublishedReportDto,
  timeZone = 'UTC',
  checkpoint: Checkpoint | null = null,
): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const ctx: Ctx = {
    doc,
    page: doc.addPage(A4),
    y: A4[1] - M,
    font: await doc.embedFont(StandardFonts.Helvetica),
    bold: await doc.embedFont(StandardFonts.HelveticaBold),
  };
  doc.setTitle(`${r.inputs.eventName} — ${r.inputs.classCode} parity report v${r.number}`);
  doc.setSubject(`Class parity report, ${r.inputs.className}`);
  doc.setProducer('Boreline');
  doc.setCreator('Boreline');
  const a = r.inputs.assumptions;
  text(ctx, `${r.inputs.className} (${r.inputs.classCode}) — class parity report, version ${r.number}`, {
    size: 15,
    bold: true,
  });
  text(
    ctx,
    `${r.inputs.eventName} · published ${formatTime(r.publishedAt, timeZone)} · class rules version ${r.inputs.ruleVersion.version}`,
    { size: 9, color: MUTE },
  );
  if (r.note) wrap(ctx, `Organiser's note: ${r.note}`);
  ctx.y -= 4;
  wrap(
    ctx,
    `Model: momentum theory of a water jet at fixed shaft power with pump efficiency ${a.pumpEfficiency}, nozzle loss ${a.nozzleLossCoefficient}, inlet loss ${a.inletLossCoefficient}, wake fraction ${a.wakeFraction} (Allison, Marine Waterjet Propulsion, SNAME Trans. 101, 1993; Faltinsen, Hydrodynamics of High-Speed Marine Vehicles, 2005, s. 2.11; MIT 2.611 course notes, 2006). Water: ${r.inputs.density.description}, ${f1(r.inputs.density.densityKgM3, 4)} kg/m3. Nozzle: area-equivalent diameter of the two-point readings at 20 C (ISO 1:2022); uncertainties are standard (k = 1) by first-order propagation (JCGM 100:2008).${a.reportModel === 'matched' ? ' This class chose the matched model: a boat with both curves declared is figured where its engine and pump settle instead (see Model per boat).' : ''}`,
  );
  const c = r.results.classFigures;
  if (c) {
    ctx.y -= 4;
    text(ctx, 'Class figures', { bold: true, size: 11 });
    const s = r.results.parity!.summary;
    wrap(
      ctx,
      `${s.boatCount} boats. Static thrust median ${f1(c.medianStaticThrustN.value, 0)} ± ${f1(c.medianStaticThrustN.u, 0)} N, min ${f1(c.minStaticThrustN.value, 0)} ± ${f1(c.minStaticThrustN.u, 0)} N, max ${f1(c.maxStaticThrustN.value, 0)} ± ${f1(c.maxStaticThrustN.u, 0)} N; max/min ${f1(s.maxMinRatio, 4)}; spread ${f1(c.spreadPercent.value, 2)} ± ${f1(c.spreadPercent.u, 2)} %; coefficient of variation ${s.coefficientOfVariationPercent === null ? '—' : f1(s.coefficientOfVariationPercent, 2) + ' %'}. Static jet velocity ${f1(c.jetVelocityMinMs, 2)} to ${f1(c.jetVelocityMaxMs, 2)} m/s (median ${f1(c.jetVelocityMedianMs, 2)}, spread ${f1(c.jetVelocitySpreadPercent, 2)} %).`,
    );
  }
  ctx.y -= 6;
  drawCurves(ctx, r);
  drawDeviationBars(ctx, r);
  drawTable(ctx, r);
  drawModelNotes(ctx, r);
  for (const l of clockReportLines(r.results.clock))
    if (l.heading) text(ctx, l.text, { bold: true, size: 11 });
    else wrap(ctx, l.text, 8);
  const awaiting = r.inputs.boats.filter((b) => b.awaitingReinspection);
  if (awaiting.length) {
    text(ctx, 'Declarations changed since inspection (figures as inspected)', { bold: true, size: 11 });
    for (const b of awaiting) wrap(ctx, `#${b.raceNumber} ${b.boatName}: ${b.awaitingReinspection}`, 8);
  }
  if (r.inputs.excluded.length) {
    text(ctx, 'Boats not in the figures', { bold: true, size: 11 });
    for (const e of r.inputs.excluded) text(ctx, `#${e.raceNumber} ${e.boatName}: ${e.reason}`, { size: 8 });
  }
  if (checkpoint) {
    ctx.y -= 4;
    text(ctx, 'Record checkpoint', { bold: true, size: 11 });
    for (const line of checkpointLines(checkpoint, timeZone)) wrap(ctx, line, 8);
  }
  ctx.y -= 6;
  wrap(
    ctx,
    "Caution: jet boat racing can injure and kill. These figures are a model of relative performance and support the officials; they are not a verdict. The governing body's rules, local regulations and the judgement of licensed officials decide every question of conformity and safety.",
    8.5,
  );
  return doc.save();
}

/** Which model each boat used, the cavitation flags (upper bounds) and the power uncertainty shares. */
function drawModelNotes(ctx: Ctx, r: PublishedReportDto) {
  const a = r.inputs.assumptions;
  const used = r.results.modelUsed;
  const name = (id: string) => {
    const b = r.inputs.boats.find((x) => x.entryId === id);
    return b ? `#${b.raceNumber} ${b.boatName}` : id;
  };
  if (a.reportModel === 'matched' && used) {
    text(ctx, 'Model per boat', { bold: true, size: 11 });
    const matched = Object.entries(used).filter(([, m]) => m.model === 'matched');
    wrap(
      ctx,
      `Matched model (engine curve x pump curve, pump affinity laws: Karassik, Pump Handbook; Brennen, Hydrodynamics of Pumps, 1994) for ${matched.length} of ${Object.keys(used).length} boats, "match" in the table; the others at fixed power. A matched figure's uncertainty is first order by finite differences from the power uncertainty (applied to the whole engine curve) and the nozzle diameter; the declared curves' own uncertainty is not computed. Crossover, equalising nozzles and odds use the fixed-power model.`,
      8,
    );
    for (const [id, m] of Object.entries(used)) if (m.reason) wrap(ctx, `${name(id)}: fixed power. ${m.reason}`, 8);
    for (const [id, m] of matched) {
      const at = (m.points ?? [])
        .filter((p) => p.cavitating)
        .map((p) => (p.speedMs === 0 ? 'rest' : `${p.speedMs} m/s`));
      if (at.length)
        wrap(ctx, `${name(id)}: the pump cavitates at ${at.join(', ')}; the thrust there is an upper bound.`, 8);
    }
  }
  const s = a.powerEvidenceShares;
  if (s)
    wrap(
      ctx,
      `Power uncertainty by evidence (expanded, k = 2): dyno sheet ${+(s.dyno_sheet * 100).toFixed(2)} %, maker's rating ${+(s.maker_rating * 100).toFixed(2)} %, declaration only ${+(s.declaration_only * 100).toFixed(2)} % of the power (${s.source === 'class' ? 'set by the class rules' : 'common practice, no published source'}).`,
      8,
    );
  ctx.y -= 4;
}
