import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { buildEntryCrewView, loadEntryContext, mayReadCrew, notFoundEntry, type EntryCrewView } from './crew-data';

/**
 * An entry's people and gear with what is not in order on today's meeting day: for the entrant, and for
 * the officials of its meeting who see its entries or its board. With eventId (the dock's and board's
 * routes) the entry must belong to that meeting.
 */
export async function getEntryCrew(
  actor: Actor | null,
  entryId: string,
  { eventId }: { eventId?: string } = {},
): Promise<EntryCrewView> {
  assertCan(actor, 'account.view');
  const id = parseId(entryId, 'entry');
  const entry = await loadEntryContext(id);
  if (!entry || (eventId && entry.eventId !== eventId)) throw notFoundEntry();
  // Anyone else gets the answer a missing entry gets: the entry's existence is not theirs to learn.
  if (!mayReadCrew(actor, entry)) throw notFoundEntry();
  return buildEntryCrewView(entry, new Date(), actor.id);
}
