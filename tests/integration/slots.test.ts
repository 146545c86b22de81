// Scrutineering slots and the dock queue through the HTTP API and the database: the chief scrutineer
// opens slots (class, bay, time in the meeting's zone, capacity), entrants book their own entries (or
// the chief scrutineer assigns), a missed slot shows as late and is re-booked, the dock checks boats in
// (a retry stores nothing new) and takes walk-ins, reminders are queued once, and two entrants taking
// the last place at once get one place between them. A grace period after the booked time before a boat
// counts as late is common practice, no source. Zone: Pacific/Auckland (IANA tz database).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { waitForMail } from '../support/mail';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const ZONE = 'Pacific/Auckland';
const meeting = new InspectionMeeting();
const chief = new HttpSession();
const scrutineer = new HttpSession();
const entrant = new HttpSession();
let classId = '';
let otherClassId = '';
let today = '';

/** The wall clock ("yyyy-MM-ddTHH:mm") in the zone, minutes from now: read with Intl, independent of the app. */
function wallClockIn(minutesFromNow: number): string {
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone: ZONE,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(new Date(Date.now() + minutesFromNow * 60_000));
  const p = Object.fromEntries(parts.map((x) => [x.type, x.value]));
  return `${p.year}-${p.month}-${p.day}T${p.hour}:${p.minute}`;
}

/** A start later today in the meeting's zone (a check-in matches the booking of its own meeting day): the given
 * minutes from now, or 23:59 when that would fall on the next day. */
function laterToday(minutesFromNow: number): string {
  const t = wallClockIn(minutesFromNow);
  const day = wallClockIn(0).slice(0, 10);
  return t.slice(0, 10) === day ? t : `${day}T23:59`;
}

const slotsUrl = () => `/api/events/${meeting.eventId}/slots`;
const entryUrl = (entryId: string) => `/api/events/${meeting.eventId}/slots/entries/${entryId}`;
const queueUrl = (day: string) => `/api/events/${meeting.eventId}/slots/queue?day=${day}`;

async function openSlot(body: Record<string, unknown>) {
  return chief.json(slotsUrl(), { classId, bay: 'Bay 1', durationMinutes: 20, capacity: 3, ...body });
}

/** A new entrant with a confirmed address, signed in, with an entry in the class. */
async function newEntrant(cls = classId): Promise<{ s: HttpSession; email: string; entry: TestEntry }> {
  const s = new HttpSession();
  const email = uniqueEmail('slot');
  await s.signUpAndConfirm({ name: 'Slot Entrant', email, password: 'slot-password-1' });
  return { s, email, entry: await meeting.addEntry(cls, { ownerEmail: email }) };
}

