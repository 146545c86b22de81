import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { assertAddressProven } from '@/lib/server/accounts/prove-address';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { createCheckoutSession, getCheckoutSession, type CheckoutInput } from '@/lib/server/payments/stripe';
import type { Boat, Event, RaceClass } from '@/models';
import { appUrl } from '@/lib/server/config/env';

/**
 * Opens the payment page for the actor's unpaid entry and returns its URL. The idempotency key is
 * derived from the entry id (and, after an expired session, from the session it replaces), and is
 * kept in the session's metadata, so a double click, a retry or a second visit reopens the same
 * session instead of creating a second one. A free entry is entered at once, with no payment.
 * Payment itself is recorded only by the verified webhook (applyPaymentEvent), never here.
 */
export async function startEntryPayment(
  actor: Actor | null,
  entryId: string,
): Promise<{ url: string; isFree: boolean }> {
  assertCan(actor, 'entry.submit_own');
  const id = parseId(entryId, 'entry');
  const { models } = getDb();
  const entry = await models.Entry.findOne({
    where: { id, entrantId: actor.id },
    include: [{ model: models.Event }, { model: models.RaceClass }, { model: models.Boat }],
  });
  if (!entry) throw new AppError('not_found', 404, 'No such entry among yours.');
  assertAddressProven(actor); // no fee is tied to an unproven address
  if (entry.status === 'entered') throw new AppError('already_paid', 409, 'This entry is already paid and entered.');
  if (entry.status !== 'awaiting_payment')
    throw new AppError('conflict', 409, 'This entry was withdrawn or cancelled, so there is nothing to pay.');
  const done = `${appUrl()}/entries?paid=${entry.id}`;

  if (entry.feeMinor === 0) {
    await models.Entry.update({ status: 'entered' }, { where: { id: entry.id, status: 'awaiting_payment' } });
    return { url: done, isFree: true };
  }

  const { event, raceClass, boat } = entry as unknown as { event: Event; raceClass: RaceClass; boat: Boat };
  const params = (checkoutKey: string): CheckoutInput => ({
    amountMinor: entry.feeMinor,
    currency: entry.currency,
    description: `Entry fee: ${event.name}, ${raceClass.code} ${raceClass.name}, ${boat.name} (#${entry.raceNumber})`,
    reference: entry.id,
    metadata: { entryId: entry.id, checkoutKey },
    successUrl: done,
    cancelUrl: `${appUrl()}/entries?cancelled=${entry.id}`,
    customerEmail: actor.email,
    idempotencyKey: checkoutKey,
  });

  let basis = 'first';
  if (entry.checkoutSessionId) {
    const existing = await getCheckoutSession(entry.checkoutSessionId).catch((err) => {
      if (err instanceof AppError && err.status === 404) return null;
      throw err;
    });
    if (existing?.status === 'complete')
      throw new AppError('payment_pending', 409, 'This entry has been paid; the confirmation is on its way.');
    if (existing?.status === 'open' && existing.metadata.checkoutKey) {
      // Same key and parameters: the provider answers with the session it already made, page URL included.
      const again = await createCheckoutSession(params(existing.metadata.checkoutKey)).catch(() => null);
      if (again?.id === existing.id) return { url: again.url, isFree: false };
    }
    basis = `after-${entry.checkoutSessionId}`;
  }
  const session = await createCheckoutSession(params(`entry-checkout-${entry.id}-${basis}`));
  await models.Entry.update({ checkoutSessionId: session.id }, { where: { id: entry.id, status: 'awaiting_payment' } });
  return { url: session.url, isFree: false };
}
