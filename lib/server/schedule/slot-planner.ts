import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { listSlots } from './list-slots';
import { LIVE_ENTRY_STATUSES, type SlotWithBookingsView } from './slot-view';

export type SlotPlanner = {
  slots: SlotWithBookingsView[];
  /** For the chief scrutineer's forms only (empty for others): the classes and the live entries. */
  classes: { id: string; code: string; name: string }[];
  entries: { id: string; raceNumber: number; boatName: string; classId: string }[];
  canManage: boolean;
  /** Slots that have not ended yet (the ones an entry can still be given). */
  notEndedIds: string[];
};

/** What the slots page shows: every slot with its bookings; for the chief scrutineer, what the forms offer. */
export async function loadSlotPlanner(actor: Actor | null, eventId: string): Promise<SlotPlanner> {
  const slots = await listSlots(actor, eventId); // checks the permission
  const canManage = can(actor, 'schedule.manage', { eventId });
  const now = Date.now();
  const notEndedIds = slots.filter((s) => new Date(s.endsAt).getTime() > now).map((s) => s.id);
  if (!canManage) return { slots, classes: [], entries: [], canManage, notEndedIds };
  const { sequelize } = getDb();
  const [classes, entries] = await Promise.all([
    sequelize.query<SlotPlanner['classes'][number]>(
      'select id, code, name from race_classes where event_id = :eventId order by code',
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    sequelize.query<SlotPlanner['entries'][number]>(
      `select e.id, e.race_number as "raceNumber", b.name as "boatName", e.class_id as "classId"
         from entries e join boats b on b.id = e.boat_id
        where e.event_id = :eventId and e.status in (:live) order by e.race_number`,
      { replacements: { eventId, live: [...LIVE_ENTRY_STATUSES] }, type: QueryTypes.SELECT },
    ),
  ]);
  return { slots, classes, entries, canManage, notEndedIds };
}
