import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

export type AppealStatus =
  'awaiting_fee' | 'lodged' | 'hearing_scheduled' | 'confirmed' | 'amended' | 'annulled' | 'superseded';
export const APPEAL_STATUS_LABELS: Record<AppealStatus, string> = {
  awaiting_fee: 'Awaiting the fee',
  lodged: 'Lodged',
  hearing_scheduled: 'Hearing set',
  confirmed: "Stewards' decision confirmed",
  amended: "Stewards' decision amended",
  annulled: "Stewards' decision annulled",
  superseded: "Closed: another appeal's decision ended the penalty",
};
export const PENDING_APPEAL: readonly AppealStatus[] = ['lodged', 'hearing_scheduled'];

/** Everything about an appeal that its parties, the meeting's officials and the appeal body may read. */
export type AppealRecord = {
  id: string;
  eventId: string;
  eventName: string;
  timeZone: string;
  penaltyId: string;
  penaltyCode: string;
  penaltyLabel: string;
  penaltyReason: string;
  penaltyAppealId: string | null; // the penalty itself came from an appeal body decision
  entryId: string;
  classId: string;
  raceNumber: number;
  boatName: string;
  penalisedEntrantId: string;
  boatOwnerId: string;
  protestLodgerId: string | null; // the protester, when the penalty came from a protest
  lodgedById: string;
  lodgedByName: string;
  lodgedByEmail: string;
  grounds: string;
  status: AppealStatus;
  feeMinor: number;
  currency: string;
  checkoutSessionId: string | null;
  paymentIntentId: string | null;
  paidAt: Date | null;
  refundId: string | null;
  refundedAt: Date | null;
  noticeDeadline: Date;
  hearingAt: Date | null;
  hearingPlace: string | null;
  decisionReasons: string | null;
  decidedAt: Date | null;
  decidedById: string | null;
  replacingPenaltyId: string | null;
  createdAt: Date;
};

export async function readAppeal(
  appealId: string,
  opts: { transaction?: Transaction; lock?: boolean } = {},
): Promise<AppealRecord | undefined> {
  const { sequelize } = getDb();
  if (opts.lock && opts.transaction)
    await sequelize.query('select 1 from appeals where id = :appealId for update', {
      replacements: { appealId },
      type: QueryTypes.SELECT,
      transaction: opts.transaction,
    });
  const [row] = await sequelize.query<AppealRecord>(
    `select a.id, a.event_id as "eventId", ev.name as "eventName", ev.time_zone as "timeZone",
            p.id as "penaltyId", p.code as "penaltyCode", p.label as "penaltyLabel", p.reason as "penaltyReason",
            p.appeal_id as "penaltyAppealId", e.id as "entryId", e.class_id as "classId", e.race_number as "raceNumber",
            b.name as "boatName", e.entrant_id as "penalisedEntrantId", b.owner_id as "boatOwnerId",
            pr.lodged_by_id as "protestLodgerId", a.lodged_by_id as "lodgedById",
            coalesce(u.name, u.email) as "lodgedByName", u.email as "lodgedByEmail", a.grounds, a.status,
            a.fee_minor as "feeMinor", a.currency, a.checkout_session_id as "checkoutSessionId",
            a.payment_intent_id as "paymentIntentId", a.paid_at as "paidAt", a.refund_id as "refundId",
            a.refunded_at as "refundedAt", a.notice_deadline as "noticeDeadline", a.hearing_at as "hearingAt",
            a.hearing_place as "hearingPlace", a.decision_reasons as "decisionReasons", a.decided_at as "decidedAt",
            a.decided_by_id as "decidedById",
            (select r.id from penalties r where r.appeal_id = a.id) as "replacingPenaltyId", a.created_at as "createdAt"
       from appeals a join penalties p on p.id = a.penalty_id join entries e on e.id = p.entry_id
       join boats b on b.id = e.boat_id join events ev on ev.id = a.event_id join users u on u.id = a.lodged_by_id
       left join protests pr on pr.id = p.protest_id
      where a.id = :appealId`,
    { replacements: { appealId }, type: QueryTypes.SELECT, transaction: opts.transaction },
  );
  return row;
}

/** The people to tell about an appeal: the appellant, the penalised entrant, the protester (once lodged). */
export async function appealPartyAddresses(a: AppealRecord, transaction?: Transaction): Promise<string[]> {
  const ids = [a.lodgedById, a.penalisedEntrantId, ...(a.protestLodgerId ? [a.protestLodgerId] : [])];
  const rows = await getDb().sequelize.query<{ email: string }>(
    `select distinct email from users where id in (:ids) and suspended_at is null`,
    { replacements: { ids }, type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => r.email);
}
