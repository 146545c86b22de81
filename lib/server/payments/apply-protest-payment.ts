import 'server-only';
import type Stripe from 'stripe';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { refundPayment } from '@/lib/server/payments/stripe';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { formatMoney } from '@/lib/core/inputs/entries';
import { notifyParties } from '../protests/notify-parties';

export type ProtestPaymentOutcome =
  | { kind: 'unmatched' | 'mismatch' | 'already_recorded' }
  | { kind: 'protest_paid'; protestId: string }
  | { kind: 'protest_refund'; protestId: string; paymentIntentId: string };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;

/**
 * A paid Checkout session for a protest fee, inside the webhook's transaction (which has already
 * recorded the event id, so a replay never gets here). A protest awaiting its fee becomes lodged;
 * a payment it no longer wants (a second session paid, or a protest rejected meanwhile) is refunded.
 */
export async function applyProtestPayment(
  session: Stripe.Checkout.Session,
  transaction: Transaction,
): Promise<ProtestPaymentOutcome> {
  const { models } = getDb();
  let protest = await models.Protest.findOne({
    where: { checkoutSessionId: session.id },
    lock: transaction.LOCK.UPDATE,
    transaction,
  });
  const byId = session.metadata?.protestId;
  if (!protest && byId && UUID.test(byId))
    protest = await models.Protest.findByPk(byId.toLowerCase(), { lock: transaction.LOCK.UPDATE, transaction });
  if (!protest) {
    console.error('[boreline] paid checkout session matches no protest', session.id);
    return { kind: 'unmatched' };
  }
  if (
    session.amount_total !== protest.feeMinor ||
    (session.currency ?? '').toLowerCase() !== protest.currency.toLowerCase()
  ) {
    console.error('[boreline] paid amount differs from the protest fee; left for the stewards', session.id, protest.id);
    return { kind: 'mismatch' };
  }
  const paymentIntentId =
    typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  if (protest.status === 'awaiting_fee') {
    const paidAt = new Date();
    await protest.update(
      { status: 'lodged', paidAt, paymentIntentId, checkoutSessionId: protest.checkoutSessionId ?? session.id },
      { transaction },
    );
    await recordAuditEvent(
      {
        eventId: protest.eventId,
        actorId: null,
        subjectType: 'protest',
        subjectId: protest.id,
        action: 'protest.lodged',
        details: { paymentIntentId, checkoutSessionId: session.id, paidAfterWindow: paidAt > protest.windowDeadline },
      },
      transaction,
    );
    return { kind: 'protest_paid', protestId: protest.id };
  }
  if (paymentIntentId && protest.paymentIntentId !== paymentIntentId)
    return { kind: 'protest_refund', protestId: protest.id, paymentIntentId };
  return { kind: 'already_recorded' };
}

/** After commit: the e-mails for a lodged protest, or the refund of a payment nobody wanted. */
export async function finishProtestPayment(outcome: ProtestPaymentOutcome) {
  if (outcome.kind === 'protest_paid') {
    const p = await getDb().models.Protest.findByPk(outcome.protestId);
    if (!p) return;
    await notifyParties(
      p.id,
      'Protest lodged',
      [
        `A protest has been lodged under ${p.ruleReference}; the fee of ${formatMoney(p.feeMinor, p.currency)} is paid.`,
        'The fee is refunded if the protest is upheld and kept if it is dismissed.',
        'The stewards will decide whether to accept it for a hearing.',
      ],
      { includeStewards: true },
    );
  }
  if (outcome.kind === 'protest_refund') {
    // The key makes a repeated refund of the same payment a no-op at the provider.
    await refundPayment({
      paymentIntentId: outcome.paymentIntentId,
      idempotencyKey: `protest-unwanted-payment-${outcome.paymentIntentId}`,
    })
      .then(() => console.warn('[boreline] refunded a protest payment that was not wanted', outcome.protestId))
      .catch((err) =>
        console.error('[boreline] REFUND NEEDED by hand: unwanted protest payment', outcome.protestId, err),
      );
  }
}
