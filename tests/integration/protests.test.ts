// Protests through the real HTTP API, the database and the payments fake: the window at the API
// (results' published_at placed by SQL one minute inside or outside it), the fee paid once through
// the verified webhook, who may see and decide what, and bad input refused with nothing stored.
// Evidence, decisions and the audit trail: protest-evidence-decisions.test.ts. The 30-minute
// window is common practice (FIA International Sporting Code), no single source.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import type { HttpSession } from '../support/http-session';
import { query } from '../support/db';
import {
  EVENT,
  MAIN_CLASS,
  WINDOW_CLASS,
  ORGANISER_ID,
  DEMO_ENTRY,
  FAKE,
  competitor,
  person,
  waitFor,
  protestRow,
  lodge,
  lodgedProtest,
  setUpMeeting,
  type Competitor,
} from './protest-fixtures';

let steward: HttpSession;
let organiser: HttpSession;
let L: Competitor; // the protester
let T: Competitor; // the protested entrant
let O: Competitor; // another entrant at the meeting, party to nothing

before(async () => {
  ({ steward, organiser } = await setUpMeeting());
  [L, T, O] = [await competitor('lodger'), await competitor('target'), await competitor('other')];
});

test('results: only the organiser publishes; unknown race numbers are refused beside the row; a CSV upload makes the next version', async () => {
  const rows = [
    { position: 1, raceNumber: T.raceNumber },
    { position: 2, raceNumber: L.raceNumber },
    { position: 3, raceNumber: O.raceNumber },
  ];
  assert.equal((await L.s.json(`/api/events/${EVENT}/results`, { classId: MAIN_CLASS, rows })).res.status, 403);
  const bad = await organiser.json(`/api/events/${EVENT}/results`, {
    classId: MAIN_CLASS,
    rows: [...rows, { position: 4, raceNumber: 9876 }],
  });
  assert.equal(bad.res.status, 400);
  assert.deepEqual(bad.body.error.details, [
    { field: 'rows.3.raceNumber', message: 'No entry has race number 9876 at this meeting.' },
  ]);
  const gap = await organiser.json(`/api/events/${EVENT}/results`, {
    classId: MAIN_CLASS,
    rows: [
      { position: 1, raceNumber: T.raceNumber },
      { position: 1, raceNumber: L.raceNumber },
    ],
  });
  assert.equal(gap.res.status, 400);
  assert.equal(gap.body.error.details[0].field, 'rows.1.position');
  assert.equal(
    (await query('select 1 from provisional_results where class_id = $1', [MAIN_CLASS])).length,
    0,
    'nothing stored',
  );

  const v1 = await organiser.json(`/api/events/${EVENT}/results`, { classId: MAIN_CLASS, rows });
  assert.equal(v1.res.status, 201, JSON.stringify(v1.body));
  assert.equal(v1.body.data.latest.version, 1);
  const form = new FormData();
  form.append('classId', MAIN_CLASS);
  form.append(
    'file',
    new Blob([`position,race_number\r\n1,${L.raceNumber}\r\n2,${T.raceNumber}\r\n3,"${O.raceNumber}"\r\n`], {
      type: 'text/csv',
    }),
    'heat-2.csv',
  );
  const v2 = await organiser.fetch(`/api/events/${EVENT}/results`, { method: 'POST', body: form });
  const v2body = await v2.json();
  assert.equal(v2.status, 201, JSON.stringify(v2body));
  assert.equal(v2body.data.latest.version, 2);
  assert.equal(v2body.data.latest.source, 'csv');
  const [stored] = await query<{ changed_entry_ids: string[]; id: string }>(
    'select id, changed_entry_ids from provisional_results where class_id = $1 and version = 2',
    [MAIN_CLASS],
  );
  assert.deepEqual(
    stored.changed_entry_ids.sort(),
    [L.entryId, T.entryId].sort(),
    'only the two boats that swapped places',
  );
  await assert.rejects(
    query('update provisional_results set rows = $1::jsonb where id = $2', ['[]', stored.id]),
    /append-only/,
  );
});

