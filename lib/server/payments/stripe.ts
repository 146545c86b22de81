import 'server-only';
import Stripe from 'stripe';
import { AppError } from '../../core/errors';
import { isPublishedSecret } from '../config/published-values';
import { serverEnv } from '../config/env';

// The card-payment provider behind one small module: a lazily created stripe client (nothing is
// read at build time), Checkout Sessions, refunds and webhook verification. Development and tests
// point STRIPE_API_URL at the local fake (scripts/fakes/payments.ts); production leaves it unset.
const globalForStripe = globalThis as unknown as { __borelineStripe?: Stripe };

/** host/port/protocol for the SDK from STRIPE_API_URL; {} means Stripe's own API. */
export function stripeConnection(apiUrl = serverEnv().STRIPE_API_URL, nodeEnv: string = serverEnv().NODE_ENV) {
  // Outside production an unset URL still means the local fake, never the real service by accident.
  const url = apiUrl || (nodeEnv === 'production' ? '' : 'http://127.0.0.1:12111');
  if (!url) return {};
  const u = new URL(url);
  const protocol = u.protocol === 'https:' ? 'https' : 'http';
  return { host: u.hostname, port: Number(u.port || (protocol === 'https' ? 443 : 80)), protocol } as const;
}

function stripe(): Stripe {
  if (!globalForStripe.__borelineStripe) {
    const key = serverEnv().STRIPE_SECRET_KEY;
    // A key published in this repository authenticates nobody (lib/server/config/published-values.ts).
    if (!key || isPublishedSecret('STRIPE_SECRET_KEY', key))
      throw new AppError('payments_unavailable', 503, 'Payments are not configured on this server.');
    globalForStripe.__borelineStripe = new Stripe(key, {
      ...stripeConnection(),
      maxNetworkRetries: 2, // POSTs carry an idempotency key, so retrying is safe
      timeout: 20_000,
      appInfo: { name: 'Boreline' },
    });
  }
  return globalForStripe.__borelineStripe;
}

export type CheckoutInput = {
  amountMinor: number; // in the currency's minor unit (pence, cents)
  currency: string; // ISO 4217, e.g. 'gbp'
  description: string;
  reference: string; // our id for what is paid for (entry, protest fee), echoed as client_reference_id
  metadata?: Record<string, string>;
  successUrl: string; // may contain {CHECKOUT_SESSION_ID}
  cancelUrl: string;
  customerEmail?: string;
  idempotencyKey: string;
};

/** Opens a hosted payment page for one amount; returns where to send the payer. */
export async function createCheckoutSession(input: CheckoutInput): Promise<{ id: string; url: string }> {
  if (!Number.isInteger(input.amountMinor) || input.amountMinor < 1)
    throw new AppError('invalid_amount', 400, 'The amount must be a whole number of minor units above zero.');
  if (!/^[a-z]{3}$/i.test(input.currency))
    throw new AppError('invalid_currency', 400, 'The currency must be a three-letter ISO 4217 code.');
  const session = await stripe().checkout.sessions.create(
    {
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: input.currency.toLowerCase(),
            unit_amount: input.amountMinor,
            product_data: { name: input.description },
          },
        },
      ],
      success_url: input.successUrl,
      cancel_url: input.cancelUrl,
      client_reference_id: input.reference,
      metadata: { ...input.metadata, reference: input.reference },
      ...(input.customerEmail && { customer_email: input.customerEmail }),
    },
    { idempotencyKey: input.idempotencyKey },
  );
  if (!session.url)
    throw new AppError('payments_unavailable', 502, 'The payment provider did not return a payment page.');
  return { id: session.id, url: session.url };
}

export type CheckoutSummary = {
  id: string;
  status: string | null; // 'open' | 'complete' | 'expired'
  paymentStatus: string; // 'unpaid' | 'paid' | 'no_payment_required'
  isPaid: boolean;
  amountTotalMinor: number | null;
  currency: string | null;
  paymentIntentId: string | null;
  reference: string | null;
  metadata: Record<string, string>;
};

export function summariseCheckoutSession(s: Stripe.Checkout.Session): CheckoutSummary {
  const pi = typeof s.payment_intent === 'string' ? s.payment_intent : (s.payment_intent?.id ?? null);
  return {
    id: s.id,
    status: s.status,
    paymentStatus: s.payment_status,
    isPaid: s.status === 'complete' && s.payment_status === 'paid',
    amountTotalMinor: s.amount_total,
    currency: s.currency,
    paymentIntentId: pi,
    reference: s.client_reference_id,
    metadata: { ...(s.metadata ?? {}) },
  };
}

/** The session as the provider sees it now (for a success page or a webhook that needs re-reading). */
export async function getCheckoutSession(id: string): Promise<CheckoutSummary> {
  try {
    return summariseCheckoutSession(await stripe().checkout.sessions.retrieve(id));
  } catch (err) {
    if (err instanceof Stripe.errors.StripeInvalidRequestError && err.code === 'resource_missing') {
      throw new AppError('not_found', 404, 'No such payment session.');
    }
    throw err;
  }
}

/** Refunds all (amountMinor omitted) or part of a payment; refunding past what was paid is a 409. */
export async function refundPayment(input: {
  paymentIntentId: string;
  amountMinor?: number;
  idempotencyKey: string;
  metadata?: Record<string, string>;
}): Promise<{ id: string; status: string | null }> {
  try {
    const refund = await stripe().refunds.create(
      {
        payment_intent: input.paymentIntentId,
        ...(input.amountMinor !== undefined && { amount: input.amountMinor }),
        ...(input.metadata && { metadata: input.metadata }),
      },
      { idempotencyKey: input.idempotencyKey },
    );
    return { id: refund.id, status: refund.status };
  } catch (err) {
    if (
      err instanceof Stripe.errors.StripeInvalidRequestError &&
      (err.code === 'charge_already_refunded' || err.code === 'amount_too_large')
    ) {
      throw new AppError(
        'refund_exceeds_payment',
        409,
        'This payment has already been refunded, or the refund is larger than what is left of it.',
      );
    }
    throw err;
  }
}

/**
 * Checks a webhook's Stripe-Signature against STRIPE_WEBHOOK_SECRET and returns the event.
 * rawBody must be the exact bytes received (`await req.text()`), never re-serialised JSON.
 */
export function verifyWebhook(rawBody: string, signatureHeader: string | null): Stripe.Event {
  const secret = serverEnv().STRIPE_WEBHOOK_SECRET;
  // Anyone can sign with a secret published in this repository: such a value verifies nothing.
  if (!secret || isPublishedSecret('STRIPE_WEBHOOK_SECRET', secret))
    throw new AppError('payments_unavailable', 503, 'Payment webhooks are not configured on this server.');
  if (!signatureHeader) throw new AppError('bad_signature', 400, 'The webhook has no Stripe-Signature header.');
  try {
    // The SDK's static verifier: checking a signature needs the webhook secret, not the API key.
    return Stripe.webhooks.constructEvent(rawBody, signatureHeader, secret);
  } catch {
    // A forged, stale (older than the SDK's 5-minute tolerance) or malformed delivery alike.
    throw new AppError('bad_signature', 400, 'The webhook signature does not match.');
  }
}
