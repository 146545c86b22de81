import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

export type ConflictReason =
  | { kind: 'lodged' }
  | { kind: 'party_boat'; side: 'lodger' | 'protested'; against: 'entry' | 'results' }
  | { kind: 'interest'; subject: string; statement: string };

export type OfficialConflict = { officialId: string; reasons: ConflictReason[] };

/**
 * Which of these officials has an interest in this protest, and why. An official is conflicted
 * when they lodged it; when they entered or own a boat on either side (the protester's boats at
 * the meeting; the protested boat, or for a protest against results every boat in that class);
 * or when they declared an interest in such a boat or in such a person (protester, entrant or
 * owner) that was still standing when the protest was lodged or since — a withdrawal made after
 * the protest came in does not clear it, so an interest cannot be withdrawn to take a decision.
 * Team interests are free text and cannot be matched here: the protest page lists them instead.
 * The one query behind every steward step and the protest page (common practice for
 * sports officials, no single source).
 */
export async function findProtestConflicts(
  protestId: string,
  officialIds: string[],
  transaction?: Transaction,
): Promise<OfficialConflict[]> {
  if (officialIds.length === 0) return [];
  const rows = await getDb().sequelize.query<{
    officialId: string;
    kind: string;
    side: string | null;
    against: string;
    subject: string | null;
    statement: string | null;
  }>(
    `with p as (
       select id, event_id, lodged_by_id, against_entry_id, against_result_id, created_at,
              case when against_entry_id is not null then 'entry' else 'results' end as against
         from protests where id = :protestId),
     party_entries as (
       select e.boat_id, e.entrant_id, 'lodger' as side from entries e join p on e.event_id = p.event_id and e.entrant_id = p.lodged_by_id
       union
       select e.boat_id, e.entrant_id, 'protested' from entries e join p on e.id = p.against_entry_id
       union
       select e.boat_id, e.entrant_id, 'protested' from entries e join provisional_results r on r.class_id = e.class_id join p on r.id = p.against_result_id and e.event_id = p.event_id),
     party_boats as (select distinct pe.boat_id, pe.side, b.owner_id, b.name from party_entries pe join boats b on b.id = pe.boat_id),
     party_people as (
       select lodged_by_id as user_id, 'lodger' as side from p
       union select entrant_id, side from party_entries
       union select owner_id, side from party_boats),
     officials as (select distinct unnest(array[:officialIds]::uuid[]) as id),
     live as (
       select i.* from official_interests i join p on p.event_id = i.event_id
         left join official_interest_withdrawals w on w.interest_id = i.id
        where w.id is null or w.withdrawn_at > p.created_at)
     select o.id::text as "officialId", 'lodged' as kind, null as side, p.against, null as subject, null as statement
       from officials o join p on p.lodged_by_id = o.id
     union all
     select o.id::text, 'party_boat', pp.side, p.against, null, null
       from officials o join party_people pp on pp.user_id = o.id cross join p
      where not (pp.side = 'lodger' and o.id = p.lodged_by_id)
     union all
     select i.official_id::text, 'interest', null, p.against, 'boat ' || pb.name, i.statement
       from live i join officials o on o.id = i.official_id join (select distinct boat_id, name from party_boats) pb on pb.boat_id = i.boat_id cross join p
      where i.subject_kind = 'boat'
     union all
     select i.official_id::text, 'interest', null, p.against, coalesce(u.name, u.email), i.statement
       from live i join officials o on o.id = i.official_id join users u on u.id = i.entrant_id cross join p
      where i.subject_kind = 'entrant' and i.entrant_id in (select user_id from party_people)`,
    { replacements: { protestId, officialIds }, type: QueryTypes.SELECT, transaction },
  );
  const byOfficial = new Map<string, ConflictReason[]>();
  for (const r of rows) {
    const reason: ConflictReason =
      r.kind === 'lodged'
        ? { kind: 'lodged' }
        : r.kind === 'party_boat'
          ? { kind: 'party_boat', side: r.side as 'lodger' | 'protested', against: r.against as 'entry' | 'results' }
          : { kind: 'interest', subject: r.subject ?? '', statement: r.statement ?? '' };
    const list = byOfficial.get(r.officialId) ?? [];
    if (!list.some((x) => JSON.stringify(x) === JSON.stringify(reason))) list.push(reason);
    byOfficial.set(r.officialId, list);
  }
  return [...byOfficial].map(([officialId, reasons]) => ({ officialId, reasons }));
}

/** A reason in words about "you" (the official reading it) or about a named official. */
export function describeConflict(r: ConflictReason, who = 'you'): string {
  const own = who === 'you' ? 'own' : 'owns';
  if (r.kind === 'lodged') return `${who} lodged this protest`;
  if (r.kind === 'party_boat') {
    if (r.side === 'lodger') return `${who} entered or ${own} a boat of the protester at this meeting`;
    return r.against === 'entry'
      ? `${who} entered or ${own} the protested boat`
      : `${who} entered or ${own} a boat in the class whose results are protested`;
  }
  return `${who} declared an interest in ${r.subject} ("${r.statement}")`;
}
