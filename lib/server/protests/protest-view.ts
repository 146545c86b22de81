import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { formatInZone } from '../../core/protests/protest-window';
import {
  PROTEST_STATUS_LABELS,
  REJECTION_LABELS,
  type ProtestStatus,
  type RejectionCode,
} from '../../core/protests/protest-states';

// A protest as screens, e-mails and the API see it (plain object), and the one query that reads it.
export type ProtestSummary = {
  id: string;
  eventId: string;
  eventName: string;
  timeZone: string;
  status: ProtestStatus;
  statusLabel: string;
  targetLabel: string; // "#13 Shingle Arrow (SS)" or "SS provisional results v2"
  againstEntryId: string | null;
  againstResultId: string | null;
  protestedEntrantId: string | null;
  raceNumber: number | null;
  ruleReference: string;
  grounds: string;
  requestedChecks: string[];
  lodgedById: string;
  lodgedByName: string;
  lodgedAt: string;
  lodgedAtLabel: string;
  windowDeadline: string;
  windowDeadlineLabel: string;
  feeMinor: number;
  currency: string;
  paidAt: string | null;
  refundId: string | null;
  refundedAt: string | null;
  rejectionCode: RejectionCode | null;
  rejectionLabel: string | null;
  hearingAt: string | null;
  hearingAtLabel: string | null;
  hearingPlace: string | null;
  decisionReasons: string | null;
  penalty: string | null;
  decidedAt: string | null;
  decidedAtLabel: string | null;
  decidedByNames: string[];
  appealDeadline: string | null;
  appealDeadlineLabel: string | null;
};

type Row = Record<string, unknown> & { timeZone: string };
const iso = (d: unknown) => (d ? new Date(d as string).toISOString() : null);

export async function queryProtestSummaries(
  where: string,
  replacements: Record<string, unknown>,
): Promise<ProtestSummary[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select p.id, p.event_id as "eventId", ev.name as "eventName", ev.time_zone as "timeZone", p.status,
            p.against_entry_id as "againstEntryId", p.against_result_id as "againstResultId", e.entrant_id as "protestedEntrantId",
            e.race_number as "raceNumber", b.name as "boatName", coalesce(c.code, rc.code) as "classCode", r.version as "resultVersion",
            p.rule_reference as "ruleReference", p.grounds, p.requested_checks as "requestedChecks", p.lodged_by_id as "lodgedById",
            coalesce(u.name, u.email) as "lodgedByName", p.created_at as "lodgedAt", p.window_deadline as "windowDeadline",
            p.fee_minor as "feeMinor", p.currency, p.paid_at as "paidAt", p.refund_id as "refundId", p.refunded_at as "refundedAt",
            p.rejection_code as "rejectionCode", p.hearing_at as "hearingAt", p.hearing_place as "hearingPlace",
            p.decision_reasons as "decisionReasons", p.penalty, p.decided_at as "decidedAt", p.appeal_deadline as "appealDeadline",
            -- The names kept on the decision; older decisions read the current names.
            case when jsonb_array_length(p.decided_by_names) > 0 then p.decided_by_names::json else
            (select coalesce(json_agg(coalesce(s.name, s.email) order by s.name), '[]'::json) from users s
              where s.id::text in (select jsonb_array_elements_text(p.decided_by_ids))) end as "decidedByNames"
       from protests p
       join events ev on ev.id = p.event_id
       join users u on u.id = p.lodged_by_id
       left join entries e on e.id = p.against_entry_id
       left join boats b on b.id = e.boat_id
       left join race_classes c on c.id = e.class_id
       left join provisional_results r on r.id = p.against_result_id
       left join race_classes rc on rc.id = r.class_id
      where ${where}
      order by p.created_at desc`,
    { replacements, type: QueryTypes.SELECT },
  );
  return rows.map((r) => {
    const tz = r.timeZone;
    const label = (d: unknown) => (d ? formatInZone(d as string, tz) : null);
    const status = r.status as ProtestStatus;
    return {
      id: r.id as string,
      eventId: r.eventId as string,
      eventName: r.eventName as string,
      timeZone: tz,
      status,
      statusLabel: PROTEST_STATUS_LABELS[status],
      targetLabel: r.againstEntryId
        ? `#${r.raceNumber} ${r.boatName} (${r.classCode})`
        : `${r.classCode} provisional results v${r.resultVersion}`,
      againstEntryId: (r.againstEntryId as string) ?? null,
      againstResultId: (r.againstResultId as string) ?? null,
      protestedEntrantId: (r.protestedEntrantId as string) ?? null,
      raceNumber: (r.raceNumber as number) ?? null,
      ruleReference: r.ruleReference as string,
      grounds: r.grounds as string,
      requestedChecks: (r.requestedChecks as string[]) ?? [],
      lodgedById: r.lodgedById as string,
      lodgedByName: r.lodgedByName as string,
      lodgedAt: iso(r.lodgedAt)!,
      lodgedAtLabel: label(r.lodgedAt)!,
      windowDeadline: iso(r.windowDeadline)!,
      windowDeadlineLabel: label(r.windowDeadline)!,
      feeMinor: r.feeMinor as number,
      currency: r.currency as string,
      paidAt: iso(r.paidAt),
      refundId: (r.refundId as string) ?? null,
      refundedAt: iso(r.refundedAt),
      rejectionCode: (r.rejectionCode as RejectionCode) ?? null,
      rejectionLabel: r.rejectionCode ? REJECTION_LABELS[r.rejectionCode as RejectionCode] : null,
      hearingAt: iso(r.hearingAt),
      hearingAtLabel: label(r.hearingAt),
      hearingPlace: (r.hearingPlace as string) ?? null,
      decisionReasons: (r.decisionReasons as string) ?? null,
      penalty: (r.penalty as string) || null,
      decidedAt: iso(r.decidedAt),
      decidedAtLabel: label(r.decidedAt),
      decidedByNames: (r.decidedByNames as string[]) ?? [],
      appealDeadline: iso(r.appealDeadline),
      appealDeadlineLabel: label(r.appealDeadline),
    };
  });
}
