import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { loadBoatCard, type BoatCard } from './load-boat-card';

/** The boat card by race number: the typed fallback when a tag is missing, dirty or will not scan. */
export async function findEntryByRaceNumber(
  actor: Actor | null,
  eventId: string,
  raceNumberText: string,
): Promise<BoatCard> {
  assertCan(actor, 'inspection.record', { eventId });
  if (!/^\d{1,4}$/.test(raceNumberText.trim())) {
    throw new AppError('invalid_input', 400, 'raceNumber: race numbers are whole numbers from 1 to 9999.', [
      { field: 'raceNumber', message: 'Race numbers are whole numbers from 1 to 9999.' },
    ]);
  }
  const raceNumber = Number(raceNumberText.trim());
  const entry = await getDb().models.Entry.findOne({ where: { eventId, raceNumber } });
  if (!entry)
    throw new AppError('unknown_race_number', 404, `No boat has race number ${raceNumber} at this meeting.`, [
      { field: 'raceNumber', message: `No boat has race number ${raceNumber} here.` },
    ]);
  return loadBoatCard(actor, eventId, entry.id);
}
