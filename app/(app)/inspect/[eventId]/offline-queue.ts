// The dock's outbox on the phone (IndexedDB via idb). Client only: imported by 'use client' screens.
//
// Every record is stored here FIRST, with the idempotency key made on the device when the form
// opened, and only then sent. Sending retries with the same key, so a double tap, a lost answer
// or a retry after coming back online never makes a second record on the server. A record the
// server refuses (400 and other refusals that waiting will not cure) stays here as "needs a fix"
// with the server's message until the scrutineer fixes or removes it: nothing is dropped silently.
// The event's board (entries, classes with their rules) is kept here too, so the form works offline.
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { RecordInspectionDraft } from '../../../../lib/core/inputs/inspections';
import type { RuleResult } from '../../../../lib/core/inspections/decide-inspection';
import type { InspectionBoard } from '../../../../lib/server/inspections/list-inspection-board';
import type { InstrumentView } from '../../../../lib/server/inspections/list-instruments';
import { requestJson, type JsonAnswer } from '../../../../components/forms/request-json';

/** A photo waiting to be sent; sealNumber: the seal it shows (sent with it, so the seal's event points at it). */
export type QueuedPhoto = { name: string; type: string; blob: Blob; sealNumber?: string };
export type QueueState = 'waiting' | 'needs_fix' | 'sent';

export type QueuedRecord = {
  idempotencyKey: string;
  eventId: string;
  /** Who recorded it: a phone shared by two scrutineers sends each one's records only under their own sign-in. */
  recordedById: string;
  /** What the lists show: race number and boat name. */
  label: string;
  payload: RecordInspectionDraft;
  photos: QueuedPhoto[];
  state: QueueState;
  attempts: number;
  createdAt: string;
  lastTriedAt: string | null;
  /** The server's refusal, or why it is still waiting. */
  message: string | null;
  /** The refusal's code (declaration_changed: the card is out of date). */
  code?: string;
  fieldErrors: Record<string, string>;
  /** Set once the server has stored the record (photos may still be on their way). */
  inspectionId: string | null;
  overallResult: string | null;
  serverRules: RuleResult[] | null;
  sentAt: string | null;
};

export type EventSnapshot = { eventId: string; savedAt: string; board: InspectionBoard; instruments: InstrumentView[] };

interface InspectDb extends DBSchema {
  outbox: { key: string; value: QueuedRecord; indexes: { byEvent: string } };
  snapshots: { key: string; value: EventSnapshot };
}

let dbPromise: Promise<IDBPDatabase<InspectDb>> | null = null;
function db() {
  dbPromise ??= openDB<InspectDb>('boreline-inspect', 1, {
    upgrade(d) {
      d.createObjectStore('outbox', { keyPath: 'idempotencyKey' }).createIndex('byEvent', 'eventId');
      d.createObjectStore('snapshots', { keyPath: 'eventId' });
    },
  });
  return dbPromise;
}

export async function putQueued(record: QueuedRecord): Promise<void> {
  await (await db()).put('outbox', record);
}

export async function listQueued(eventId: string): Promise<QueuedRecord[]> {
  const all = await (await db()).getAllFromIndex('outbox', 'byEvent', eventId);
  return all.sort((a, b) => a.createdAt.localeCompare(b.createdAt));
}

/** Only on the scrutineer's explicit request ("Remove from this phone"). */
export async function removeQueued(idempotencyKey: string): Promise<void> {
  await (await db()).delete('outbox', idempotencyKey);
}

export async function saveSnapshot(snapshot: EventSnapshot): Promise<void> {
  await (await db()).put('snapshots', snapshot);
}

export async function loadSnapshot(eventId: string): Promise<EventSnapshot | undefined> {
  return (await db()).get('snapshots', eventId);
}

/** null when there is no answer at all (offline, or the service worker had nothing to give). */
async function ask(
  url: string,
  body: unknown,
  fallbackMessage: (status: number) => string,
): Promise<JsonAnswer<unknown> | null> {
  const answer = await requestJson(url, { method: 'POST', body, fallbackMessage });
  if (answer.status === 0 || (!answer.ok && answer.status === 503 && answer.code === 'offline')) return null;
  return answer;
}

// Worth waiting for: no answer, our side failing, too many requests, signed out (signing in again cures it).
const isTransient = (status: number) => status >= 500 || status === 429 || status === 408 || status === 401;

