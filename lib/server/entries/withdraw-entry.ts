import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { listMyEntries, type MyEntry } from './list-my-entries';

/**
 * The entrant withdraws their own unpaid entry. A paid entry is the organiser's to cancel (they
 * arrange the refund). The row is locked so a payment arriving at the same moment is not lost.
 */
export async function withdrawEntry(actor: Actor | null, entryId: string): Promise<MyEntry> {
  assertCan(actor, 'entry.submit_own');
  const id = parseId(entryId, 'entry');
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (transaction) => {
    const entry = await models.Entry.findOne({
      where: { id, entrantId: actor.id },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!entry) throw new AppError('not_found', 404, 'No such entry among yours.');
    if (entry.status === 'withdrawn' || entry.status === 'cancelled')
      throw new AppError('conflict', 409, 'This entry is already withdrawn or cancelled.');
    if (entry.paidAt || (entry.status === 'entered' && entry.feeMinor > 0)) {
      throw new AppError(
        'conflict',
        409,
        'This entry is paid: ask the organiser to cancel it, and they will arrange the refund.',
      );
    }
    await entry.update({ status: 'withdrawn' }, { transaction });
  });
  const [entry] = await listMyEntries(actor, { entryId: id });
  return entry;
}
