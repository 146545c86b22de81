import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { fieldError } from '@/lib/core/errors';
import { AddLogNoteInput } from '@/lib/core/inputs/logbook';
import { openLogbookForNote } from './open-logbook';

export type LogNoteView = {
  id: string;
  boatId: string;
  eventId: string;
  category: string;
  notedOn: string;
  body: string;
  author: string;
  createdAt: string;
};

/**
 * The chief scrutineer or a steward of a meeting the boat is entered in adds a dated note, tied to
 * that meeting. The permission is asked before the body is read (readInput runs only then). Notes
 * are append-only in the database: a wrong note is answered by another note, never an edit.
 */
export async function addLogNote(
  actor: Actor | null,
  rawBoatId: string,
  readInput: () => Promise<unknown>,
): Promise<LogNoteView> {
  const access = await openLogbookForNote(actor, rawBoatId);
  const input = AddLogNoteInput.parse(await readInput());
  if (!access.noteEventIds.includes(input.eventId))
    throw fieldError(
      'eventId',
      'Choose a meeting this boat is entered in where you are the chief scrutineer or a steward.',
    );
  const note = await getDb().models.BoatLogNote.create({
    boatId: access.boatId,
    eventId: input.eventId,
    category: input.category,
    notedOn: input.notedOn,
    body: input.body,
    authorId: access.actor.id,
  });
  return {
    id: note.id,
    boatId: note.boatId,
    eventId: note.eventId,
    category: note.category,
    notedOn: input.notedOn,
    body: note.body,
    author: access.actor.name ?? access.actor.email,
    createdAt: new Date(note.createdAt).toISOString(),
  };
}
