import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { describeConflict, findProtestConflicts } from './find-protest-conflicts';

export type StewardInterests = {
  conflicts: { officialId: string; name: string; reasons: string[]; reasonsAsOthers: string[] }[];
  teamInterests: { officialName: string; teamName: string; statement: string }[];
};

/**
 * For the protest page (officials only; the caller checks): which stewards of the meeting have an
 * interest in this protest, and the stewards' standing team interests, to be checked by hand.
 */
export async function listStewardInterests(protestId: string, eventId: string): Promise<StewardInterests> {
  const { sequelize } = getDb();
  const stewards = await sequelize.query<{ id: string; name: string }>(
    `select distinct u.id::text as id, coalesce(u.name, u.email) as name from event_staff s join users u on u.id = s.user_id where s.event_id = :eventId and s.role = 'steward'`,
    { replacements: { eventId }, type: QueryTypes.SELECT },
  );
  const names = new Map(stewards.map((s) => [s.id, s.name]));
  const [conflicts, teamInterests] = await Promise.all([
    findProtestConflicts(
      protestId,
      stewards.map((s) => s.id),
    ),
    sequelize.query<{ officialName: string; teamName: string; statement: string }>(
      `select coalesce(u.name, u.email) as "officialName", i.team_name as "teamName", i.statement
         from official_interests i join users u on u.id = i.official_id
         join event_staff s on s.event_id = i.event_id and s.user_id = i.official_id and s.role = 'steward'
        where i.event_id = :eventId and i.subject_kind = 'team'
          and not exists (select 1 from official_interest_withdrawals w where w.interest_id = i.id)
        order by i.declared_at`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  return {
    conflicts: conflicts.map((c) => {
      const name = names.get(c.officialId) ?? 'A steward';
      return {
        officialId: c.officialId,
        name,
        reasons: c.reasons.map((r) => describeConflict(r)),
        reasonsAsOthers: c.reasons.map((r) => describeConflict(r, name)),
      };
    }),
    teamInterests,
  };
}
