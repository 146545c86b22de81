import 'server-only';
import type Stripe from 'stripe';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { refundPayment } from '@/lib/server/payments/stripe';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { formatMoney } from '@/lib/core/inputs/entries';
import { readAppeal } from '../appeals/appeal-view';
import { notifyAppeal } from '../appeals/notify-appeal';

export type AppealPaymentOutcome =
  | { kind: 'unmatched' | 'mismatch' | 'already_recorded' }
  | { kind: 'appeal_paid'; appealId: string }
  | { kind: 'appeal_refund'; appealId: string; paymentIntentId: string };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;

/**
 * A paid Checkout session for an appeal fee, inside the webhook's transaction (which has already recorded the
 * event id, so a replay never gets here). An appeal awaiting its fee becomes lodged, and its parties are told
 * (the mail is queued in this transaction); a payment it no longer wants (a second session paid) is refunded
 * after commit.
 */
export async function applyAppealPayment(
  session: Stripe.Checkout.Session,
  transaction: Transaction,
): Promise<AppealPaymentOutcome> {
  const { sequelize } = getDb();
  const [bySession] = await sequelize.query<{ id: string }>(
    'select id from appeals where checkout_session_id = :sid for update',
    { replacements: { sid: session.id }, type: QueryTypes.SELECT, transaction },
  );
  const byId = session.metadata?.appealId;
  const id = bySession?.id ?? (byId && UUID.test(byId) ? byId.toLowerCase() : null);
  const appeal = id ? await readAppeal(id, { transaction, lock: true }) : undefined;
  if (!appeal) {
    console.error('[boreline] paid checkout session matches no appeal', session.id);
    return { kind: 'unmatched' };
  }
  if (
    session.amount_total !== appeal.feeMinor ||
    (session.currency ?? '').toLowerCase() !== appeal.currency.toLowerCase()
  ) {
    console.error(
      '[boreline] paid amount differs from the appeal fee; left for the appeal body',
      session.id,
      appeal.id,
    );
    return { kind: 'mismatch' };
  }
  const paymentIntentId =
    typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  if (appeal.status === 'awaiting_fee') {
    const paidAt = new Date();
    await sequelize.query(
      `update appeals set status = 'lodged', paid_at = :paidAt, payment_intent_id = :pi,
              checkout_session_id = coalesce(checkout_session_id, :sid), updated_at = now() where id = :id`,
      { replacements: { paidAt, pi: paymentIntentId, sid: session.id, id: appeal.id }, transaction },
    );
    await recordAuditEvent(
      {
        eventId: appeal.eventId,
        actorId: null,
        subjectType: 'appeal',
        subjectId: appeal.id,
        action: 'appeal.lodged',
        details: { paymentIntentId, checkoutSessionId: session.id, paidAfterNotice: paidAt > appeal.noticeDeadline },
      },
      transaction,
    );
    await notifyAppeal(
      appeal,
      'Appeal lodged',
      [
        `Notice of appeal has been lodged with the appeal body; the fee of ${formatMoney(appeal.feeMinor, appeal.currency)} is paid.`,
        "The fee is refunded if the appeal body annuls or amends the stewards' decision, and kept if it confirms it.",
        'The results concerned show "under appeal" until the appeal body decides.',
      ],
      transaction,
    );
    return { kind: 'appeal_paid', appealId: appeal.id };
  }
  if (paymentIntentId && appeal.paymentIntentId !== paymentIntentId)
    return { kind: 'appeal_refund', appealId: appeal.id, paymentIntentId };
  return { kind: 'already_recorded' };
}

/** After commit: the refund of an appeal payment nobody wanted (the key makes a repeat a no-op at the provider). */
export async function finishAppealPayment(outcome: AppealPaymentOutcome) {
  if (outcome.kind !== 'appeal_refund') return;
  await refundPayment({
    paymentIntentId: outcome.paymentIntentId,
    idempotencyKey: `appeal-unwanted-payment-${outcome.paymentIntentId}`,
  })
    .then(() => console.warn('[boreline] refunded an appeal payment that was not wanted', outcome.appealId))
    .catch((err) => console.error('[boreline] REFUND NEEDED by hand: unwanted appeal payment', outcome.appealId, err));
}
