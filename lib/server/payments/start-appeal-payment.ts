import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { assertAddressProven } from '@/lib/server/accounts/prove-address';
import { AppError } from '@/lib/core/errors';
import { createCheckoutSession, getCheckoutSession, type CheckoutInput } from '@/lib/server/payments/stripe';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findAppealForActor } from '../appeals/find-appeal-for-actor';
import { appUrl } from '@/lib/server/config/env';

/**
 * Opens the payment page for the appellant's fee, as for protest fees: the idempotency key comes from the
 * appeal id (and the session it replaces after an expiry) and is kept in the session's metadata, so a second
 * click reopens the same session and the fee is never charged twice. The appeal becomes lodged only through
 * the verified webhook (apply-appeal-payment.ts).
 */
export async function startAppealPayment(actor: Actor | null, appealId: string): Promise<{ url: string }> {
  const { appeal, isAppellant } = await findAppealForActor(actor, appealId);
  if (!isAppellant) throw new AppError('forbidden', 403, 'Only the appellant pays the appeal fee.');
  assertCan(actor, 'appeal.lodge', { eventId: appeal.eventId });
  assertAddressProven(actor);
  if (appeal.paidAt) throw new AppError('already_paid', 409, 'The appeal fee is already paid.');
  if (appeal.status !== 'awaiting_fee') throw new AppError('conflict', 409, 'This appeal is not waiting for its fee.');
  const { sequelize } = getDb();
  const [ended] = await sequelize.query(
    `select 1 from appeals where penalty_id = :penaltyId and status in ('annulled', 'amended')`,
    { replacements: { penaltyId: appeal.penaltyId }, type: QueryTypes.SELECT },
  );
  if (ended)
    throw new AppError(
      'superseded',
      409,
      "Another appeal's decision has already ended this penalty: there is nothing left to appeal, so no fee is taken.",
    );
  const done = `${appUrl()}/appeals/${appeal.id}?paid=1`;
  const params = (checkoutKey: string): CheckoutInput => ({
    amountMinor: appeal.feeMinor,
    currency: appeal.currency,
    description: `Appeal fee: ${appeal.eventName}, penalty ${appeal.penaltyCode} on #${appeal.raceNumber}`.slice(
      0,
      250,
    ),
    reference: appeal.id,
    metadata: { kind: 'appeal', appealId: appeal.id, checkoutKey },
    successUrl: done,
    cancelUrl: `${appUrl()}/appeals/${appeal.id}?cancelled=1`,
    customerEmail: actor!.email,
    idempotencyKey: checkoutKey,
  });
  let basis = 'first';
  if (appeal.checkoutSessionId) {
    const existing = await getCheckoutSession(appeal.checkoutSessionId).catch((err) => {
      if (err instanceof AppError && err.status === 404) return null;
      throw err;
    });
    if (existing?.status === 'complete')
      throw new AppError('payment_pending', 409, 'The fee has been paid; the confirmation is on its way.');
    if (existing?.status === 'open' && existing.metadata.checkoutKey) {
      const again = await createCheckoutSession(params(existing.metadata.checkoutKey)).catch(() => null);
      if (again?.id === existing.id) return { url: again.url };
    }
    basis = `after-${appeal.checkoutSessionId}`;
  }
  const session = await createCheckoutSession(params(`appeal-checkout-${appeal.id}-${basis}`));
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `update appeals set checkout_session_id = :sessionId, updated_at = now() where id = :id and status = 'awaiting_fee'`,
      { replacements: { sessionId: session.id, id: appeal.id }, transaction },
    );
    await recordAuditEvent(
      {
        eventId: appeal.eventId,
        actorId: actor!.id,
        subjectType: 'appeal',
        subjectId: appeal.id,
        action: 'appeal.checkout_opened',
        details: { checkoutSessionId: session.id },
      },
      transaction,
    );
  });
  return { url: session.url };
}
