import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { ENTRY_STATUS_LABELS, INSPECTION_RESULT_LABELS } from '@/lib/core/inputs/entries';
import type { EntryStatus, InspectionResult } from '@/models/entry';
import { heldPartsJsonSql, type HeldPart } from '@/lib/server/custody/custody-view';

export type MyEntry = {
  id: string;
  eventId: string;
  eventName: string;
  venue: string;
  timeZone: string;
  startsOn: string;
  classId: string;
  classCode: string;
  className: string;
  boatId: string;
  boatName: string;
  raceNumber: number;
  status: EntryStatus;
  inspectionResult: InspectionResult | null;
  /** What the entrant reads: awaiting payment, entered, inspected: …, withdrawn, cancelled. */
  statusLabel: string;
  feeMinor: number;
  currency: string;
  paidAt: string | null;
  refundedAt: string | null;
  cancelledReason: string | null;
  createdAt: string;
  /** Parts of this boat the officials hold now (taken into custody, not yet released). */
  partsHeld: HeldPart[];
  /** Set when the declaration changed after inspection: the open re-inspection's reason, with what changed. */
  declarationChange: string | null;
};

type Row = Omit<MyEntry, 'statusLabel' | 'startsOn' | 'paidAt' | 'refundedAt' | 'createdAt' | 'partsHeld'> & {
  partsHeld: HeldPart[] | null;
  startsOn: string | Date;
  paidAt: Date | null;
  refundedAt: Date | null;
  createdAt: Date;
};

export function entryStatusLabel(status: EntryStatus, inspectionResult: InspectionResult | null): string {
  if (status === 'entered' && inspectionResult) return INSPECTION_RESULT_LABELS[inspectionResult];
  return ENTRY_STATUS_LABELS[status];
}

/** The actor's entries (or one of them), newest meeting first; ownership is part of the query. */
export async function listMyEntries(actor: Actor | null, opts: { entryId?: string } = {}): Promise<MyEntry[]> {
  assertCan(actor, 'entry.submit_own');
  const rows = await getDb().sequelize.query<Row>(
    `select e.id, e.event_id as "eventId", ev.name as "eventName", ev.venue, ev.time_zone as "timeZone", ev.starts_on as "startsOn",
            c.id as "classId", c.code as "classCode", c.name as "className", b.id as "boatId", b.name as "boatName",
            e.race_number as "raceNumber", e.status, e.inspection_result as "inspectionResult",
            e.fee_minor as "feeMinor", e.currency, e.paid_at as "paidAt", e.refunded_at as "refundedAt",
            e.cancelled_reason as "cancelledReason", e.created_at as "createdAt",
            ${heldPartsJsonSql('e.id')} as "partsHeld",
            (select r.reason from reinspections r where r.entry_id = e.id and r.done_at is null and r.declaration_version_id is not null
              order by r.created_at desc limit 1) as "declarationChange"
       from entries e
       join events ev on ev.id = e.event_id
       join race_classes c on c.id = e.class_id
       join boats b on b.id = e.boat_id
      where e.entrant_id = :uid ${opts.entryId ? 'and e.id = :entryId' : ''}
      order by ev.starts_on desc, e.created_at desc`,
    { replacements: { uid: actor.id, entryId: opts.entryId ?? null }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    ...r,
    startsOn: typeof r.startsOn === 'string' ? r.startsOn : r.startsOn.toISOString().slice(0, 10),
    statusLabel: entryStatusLabel(r.status, r.inspectionResult),
    paidAt: r.paidAt ? new Date(r.paidAt).toISOString() : null,
    refundedAt: r.refundedAt ? new Date(r.refundedAt).toISOString() : null,
    createdAt: new Date(r.createdAt).toISOString(),
    partsHeld: r.partsHeld ?? [],
  }));
}
