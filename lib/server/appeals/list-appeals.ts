import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { formatInZone } from '../../core/protests/protest-window';
import { APPEAL_STATUS_LABELS, type AppealStatus } from './appeal-view';

export type AppealListItem = {
  id: string;
  eventId: string;
  eventName: string;
  raceNumber: number;
  boatName: string;
  penaltyCode: string;
  penaltyLabel: string;
  lodgedByName: string;
  status: AppealStatus;
  statusLabel: string;
  createdAtLabel: string;
  hearingAtLabel: string | null;
};

/**
 * Appeals the person may read: every meeting's for the appeal body (lodged ones; one awaiting its fee is
 * nothing yet), and otherwise the appeals they lodged or that concern their boat (once lodged).
 */
export async function listAppeals(actor: Actor | null): Promise<AppealListItem[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const all = can(actor, 'appeal.hear');
  const rows = await getDb().sequelize.query<
    Omit<AppealListItem, 'statusLabel' | 'createdAtLabel' | 'hearingAtLabel'> & {
      createdAt: Date;
      hearingAt: Date | null;
      timeZone: string;
    }
  >(
    `select a.id, a.event_id as "eventId", ev.name as "eventName", e.race_number as "raceNumber", b.name as "boatName",
            p.code as "penaltyCode", p.label as "penaltyLabel", coalesce(u.name, u.email) as "lodgedByName", a.status,
            a.created_at as "createdAt", a.hearing_at as "hearingAt", ev.time_zone as "timeZone"
       from appeals a join penalties p on p.id = a.penalty_id join entries e on e.id = p.entry_id
       join boats b on b.id = e.boat_id join events ev on ev.id = a.event_id join users u on u.id = a.lodged_by_id
       left join protests pr on pr.id = p.protest_id
      where ${
        all
          ? `a.status <> 'awaiting_fee' or a.lodged_by_id = :me`
          : `a.lodged_by_id = :me or (a.status <> 'awaiting_fee' and :me in (e.entrant_id, b.owner_id, pr.lodged_by_id))`
      }
      order by a.created_at desc
      limit 500`,
    { replacements: { me: actor.id }, type: QueryTypes.SELECT },
  );
  return rows.map(({ createdAt, hearingAt, timeZone, ...r }) => ({
    ...r,
    statusLabel: APPEAL_STATUS_LABELS[r.status],
    createdAtLabel: formatInZone(createdAt, timeZone),
    hearingAtLabel: hearingAt ? formatInZone(hearingAt, timeZone) : null,
  }));
}
