// No pass, no start, through the real HTTP API and database: the start list of a meeting day built from
// each entry's state now (payment, the current inspection, open re-inspections), the organiser's decisions
// with their reasons (append-only), the CSV for the timing system, and who may read or decide.
// Verdicts are the worked decisions of ISO 14253-1:2017 for an upper limit of 102.00 mm with U 0.05 mm
// (101.90 mm conforms, 102.06 mm does not conform); the rest is common practice at meetings, no source.
// Runs alone (scripts/test.sh): it counts every start decision (nothing stored on refusal).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
const steward = new HttpSession();
const entrant = new HttpSession();
let classId = '';
const e: Record<'clear' | 'unpaid' | 'failed' | 'changed' | 'waiting', TestEntry> = {} as never;
const list = (s: HttpSession, q = '') => s.fetch(`/api/events/${meeting.eventId}/start-list${q}`);
type Row = { raceNumber: number; verdict: { mayStart: boolean; holds: string[]; basis: string; decision: unknown } };
const rowOf = (rows: Row[], t: TestEntry) => rows.find((r) => r.raceNumber === t.raceNumber)!;

const driver = {
  role: 'driver',
  name: 'Mere Startline',
  bornOn: '1990-03-14',
  licence: { issuedBy: 'Invented Racing Body', grade: 'A', number: 'IRB-5150', expiresOn: '2030-12-31' },
  medicalExpiresOn: '2030-12-31',
  gear: [{ kind: 'helmet', standard: 'Invented Std 7', serial: 'HM-51', dateKind: 'expires', dueOn: '2027-05-01' }],
};

