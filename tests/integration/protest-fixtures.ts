// Shared set-up for the protest integration tests: a test-owned meeting (Pacific/Auckland, 30-minute
// window, 50.00 NZD fee) staffed by the demo steward and organiser, competitors with confirmed
// entries, and helpers that lodge and pay protests through the payments fake. Not a test file.
import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { PNG } from 'pngjs';
import { S3Client } from '@aws-sdk/client-s3';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';

const CLUB = '0b0e0000-0000-4000-8000-000000000001';
export const EVENT = '7e570000-0000-4000-8000-000000000701';
export const MAIN_CLASS = '7e570000-0000-4000-8000-000000000702'; // results published through the API (protests.test.ts)
export const WINDOW_CLASS = '7e570000-0000-4000-8000-000000000703'; // results placed in time by SQL
export const DECISION_CLASS = '7e570000-0000-4000-8000-000000000704'; // protest-evidence-decisions.test.ts
export const STEWARD_ID = '0b0e0000-0000-4000-8000-000000001005';
export const ORGANISER_ID = '0b0e0000-0000-4000-8000-000000001002';
export const DEMO_ENTRY = '0b0e0000-0000-4000-8401-000000000002'; // an entry of the demo meeting (another event)
export const FAKE = process.env.STRIPE_API_URL ?? 'http://127.0.0.1:12211';
const PW = 'protest-test-password';
export const s3 = new S3Client({
  endpoint: process.env.S3_ENDPOINT ?? 'http://127.0.0.1:9850',
  region: process.env.S3_REGION ?? 'us-east-1',
  forcePathStyle: true,
  credentials: {
    accessKeyId: process.env.S3_ACCESS_KEY_ID ?? 'boreline-local',
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? 'x',
  },
  requestChecksumCalculation: 'WHEN_REQUIRED',
  responseChecksumValidation: 'WHEN_REQUIRED',
});
export const BUCKET = process.env.S3_BUCKET ?? 'boreline-test';
export const sha256 = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export type Person = { s: HttpSession; id: string; email: string };
export type Competitor = Person & { entryId: string; raceNumber: number };

export async function person(prefix: string): Promise<Person> {
  const s = new HttpSession();
  const email = uniqueEmail(prefix);
  await s.signUpAndConfirm({ name: `${prefix} Tester`, email, password: PW });
  const [{ id }] = await query<{ id: string }>('select id from users where email = $1', [email]);
  return { s, id, email };
}
export async function competitor(prefix: string, classId = MAIN_CLASS): Promise<Competitor> {
  const p = await person(prefix);
  const [boat] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, $2, 101.5, 220) returning id`,
    [p.id, `${prefix} boat`],
  );
  // Next free race number at the test meeting (files run one after another against one database).
  const [{ n }] = await query<{ n: number }>(
    'select coalesce(max(race_number), 99) + 1 as n from entries where event_id = $1',
    [EVENT],
  );
  const [entry] = await query<{ id: string }>(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency) values ($1, $2, $3, $4, $5, 'entered', 0, 'NZD') returning id`,
    [EVENT, classId, boat.id, p.id, n],
  );
  return { ...p, entryId: entry.id, raceNumber: n };
}
export async function waitFor<T>(
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
export const protestRow = async (id: string) =>
  (await query<Record<string, unknown>>('select * from protests where id = $1', [id]))[0];
export const lodge = (c: Person, body: Record<string, unknown>) =>
  c.s.json(`/api/events/${EVENT}/protests`, {
    ruleReference: 'TP 2.1 nozzle exit diameter maximum',
    grounds: 'Measured the nozzle exit with a caliper at the dock: 102.6 mm.',
    requestedChecks: ['nozzle_diameter'],
    ...body,
  });

/** Lodges and pays a protest through the fake; returns it lodged, with its payment intent. */
export async function lodgedProtest(lodger: Competitor, target: Competitor, rule: string) {
  const made = await lodge(lodger, { againstEntryId: target.entryId, ruleReference: rule });
  assert.equal(made.res.status, 201, JSON.stringify(made.body));
  const id = made.body.data.id as string;
  const co = await lodger.s.fetch(`/api/protests/${id}/checkout`, { method: 'POST' });
  assert.equal(co.status, 200);
  const sessionId = (await protestRow(id)).checkout_session_id as string;
  assert.equal((await fetch(`${FAKE}/_fake/sessions/${sessionId}/pay`, { method: 'POST' })).status, 200);
  const row = await waitFor('the protest to be lodged', async () => {
    const r = await protestRow(id);
    return r.status === 'lodged' ? r : null;
  });
  return { id, sessionId, paymentIntentId: row.payment_intent_id as string };
}
export async function refundEventsFor(paymentIntentId: string) {
  const events = (await (await fetch(`${FAKE}/_fake/events?type=charge.refunded`)).json()).data as {
    payload: string;
  }[];
  return events
    .map((e) => JSON.parse(e.payload).data.object as { payment_intent: string; amount_refunded: number })
    .filter((c) => c.payment_intent === paymentIntentId);
}
export const png = () => {
  const img = new PNG({ width: 8, height: 8 });
  for (let i = 0; i < img.data.length; i++) img.data[i] = (i * 37) % 256;
  return PNG.sync.write(img);
};
export const upload = (s: HttpSession, protestId: string, bytes: Uint8Array, name: string, type: string) => {
  const form = new FormData();
  form.append('file', new Blob([Buffer.from(bytes)], { type }), name);
  return s.fetch(`/api/protests/${protestId}/evidence`, { method: 'POST', body: form });
};

/** The test meeting, its classes and staff (idempotent), and signed-in steward and organiser sessions. */
export async function setUpMeeting() {
  await query(
    `insert into events (id, organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status, protest_window_minutes, protest_fee_minor, currency)
     values ($1, $2, 'Protest test meeting', 'protest-test-meeting', 'Test Reach', '2027-04-03', '2027-04-04', 'Pacific/Auckland', 'racing', 30, 5000, 'NZD') on conflict do nothing`,
    [EVENT, CLUB],
  );
  for (const [id, code] of [
    [MAIN_CLASS, 'TP'],
    [WINDOW_CLASS, 'TW'],
    [DECISION_CLASS, 'TD'],
  ]) {
    await query(`insert into race_classes (id, event_id, name, code) values ($1, $2, $3, $4) on conflict do nothing`, [
      id,
      EVENT,
      `Test ${code}`,
      code,
    ]);
  }
  await query(
    `insert into event_staff (event_id, user_id, role) values ($1, $2, 'steward'), ($1, $3, 'organiser') on conflict do nothing`,
    [EVENT, STEWARD_ID, ORGANISER_ID],
  );
  const steward = new HttpSession();
  assert.equal((await steward.signInWithPassword(DEMO.steward, DEMO_PASSWORD)).status, 200);
  const organiser = new HttpSession();
  assert.equal((await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD)).status, 200);
  return { steward, organiser };
}

/** Publishes a class's results through the API (the organiser), finishers in the order given. */
export async function publishResults(organiser: HttpSession, classId: string, finishers: Competitor[]) {
  const res = await organiser.json(`/api/events/${EVENT}/results`, {
    classId,
    rows: finishers.map((c, i) => ({ position: i + 1, raceNumber: c.raceNumber })),
  });
  assert.equal(res.res.status, 201, JSON.stringify(res.body));
  return res.body.data;
}
