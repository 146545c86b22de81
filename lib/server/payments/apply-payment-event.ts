import 'server-only';
import { formatTime } from '@/lib/core/format/time';
import type Stripe from 'stripe';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { parseId } from '@/lib/server/http/ids';
import { refundPayment } from '@/lib/server/payments/stripe';
import { sendMail } from '@/lib/server/mail/send';
import { formatMoney } from '@/lib/core/inputs/entries';
import {
  applyProtestPayment,
  finishProtestPayment,
  type ProtestPaymentOutcome,
} from '@/lib/server/payments/apply-protest-payment';
import {
  applyAppealPayment,
  finishAppealPayment,
  type AppealPaymentOutcome,
} from '@/lib/server/payments/apply-appeal-payment';

type Outcome =
  | { kind: 'replay' | 'ignored' | 'unmatched' | 'mismatch' | 'already_recorded' }
  | { kind: 'paid'; entryId: string }
  | { kind: 'refund'; entryId: string; paymentIntentId: string }
  | ProtestPaymentOutcome
  | AppealPaymentOutcome;

const PAID_TYPES = new Set(['checkout.session.completed', 'checkout.session.async_payment_succeeded']);

/**
 * Applies one verified payment webhook event, exactly once: the event id goes into payment_events
 * in the same transaction as the entry change, so a replayed delivery finds it there and changes
 * nothing. A completed, paid Checkout session marks its entry entered (amount and currency must
 * match the entry's fee). A payment for an entry that no longer wants one (withdrawn, cancelled,
 * or already paid through another session) is refunded. The receipt goes out after commit.
 */
export async function applyPaymentEvent(event: Stripe.Event): Promise<Outcome> {
  const { sequelize, models } = getDb();
  const outcome = await sequelize.transaction(async (transaction): Promise<Outcome> => {
    const inserted = await sequelize.query(
      'insert into payment_events (id, type) values (:id, :type) on conflict (id) do nothing returning id',
      { replacements: { id: event.id, type: event.type }, type: QueryTypes.SELECT, transaction },
    );
    if (inserted.length === 0) return { kind: 'replay' };
    if (!PAID_TYPES.has(event.type)) return { kind: 'ignored' };
    const session = event.data.object as Stripe.Checkout.Session;
    if (session.payment_status !== 'paid') return { kind: 'ignored' };
    // Protest fees share the webhook (and its replay protection); metadata.kind says which it is.
    if (session.metadata?.kind === 'protest') return applyProtestPayment(session, transaction);
    if (session.metadata?.kind === 'appeal') return applyAppealPayment(session, transaction);

    let entry = await models.Entry.findOne({
      where: { checkoutSessionId: session.id },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!entry && session.metadata?.entryId) {
      const byId = (() => {
        try {
          return parseId(session.metadata!.entryId, 'entry');
        } catch {
          return null;
        }
      })();
      if (byId) entry = await models.Entry.findByPk(byId, { lock: transaction.LOCK.UPDATE, transaction });
    }
    if (!entry) {
      console.error('[boreline] paid checkout session matches no entry', session.id);
      return { kind: 'unmatched' };
    }
    if (
      session.amount_total !== entry.feeMinor ||
      (session.currency ?? '').toLowerCase() !== entry.currency.toLowerCase()
    ) {
      console.error('[boreline] paid amount differs from the entry fee; left for the organiser', session.id, entry.id);
      return { kind: 'mismatch' };
    }
    const paymentIntentId =
      typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
    if (entry.status === 'awaiting_payment') {
      await entry.update(
        {
          status: 'entered',
          paidAt: new Date(),
          paymentIntentId,
          checkoutSessionId: entry.checkoutSessionId ?? session.id,
        },
        { transaction },
      );
      return { kind: 'paid', entryId: entry.id };
    }
    if (paymentIntentId && entry.paymentIntentId !== paymentIntentId)
      return { kind: 'refund', entryId: entry.id, paymentIntentId };
    return { kind: 'already_recorded' };
  });

  if (outcome.kind === 'protest_paid' || outcome.kind === 'protest_refund') await finishProtestPayment(outcome);
  if (outcome.kind === 'appeal_refund') await finishAppealPayment(outcome);
  if (outcome.kind === 'paid')
    await sendReceipt(outcome.entryId).catch((err) =>
      console.error('[boreline] receipt not sent', outcome.entryId, err),
    );
  if (outcome.kind === 'refund') {
    // The key makes a repeated refund for the same payment a no-op at the provider.
    await refundPayment({
      paymentIntentId: outcome.paymentIntentId,
      idempotencyKey: `entry-unwanted-payment-${outcome.paymentIntentId}`,
    })
      .then(() => console.warn('[boreline] refunded a payment for an entry that no longer wanted one', outcome.entryId))
      .catch((err) =>
        console.error(
          '[boreline] REFUND NEEDED by hand: payment for an entry that no longer wanted one',
          outcome.entryId,
          err,
        ),
      );
  }
  return outcome;
}

async function sendReceipt(entryId: string) {
  const [row] = await getDb().sequelize.query<{
    email: string;
    name: string | null;
    eventName: string;
    venue: string;
    className: string;
    classCode: string;
    boatName: string;
    raceNumber: number;
    feeMinor: number;
    currency: string;
    paidAt: Date;
    paymentIntentId: string | null;
    timeZone: string;
  }>(
    `select u.email, u.name, ev.name as "eventName", ev.venue, c.name as "className", c.code as "classCode", b.name as "boatName",
            e.race_number as "raceNumber", e.fee_minor as "feeMinor", e.currency, e.paid_at as "paidAt", e.payment_intent_id as "paymentIntentId", ev.time_zone as "timeZone"
       from entries e join users u on u.id = e.entrant_id join events ev on ev.id = e.event_id
       join race_classes c on c.id = e.class_id join boats b on b.id = e.boat_id
      where e.id = :entryId`,
    { replacements: { entryId }, type: QueryTypes.SELECT },
  );
  if (!row) return;
  const amount = formatMoney(row.feeMinor, row.currency);
  const lines = [
    `Hello ${row.name ?? row.email},`,
    '',
    `Thank you: we have received your entry fee of ${amount}.`,
    '',
    `Meeting: ${row.eventName}, ${row.venue}`,
    `Class: ${row.classCode} ${row.className}`,
    `Boat: ${row.boatName}`,
    `Race number: ${row.raceNumber}`,
    `Amount paid: ${amount}`,
    `Paid at: ${formatTime(row.paidAt, row.timeZone)}`,
    `Payment reference: ${row.paymentIntentId ?? '—'}`,
    `Entry reference: ${entryId}`,
    '',
    'Bring the boat to technical inspection with its QR tag fixed where scrutineers can scan it.',
  ];
  await sendMail({
    to: row.email,
    subject: `Receipt: entry fee for ${row.boatName} (#${row.raceNumber}) at ${row.eventName}`,
    text: lines.join('\n'),
  });
}