before(async () => {
  await meeting.create(`Start List Meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  classId = await meeting.addClass('SL', rulesWith({ decisionRule: 'iso14253', safetyItems: ['helmet'] }));
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  e.clear = await meeting.addEntry(classId);
  e.unpaid = await meeting.addEntry(classId);
  e.failed = await meeting.addEntry(classId);
  e.changed = await meeting.addEntry(classId);
  e.waiting = await meeting.addEntry(classId);
  await query(`update entries set status = 'awaiting_payment', paid_at = null where id = $1`, [e.unpaid.id]);
  // A driver in order with dated gear on every boat but the one still waiting (invented person and body).
  for (const t of [e.clear, e.unpaid, e.failed, e.changed]) {
    const crew = await entrant.json(`/api/entries/${t.id}/crew`, { members: [driver], boatGear: [] }, 'PUT');
    assert.equal(crew.res.status, 200, JSON.stringify(crew.body));
  }
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  await steward.signInWithPassword(DEMO.steward, DEMO_PASSWORD);
  const record = async (t: TestEntry, largest: number) => {
    const r = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, {
      ...inspectionBody(t.id, largest),
      declarationVersion: 1,
    });
    assert.equal(r.res.status, 201, JSON.stringify(r.body));
  };
  await record(e.clear, 101.9);
  await record(e.unpaid, 101.9);
  await record(e.failed, 102.06);
  await record(e.changed, 101.9);
  // The owner raises the declared power after the inspection: re-inspection required.
  const owner = new HttpSession();
  await owner.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  const patched = await owner.json(`/api/boats/${e.changed.boatId}`, { power: 260, powerUnit: 'kW' }, 'PATCH');
  assert.equal(patched.res.status, 200, JSON.stringify(patched.body));
});

test('each boat may start or is held with every reason, from its state now', async () => {
  const res = await list(scrutineer, '?day=2027-05-01');
  assert.equal(res.status, 200);
  const data = (await res.json()).data as { day: string; days: string[]; rows: Row[]; counts: Record<string, number> };
  assert.equal(data.day, '2027-05-01');
  assert.deepEqual(data.days, ['2027-05-01', '2027-05-02']);
  assert.deepEqual(rowOf(data.rows, e.clear).verdict, {
    mayStart: true,
    holds: [],
    basis: 'clear',
    decision: null,
    newSinceDecision: [],
  });
  assert.deepEqual(rowOf(data.rows, e.unpaid).verdict.holds, ['Entry fee not paid.']);
  assert.deepEqual(rowOf(data.rows, e.failed).verdict.holds, ['Inspection: does not conform.']);
  const changed = rowOf(data.rows, e.changed).verdict;
  assert.equal(changed.mayStart, false);
  assert.match(changed.holds.join(' '), /Not inspected \(or its declaration changed/);
  assert.match(changed.holds.join(' '), /Re-inspection required: .*power/i);
  assert.deepEqual(rowOf(data.rows, e.waiting).verdict.holds, [
    'Not inspected (or its declaration changed since the inspection).',
    'No crew or gear declared: the driver, their licence and the safety gear cannot be checked.',
  ]);
  assert.deepEqual(data.counts, { total: 5, mayStart: 1, held: 4, byOrganiser: 0 });
});

test('the organiser lets a held boat start and holds a clear one, with reasons kept; the list and CSV show it', async () => {
  const decide = (body: Record<string, unknown>) =>
    meeting.organiser.json(`/api/events/${meeting.eventId}/start-list/decisions`, body);
  const allow = await decide({
    entryId: e.failed.id,
    day: '2027-05-01',
    mayStart: true,
    reason: 'Restrictor fitted and sealed at the slipway, measured 101.80 mm',
  });
  assert.equal(allow.res.status, 201, JSON.stringify(allow.body));
  const hold = await decide({ entryId: e.clear.id, day: '2027-05-01', mayStart: false, reason: 'Hull seen leaking' });
  assert.equal(hold.res.status, 201, JSON.stringify(hold.body));

  const day1 = (await (await list(steward, `?day=2027-05-01&class=${classId}`)).json()).data as { rows: Row[] };
  const failed = rowOf(day1.rows, e.failed).verdict;
  assert.equal(failed.mayStart, true);
  assert.equal(failed.basis, 'organiser');
  assert.deepEqual(failed.holds, ['Inspection: does not conform.'], 'the hold stays shown beside the decision');
  assert.match(JSON.stringify(failed.decision), /Restrictor fitted/);
  assert.equal(rowOf(day1.rows, e.clear).verdict.mayStart, false);
  // A decision is for its day only.
  const day2 = (await (await list(steward, '?day=2027-05-02')).json()).data as { rows: Row[] };
  assert.equal(rowOf(day2.rows, e.failed).verdict.mayStart, false);
  // On the second day the clear boat's helmet (valid through 1 May in the meeting's zone) has expired:
  // it is held for that, and the first day's decision does not carry over.
  assert.deepEqual(rowOf(day2.rows, e.clear).verdict, {
    mayStart: false,
    holds: ['Driver Mere Startline: helmet HM-51: expires on Sat 1 May 2027, past.'],
    basis: 'held',
    decision: null,
    newSinceDecision: [],
  });

  const csv = await list(scrutineer, '?day=2027-05-01&format=csv');
  assert.equal(csv.status, 200);
  assert.match(csv.headers.get('content-type') ?? '', /^text\/csv/);
  assert.match(csv.headers.get('content-disposition') ?? '', /start-list-2027-05-01-all\.csv/);
  const lines = (await csv.text()).trim().split('\r\n');
  assert.equal(lines[0], 'day,race_number,boat,class,entrant,may_start,held_for,organiser_decision');
  assert.equal(lines.length, 6);
  const failedLine = lines.find((l) => l.startsWith(`2027-05-01,${e.failed.raceNumber},`))!;
  assert.match(failedLine, /,yes,Inspection: does not conform\.,"?allowed by .*Restrictor fitted/);

  // A hold that arises after the "may start" (a steward orders a re-inspection) holds the boat again.
  const ordered = await steward.json(`/api/events/${meeting.eventId}/reinspections`, {
    entryIds: [e.failed.id],
    reason: 'Protest hearing: measure the nozzle again',
  });
  assert.equal(ordered.res.status, 201, JSON.stringify(ordered.body));
  const after = (await (await list(steward, '?day=2027-05-01')).json()).data as { rows: Row[] };
  const again = rowOf(after.rows, e.failed).verdict as Row['verdict'] & { newSinceDecision: string[] };
  assert.equal(again.mayStart, false);
  assert.equal(again.basis, 'held');
  assert.deepEqual(again.newSinceDecision, ['Re-inspection required: Protest hearing: measure the nozzle again.']);

  // Decisions are append-only in the database.
  await assert.rejects(query(`update start_decisions set may_start = false where entry_id = $1`, [e.failed.id]));
  await assert.rejects(query(`delete from start_decisions where entry_id = $1`, [e.failed.id]));
});

test('a re-inspection task is answered only by a boat measured after it was opened', async () => {
  const [task] = await query<{ id: string }>(
    'select id from reinspections where entry_id = $1 and done_at is null order by created_at desc limit 1',
    [e.failed.id],
  );
  const post = (capturedAt: string) =>
    scrutineer.json(`/api/events/${meeting.eventId}/inspections`, {
      ...inspectionBody(e.failed.id, 101.9, { reinspectionId: task.id, capturedAt }),
      declarationVersion: 1,
    });
  // Captured half an hour before the steward ordered it (a phone's clock may be minutes off, not thirty):
  // the record is kept, the task stays open and the boat stays held for it.
  const early = await post(new Date(Date.now() - 30 * 60_000).toISOString());
  assert.equal(early.res.status, 201, JSON.stringify(early.body));
  const [open] = await query<{ done_at: Date | null }>('select done_at from reinspections where id = $1', [task.id]);
  assert.equal(open.done_at, null);
  const now = await post(new Date().toISOString());
  assert.equal(now.res.status, 201, JSON.stringify(now.body));
  const [done] = await query<{ inspection_id: string }>('select inspection_id from reinspections where id = $1', [
    task.id,
  ]);
  assert.equal(done.inspection_id, now.body.data.id);
});

test('bad input is refused by field and stores nothing', async () => {
  const before = Number((await query<{ n: string }>('select count(*) as n from start_decisions'))[0].n);
  const url = `/api/events/${meeting.eventId}/start-list/decisions`;
  const cases: [Record<string, unknown>, string][] = [
    [{ entryId: e.clear.id, day: '2027-06-01', mayStart: true, reason: 'outside the meeting' }, 'day'],
    [{ entryId: e.clear.id, day: '1 May', mayStart: true, reason: 'bad day' }, 'day'],
    [{ entryId: e.clear.id, day: '2027-05-01', mayStart: true, reason: '  ' }, 'reason'],
    [{ entryId: e.clear.id, day: '2027-05-01', mayStart: true, reason: 'x'.repeat(501) }, 'reason'],
    [{ entryId: e.clear.id, day: '2027-05-01', mayStart: 'yes', reason: 'a string' }, 'mayStart'],
    [
      { entryId: '00000000-0000-4000-8000-000000000000', day: '2027-05-01', mayStart: true, reason: 'no entry' },
      'entryId',
    ],
    [{ entryId: e.clear.id, day: '2027-05-01', mayStart: true, reason: 'extra', extra: 1 }, ''],
  ];
  for (const [body, field] of cases) {
    const r = await meeting.organiser.json(url, body);
    assert.equal(r.res.status, 400, JSON.stringify(body));
    if (field) assert.ok(JSON.stringify(r.body.error.details ?? []).includes(`"${field}"`), JSON.stringify(r.body));
  }
  const huge = await meeting.organiser.fetch(url, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ reason: 'x'.repeat(100_000) }),
  });
  assert.equal(huge.status, 413);
  const badDay = await list(scrutineer, '?day=2027-05-03');
  assert.equal(badDay.status, 400);
  assert.equal((await list(scrutineer, '?class=NOPE')).status, 400);
  assert.equal(Number((await query<{ n: string }>('select count(*) as n from start_decisions'))[0].n), before);
});

test('an organiser who owns a boat cannot decide on its start', async () => {
  const own = await meeting.addEntry(classId, { ownerEmail: DEMO.organiser });
  const r = await meeting.organiser.json(`/api/events/${meeting.eventId}/start-list/decisions`, {
    entryId: own.id,
    day: '2027-05-01',
    mayStart: true,
    reason: 'my own boat, please',
  });
  assert.equal(r.res.status, 403, JSON.stringify(r.body));
  assert.equal(r.body.error.code, 'own_boat');
  assert.equal((await query('select id from start_decisions where entry_id = $1', [own.id])).length, 0);
});

test('an entrant and the scrutineer cannot decide; an entrant cannot read the list', async () => {
  const body = { entryId: e.failed.id, day: '2027-05-01', mayStart: true, reason: 'my own boat please' };
  const url = `/api/events/${meeting.eventId}/start-list/decisions`;
  assert.equal((await scrutineer.json(url, body)).res.status, 403);
  assert.ok([403, 404].includes((await entrant.json(url, body)).res.status));
  assert.ok([403, 404].includes((await list(entrant)).status));
  assert.equal((await new HttpSession().fetch(`/api/events/${meeting.eventId}/start-list`)).status, 401);
});
