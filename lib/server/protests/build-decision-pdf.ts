import 'server-only';
import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { pdfSafeText as safe, wrapPdfText } from '../../core/format/pdf-text';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { formatMoney } from '@/lib/core/inputs/entries';
import { getProtest, type ProtestDetail } from './get-protest';
import { DECIDED_STATUSES, REQUESTED_CHECKS, type RequestedCheck } from '../../core/protests/protest-states';
import { formatInZone } from '../../core/protests/protest-window';

const A4: [number, number] = [595.28, 841.89];
const M = 48;
const INK = rgb(0.043, 0.086, 0.125);
const MUTE = rgb(0.32, 0.38, 0.43);
const FLARE = rgb(0.91, 0.42, 0.06);

type Ctx = { doc: PDFDocument; page: PDFPage; y: number; font: PDFFont; bold: PDFFont; mono: PDFFont };

function line(
  ctx: Ctx,
  s: string,
  o: { size?: number; font?: PDFFont; color?: ReturnType<typeof rgb>; indent?: number } = {},
) {
  const size = o.size ?? 10;
  const font = o.font ?? ctx.font;
  const width = A4[0] - 2 * M - (o.indent ?? 0);
  // Wrap by words; a hash (no spaces) is cut by characters.
  const out = wrapPdfText(font, safe(font, s), size, width, false);
  for (const l of out.length ? out : ['']) {
    if (ctx.y - size - 4 < M) {
      ctx.page = ctx.doc.addPage(A4);
      ctx.y = A4[1] - M;
    }
    ctx.page.drawText(l, { x: M + (o.indent ?? 0), y: ctx.y - size, size, font, color: o.color ?? INK });
    ctx.y -= size + 4;
  }
}
const gap = (ctx: Ctx, h = 8) => {
  ctx.y -= h;
};
const heading = (ctx: Ctx, s: string) => {
  gap(ctx, 6);
  line(ctx, s, { size: 12, font: ctx.bold });
};

/** The written decision: protest, parties, matter, evidence with hashes, decision, reasons, penalty, stewards, time, appeal, caution. */
export async function buildDecisionPdf(
  actor: Actor | null,
  protestId: string,
): Promise<{ fileName: string; bytes: Uint8Array; protest: ProtestDetail }> {
  const p = await getProtest(actor, protestId);
  if (!DECIDED_STATUSES.includes(p.status))
    throw new AppError('not_decided', 409, 'The stewards have not decided this protest yet.');
  const doc = await PDFDocument.create();
  doc.setTitle(`Stewards' decision: protest ${p.id}`);
  doc.setCreator('Boreline');
  const ctx: Ctx = {
    doc,
    page: doc.addPage(A4),
    y: A4[1] - M,
    font: await doc.embedFont(StandardFonts.Helvetica),
    bold: await doc.embedFont(StandardFonts.HelveticaBold),
    mono: await doc.embedFont(StandardFonts.Courier),
  };

  line(ctx, "Stewards' decision", { size: 20, font: ctx.bold });
  line(ctx, p.eventName, { size: 12 });
  line(ctx, `Protest ${p.id}`, { size: 9, color: MUTE, font: ctx.mono });

  heading(ctx, 'Decision');
  line(ctx, p.status === 'rejected' ? `REJECTED AS INVALID (${p.rejectionLabel})` : p.statusLabel.toUpperCase(), {
    size: 14,
    font: ctx.bold,
  });
  line(ctx, `Decided: ${p.decidedAtLabel}`);
  line(ctx, `Stewards: ${p.decidedByNames.join(', ')}`);
  heading(ctx, 'Reasons');
  for (const para of (p.decisionReasons ?? '').split(/\n+/)) line(ctx, para);
  if (p.penalty) {
    heading(ctx, 'Penalty');
    line(ctx, p.penalty);
  }
  if (p.feeMinor > 0) {
    heading(ctx, 'Protest fee');
    line(
      ctx,
      p.refundId
        ? `${formatMoney(p.feeMinor, p.currency)} refunded (refund ${p.refundId}).`
        : `${formatMoney(p.feeMinor, p.currency)} ${p.paidAt ? 'kept' : 'not paid'}.`,
    );
  }

  heading(ctx, 'Parties and matter');
  line(ctx, `Protester: ${p.lodgedByName}`);
  line(ctx, `Protested: ${p.targetLabel}`);
  line(ctx, `Rule: ${p.ruleReference}`);
  line(ctx, `Lodged: ${p.lodgedAtLabel} (window closed ${p.windowDeadlineLabel})`);
  if (p.requestedChecks.length)
    line(
      ctx,
      `Checks asked for: ${p.requestedChecks.map((c) => REQUESTED_CHECKS[c as RequestedCheck] ?? c).join(', ')}`,
    );
  if (p.hearingAtLabel) line(ctx, `Hearing: ${p.hearingAtLabel}, ${p.hearingPlace}`);
  line(ctx, 'Grounds:', { font: ctx.bold });
  for (const para of p.grounds.split(/\n+/)) line(ctx, para, { indent: 12 });

  heading(ctx, `Evidence (${p.evidence.length})`);
  if (p.evidence.length === 0) line(ctx, 'None was added.');
  p.evidence.forEach((e, i) => {
    const when = formatInZone(e.createdAt, p.timeZone);
    if (e.kind === 'file') {
      line(
        ctx,
        `${i + 1}. File "${e.fileName}" (${e.contentType}, ${e.sizeBytes} bytes), added by ${e.addedByName}, ${when}; check on ${formatInZone(new Date(), p.timeZone)}: ${e.integrity}`,
      );
      line(ctx, `SHA-256 ${e.sha256}`, { font: ctx.mono, size: 8, indent: 12 });
    } else if (e.kind === 'note') line(ctx, `${i + 1}. Note by ${e.addedByName}, ${when}: ${e.note}`);
    else
      line(
        ctx,
        `${i + 1}. Inspection record ${e.inspectionId} (${e.inspectionLabel ?? 'inspection'}), linked by ${e.addedByName}, ${when}`,
      );
  });
  for (const t of p.reinspections)
    line(
      ctx,
      `Re-inspection ordered: ${t.reason}; ${t.inspectionId ? `recorded as inspection ${t.inspectionId}` : 'not yet recorded'}.`,
    );

  heading(ctx, 'Appeal');
  line(
    ctx,
    `Notice of appeal is due by ${p.appealDeadlineLabel}. The governing body's rules say how an appeal is made and heard.`,
  );
  gap(ctx, 10);
  line(
    ctx,
    "Safety first. Jet boat racing can injure and kill. Boreline supports the checks; it never replaces them. The governing body's rules, local regulations and the judgement of licensed officials decide every verdict and every safety matter; this decision may be appealed as those rules provide.",
    { size: 9, color: FLARE },
  );
  line(ctx, `Produced by Boreline on ${formatInZone(new Date(), p.timeZone)}.`, { size: 8, color: MUTE });
  return { fileName: `decision-protest-${p.id.slice(0, 8)}.pdf`, bytes: await doc.save(), protest: p };
}
