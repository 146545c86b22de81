// POST /api/payments/webhook: signed events from the payment provider; verified before anything changes.
import { publicHandler } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { verifyWebhook } from '@/lib/payments/stripe';
import { applyPaymentEvent } from '@/lib/entries/apply-payment-event';

const MAX_WEBHOOK_BYTES = 512 * 1024;

export const POST = publicHandler(async (req) => {
  if (Number(req.headers.get('content-length') ?? 0) > MAX_WEBHOOK_BYTES) throw new AppError('too_large', 413, 'The webhook body is too large.');
  // The signature covers the exact bytes received, so the body is read as text and never re-serialised.
  const raw = await req.text();
  const event = verifyWebhook(raw, req.headers.get('stripe-signature'));
  const outcome = await applyPaymentEvent(event);
  // Unknown types and replays are acknowledged too, so the provider stops resending them.
  return Response.json({ data: { received: true, outcome: outcome.kind } });
});
