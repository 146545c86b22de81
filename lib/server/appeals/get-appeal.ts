import 'server-only';
import type { Actor } from '@/lib/server/auth/actor';
import { formatMoney } from '@/lib/core/inputs/entries';
import { formatInZone } from '../../core/protests/protest-window';
import { APPEAL_STATUS_LABELS, type AppealRecord, type AppealStatus } from './appeal-view';
import { findAppealForActor, type AppealAccess } from './find-appeal-for-actor';

export type AppealDetail = {
  id: string;
  eventId: string;
  eventName: string;
  penalty: { id: string; code: string; label: string; reason: string };
  entry: { id: string; raceNumber: number; boatName: string };
  lodgedByName: string;
  grounds: string;
  status: AppealStatus;
  statusLabel: string;
  fee: string | null;
  feeState: 'none' | 'due' | 'paid' | 'refunded';
  noticeDeadline: string;
  noticeDeadlineLabel: string;
  hearingAt: string | null;
  hearingAtLabel: string | null;
  hearingPlace: string | null;
  decisionReasons: string | null;
  decidedAt: string | null;
  replacingPenaltyId: string | null;
  you: { isAppellant: boolean; isParty: boolean; mayPay: boolean; mayHear: boolean };
};

export function toAppealDetail(a: AppealRecord, access: Omit<AppealAccess, 'appeal'>): AppealDetail {
  return {
    id: a.id,
    eventId: a.eventId,
    eventName: a.eventName,
    penalty: { id: a.penaltyId, code: a.penaltyCode, label: a.penaltyLabel, reason: a.penaltyReason },
    entry: { id: a.entryId, raceNumber: a.raceNumber, boatName: a.boatName },
    lodgedByName: a.lodgedByName,
    grounds: a.grounds,
    status: a.status,
    statusLabel: APPEAL_STATUS_LABELS[a.status],
    fee: a.feeMinor > 0 ? formatMoney(a.feeMinor, a.currency) : null,
    feeState: a.feeMinor === 0 ? 'none' : a.refundId ? 'refunded' : a.paidAt ? 'paid' : 'due',
    noticeDeadline: new Date(a.noticeDeadline).toISOString(),
    noticeDeadlineLabel: formatInZone(a.noticeDeadline, a.timeZone),
    hearingAt: a.hearingAt ? new Date(a.hearingAt).toISOString() : null,
    hearingAtLabel: a.hearingAt ? formatInZone(a.hearingAt, a.timeZone) : null,
    hearingPlace: a.hearingPlace,
    decisionReasons: a.decisionReasons,
    decidedAt: a.decidedAt ? new Date(a.decidedAt).toISOString() : null,
    replacingPenaltyId: a.replacingPenaltyId,
    you: {
      isAppellant: access.isAppellant,
      isParty: access.isParty,
      mayPay: access.isAppellant && a.status === 'awaiting_fee',
      mayHear: access.isAppealBody,
    },
  };
}

/** One appeal, for its parties, the meeting's stewards and organiser, and the appeal body (404 for anyone else). */
export async function getAppeal(actor: Actor | null, appealId: string): Promise<AppealDetail> {
  const { appeal, ...access } = await findAppealForActor(actor, appealId);
  return toAppealDetail(appeal, access);
}