before(async () => {
  await meeting.create(`Slots Meeting ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  // The meeting runs from yesterday to tomorrow in its zone, so slots can start within the hour.
  await query(
    `update events set time_zone = $2::text, starts_on = (now() at time zone $2::text)::date - 1, ends_on = (now() at time zone $2::text)::date + 1 where id = $1`,
    [meeting.eventId, ZONE],
  );
  classId = await meeting.addClass('SL', rulesWith());
  otherClassId = await meeting.addClass('SO', rulesWith());
  today = wallClockIn(0).slice(0, 10);
  for (const [s, email] of [
    [chief, DEMO.chief],
    [scrutineer, DEMO.scrutineer],
    [entrant, DEMO.entrant],
  ] as const)
    assert.equal((await s.signInWithPassword(email, DEMO_PASSWORD)).status, 200);
});

test('the chief scrutineer opens a slot in the meeting zone; bad capacities, times and classes are refused, nothing stored', async () => {
  const startsAt = wallClockIn(180);
  const ok = await openSlot({ startsAt, capacity: 2, graceMinutes: 5 });
  assert.equal(ok.res.status, 201, JSON.stringify(ok.body));
  const [row] = await query<{ local: string; minutes: number }>(
    `select to_char(starts_at at time zone $2, 'YYYY-MM-DD"T"HH24:MI') as local,
            extract(epoch from ends_at - starts_at) / 60 as minutes from inspection_slots where id = $1`,
    [ok.body.data.id, ZONE],
  );
  assert.equal(
    row.local,
    startsAt,
    'stored as the instant of that wall-clock time in the zone (PostgreSQL AT TIME ZONE)',
  );
  assert.equal(Number(row.minutes), 20);

  const before = (await query('select id from inspection_slots where event_id = $1', [meeting.eventId])).length;
  const refusals: [Record<string, unknown>, string][] = [
    [{ startsAt, capacity: 0 }, 'capacity'],
    [{ startsAt, capacity: 1e9 }, 'capacity'],
    [{ startsAt, capacity: 2.5 }, 'capacity'],
    [{ startsAt, capacity: '3' }, 'capacity'],
    [{ startsAt, durationMinutes: 100000 }, 'durationMinutes'],
    [{ startsAt: '2020-01-01T10:00' }, 'startsAt'],
    [{ startsAt: `${today}T25:00` }, 'startsAt'],
    [{ startsAt: 'tomorrow morning' }, 'startsAt'],
    [{ startsAt, classId: randomUUID() }, 'classId'],
    [{ startsAt, bay: 'Bay\n2' }, 'bay'],
    [{ startsAt, bay: 'x'.repeat(41) }, 'bay'],
    [{ startsAt, graceMinutes: -1 }, 'graceMinutes'],
    [{ startsAt, extra: true }, '(body)'],
  ];
  for (const [body, field] of refusals) {
    const r = await openSlot(body);
    assert.equal(r.res.status, 400, `${JSON.stringify(body).slice(0, 80)}: ${JSON.stringify(r.body)}`);
    assert.equal(r.body.error.details[0].field, field, JSON.stringify(r.body));
  }
  // Four days after the meeting's last day: outside its days.
  const late = await openSlot({ startsAt: `${wallClockIn(4 * 24 * 60).slice(0, 10)}T10:00` });
  assert.equal(late.res.status, 400);
  assert.match(late.body.error.message, /meeting's days/);
  const after = (await query('select id from inspection_slots where event_id = $1', [meeting.eventId])).length;
  assert.equal(after, before, 'nothing stored for refused slots');

  // Only the chief scrutineer opens slots; the body is never read for others.
  assert.equal((await scrutineer.json(slotsUrl(), { startsAt, classId })).res.status, 403);
  assert.equal((await entrant.json(slotsUrl(), { startsAt, classId })).res.status, 403);
  assert.equal((await new HttpSession().json(slotsUrl(), {})).res.status, 401);
  assert.equal((await entrant.fetch(slotsUrl())).status, 403, 'an entrant does not read who is booked');
});

test('a slot booked, missed and re-booked; the queue shows late, then the new slot; bookings are append-only', async () => {
  const a = await openSlot({ startsAt: wallClockIn(120), bay: 'Bay A' });
  const b = await openSlot({ startsAt: wallClockIn(150), bay: 'Bay B' });
  const { s, entry } = await newEntrant();
  const booked = await s.json(entryUrl(entry.id), { slotId: a.body.data.id });
  assert.equal(booked.res.status, 201, JSON.stringify(booked.body));
  assert.equal(booked.body.data.slot.id, a.body.data.id);
  const list = await s.fetch(entryUrl(entry.id));
  const view = (await list.json()).data;
  assert.equal(view.booking.slot.bay, 'Bay A');
  assert.ok(
    view.slots.some((x: { id: string }) => x.id === b.body.data.id),
    'the later slot is offered',
  );

  // The slot's time passes with no check-in: the slot is moved into the past (slots are not append-only;
  // this stands in for the clock). 30 minutes after its start, with 10 minutes' grace, the boat is late.
  await query(
    `update inspection_slots set starts_at = now() - interval '30 minutes', ends_at = now() + interval '5 minutes' where id = $1`,
    [a.body.data.id],
  );
  const dayA = (
    await query<{ d: string }>(`select ((now() - interval '30 minutes') at time zone $1)::date::text as d`, [ZONE])
  )[0].d;
  const q1 = (await (await scrutineer.fetch(queueUrl(dayA))).json()).data;
  const rowA = q1.rows.find((r: { entryId: string }) => r.entryId === entry.id);
  assert.equal(rowA.status, 'late', JSON.stringify(rowA));
  assert.equal(rowA.bay, 'Bay A');

  // The entrant cannot take a slot that has started, but can move to a later one.
  const started = await openSlot({ startsAt: wallClockIn(150) });
  await query(`update inspection_slots set starts_at = now() - interval '1 minute' where id = $1`, [
    started.body.data.id,
  ]);
  const refused = await s.json(entryUrl(entry.id), { slotId: started.body.data.id });
  assert.equal(refused.res.status, 400);
  assert.equal(refused.body.error.details[0].field, 'slotId');
  const rebooked = await s.json(entryUrl(entry.id), { slotId: b.body.data.id });
  assert.equal(rebooked.res.status, 201, JSON.stringify(rebooked.body));
  assert.equal(rebooked.body.data.slot.bay, 'Bay B');
  const chain = await query<{ id: string; supersedes_id: string | null; slot_id: string }>(
    'select id, supersedes_id, slot_id from slot_bookings where entry_id = $1 order by created_at',
    [entry.id],
  );
  assert.equal(chain.length, 2);
  assert.equal(chain[1].supersedes_id, chain[0].id, 'the re-booking supersedes the missed one');
  const dayB = wallClockIn(150).slice(0, 10);
  const q2 = (await (await scrutineer.fetch(queueUrl(dayB))).json()).data;
  const rows = q2.rows.filter((r: { entryId: string }) => r.entryId === entry.id);
  assert.equal(rows.length, 1, 'only the current booking is in the queue');
  assert.equal(rows[0].bay, 'Bay B');
  assert.equal(rows[0].status, 'upcoming');
  // Booking the slot it already holds changes nothing.
  const again = await s.json(entryUrl(entry.id), { slotId: b.body.data.id });
  assert.equal(again.body.data.bookingId, rebooked.body.data.bookingId);
  await assert.rejects(
    query('update slot_bookings set slot_id = $2 where id = $1', [chain[1].id, a.body.data.id]),
    /append-only/,
  );
  await assert.rejects(query('delete from slot_bookings where id = $1', [chain[0].id]), /append-only/);
});

test("nobody books someone else's entry: another entrant, an official of another meeting, a scrutineer; a slot of another class is refused", async () => {
  const slot = await openSlot({ startsAt: wallClockIn(200) });
  const { entry } = await newEntrant();
  const other = await newEntrant();
  const elsewhere = new HttpSession();
  await elsewhere.signInWithPassword(DEMO.organiser, DEMO_PASSWORD); // the organiser of this meeting is not its chief scrutineer
  for (const [who, session] of [
    ['another entrant', other.s],
    ['a scrutineer', scrutineer],
    ['the demo entrant', entrant],
  ] as const) {
    const r = await session.json(entryUrl(entry.id), { slotId: slot.body.data.id });
    assert.equal(r.res.status, 404, `${who}: ${JSON.stringify(r.body)}`);
    assert.equal((await session.fetch(entryUrl(entry.id))).status, 404, who);
  }
  assert.equal((await new HttpSession().json(entryUrl(entry.id), { slotId: slot.body.data.id })).res.status, 401);
  const otherClass = await openSlot({ startsAt: wallClockIn(200), classId: otherClassId });
  const wrong = await other.s.json(entryUrl(other.entry.id), { slotId: otherClass.body.data.id });
  assert.equal(wrong.res.status, 400);
  assert.equal(wrong.body.error.details[0].field, 'slotId');
  const malformed = await other.s.json(entryUrl(other.entry.id), { slotId: 'x'.repeat(100_000) });
  assert.equal(malformed.res.status, 400);
  const huge = await other.s.fetch(entryUrl(other.entry.id), {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ slotId: slot.body.data.id, pad: 'x'.repeat(2 * 1024 * 1024) }),
  });
  assert.equal(huge.status, 413);
  assert.equal(
    (await query('select id from slot_bookings where entry_id = any($1::uuid[])', [[entry.id, other.entry.id]])).length,
    0,
    'nothing booked',
  );
  // The chief scrutineer assigns a slot to any entry of the meeting.
  const assigned = await chief.json(entryUrl(entry.id), { slotId: slot.body.data.id });
  assert.equal(assigned.res.status, 201, JSON.stringify(assigned.body));
});

test('two entrants taking the last place at once: one gets it, the other is told the slot is full', async () => {
  const slot = await openSlot({ startsAt: wallClockIn(240), capacity: 1 });
  const people = await Promise.all([newEntrant(), newEntrant(), newEntrant()]);
  const answers = await Promise.all(people.map((p) => p.s.json(entryUrl(p.entry.id), { slotId: slot.body.data.id })));
  const statuses = answers.map((a) => a.res.status).sort();
  assert.deepEqual(statuses, [201, 409, 409], JSON.stringify(answers.map((a) => a.body)));
  for (const a of answers.filter((x) => x.res.status === 409)) assert.equal(a.body.error.code, 'slot_full');
  const [{ n }] = await query<{ n: string }>('select count(*) as n from slot_bookings where slot_id = $1', [
    slot.body.data.id,
  ]);
  assert.equal(Number(n), 1);
});

test('the dock checks boats in once per key and booking, takes walk-ins, and refuses implausible times', async () => {
  const slot = await openSlot({ startsAt: laterToday(90) });
  const booked = await newEntrant();
  await booked.s.json(entryUrl(booked.entry.id), { slotId: slot.body.data.id });
  const arrivals = `/api/events/${meeting.eventId}/slots/arrivals`;
  const key = randomUUID();
  const body = { key, entryId: booked.entry.id, arrivedAt: new Date().toISOString(), bay: 'Bay 1' };
  const first = await scrutineer.json(arrivals, body);
  assert.equal(first.res.status, 201, JSON.stringify(first.body));
  assert.equal(first.body.data.walkIn, false);
  const retry = await scrutineer.json(arrivals, body);
  assert.equal(retry.body.data.id, first.body.data.id, 'the same key: the stored check-in');
  const otherKey = await scrutineer.json(arrivals, { ...body, key: randomUUID() });
  assert.equal(otherKey.body.data.id, first.body.data.id, 'the same booking: the first check-in');
  const reused = await scrutineer.json(arrivals, { ...body, entryId: (await newEntrant()).entry.id });
  assert.equal(reused.res.status, 409, 'a key names one boat');

  const walkIn = await newEntrant();
  const w = await scrutineer.json(arrivals, { ...body, key: randomUUID(), entryId: walkIn.entry.id });
  assert.equal(w.res.status, 201);
  assert.equal(w.body.data.walkIn, true);
  const q = (await (await scrutineer.fetch(queueUrl(w.body.data.meetingDay))).json()).data;
  const mine = q.rows.filter((r: { entryId: string }) => [booked.entry.id, walkIn.entry.id].includes(r.entryId));
  assert.deepEqual(
    mine.map((r: { status: string }) => r.status),
    ['arrived', 'arrived'],
  );
  assert.equal(mine.find((r: { walkIn: boolean }) => r.walkIn).entryId, walkIn.entry.id);
  assert.equal(
    (await query('select id from slot_arrivals where entry_id = any($1::uuid[])', [[booked.entry.id, walkIn.entry.id]]))
      .length,
    2,
  );

  for (const arrivedAt of [new Date(Date.now() + 3_600_000).toISOString(), '2001-01-01T00:00:00Z', 'now']) {
    const r = await scrutineer.json(arrivals, { ...body, key: randomUUID(), arrivedAt });
    assert.equal(r.res.status, 400, arrivedAt);
    assert.equal(r.body.error.details[0].field, 'arrivedAt');
  }
  assert.equal((await entrant.json(arrivals, body)).res.status, 403);
  assert.equal((await entrant.fetch(queueUrl(today))).status, 403);
  for (const day of ['9999-99-99', '2027-02-30', "2027-01-01' or 1=1--"]) {
    const r = await scrutineer.fetch(queueUrl(encodeURIComponent(day)));
    assert.equal(r.status, 400, day);
    assert.equal((await r.json()).error.details[0].field, 'day');
  }
  await assert.rejects(query('delete from slot_arrivals where id = $1', [first.body.data.id]), /append-only/);
});

test('a reminder is e-mailed before the slot, once per booking; a slot further off gets none yet', async () => {
  const soon = await openSlot({ startsAt: wallClockIn(30) });
  const later = await openSlot({ startsAt: wallClockIn(300) });
  const one = await newEntrant();
  const farOff = await newEntrant();
  assert.equal((await one.s.json(entryUrl(one.entry.id), { slotId: soon.body.data.id })).res.status, 201);
  assert.equal((await farOff.s.json(entryUrl(farOff.entry.id), { slotId: later.body.data.id })).res.status, 201);
  const mail = await waitForMail(one.email, { subject: /Scrutineering at/ });
  assert.match(mail.text, new RegExp(`no\\. ${one.entry.raceNumber}`));
  assert.match(mail.text, /Pacific\/Auckland/);
  // A later event that must happen: a second booking in the soon slot gets its reminder; by then the
  // worker has run again over the first booking, which must still have exactly one.
  const two = await newEntrant();
  await two.s.json(entryUrl(two.entry.id), { slotId: soon.body.data.id });
  await waitForMail(two.email, { subject: /Scrutineering at/ });
  const counts = await query<{ to_address: string; n: string }>(
    `select to_address, count(*) as n from mail_outbox where kind = 'slot_reminder' and to_address = any($1::text[]) group by 1`,
    [[one.email, farOff.email]],
  );
  assert.deepEqual(
    counts.map((c) => [c.to_address, Number(c.n)]),
    [[one.email, 1]],
  );
  await assert.rejects(
    query(`insert into slot_reminders (booking_id) select id from slot_bookings where entry_id = $1`, [one.entry.id]),
  );
});
