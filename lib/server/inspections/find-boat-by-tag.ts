import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { lookUpTag } from '@/lib/server/tags/tokens';
import { loadBoatCard, type BoatCard } from './load-boat-card';
import { chooseDockEntry } from './choose-dock-entry';
import { parseTagScan } from '../../core/tags/parse-tag-scan';

/**
 * The boat card for a scanned tag at this meeting. A replaced (retired) tag, a token nobody issued
 * and a boat not entered here are each refused plainly, so a stale sticker never passes for a boat.
 */
export async function findBoatByTag(
  actor: Actor | null,
  eventId: string,
  scanned: string,
  wantedEntryId?: string,
): Promise<BoatCard> {
  assertCan(actor, 'inspection.record', { eventId });
  const token = parseTagScan(scanned);
  const found = token ? await lookUpTag(token) : ({ state: 'unknown' } as const);
  if (found.state === 'unknown') {
    throw new AppError(
      'unknown_tag',
      404,
      'This is not a Boreline tag we know. Type the race number instead, and tell the chief scrutineer.',
    );
  }
  const { Boat } = getDb().models;
  const boat = await Boat.findByPk(found.boatId, { attributes: ['id', 'name'] });
  if (!boat)
    throw new AppError('unknown_tag', 404, 'This is not a Boreline tag we know. Type the race number instead.');
  if (found.state === 'retired') {
    throw new AppError(
      'retired_tag',
      410,
      `This tag was replaced on ${found.retiredAt.toISOString().slice(0, 10)} and is no longer valid (it belonged to ${boat.name}). Scan the boat’s new tag or type its race number.`,
      {
        boatName: boat.name,
        retiredAt: found.retiredAt.toISOString(),
      },
    );
  }
  // The entry asked for (a class chosen at the dock), else the one to look at first; its siblings travel with it.
  const entries = await chooseDockEntry(eventId, { boatId: boat.id }, wantedEntryId);
  if (!entries)
    throw new AppError('not_entered', 404, `${boat.name} is not entered at this meeting.`, { boatName: boat.name });
  return loadBoatCard(actor, eventId, entries.chosen.entryId, entries.others);
}
