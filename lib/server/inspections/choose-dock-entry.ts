import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { parseId } from '@/lib/server/http/ids';

/** One of a boat's entries at a meeting, as the dock offers it (a boat may be in several classes). */
export type DockEntryChoice = {
  entryId: string;
  classId: string;
  classCode: string;
  className: string;
  status: string;
  inspectionResult: string | null;
};

/**
 * The boat's entries at this meeting for the dock, the one to open first at the head: the entry asked for
 * (when it is this boat's here), else a live entry not yet inspected, else a live one, else the latest (a
 * withdrawn boat still shows, marked so). Each class's entry is inspected under that class's own rules.
 */
export async function chooseDockEntry(
  eventId: string,
  boat: { boatId: string } | { raceNumber: number },
  wantedEntryId?: string,
): Promise<{ chosen: DockEntryChoice; others: DockEntryChoice[] } | null> {
  const rows = await getDb().sequelize.query<DockEntryChoice & { isLive: boolean }>(
    `select e.id as "entryId", c.id as "classId", c.code as "classCode", c.name as "className", e.status,
            e.inspection_result as "inspectionResult", e.status in ('awaiting_payment', 'entered') as "isLive"
       from entries e join race_classes c on c.id = e.class_id
      where e.event_id = :eventId and ${'boatId' in boat ? 'e.boat_id = :boatId' : 'e.race_number = :raceNumber'}
      order by (e.id = :wanted) desc, "isLive" desc, (e.inspection_result is null) desc, c.code, e.created_at desc`,
    {
      replacements: { eventId, ...boat, wanted: wantedEntryId ?? '00000000-0000-0000-0000-000000000000' },
      type: QueryTypes.SELECT,
    },
  );
  if (rows.length === 0) return null;
  const [head, ...rest] = rows.map(({ isLive, ...r }) => ({ ...r, isLive }));
  const strip = ({ isLive: _l, ...r }: DockEntryChoice & { isLive: boolean }): DockEntryChoice => r;
  // The other classes worth switching to: live entries only (a withdrawn one is history, on the logbook).
  return { chosen: strip(head), others: rest.filter((r) => r.isLive).map(strip) };
}

/** `?entry=<id>`: the class's entry the dock switched to (a boat in several classes); anything else is 404. */
export function wantedEntry(req: Request): string | undefined {
  const v = new URL(req.url).searchParams.get('entry');
  return v == null ? undefined : parseId(v, 'entry');
}
