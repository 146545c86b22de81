import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import type { Actor } from '@/lib/server/auth/actor';
import { formatInZone } from '../../core/protests/protest-window';
import { formatMoney } from '@/lib/core/inputs/entries';

export type AppealablePenalty = {
  id: string;
  eventId: string;
  label: string; // meeting, boat and penalty in words
  deadlineLabel: string;
  fee: string | null;
};

/**
 * The penalties this person may still appeal: in force, set by the stewards (not by the appeal body), within the
 * notice period, on a boat they entered or own or from a protest they lodged, and not appealed by them already.
 */
export async function listAppealablePenalties(actor: Actor | null, now = new Date()): Promise<AppealablePenalty[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const rows = await getDb().sequelize.query<{
    id: string;
    eventId: string;
    eventName: string;
    raceNumber: number;
    boatName: string;
    code: string;
    penaltyLabel: string;
    deadline: Date;
    timeZone: string;
    feeMinor: number;
    currency: string;
  }>(
    `select p.id, p.event_id as "eventId", ev.name as "eventName", e.race_number as "raceNumber", b.name as "boatName",
            p.code, p.label as "penaltyLabel", p.decided_at + make_interval(mins => ev.appeal_notice_minutes) as deadline,
            ev.time_zone as "timeZone", ev.appeal_fee_minor as "feeMinor", ev.currency
       from penalties p join entries e on e.id = p.entry_id join boats b on b.id = e.boat_id
       join events ev on ev.id = p.event_id left join protests pr on pr.id = p.protest_id
      where p.appeal_id is null
        and :me in (e.entrant_id, b.owner_id, pr.lodged_by_id)
        and p.decided_at + make_interval(mins => ev.appeal_notice_minutes) >= :now
        and not exists (select 1 from appeals x where x.penalty_id = p.id and (x.lodged_by_id = :me or x.status in ('annulled', 'amended')))
      order by p.decided_at desc limit 100`,
    { replacements: { me: actor.id, now }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    eventId: r.eventId,
    label: `${r.eventName}: #${r.raceNumber} ${r.boatName}, ${r.code} ${r.penaltyLabel}`,
    deadlineLabel: formatInZone(r.deadline, r.timeZone),
    fee: r.feeMinor > 0 ? formatMoney(r.feeMinor, r.currency) : null,
  }));
}
