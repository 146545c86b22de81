import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { scopeFromRequestedChecks, type CheckArea } from '../../core/inspections/decide-inspection';

// A re-inspection task as screens and the API see it (plain object), and the query that reads them.
export type ReinspectionView = {
  id: string;
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  reason: string;
  requestedBy: string;
  createdAt: string;
  doneAt: string | null;
  inspectionId: string | null;
  /** The protest this task came from, if any. */
  protestId: string | null;
  /** What it was ordered to check (from the protest's requested checks); null: everything. */
  checks: CheckArea[] | null;
};

type Row = Omit<ReinspectionView, 'createdAt' | 'doneAt' | 'checks'> & {
  createdAt: Date;
  doneAt: Date | null;
  requestedChecks: string[] | null;
};

/** Tasks of an event (optionally of one entry, optionally only open ones), oldest first: the order to work through. */
export async function listReinspectionViews(opts: {
  eventId: string;
  entryId?: string;
  openOnly?: boolean;
}): Promise<ReinspectionView[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select r.id, r.entry_id as "entryId", e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode", r.reason,
            coalesce(u.name, u.email) as "requestedBy", r.created_at as "createdAt", r.done_at as "doneAt", r.inspection_id as "inspectionId",
            r.protest_id as "protestId", p.requested_checks as "requestedChecks"
       from reinspections r
       left join protests p on p.id = r.protest_id
       join entries e on e.id = r.entry_id
       join boats b on b.id = e.boat_id
       join race_classes c on c.id = e.class_id
       join users u on u.id = r.requested_by_id
      where r.event_id = :eventId
        ${opts.entryId ? 'and r.entry_id = :entryId' : ''}
        ${opts.openOnly ? 'and r.done_at is null' : ''}
      order by r.done_at is not null, r.created_at, e.race_number`,
    { replacements: { eventId: opts.eventId, entryId: opts.entryId ?? null }, type: QueryTypes.SELECT },
  );
  return rows.map(({ requestedChecks, ...r }) => ({
    ...r,
    checks: scopeFromRequestedChecks(requestedChecks),
    createdAt: new Date(r.createdAt).toISOString(),
    doneAt: r.doneAt ? new Date(r.doneAt).toISOString() : null,
  }));
}
