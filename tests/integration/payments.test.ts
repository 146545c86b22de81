// Entry fees through the payments fake and the app's webhook: checkout, payment, a forged webhook
// refused, a replayed one harmless, the receipt e-mailed. Only a verified webhook marks an entry paid.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import Stripe from 'stripe';
import { HttpSession } from '../support/http-session';
import { BASE_URL, MAIL_INBOX, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { waitForMail } from '../support/mail';
import { DEFAULT_CLASS_RULES } from '../../lib/core/inputs/class-rules';

const CLUB = '0b0e0000-0000-4000-8000-000000000001';
const PAID_EVENT = '7e570000-0000-4000-8000-000000000103';
const PAID_CLASS = '7e570000-0000-4000-8000-000000000203';
const FAKE = process.env.STRIPE_API_URL ?? 'http://127.0.0.1:12211';
const WEBHOOK_SECRET = process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_boreline_test_fake';

type EntryRow = {
  status: string;
  paid_at: Date | null;
  payment_intent_id: string | null;
  checkout_session_id: string | null;
  race_number: number;
};
const entryRow = async (id: string) => (await query<EntryRow>('select * from entries where id = $1', [id]))[0];
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

before(async () => {
  await query(
    `insert into events (id, organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status, entry_fee_minor, currency)
     values ($1, $2, 'Test paid meeting', 'test-paid-meeting', 'Test Reach', '2027-05-01', '2027-05-02', 'UTC', 'entries_open', 4500, 'NZD')
     on conflict do nothing`,
    [PAID_EVENT, CLUB],
  );
  await query(
    `insert into race_classes (id, event_id, name, code) values ($1, $2, 'Test Sprint', 'TS') on conflict do nothing`,
    [PAID_CLASS, PAID_EVENT],
  );
  await query(
    `insert into class_rule_versions (class_id, version, status, rules, effective_from, published_at)
     values ($1, 1, 'published', $2::jsonb, now(), now()) on conflict do nothing`,
    [PAID_CLASS, JSON.stringify({ ...DEFAULT_CLASS_RULES, nozzle: { ...DEFAULT_CLASS_RULES.nozzle, maxMm: 102 } })],
  );
});

async function enteredEntrant() {
  const s = new HttpSession();
  const email = uniqueEmail('payer');
  await s.signUpAndConfirm({ name: 'Nia Stanway', email, password: 'long-enough-pw' });
  const boat = await s.json('/api/boats', { name: 'Cascade Hawk', nozzleDiameter: 101.2, power: 220 });
  assert.equal(boat.res.status, 201, JSON.stringify(boat.body));
  const entry = await s.json('/api/entries', { boatId: boat.body.data.id, eventId: PAID_EVENT, classId: PAID_CLASS });
  assert.equal(entry.res.status, 201, JSON.stringify(entry.body));
  return {
    s,
    email,
    entryId: entry.body.data.entry.id as string,
    raceNumber: entry.body.data.entry.raceNumber as number,
  };
}

async function waitFor<T>(
  what: string,
  fn: () => Promise<T | null | undefined | false>,
  timeoutMs = 10_000,
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await sleep(150);
  }
}

