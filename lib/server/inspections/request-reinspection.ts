import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { RequestReinspectionInput } from '@/lib/core/inputs/inspections';
import { listReinspectionViews, type ReinspectionView } from './reinspection-view';

/**
 * The chief scrutineer or a steward asks for chosen entries to be inspected again (the top
 * finishers after a heat, say). An entry that already has an open task keeps it rather than
 * getting a second one; a recorded inspection that names the task marks it done.
 */
export async function requestReinspection(
  actor: Actor | null,
  eventId: string,
  raw: unknown,
): Promise<ReinspectionView[]> {
  assertCan(actor, 'inspection.assign_reinspection', { eventId });
  const input = RequestReinspectionInput.parse(raw);
  const entryIds = [...new Set(input.entryIds.map((id) => id.toLowerCase()))];
  const { models, sequelize } = getDb();
  const entries = await models.Entry.findAll({
    where: { eventId, id: { [Op.in]: entryIds }, status: { [Op.in]: ['awaiting_payment', 'entered'] } },
    attributes: ['id'],
  });
  if (entries.length !== entryIds.length) {
    throw new AppError('invalid_input', 400, 'entryIds: every entry must be a live entry of this meeting.', [
      { field: 'entryIds', message: 'Choose live entries of this meeting only.' },
    ]);
  }
  await sequelize.transaction(async (transaction) => {
    const open = await models.Reinspection.findAll({
      where: { eventId, entryId: { [Op.in]: entryIds }, doneAt: null },
      attributes: ['entryId'],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const hasOpen = new Set(open.map((t) => t.entryId));
    const fresh = entryIds.filter((id) => !hasOpen.has(id));
    if (fresh.length)
      await models.Reinspection.bulkCreate(
        fresh.map((entryId) => ({ eventId, entryId, reason: input.reason, requestedById: actor.id })),
        { transaction },
      );
  });
  const tasks = await listReinspectionViews({ eventId, openOnly: true });
  return tasks.filter((t) => entryIds.includes(t.entryId));
}
