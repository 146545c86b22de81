import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { ListSealsQuery } from '@/lib/core/inputs/seals';
import { describeComponent, describeSealState } from '@/lib/core/seals/seal-words';
import type { SealAction } from '@/models/boat-record';

// The register as a meeting's officials see it: the seals issued to this meeting and any seal that
// has been recorded here (a seal carried in from another meeting on a boat's component), each with
// its state from its latest event, and one seal's whole history across meetings.

export type SealRow = {
  id: string;
  number: string;
  batchId: string | null;
  /** The meeting the seal was issued to (null: carried over from a free-text record). */
  issuedTo: string | null;
  lastAction: SealAction | null;
  lastAt: string | null;
  component: string | null;
  boatName: string | null;
  /** The state in words: unused, applied to …, intact at last check, broken, missing, removed. */
  state: string;
};

export type SealHistoryEvent = {
  id: string;
  action: SealAction;
  at: string;
  component: string | null;
  boatName: string | null;
  eventName: string | null;
  eventId: string | null;
  inspectionId: string | null;
  position: string;
  photoId: string | null;
  reason: string;
  recordedBy: string;
};

/** Seals this meeting's officials may see: issued here, recorded here, or on a boat entered here. */
const VISIBLE = `(
  select s.id from seals s join seal_batches b on b.id = s.batch_id where b.event_id = :eventId
  union select e.seal_id from seal_events e where e.event_id = :eventId
  union select e.seal_id from seal_events e join entries en on en.boat_id = e.boat_id where en.event_id = :eventId
)`;

const LIMIT = 1000;

/** The register's seals for this meeting, by number; q narrows by part of the number. */
export async function listSeals(
  actor: Actor | null,
  eventId: string,
  rawQuery: unknown,
): Promise<{ seals: SealRow[]; isCut: boolean }> {
  assertCan(actor, 'inspection.board', { eventId });
  const { q } = ListSealsQuery.parse(rawQuery ?? {});
  const rows = await getDb().sequelize.query<{
    id: string;
    number: string;
    batchId: string | null;
    issuedTo: string | null;
    lastAction: SealAction | null;
    lastAt: Date | null;
    kind: string | null;
    maker: string | null;
    model: string | null;
    serialNumber: string | null;
    boatName: string | null;
  }>(
    `select s.id, s.number, s.batch_id as "batchId", ev.name as "issuedTo", l.action as "lastAction", l.created_at as "lastAt",
            c.kind, c.maker, c.model, c.serial_number as "serialNumber", coalesce(now_boat.name, then_boat.name) as "boatName"
       from ${VISIBLE} v
       join seals s on s.id = v.id
       left join seal_batches b on b.id = s.batch_id
       left join events ev on ev.id = b.event_id
       left join lateral (select e.action, e.created_at, e.component_id, e.boat_id from seal_events e
                           where e.seal_id = s.id order by e.created_at desc, e.id desc limit 1) l on true
       left join boat_components c on c.id = l.component_id
       left join boats now_boat on now_boat.id = c.boat_id
       left join boats then_boat on then_boat.id = l.boat_id
      where (:q = '' or upper(s.number) like '%' || upper(:q) || '%')
      order by s.number
      limit ${LIMIT + 1}`,
    { replacements: { eventId, q }, type: QueryTypes.SELECT },
  );
  const seals = rows.slice(0, LIMIT).map((r) => {
    const component = r.kind
      ? describeComponent({
          kind: r.kind,
          maker: r.maker ?? '',
          model: r.model ?? '',
          serialNumber: r.serialNumber ?? '',
        })
      : null;
    return {
      id: r.id,
      number: r.number,
      batchId: r.batchId,
      issuedTo: r.issuedTo,
      lastAction: r.lastAction,
      lastAt: r.lastAt ? new Date(r.lastAt).toISOString() : null,
      component,
      boatName: r.boatName,
      state: describeSealState({ lastAction: r.lastAction, component, boatName: r.boatName }),
    };
  });
  return { seals, isCut: rows.length > LIMIT };
}

/** One seal's whole history, across meetings, oldest first (404 for a seal this meeting has no part in). */
export async function loadSealHistory(
  actor: Actor | null,
  eventId: string,
  sealId: string,
): Promise<{ seal: { id: string; number: string; issuedTo: string | null }; events: SealHistoryEvent[] }> {
  assertCan(actor, 'inspection.board', { eventId });
  const { sequelize } = getDb();
  const [seal] = await sequelize.query<{ id: string; number: string; issuedTo: string | null }>(
    `select s.id, s.number, ev.name as "issuedTo"
       from seals s left join seal_batches b on b.id = s.batch_id left join events ev on ev.id = b.event_id
      where s.id = :sealId and s.id in ${VISIBLE}`,
    { replacements: { eventId, sealId }, type: QueryTypes.SELECT },
  );
  if (!seal) throw new AppError('not_found', 404, 'No such seal in this meeting’s register.');
  const rows = await sequelize.query<
    Omit<SealHistoryEvent, 'at' | 'component'> & {
      at: Date;
      kind: string | null;
      maker: string | null;
      model: string | null;
      serialNumber: string | null;
    }
  >(
    `select e.id, e.action, e.created_at as at, c.kind, c.maker, c.model, c.serial_number as "serialNumber",
            bo.name as "boatName", ev.name as "eventName", e.event_id as "eventId", e.inspection_id as "inspectionId",
            e.position, e.photo_id as "photoId", e.reason, coalesce(u.name, u.email) as "recordedBy"
       from seal_events e
       left join boat_components c on c.id = e.component_id
       left join boats bo on bo.id = e.boat_id
       left join events ev on ev.id = e.event_id
       join users u on u.id = e.recorded_by_id
      where e.seal_id = :sealId
      order by e.created_at, e.id`,
    { replacements: { sealId }, type: QueryTypes.SELECT },
  );
  return {
    seal,
    events: rows.map(({ kind, maker, model, serialNumber, at, ...r }) => ({
      ...r,
      at: new Date(at).toISOString(),
      component: kind
        ? describeComponent({ kind, maker: maker ?? '', model: model ?? '', serialNumber: serialNumber ?? '' })
        : null,
    })),
  };
}
