import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { listIncidents } from './list-incidents';
import type { IncidentView } from './incident-view';

export type IncidentsPage = {
  incidents: IncidentView[];
  canRecord: boolean;
  /** The meeting's entries, for the form (empty for those who only read). */
  entries: { id: string; raceNumber: number; boatName: string; classCode: string }[];
};

export async function loadIncidentsPage(actor: Actor | null, eventId: string): Promise<IncidentsPage> {
  const incidents = await listIncidents(actor, eventId); // checks the permission
  const canRecord = can(actor, 'incident.record', { eventId });
  if (!canRecord) return { incidents, canRecord, entries: [] };
  const entries = await getDb().sequelize.query<IncidentsPage['entries'][number]>(
    `select e.id, e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode"
       from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
      where e.event_id = :eventId order by e.race_number`,
    { replacements: { eventId }, type: QueryTypes.SELECT },
  );
  return { incidents, canRecord, entries };
}