/** Sends one record (then its photos) and stores the outcome on the phone. */
export async function sendQueued(record: QueuedRecord): Promise<QueuedRecord> {
  const now = new Date().toISOString();
  let r: QueuedRecord = { ...record, attempts: record.attempts + 1, lastTriedAt: now };
  if (!r.inspectionId) {
    const answer = await ask(`/api/events/${r.eventId}/inspections`, r.payload, (status) => `Refused (${status}).`);
    // A write that crossed another (409 crossed_write: nothing stored) goes again with the same key.
    if (!answer || isTransient(answer.status) || (!answer.ok && answer.code === 'crossed_write')) {
      r.message = !answer
        ? 'No connection: it will be sent when the signal returns.'
        : answer.status === 401
          ? 'Signed out: sign in again and it will be sent.'
          : `The server did not take it (${answer.status}); trying again shortly.`;
      await putQueued(r);
      return r;
    }
    if (answer.status !== 200 && answer.status !== 201) {
      // The per-field messages read as sentences; the overall message names the fields by path.
      const fieldErrors = answer.ok ? {} : answer.fieldErrors;
      const message =
        Object.values(fieldErrors).join(' ') || (answer.ok ? `Refused (${answer.status}).` : answer.message);
      r = { ...r, state: 'needs_fix', message, fieldErrors, code: answer.ok ? undefined : answer.code };
      await putQueued(r);
      return r;
    }
    const data = (answer.ok ? answer.data : undefined) as { id: string; overallResult: string; rules: RuleResult[] };
    r = {
      ...r,
      inspectionId: data.id,
      overallResult: data.overallResult,
      serverRules: data.rules,
      message: null,
      fieldErrors: {},
    };
    await putQueued(r);
  }
  // Photos one per request (each within the upload limit); each sent one leaves the phone's copy.
  while (r.photos.length) {
    const [p, ...rest] = r.photos;
    const form = new FormData();
    form.append('photo', new File([p.blob], p.name, { type: p.type }));
    if (p.sealNumber) form.append('sealNumber', p.sealNumber);
    const answer = await ask(`/api/events/${r.eventId}/inspections/${r.inspectionId}/photos`, form, (status) =>
      String(status),
    );
    // A write that crossed another (409 crossed_write: nothing stored) goes again with the same key.
    if (!answer || isTransient(answer.status) || (!answer.ok && answer.code === 'crossed_write')) {
      r.message = 'Record stored; photos will follow when the signal returns.';
      await putQueued(r);
      return r;
    }
    if (answer.status !== 201) {
      const refusal = answer.ok ? { message: String(answer.status), fieldErrors: {} } : answer;
      r = {
        ...r,
        state: 'needs_fix',
        message: `The record is stored, but the photo ${p.name} was refused: ${refusal.message}`,
        fieldErrors: refusal.fieldErrors,
      };
      await putQueued(r);
      return r;
    }
    r = { ...r, photos: rest };
    await putQueued(r);
  }
  r = { ...r, state: 'sent', photos: [], sentAt: new Date().toISOString(), message: null, fieldErrors: {} };
  await putQueued(r);
  return r;
}

let sending: Promise<void> | null = null;

/** Sends the signed-in person's waiting records of the event, oldest first; one run at a time per tab. */
export function sendWaiting(eventId: string, recordedById: string): Promise<void> {
  sending ??= (async () => {
    try {
      for (const r of await listQueued(eventId)) {
        if (r.state !== 'waiting' || r.recordedById !== recordedById) continue;
        const after = await sendQueued(r);
        if (after.state === 'waiting' && !after.inspectionId) break; // no connection: try the rest next time
      }
    } finally {
      sending = null;
    }
  })();
  return sending;
}

/** Every record of this person still waiting on the phone, whatever the meeting, oldest first. */
export async function listWaitingOf(recordedById: string): Promise<QueuedRecord[]> {
  const all = await (await db()).getAll('outbox');
  return all
    .filter((r) => r.state === 'waiting' && r.recordedById === recordedById)
    .sort((a, b) => a.createdAt.localeCompare(b.createdAt));
}

/**
 * Sends this person's waiting records of every meeting, oldest first, and says how many still wait. The
 * service worker calls it with no page open (Background Sync) and when any Boreline page opens; the server
 * answers a repeated idempotency key with the stored record, so a page sending the same record at the same
 * moment never makes two.
 */
export async function sendAllWaiting(recordedById: string): Promise<{ sent: number; waiting: number }> {
  let sent = 0;
  const blocked = new Set<string>(); // meetings whose sending found no connection: the rest of them waits
  for (const r of await listWaitingOf(recordedById)) {
    if (blocked.has(r.eventId)) continue;
    const after = await sendQueued(r);
    if (after.state === 'sent') sent += 1;
    else if (after.state === 'waiting') blocked.add(after.eventId);
  }
  return { sent, waiting: (await listWaitingOf(recordedById)).length };
}