test('the window at the API: one minute inside is lodged (awaiting the fee), one minute outside is refused with the deadline; a later version restarts it only for what changed', async () => {
  const [x, y] = [await competitor('window-x', WINDOW_CLASS), await competitor('window-y', WINDOW_CLASS)];
  // Version 1 published 31 minutes ago (both boats), version 2 29 minutes ago (only y moved).
  await query(
    `insert into provisional_results (event_id, class_id, version, published_at, published_by_id, rows, changed_entry_ids, source)
     values ($1, $2, 1, now() - interval '31 minutes', $3, $4::jsonb, $5::jsonb, 'form'),
            ($1, $2, 2, now() - interval '29 minutes', $3, $6::jsonb, $7::jsonb, 'form')`,
    [
      EVENT,
      WINDOW_CLASS,
      ORGANISER_ID,
      JSON.stringify([
        { position: 1, raceNumber: x.raceNumber, entryId: x.entryId },
        { position: 2, raceNumber: y.raceNumber, entryId: y.entryId },
      ]),
      JSON.stringify([x.entryId, y.entryId]),
      JSON.stringify([{ position: 1, raceNumber: x.raceNumber, entryId: x.entryId }]),
      JSON.stringify([y.entryId]),
    ],
  );
  const late = await lodge(L, { againstEntryId: x.entryId });
  assert.equal(late.res.status, 409);
  assert.equal(late.body.error.code, 'out_of_time');
  assert.match(
    late.body.error.message,
    /^The protest window closed at \w{3} \d{1,2} \w{3} 2\d{3}, \d{2}:\d{2} UTC\+1[23]:00 \(Pacific\/Auckland\)\.$/,
  );
  assert.equal(late.body.error.details[0].field, 'againstEntryId');
  const inTime = await lodge(L, { againstEntryId: y.entryId });
  assert.equal(inTime.res.status, 201, JSON.stringify(inTime.body));
  assert.equal(inTime.body.data.status, 'awaiting_fee');
  const [check] = await query<{ ok: boolean }>(
    // Within a millisecond: PostgreSQL keeps microseconds, JavaScript dates milliseconds.
    `select abs(extract(epoch from p.window_deadline - (r.published_at + interval '30 minutes'))) < 0.001 as ok from protests p join provisional_results r on r.id = p.results_version_id where p.id = $1 and r.version = 2`,
    [inTime.body.data.id],
  );
  assert.equal(check?.ok, true, 'the deadline runs from the version that changed the boat');
  assert.equal(
    (await query('select 1 from protests where against_entry_id = $1', [x.entryId])).length,
    0,
    'the late protest stored nothing',
  );
});

test('bad input: no grounds, one’s own entry, an entry of another meeting, a repeated matter — each a clear error beside its field, nothing stored', async () => {
  const before = (
    await query<{ n: number }>('select count(*)::int as n from protests where lodged_by_id = $1', [L.id])
  )[0].n;
  const noGrounds = await lodge(L, { againstEntryId: T.entryId, grounds: '' });
  assert.equal(noGrounds.res.status, 400);
  assert.ok(
    noGrounds.body.error.details.some(
      (d: { field: string; message: string }) => d.field === 'grounds' && /Write the grounds/.test(d.message),
    ),
  );
  const own = await lodge(L, { againstEntryId: L.entryId });
  assert.equal(own.res.status, 400);
  assert.deepEqual(own.body.error.details, [
    { field: 'againstEntryId', message: 'You cannot protest your own entry.' },
  ]);
  const elsewhere = await lodge(L, { againstEntryId: DEMO_ENTRY });
  assert.equal(elsewhere.res.status, 400);
  assert.match(elsewhere.body.error.details[0].message, /another meeting/);
  const outsider = await person('outsider');
  assert.equal(
    (await lodge(outsider, { againstEntryId: T.entryId })).res.status,
    403,
    'only entrants of the meeting protest',
  );
  assert.equal((await query('select count(*)::int as n from protests where lodged_by_id = $1', [L.id]))[0].n, before);
  const first = await lodge(L, { againstEntryId: T.entryId, ruleReference: 'TP 3.4 minimum weight' });
  assert.equal(first.res.status, 201);
  const again = await lodge(L, { againstEntryId: T.entryId, ruleReference: 'tp 3.4  Minimum WEIGHT' });
  assert.equal(again.res.status, 409, 'one protest per entrant per matter');
  assert.equal(again.body.error.details[0].field, 'ruleReference');
  assert.equal(
    (await query('select count(*)::int as n from protests where lodged_by_id = $1', [L.id]))[0].n,
    before + 1,
  );
});

