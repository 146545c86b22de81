import 'server-only';
import { getDb } from '@/lib/server/db';
import { type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { toInstrumentView, type InstrumentView } from './list-instruments';
import { assertCanManageInstruments } from './manage-instruments-access';
import { eventTimeZone, loadCalibrationFacts } from './instrument-calibration';

/**
 * Takes an instrument out of service at this meeting (dropped, out of calibration, gone home).
 * It stays in the list as retired, so records made with it keep their name and U; the dock no
 * longer offers it and the server refuses new records that name it.
 */
export async function retireInstrument(
  actor: Actor | null,
  eventId: string,
  instrumentId: string,
): Promise<InstrumentView> {
  assertCanManageInstruments(actor, eventId);
  const { models } = getDb();
  // Only an instrument of this meeting: another meeting's id is "not found", as for a missing one.
  const [count, rows] = await models.Instrument.update(
    { retiredAt: new Date() },
    { where: { id: instrumentId, eventId, retiredAt: null }, returning: true },
  );
  if (count === 1) {
    const [facts, timeZone] = await Promise.all([loadCalibrationFacts([instrumentId]), eventTimeZone(eventId)]);
    return toInstrumentView(rows[0], facts.get(instrumentId), timeZone ?? 'UTC');
  }
  const existing = await models.Instrument.findOne({ where: { id: instrumentId, eventId } });
  if (!existing) throw new AppError('not_found', 404, 'No such instrument at this meeting.');
  throw new AppError('conflict', 409, `${existing.name} was already retired.`);
}
