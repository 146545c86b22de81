import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';

// An incident as screens and the API see it (plain object), and the query that reads them. Incidents are
// append-only: the current record of an incident is the one nothing supersedes.
export type IncidentView = {
  id: string;
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  occurredAt: string;
  description: string;
  damage: boolean;
  /** The re-inspection task the damage opened (or the open one it joined), with whether it is done. */
  reinspection: { id: string; doneAt: string | null } | null;
  supersedesId: string | null;
  correctionReason: string | null;
  isCurrent: boolean;
  recordedBy: string;
  createdAt: string;
  photos: { id: string; contentType: string; sizeBytes: number; sha256: string }[];
};

type Row = Omit<IncidentView, 'occurredAt' | 'createdAt' | 'reinspection'> & {
  occurredAt: Date;
  createdAt: Date;
  reinspectionId: string | null;
  reinspectionDoneAt: Date | null;
};

export async function readIncidents(opts: { eventId: string; id?: string }): Promise<IncidentView[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select i.id, i.entry_id as "entryId", e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode",
            i.occurred_at as "occurredAt", i.description, i.damage, i.reinspection_id as "reinspectionId",
            r.done_at as "reinspectionDoneAt", i.supersedes_id as "supersedesId", i.correction_reason as "correctionReason",
            not exists (select 1 from incidents x where x.supersedes_id = i.id) as "isCurrent",
            coalesce(u.name, u.email) as "recordedBy", i.created_at as "createdAt",
            coalesce((select json_agg(json_build_object('id', p.id, 'contentType', p.content_type, 'sizeBytes', p.size_bytes,
                                                        'sha256', p.sha256) order by p.created_at)
                        from incident_photos p where p.incident_id = i.id), '[]') as photos
       from incidents i join entries e on e.id = i.entry_id join boats b on b.id = e.boat_id
       join race_classes c on c.id = e.class_id join users u on u.id = i.recorded_by_id
       left join reinspections r on r.id = i.reinspection_id
      where i.event_id = :eventId ${opts.id ? 'and i.id = :id' : ''}
      order by i.occurred_at desc, i.created_at desc`,
    { replacements: { eventId: opts.eventId, id: opts.id ?? null }, type: QueryTypes.SELECT },
  );
  return rows.map(({ reinspectionId, reinspectionDoneAt, ...r }) => ({
    ...r,
    occurredAt: new Date(r.occurredAt).toISOString(),
    createdAt: new Date(r.createdAt).toISOString(),
    reinspection: reinspectionId
      ? { id: reinspectionId, doneAt: reinspectionDoneAt ? new Date(reinspectionDoneAt).toISOString() : null }
      : null,
    photos: r.photos.map((p) => ({ ...p, sizeBytes: Number(p.sizeBytes) })),
  }));
}
