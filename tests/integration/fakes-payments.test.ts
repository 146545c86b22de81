// The payments fake driven by the real stripe SDK (v23): the SDK's own error classes, its webhook
// verifier (stripe.webhooks.constructEvent) and its idempotency handling are the references here.
// Runs under scripts/test.sh, which starts the fakes with STRIPE_* and PAYMENTS_WEBHOOK_URL set.
import { test, after } from 'node:test';
import assert from 'node:assert/strict';
import http from 'node:http';
import os from 'node:os';
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { startPaymentsFake } from '../../scripts/fakes/payments';

const API_URL = new URL(process.env.STRIPE_API_URL ?? 'http://127.0.0.1:12211');
const KEY = process.env.STRIPE_SECRET_KEY ?? 'sk_test_boreline_local_fake';
const WHSEC = process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_boreline_test_fake';
const sdk = (key = KEY, url = API_URL) =>
  new Stripe(key, { host: url.hostname, port: Number(url.port), protocol: 'http', maxNetworkRetries: 0 });
const stripe = sdk();

type FakeEvent = {
  id: string;
  type: string;
  payload: string;
  signatureHeader: string;
  delivered: boolean;
  attempts: { status: number | null }[];
};

async function fakeJson<T>(p: string, init?: RequestInit): Promise<T> {
  const res = await fetch(new URL(p, API_URL), init);
  assert.equal(res.status, 200, `${p} answered ${res.status}`);
  return ((await res.json()) as { data: T }).data;
}
const events = () => fakeJson<FakeEvent[]>('/_fake/events');

function newSession(amountMinor = 4500, extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) {
  return stripe.checkout.sessions.create({
    mode: 'payment',
    line_items: [
      {
        quantity: 2,
        price_data: {
          currency: 'gbp',
          unit_amount: amountMinor / 2,
          product_data: { name: 'Entry fee — Class J2 (invented)' },
        },
      },
    ],
    success_url: 'http://localhost:3100/pay/done?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://localhost:3100/pay/cancelled',
    client_reference_id: 'entry-test-1',
    metadata: { entryId: 'entry-test-1', purpose: 'entry_fee' },
    customer_email: 'entrant@example.org',
    ...extra,
  });
}

