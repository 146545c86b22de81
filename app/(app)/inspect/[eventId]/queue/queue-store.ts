// The dock queue's outbox on the phone (IndexedDB via idb, as the record form's offline-queue.ts): a
// check-in is stored here first with a key made on the phone, then sent; a retry sends the same key, so
// the server stores it once. The last queue the server sent is kept too, so the list shows with no signal.
// Its own small database, so the record form's stays as it is. Client only.
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { DockQueue } from '../../../../../lib/server/schedule/dock-queue';

export type PendingCheckIn = {
  key: string;
  eventId: string;
  /** Who checked the boat in: a phone shared by two officials sends each one's check-ins only under their own sign-in. */
  recordedById: string;
  entryId: string;
  label: string;
  arrivedAt: string;
  bay: string;
  state: 'waiting' | 'needs_fix';
  message: string | null;
};

interface QueueDb extends DBSchema {
  checkins: { key: string; value: PendingCheckIn; indexes: { byEvent: string } };
  queues: { key: string; value: { eventId: string; savedAt: string; queue: DockQueue } };
}

let dbPromise: Promise<IDBPDatabase<QueueDb>> | null = null;
function db() {
  dbPromise ??= openDB<QueueDb>('boreline-dock-queue', 1, {
    upgrade(d) {
      d.createObjectStore('checkins', { keyPath: 'key' }).createIndex('byEvent', 'eventId');
      d.createObjectStore('queues', { keyPath: 'eventId' });
    },
  });
  return dbPromise;
}

export async function putCheckIn(c: PendingCheckIn) {
  await (await db()).put('checkins', c);
}
export async function listCheckIns(eventId: string): Promise<PendingCheckIn[]> {
  return (await (await db()).getAllFromIndex('checkins', 'byEvent', eventId)).sort((a, b) =>
    a.arrivedAt.localeCompare(b.arrivedAt),
  );
}
export async function removeCheckIn(key: string) {
  await (await db()).delete('checkins', key);
}
export async function saveQueue(eventId: string, queue: DockQueue) {
  await (await db()).put('queues', { eventId, savedAt: new Date().toISOString(), queue });
}
export async function loadQueue(eventId: string) {
  return (await db()).get('queues', eventId);
}
