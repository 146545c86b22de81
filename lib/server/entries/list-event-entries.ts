import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';

export type EventEntryRow = {
  id: string;
  raceNumber: number;
  boatId: string;
  boatName: string;
  hullNumber: string;
  classId: string;
  classCode: string;
  className: string;
  entrantName: string | null;
  entrantEmail: string;
  status: string;
  inspectionResult: string | null;
  declaredNozzleMm: number;
  declaredPowerKw: number;
  feeMinor: number;
  currency: string;
  paidAt: string | null;
  createdAt: string;
};

/** Every entry of an event for its officials, in one query (permission checked for the event). */
export async function listEventEntries(actor: Actor | null, eventId: string): Promise<EventEntryRow[]> {
  assertCan(actor, 'entry.view_all', { eventId });
  const [rows] = await getDb().sequelize.query(
    `select e.id, e.race_number as "raceNumber", b.id as "boatId", b.name as "boatName", b.hull_number as "hullNumber",
            c.id as "classId", c.code as "classCode", c.name as "className", u.name as "entrantName", u.email as "entrantEmail",
            e.status, e.inspection_result as "inspectionResult", b.declared_nozzle_mm as "declaredNozzleMm",
            b.declared_power_kw as "declaredPowerKw", e.fee_minor as "feeMinor", e.currency, e.paid_at as "paidAt", e.created_at as "createdAt"
       from entries e
       join boats b on b.id = e.boat_id
       join race_classes c on c.id = e.class_id
       join users u on u.id = e.entrant_id
      where e.event_id = :eventId
      order by e.race_number`,
    { replacements: { eventId } },
  );
  return (rows as (EventEntryRow & { paidAt: Date | null; createdAt: Date })[]).map((r) => ({
    ...r,
    paidAt: r.paidAt ? new Date(r.paidAt).toISOString() : null,
    createdAt: new Date(r.createdAt).toISOString(),
  }));
}