/** A webhook receiver that answers 500 to its first request and 200 after: proves retries. */
async function flakyReceiver() {
  const received: { body: string; signature: string }[] = [];
  const waiters: (() => void)[] = [];
  const server = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      received.push({ body, signature: String(req.headers['stripe-signature'] ?? '') });
      res.statusCode = received.length === 1 ? 500 : 200;
      res.end();
      waiters.splice(0).forEach((w) => w());
    });
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/hook`;
  const waitFor = async (n: number) => {
    const deadline = Date.now() + 8000;
    while (received.length < n) {
      assert.ok(Date.now() < deadline, `expected ${n} deliveries, got ${received.length}`);
      await new Promise<void>((r) => {
        waiters.push(r);
        setTimeout(r, 200);
      });
    }
  };
  return { url, received, waitFor, close: () => new Promise((r) => server.close(r)) };
}

test('the fake answers its health check', async () => {
  const deadline = Date.now() + 5000;
  for (;;) {
    const ok = await fetch(new URL('/_fake/health', API_URL)).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    assert.ok(Date.now() < deadline, 'payments fake not reachable');
    await new Promise((r) => setTimeout(r, 100));
  }
});

test('a checkout session is created open and unpaid, and retrieved as created', async () => {
  const s = await newSession(4500);
  assert.match(s.id, /^cs_test_/);
  assert.equal(s.object, 'checkout.session');
  assert.equal(s.amount_total, 4500);
  assert.equal(s.currency, 'gbp');
  assert.equal(s.status, 'open');
  assert.equal(s.payment_status, 'unpaid');
  assert.equal(s.payment_intent, null);
  assert.equal(s.client_reference_id, 'entry-test-1');
  assert.deepEqual(s.metadata, { entryId: 'entry-test-1', purpose: 'entry_fee' });
  assert.equal(s.url, `${API_URL.origin}/pay/${s.id}`);
  const again = await stripe.checkout.sessions.retrieve(s.id);
  assert.equal(again.id, s.id);
  assert.equal(again.amount_total, 4500);

  const page = await fetch(s.url!);
  const html = await page.text();
  assert.equal(page.status, 200);
  assert.match(html, /Local test payment — no real money/);
  assert.match(html, /£45\.00/);
  assert.match(html, /<button[^>]*>Pay now<\/button>/);
  assert.match(html, /<button[^>]*>Cancel<\/button>/);
});

test('the same Idempotency-Key returns the same session; other parameters under it are refused', async () => {
  const key = `test-${randomUUID()}`;
  const params = (unitAmount: number): Stripe.Checkout.SessionCreateParams => ({
    mode: 'payment',
    success_url: 'http://localhost/ok',
    line_items: [
      { quantity: 1, price_data: { currency: 'eur', unit_amount: unitAmount, product_data: { name: 'Protest fee' } } },
    ],
  });
  const a = await stripe.checkout.sessions.create(params(3000), { idempotencyKey: key });
  const b = await stripe.checkout.sessions.create(params(3000), { idempotencyKey: key });
  assert.equal(b.id, a.id);
  assert.equal(b.lastResponse.headers['idempotent-replayed'], 'true');
  const c = await stripe.checkout.sessions.create(params(3000), { idempotencyKey: `${key}-other` });
  assert.notEqual(c.id, a.id);
  await assert.rejects(
    stripe.checkout.sessions.create(params(9999), { idempotencyKey: key }),
    (err: unknown) => err instanceof Stripe.errors.StripeIdempotencyError,
  );
});

test('paying delivers a signed checkout.session.completed, retried until accepted, verifiable with constructEvent', async () => {
  const s = await newSession(5000);
  const hook = await flakyReceiver();
  try {
    const paid = await fakeJson<{ session: Stripe.Checkout.Session; event: { id: string } }>(
      `/_fake/sessions/${s.id}/pay`,
      {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ webhookUrl: hook.url }),
      },
    );
    await hook.waitFor(2); // the first answer was 500; the fake must try again
    for (const d of hook.received) {
      const ev = stripe.webhooks.constructEvent(d.body, d.signature, WHSEC);
      assert.equal(ev.id, paid.event.id);
      assert.equal(ev.type, 'checkout.session.completed');
      const obj = ev.data.object as Stripe.Checkout.Session;
      assert.equal(obj.id, s.id);
      assert.equal(obj.payment_status, 'paid');
      assert.equal(obj.metadata?.entryId, 'entry-test-1');
    }
    const got = await stripe.checkout.sessions.retrieve(s.id);
    assert.equal(got.status, 'complete');
    assert.equal(got.payment_status, 'paid');
    assert.match(String(got.payment_intent), /^pi_/);

    const recorded = (await events()).find((e) => e.id === paid.event.id)!;
    assert.ok(recorded.delivered, 'marked delivered after the retry');
    assert.deepEqual(recorded.attempts.map((a) => a.status).slice(0, 2), [500, 200]);
    assert.equal(stripe.webhooks.constructEvent(recorded.payload, recorded.signatureHeader, WHSEC).id, recorded.id);
    const tampered = recorded.payload.replace('"amount_total": 5000', '"amount_total": 1');
    assert.notEqual(tampered, recorded.payload);
    assert.throws(
      () => stripe.webhooks.constructEvent(tampered, recorded.signatureHeader, WHSEC),
      Stripe.errors.StripeSignatureVerificationError,
    );
    assert.throws(
      () => stripe.webhooks.constructEvent(recorded.payload, recorded.signatureHeader, 'whsec_wrong'),
      Stripe.errors.StripeSignatureVerificationError,
    );

    // A replay: the same event id and body again, freshly signed.
    const before = hook.received.length;
    const resent = await fakeJson<FakeEvent>(`/_fake/events/${recorded.id}/resend`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ webhookUrl: hook.url }),
    });
    await hook.waitFor(before + 1);
    const replay = hook.received[before];
    assert.equal(replay.body, recorded.payload);
    assert.equal(stripe.webhooks.constructEvent(replay.body, replay.signature, WHSEC).id, recorded.id);
    assert.equal(resent.id, recorded.id);

    // Paying twice sends nothing new.
    const second = await fakeJson<{ event: null }>(`/_fake/sessions/${s.id}/pay`, { method: 'POST' });
    assert.equal(second.event, null);
  } finally {
    await hook.close();
  }
});

test('the hosted page pays with a 303 to success_url (session id filled in) and cancels to cancel_url', async () => {
  const s = await newSession(1200);
  const cancel = await fetch(new URL(`/pay/${s.id}/cancel`, API_URL), { method: 'POST', redirect: 'manual' });
  assert.equal(cancel.status, 303);
  assert.equal(cancel.headers.get('location'), 'http://localhost:3100/pay/cancelled');
  const pay = await fetch(new URL(`/pay/${s.id}/pay`, API_URL), { method: 'POST', redirect: 'manual' });
  assert.equal(pay.status, 303);
  assert.equal(pay.headers.get('location'), `http://localhost:3100/pay/done?session=${s.id}`);
  assert.equal((await stripe.checkout.sessions.retrieve(s.id)).payment_status, 'paid');
  const ev = (await events()).find((e) => e.type === 'checkout.session.completed' && e.payload.includes(s.id));
  assert.ok(ev, 'an event was recorded for the hosted-page payment');
  assert.ok(ev.attempts.length >= 1, 'delivery to PAYMENTS_WEBHOOK_URL was attempted');
});

