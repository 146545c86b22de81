// POST /api/payments/webhook: signed events from the payment provider; verified before anything changes.
import { publicHandler } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { readRawText } from '@/lib/server/http/read-body';
import { verifyWebhook } from '@/lib/server/payments/stripe';
import { applyPaymentEvent } from '@/lib/server/payments/apply-payment-event';

const MAX_WEBHOOK_BYTES = 512 * 1024;

export const POST = publicHandler(async (req) => {
  // The signature covers the exact bytes received, so the body is read as text and never re-serialised;
  // the capped reader refuses a larger body by its length or, without one, as soon as it passes the cap.
  const raw = await readRawText(
    req,
    MAX_WEBHOOK_BYTES,
    () => new AppError('too_large', 413, 'The webhook body is too large.'),
  );
  const event = verifyWebhook(raw, req.headers.get('stripe-signature'));
  const outcome = await applyPaymentEvent(event);
  // Unknown types and replays are acknowledged too, so the provider stops resending them.
  return Response.json({ data: { received: true, outcome: outcome.kind } });
});
