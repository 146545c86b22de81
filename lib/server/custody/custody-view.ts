import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

// A part in (or out of) the officials' custody, as screens and the API see it.
export type CustodyItemView = {
  id: string;
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  description: string;
  sealNumber: string | null;
  takenBy: string;
  takenAt: string;
  protest: { id: string; ruleReference: string; status: string } | null;
  release: { releasedTo: string; note: string; releasedBy: string; releasedAt: string } | null;
};

export type HeldPart = { description: string; sealNumber: string | null; takenAt: string };

/**
 * SQL for the parts of one entry the officials hold now (taken, not released), as a JSON array
 * (null when none), oldest first; `entryIdSql` names the entry (a column or a replacement).
 */
export const heldPartsJsonSql = (entryIdSql: string) =>
  `(select json_agg(json_build_object('description', ci.description, 'sealNumber', ci.seal_number, 'takenAt', ci.taken_at) order by ci.taken_at)
      from custody_items ci where ci.entry_id = ${entryIdSql} and not exists (select 1 from custody_releases cr where cr.item_id = ci.id))`;

type Row = {
  id: string;
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  description: string;
  sealNumber: string | null;
  takenBy: string;
  takenAt: Date;
  protestId: string | null;
  ruleReference: string | null;
  protestStatus: string | null;
  releasedTo: string | null;
  releaseNote: string | null;
  releasedBy: string | null;
  releasedAt: Date | null;
};

/** Items of a meeting (or one item), held first, then released, newest first within each. */
export async function loadCustodyViews(opts: {
  eventId: string;
  itemId?: string;
  protestId?: string;
  transaction?: Transaction;
}): Promise<CustodyItemView[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select i.id, i.entry_id as "entryId", e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode",
            i.description, i.seal_number as "sealNumber", coalesce(tu.name, tu.email) as "takenBy", i.taken_at as "takenAt",
            p.id as "protestId", p.rule_reference as "ruleReference", p.status as "protestStatus",
            r.released_to as "releasedTo", r.note as "releaseNote", coalesce(ru.name, ru.email) as "releasedBy", r.released_at as "releasedAt"
       from custody_items i
       join entries e on e.id = i.entry_id join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
       join users tu on tu.id = i.taken_by_id
       left join protests p on p.id = i.protest_id
       left join custody_releases r on r.item_id = i.id left join users ru on ru.id = r.released_by_id
      where i.event_id = :eventId ${opts.itemId ? 'and i.id = :itemId' : ''} ${opts.protestId ? 'and i.protest_id = :protestId' : ''}
      order by r.id is not null, i.taken_at desc`,
    {
      replacements: { eventId: opts.eventId, itemId: opts.itemId ?? null, protestId: opts.protestId ?? null },
      type: QueryTypes.SELECT,
      transaction: opts.transaction,
    },
  );
  return rows.map((r) => ({
    id: r.id,
    entryId: r.entryId,
    raceNumber: r.raceNumber,
    boatName: r.boatName,
    classCode: r.classCode,
    description: r.description,
    sealNumber: r.sealNumber,
    takenBy: r.takenBy,
    takenAt: new Date(r.takenAt).toISOString(),
    protest: r.protestId ? { id: r.protestId, ruleReference: r.ruleReference!, status: r.protestStatus! } : null,
    release: r.releasedAt
      ? {
          releasedTo: r.releasedTo!,
          note: r.releaseNote ?? '',
          releasedBy: r.releasedBy!,
          releasedAt: new Date(r.releasedAt).toISOString(),
        }
      : null,
  }));
}
