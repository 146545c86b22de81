import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { CancelEntryInput } from '@/lib/core/inputs/events';
import { refundPayment } from '@/lib/server/payments/stripe';
import { sendMail } from '@/lib/server/mail/send';

/** The organiser cancels an entry; a paid fee is refunded through the payment provider first. */
export async function cancelEntry(actor: Actor | null, eventId: string, entryId: string, raw: unknown) {
  assertCan(actor, 'entry.cancel', { eventId });
  const { reason } = CancelEntryInput.parse(raw);
  const { models } = getDb();
  const entry = await models.Entry.findOne({
    where: { id: entryId, eventId },
    include: [{ model: models.User, as: 'entrant' }, { model: models.Boat }],
  });
  if (!entry) throw new AppError('not_found', 404, 'No such entry at this meeting.');
  if (entry.status === 'cancelled' || entry.status === 'withdrawn')
    throw new AppError('conflict', 409, 'This entry is already cancelled or withdrawn.');
  let refundId: string | null = null;
  if (entry.paidAt && entry.paymentIntentId && !entry.refundedAt) {
    // The idempotency key makes a retried cancellation refund once only.
    const refund = await refundPayment({
      paymentIntentId: entry.paymentIntentId,
      idempotencyKey: `entry-refund-${entry.id}`,
    });
    refundId = refund.id;
  }
  await entry.update({
    status: 'cancelled',
    cancelledReason: reason,
    ...(refundId && { refundId, refundedAt: new Date() }),
  });
  const entrant = (entry as unknown as { entrant: { email: string } }).entrant;
  const boat = (entry as unknown as { boat: { name: string } }).boat;
  await sendMail({
    to: entrant.email,
    subject: `Entry cancelled: ${boat.name} (#${entry.raceNumber})`,
    text: `The organiser cancelled your entry for ${boat.name}, race number ${entry.raceNumber}.\n\nReason: ${reason}\n\n${
      refundId
        ? `Your entry fee of ${(entry.feeMinor / 100).toFixed(2)} ${entry.currency} has been refunded (refund ${refundId}).`
        : entry.paidAt
          ? 'Your fee was recorded as paid outside the online checkout: the organiser will refund it directly.'
          : 'No fee had been paid, so there is nothing to refund.'
    }`,
  });
  return { id: entry.id, status: entry.status, refundId };
}