test('the fee through the fake: a second checkout reopens the same session; the verified webhook lodges the protest; paying again is refused', async () => {
  const made = await lodge(L, { againstEntryId: T.entryId, ruleReference: 'TP 4.1 engine power band' });
  const id = made.body.data.id as string;
  const first = await (await L.s.fetch(`/api/protests/${id}/checkout`, { method: 'POST' })).json();
  const second = await (await L.s.fetch(`/api/protests/${id}/checkout`, { method: 'POST' })).json();
  assert.equal(second.data.url, first.data.url, 'the same payment page: the fee is not charged twice');
  assert.equal(
    (await T.s.fetch(`/api/protests/${id}/checkout`, { method: 'POST' })).status,
    404,
    'the protested entrant cannot see an unpaid protest',
  );
  const sessionId = (await protestRow(id)).checkout_session_id as string;
  assert.equal(first.data.url, `${FAKE}/pay/${sessionId}`);
  assert.equal((await protestRow(id)).status, 'awaiting_fee', 'opening the page pays nothing');
  await fetch(`${FAKE}/_fake/sessions/${sessionId}/pay`, { method: 'POST' });
  const row = await waitFor('lodged', async () => {
    const r = await protestRow(id);
    return r.status === 'lodged' && r.paid_at ? r : null;
  });
  assert.match(String(row.payment_intent_id), /^pi_/);
  const third = await L.s.fetch(`/api/protests/${id}/checkout`, { method: 'POST' });
  assert.equal(third.status, 409);
  assert.equal((await third.json()).error.code, 'already_paid');
  const audit = await query<{ action: string; actor_id: string | null }>(
    `select action, actor_id from audit_events where subject_id = $1 order by id`,
    [id],
  );
  assert.deepEqual(
    audit.map((a) => a.action),
    ['protest.submitted', 'protest.checkout_opened', 'protest.lodged'],
  );
  assert.equal(audit[2].actor_id, null, 'lodged by the verified webhook, not a person');
});

test('permissions: parties see their protest, other entrants get 404; only the meeting’s stewards accept and decide (organiser and entrants 403)', async () => {
  const { id } = await lodgedProtest(L, T, 'TP 5.2 safety equipment');
  assert.equal((await L.s.fetch(`/api/protests/${id}`)).status, 200);
  assert.equal(
    (await T.s.fetch(`/api/protests/${id}`)).status,
    200,
    'the protested entrant is a party once it is lodged',
  );
  assert.equal((await O.s.fetch(`/api/protests/${id}`)).status, 404);
  assert.equal((await O.s.fetch(`/api/protests/${id}/evidence`)).status, 404);
  assert.equal((await organiser.fetch(`/api/protests/${id}`)).status, 200);
  const mineOnly = (await (await O.s.fetch(`/api/events/${EVENT}/protests`)).json()).data;
  assert.equal(mineOnly.scope, 'own');
  assert.ok(!mineOnly.items.some((p: { id: string }) => p.id === id));
  const all = (await (await steward.fetch(`/api/events/${EVENT}/protests`)).json()).data;
  assert.equal(all.scope, 'all');
  assert.ok(all.items.some((p: { id: string }) => p.id === id));
  const decision = { outcome: 'upheld', reasons: 'The boat carried no fire extinguisher at the start.' };
  assert.equal((await organiser.json(`/api/protests/${id}/accept`, {})).res.status, 403);
  assert.equal((await L.s.json(`/api/protests/${id}/accept`, {})).res.status, 403);
  assert.equal((await steward.json(`/api/protests/${id}/accept`, {})).res.status, 200);
  assert.equal((await organiser.json(`/api/protests/${id}/decision`, decision)).res.status, 403);
  assert.equal((await T.s.json(`/api/protests/${id}/decision`, decision)).res.status, 403);
  assert.equal((await O.s.json(`/api/protests/${id}/decision`, decision)).res.status, 404);
  assert.equal((await protestRow(id)).status, 'accepted', 'no refused call changed anything');
});