test('checkout through the fake: the webhook marks the entry entered with paid_at; a replay changes nothing; the receipt arrives', async () => {
  const { s, email, entryId, raceNumber } = await enteredEntrant();
  const first = await s.fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' });
  assert.equal(first.status, 200);
  const { url } = (await first.json()).data as { url: string };
  const sessionId = (await entryRow(entryId)).checkout_session_id;
  assert.ok(sessionId, 'the session id is stored on the entry');
  assert.equal(url, `${FAKE}/pay/${sessionId}`);
  const again = await s.fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' });
  assert.equal((await again.json()).data.url, url, 'a second click reopens the same session');
  assert.equal((await entryRow(entryId)).status, 'awaiting_payment', 'opening the payment page pays nothing');

  const paid = await fetch(`${FAKE}/_fake/sessions/${sessionId}/pay`, { method: 'POST' });
  assert.equal(paid.status, 200);
  const row = await waitFor('the entry to be marked paid', async () => {
    const r = await entryRow(entryId);
    return r.status === 'entered' && r.paid_at ? r : null;
  });
  assert.match(row.payment_intent_id ?? '', /^pi_/);

  const events = (await (await fetch(`${FAKE}/_fake/events?type=checkout.session.completed`)).json()).data as {
    id: string;
    payload: string;
  }[];
  const event = events.find(
    (e) => (JSON.parse(e.payload) as Stripe.Event & { data: { object: { id: string } } }).data.object.id === sessionId,
  );
  assert.ok(event, 'the fake sent a checkout.session.completed event for this session');
  assert.equal((await query('select 1 from payment_events where id = $1', [event.id])).length, 1);
  const resend = await fetch(`${FAKE}/_fake/events/${event.id}/resend`, { method: 'POST' });
  assert.equal(resend.status, 200);
  const delivered = (await resend.json()).data as { attempts: { status: number | null }[] };
  assert.equal(delivered.attempts.at(-1)?.status, 200, 'the replay is acknowledged');
  assert.equal(
    (await query('select 1 from payment_events where id = $1', [event.id])).length,
    1,
    'still one payment_events row',
  );
  const after = await entryRow(entryId);
  assert.equal(after.paid_at?.getTime(), row.paid_at?.getTime(), 'paid_at unchanged by the replay');
  assert.equal(after.status, 'entered');

  const mail = await waitForMail(email, { subject: /Receipt/ });
  assert.match(mail.text, /45\.00 NZD/);
  assert.match(mail.text, /Test paid meeting/);
  assert.match(mail.text, /TS Test Sprint/);
  assert.match(mail.text, /Cascade Hawk/);
  assert.match(mail.text, new RegExp(`Race number: ${raceNumber}\\b`));
  const receipts = (await (await fetch(`${MAIL_INBOX}?to=${encodeURIComponent(email)}`)).json()).data as {
    subject: string;
  }[];
  assert.equal(receipts.filter((m) => /Receipt/.test(m.subject)).length, 1, 'one receipt, not one per delivery');

  const list = (await (await s.fetch('/api/entries')).json()).data as {
    id: string;
    statusLabel: string;
    paidAt: string | null;
  }[];
  const mine = list.find((e) => e.id === entryId);
  assert.equal(mine?.statusLabel, 'Entered');
  assert.ok(mine?.paidAt);
  assert.equal(
    (await s.fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' })).status,
    409,
    'a paid entry cannot be paid again',
  );
  assert.equal(
    (await s.fetch(`/api/entries/${entryId}/withdraw`, { method: 'POST' })).status,
    409,
    'a paid entry is the organiser’s to cancel',
  );
});

test('a webhook with a bad or missing signature gets 400 and changes nothing', async () => {
  const { s, entryId } = await enteredEntrant();
  await s.fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' });
  const sessionId = (await entryRow(entryId)).checkout_session_id!;
  const forged = JSON.stringify({
    id: 'evt_forged_0001',
    object: 'event',
    type: 'checkout.session.completed',
    created: Math.floor(Date.now() / 1000),
    data: {
      object: {
        id: sessionId,
        object: 'checkout.session',
        payment_status: 'paid',
        status: 'complete',
        amount_total: 4500,
        currency: 'nzd',
        payment_intent: 'pi_forged',
        metadata: { entryId },
      },
    },
  });
  const wrongSecret = Stripe.webhooks.generateTestHeaderString({
    payload: forged,
    secret: 'whsec_not_the_real_secret',
  });
  const signatures: Record<string, string>[] = [
    { 'stripe-signature': wrongSecret },
    { 'stripe-signature': 't=1,v1=deadbeef' },
    {},
  ];
  for (const headers of signatures) {
    const res = await fetch(`${BASE_URL}/api/payments/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...headers },
      body: forged,
    });
    assert.equal(res.status, 400);
    assert.equal((await res.json()).error.code, 'bad_signature');
  }
  const row = await entryRow(entryId);
  assert.equal(row.status, 'awaiting_payment');
  assert.equal(row.paid_at, null);
  assert.equal((await query('select 1 from payment_events where id = $1', ['evt_forged_0001'])).length, 0);
});

test('a correctly signed event of a type the app does not use is acknowledged (200) and recorded once', async () => {
  const payload = JSON.stringify({
    id: `evt_other_${Date.now()}`,
    object: 'event',
    type: 'customer.created',
    created: Math.floor(Date.now() / 1000),
    data: { object: { id: 'cus_1', object: 'customer' } },
  });
  const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET });
  const res = await fetch(`${BASE_URL}/api/payments/webhook`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'stripe-signature': header },
    body: payload,
  });
  assert.equal(res.status, 200);
  assert.equal((await res.json()).data.outcome, 'ignored');
  assert.equal((await query('select 1 from payment_events where id = $1', [JSON.parse(payload).id])).length, 1);
});

test('another entrant cannot open checkout for an entry that is not theirs (404); malformed ids are 404', async () => {
  const { entryId } = await enteredEntrant();
  const other = await enteredEntrant();
  assert.equal((await other.s.fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' })).status, 404);
  assert.equal((await other.s.fetch('/api/entries/zzz/checkout', { method: 'POST' })).status, 404);
  assert.equal((await entryRow(entryId)).checkout_session_id, null);
});

test('a payment that arrives for an entry withdrawn meanwhile is refunded, and the entry stays withdrawn', async () => {
  const { s, entryId } = await enteredEntrant();
  await s.fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' });
  const sessionId = (await entryRow(entryId)).checkout_session_id!;
  assert.equal((await s.fetch(`/api/entries/${entryId}/withdraw`, { method: 'POST' })).status, 200);
  const paid = await fetch(`${FAKE}/_fake/sessions/${sessionId}/pay`, { method: 'POST' });
  assert.equal(paid.status, 200);
  const paymentIntent = ((await paid.json()).data as { session: { payment_intent: string } }).session.payment_intent;
  const refund = await waitFor('the refund of the unwanted payment', async () => {
    const events = (await (await fetch(`${FAKE}/_fake/events?type=charge.refunded`)).json()).data as {
      payload: string;
    }[];
    return events
      .map((e) => JSON.parse(e.payload).data.object as { payment_intent: string; refunded: boolean })
      .find((c) => c.payment_intent === paymentIntent);
  });
  assert.equal(refund.refunded, true);
  const row = await entryRow(entryId);
  assert.equal(row.status, 'withdrawn');
  assert.equal(row.paid_at, null);
});
