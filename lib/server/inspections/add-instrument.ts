import 'server-only';
import { getDb } from '@/lib/server/db';
import { type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { AddInstrumentInput } from '@/lib/core/inputs/inspections';
import { toInstrumentView, type InstrumentView } from './list-instruments';
import { assertCanManageInstruments } from './manage-instruments-access';

/** The organiser or chief scrutineer puts an instrument on the meeting's list (error limit and resolution, or a certificate's U). */
export async function addInstrument(actor: Actor | null, eventId: string, raw: unknown): Promise<InstrumentView> {
  assertCanManageInstruments(actor, eventId);
  const input = AddInstrumentInput.parse(raw);
  const { models } = getDb();
  if (!(await models.Event.findByPk(eventId, { attributes: ['id'] })))
    throw new AppError('not_found', 404, 'No such meeting.');
  return toInstrumentView(await models.Instrument.create({ eventId, ...input }));
}
