import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { assertAddressProven } from '@/lib/server/accounts/prove-address';
import { AppError } from '@/lib/core/errors';
import { createCheckoutSession, getCheckoutSession, type CheckoutInput } from '@/lib/server/payments/stripe';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findProtestForActor } from '../protests/find-protest-for-actor';
import { appUrl } from '@/lib/server/config/env';

/**
 * Opens the payment page for the protester's fee. As for entry fees, the idempotency key comes
 * from the protest id (and the session it replaces after an expiry) and is kept in the session's
 * metadata, so a second click reopens the same session: the fee is never charged twice. Once paid,
 * a new checkout is refused. The protest becomes 'lodged' only through the verified webhook.
 */
export async function startProtestPayment(actor: Actor | null, protestId: string): Promise<{ url: string }> {
  const { protest, isLodger } = await findProtestForActor(actor, protestId);
  if (!isLodger) throw new AppError('forbidden', 403, 'Only the protester pays the protest fee.');
  assertCan(actor, 'protest.lodge', { eventId: protest.eventId });
  assertAddressProven(actor); // no fee is tied to an unproven address
  if (protest.paidAt) throw new AppError('already_paid', 409, 'The protest fee is already paid.');
  if (protest.status !== 'awaiting_fee')
    throw new AppError('conflict', 409, 'This protest is not waiting for its fee.');
  const { models } = getDb();
  const event = (await models.Event.findByPk(protest.eventId))!;
  const done = `${appUrl()}/protests/${protest.id}?paid=1`;
  const params = (checkoutKey: string): CheckoutInput => ({
    amountMinor: protest.feeMinor,
    currency: protest.currency,
    description: `Protest fee: ${event.name}, protest under ${protest.ruleReference}`.slice(0, 250),
    reference: protest.id,
    metadata: { kind: 'protest', protestId: protest.id, checkoutKey },
    successUrl: done,
    cancelUrl: `${appUrl()}/protests/${protest.id}?cancelled=1`,
    customerEmail: actor!.email,
    idempotencyKey: checkoutKey,
  });

  let basis = 'first';
  if (protest.checkoutSessionId) {
    const existing = await getCheckoutSession(protest.checkoutSessionId).catch((err) => {
      if (err instanceof AppError && err.status === 404) return null;
      throw err;
    });
    if (existing?.status === 'complete')
      throw new AppError('payment_pending', 409, 'The fee has been paid; the confirmation is on its way.');
    if (existing?.status === 'open' && existing.metadata.checkoutKey) {
      // Same key and parameters: the provider answers with the session it already made.
      const again = await createCheckoutSession(params(existing.metadata.checkoutKey)).catch(() => null);
      if (again?.id === existing.id) return { url: again.url };
    }
    basis = `after-${protest.checkoutSessionId}`;
  }
  const session = await createCheckoutSession(params(`protest-checkout-${protest.id}-${basis}`));
  await getDb().sequelize.transaction(async (transaction) => {
    await models.Protest.update(
      { checkoutSessionId: session.id },
      { where: { id: protest.id, status: 'awaiting_fee' }, transaction },
    );
    await recordAuditEvent(
      {
        eventId: protest.eventId,
        actorId: actor!.id,
        subjectType: 'protest',
        subjectId: protest.id,
        action: 'protest.checkout_opened',
        details: { checkoutSessionId: session.id },
      },
      transaction,
    );
  });
  return { url: session.url };
}
