import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { formatInZone } from '@/lib/core/protests/protest-window';
import type { InterestKind } from '../../core/inputs/interests';

// A declaration in the register as screens and the API see it (plain object), and the one query that reads them.
export type InterestView = {
  id: string;
  officialId: string;
  officialName: string;
  officialRoles: string[];
  kind: InterestKind;
  subjectLabel: string; // "#104 Shingle Arrow (TP)", "Ana Ruiz", "Team Kelda"
  statement: string;
  declaredAt: string;
  declaredAtLabel: string;
  withdrawal: { at: string; atLabel: string; reason: string; byName: string } | null;
};

type Row = Omit<InterestView, 'declaredAtLabel' | 'withdrawal' | 'declaredAt'> & {
  declaredAt: Date;
  timeZone: string;
  withdrawnAt: Date | null;
  withdrawalReason: string | null;
  withdrawnByName: string | null;
};

/** Declarations of one meeting, oldest first; only one official's when officialId is given. */
export async function queryInterests(
  eventId: string,
  opts: { officialId?: string; interestId?: string; transaction?: Transaction } = {},
): Promise<InterestView[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select i.id::text as id, i.official_id::text as "officialId", coalesce(o.name, o.email) as "officialName",
            coalesce((select json_agg(distinct s.role) from event_staff s where s.event_id = i.event_id and s.user_id = i.official_id), '[]') as "officialRoles",
            i.subject_kind as kind,
            case i.subject_kind
              when 'boat' then coalesce((select '#' || e.race_number || ' ' || b.name || ' (' || c.code || ')' from entries e join race_classes c on c.id = e.class_id
                                          where e.event_id = i.event_id and e.boat_id = i.boat_id order by e.created_at limit 1), b.name)
              when 'entrant' then coalesce(p.name, p.email)
              else i.team_name end as "subjectLabel",
            i.statement, i.declared_at as "declaredAt", ev.time_zone as "timeZone",
            w.withdrawn_at as "withdrawnAt", w.reason as "withdrawalReason", coalesce(wb.name, wb.email) as "withdrawnByName"
       from official_interests i
       join events ev on ev.id = i.event_id
       join users o on o.id = i.official_id
       left join boats b on b.id = i.boat_id
       left join users p on p.id = i.entrant_id
       left join official_interest_withdrawals w on w.interest_id = i.id
       left join users wb on wb.id = w.withdrawn_by_id
      where i.event_id = :eventId
        ${opts.officialId ? 'and i.official_id = :officialId' : ''}
        ${opts.interestId ? 'and i.id = :interestId' : ''}
      order by i.declared_at, i.id`,
    {
      replacements: { eventId, officialId: opts.officialId ?? null, interestId: opts.interestId ?? null },
      type: QueryTypes.SELECT,
      transaction: opts.transaction,
    },
  );
  return rows.map(({ timeZone, withdrawnAt, withdrawalReason, withdrawnByName, declaredAt, ...r }) => ({
    ...r,
    declaredAt: new Date(declaredAt).toISOString(),
    declaredAtLabel: formatInZone(declaredAt, timeZone),
    withdrawal: withdrawnAt
      ? {
          at: new Date(withdrawnAt).toISOString(),
          atLabel: formatInZone(withdrawnAt, timeZone),
          reason: withdrawalReason ?? '',
          byName: withdrawnByName ?? '',
        }
      : null,
  }));
}
