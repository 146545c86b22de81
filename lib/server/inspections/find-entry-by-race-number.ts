import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { loadBoatCard, type BoatCard } from './load-boat-card';
import { chooseDockEntry } from './choose-dock-entry';

/** The boat card by race number: the typed fallback when a tag is missing, dirty or will not scan. */
export async function findEntryByRaceNumber(
  actor: Actor | null,
  eventId: string,
  raceNumberText: string,
  wantedEntryId?: string,
): Promise<BoatCard> {
  assertCan(actor, 'inspection.record', { eventId });
  if (!/^\d{1,4}$/.test(raceNumberText.trim())) {
    throw new AppError('invalid_input', 400, 'raceNumber: race numbers are whole numbers from 1 to 9999.', [
      { field: 'raceNumber', message: 'Race numbers are whole numbers from 1 to 9999.' },
    ]);
  }
  const raceNumber = Number(raceNumberText.trim());
  // One boat has a number here, in one class or several: the entry asked for, else the one to look at first.
  const entries = await chooseDockEntry(eventId, { raceNumber }, wantedEntryId);
  if (!entries)
    throw new AppError('unknown_race_number', 404, `No boat has race number ${raceNumber} at this meeting.`, [
      { field: 'raceNumber', message: `No boat has race number ${raceNumber} here.` },
    ]);
  return loadBoatCard(actor, eventId, entries.chosen.entryId, entries.others);
}
