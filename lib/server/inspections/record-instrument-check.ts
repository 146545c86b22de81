import 'server-only';
import { getDb } from '@/lib/server/db';
import { type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { RecordInstrumentCheckInput } from '@/lib/core/inputs/instrument-calibration';
import { meetingDayOf } from '../../core/inspections/calibration-state';
import { decideInstrumentCheck } from '../../core/inspections/decide-instrument-check';
import { eventTimeZone } from './instrument-calibration';
import { assertCanManageInstruments } from './manage-instruments-access';

export type InstrumentCheckView = {
  id: string;
  instrumentId: string;
  meetingDay: string;
  reference: string;
  nominalValue: number;
  reading: number;
  passed: boolean;
  checkedAt: string;
};

/**
 * Records today's check of an instrument in service against a reference (gauge block, check weight),
 * dated by the meeting's time zone. A failed check takes the instrument out of use for the rest of
 * that meeting day (unless a later check that day passes). Checks are append-only.
 */
export async function recordInstrumentCheck(
  actor: Actor | null,
  eventId: string,
  instrumentId: string,
  raw: unknown,
): Promise<InstrumentCheckView> {
  assertCanManageInstruments(actor, eventId);
  const input = RecordInstrumentCheckInput.parse(raw);
  const { models } = getDb();
  const instrument = await models.Instrument.findOne({
    where: { id: instrumentId, eventId },
    attributes: ['id', 'name', 'retiredAt', 'errorLimit', 'quantity'],
  });
  if (!instrument) throw new AppError('not_found', 404, 'No such instrument at this meeting.');
  if (instrument.retiredAt) throw new AppError('conflict', 409, `${instrument.name} is retired: it is not checked.`);
  const passed = decideInstrumentCheck(input, instrument);
  const checkedAt = new Date();
  const meetingDay = meetingDayOf(checkedAt, (await eventTimeZone(eventId)) ?? 'UTC');
  const row = await models.InstrumentCheck.create({
    instrumentId,
    meetingDay,
    reference: input.reference,
    nominalValue: input.nominalValue,
    reading: input.reading,
    passed,
    checkedById: actor.id,
    checkedAt,
  });
  return {
    id: row.id,
    instrumentId,
    meetingDay: String(row.meetingDay),
    reference: row.reference,
    nominalValue: row.nominalValue,
    reading: row.reading,
    passed: row.passed,
    checkedAt: checkedAt.toISOString(),
  };
}