test('a refund succeeds once; a second full refund and an over-refund are StripeInvalidRequestError', async () => {
  const s = await newSession(6000);
  await fakeJson(`/_fake/sessions/${s.id}/pay`, { method: 'POST' });
  const pi = String((await stripe.checkout.sessions.retrieve(s.id)).payment_intent);
  const part = await stripe.refunds.create(
    { payment_intent: pi, amount: 1000, metadata: { reason: 'test' } },
    { idempotencyKey: `r-${randomUUID()}` },
  );
  assert.match(part.id, /^re_/);
  assert.equal(part.status, 'succeeded');
  assert.equal(part.amount, 1000);
  await assert.rejects(
    stripe.refunds.create({ payment_intent: pi, amount: 5001 }),
    (err: unknown) =>
      err instanceof Stripe.errors.StripeInvalidRequestError &&
      err.type === 'StripeInvalidRequestError' &&
      err.statusCode === 400 &&
      err.code === 'amount_too_large',
  );
  const rest = await stripe.refunds.create({ payment_intent: pi });
  assert.equal(rest.amount, 5000);
  await assert.rejects(
    stripe.refunds.create({ payment_intent: pi }),
    (err: unknown) =>
      err instanceof Stripe.errors.StripeInvalidRequestError &&
      err.statusCode === 400 &&
      err.code === 'charge_already_refunded' &&
      err.rawType === 'invalid_request_error',
  );

  const refunded = (await events()).filter((e) => e.type === 'charge.refunded' && e.payload.includes(pi));
  assert.equal(refunded.length, 2);
  const latest = stripe.webhooks.constructEvent(refunded[0].payload, refunded[0].signatureHeader, WHSEC);
  const charge = latest.data.object as Stripe.Charge;
  assert.equal(charge.amount_refunded, 6000);
  assert.equal(charge.refunded, true);
});

test('a wrong API key is StripeAuthenticationError; an unknown session is resource_missing', async () => {
  await assert.rejects(
    sdk('sk_test_wrong').checkout.sessions.retrieve('cs_test_x'),
    (err: unknown) => err instanceof Stripe.errors.StripeAuthenticationError && err.statusCode === 401,
  );
  await assert.rejects(
    stripe.checkout.sessions.retrieve('cs_test_doesnotexist'),
    (err: unknown) =>
      err instanceof Stripe.errors.StripeInvalidRequestError &&
      err.statusCode === 404 &&
      err.code === 'resource_missing',
  );
  await assert.rejects(
    stripe.checkout.sessions.create({ mode: 'payment', line_items: [] } as Stripe.Checkout.SessionCreateParams),
    (err: unknown) => err instanceof Stripe.errors.StripeInvalidRequestError && err.param === 'line_items',
  );
});

test('sessions survive a restart of the fake (state file)', async () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'boreline-payments-'));
  after(() => fs.rmSync(dir, { recursive: true, force: true }));
  const conf = {
    port: 0,
    secretKey: 'sk_test_restart',
    webhookSecret: 'whsec_restart',
    webhookUrl: 'http://127.0.0.1:9/none',
    storeFile: path.join(dir, 'p.json'),
  };
  const start = async () => {
    const f = startPaymentsFake(conf);
    await new Promise((r) => f.server.once('listening', r));
    return {
      f,
      client: sdk('sk_test_restart', new URL(`http://127.0.0.1:${(f.server.address() as AddressInfo).port}`)),
    };
  };
  const first = await start();
  const s = await first.client.checkout.sessions.create({
    mode: 'payment',
    success_url: 'http://localhost/ok',
    line_items: [{ quantity: 1, price_data: { currency: 'nzd', unit_amount: 2500, product_data: { name: 'Entry' } } }],
  });
  await first.f.close();
  const second = await start();
  try {
    const got = await second.client.checkout.sessions.retrieve(s.id);
    assert.equal(got.amount_total, 2500);
    assert.equal(got.currency, 'nzd');
  } finally {
    await second.f.close();
  }
});
