// Conflicts of interest through the real HTTP API, the database and the payments fake: a steward
// who is a party to a protest (lodged it from their own entered boat) or who declared an interest
// in a party's boat is refused every steward step; a steward without an interest takes them; the
// register of declared interests is append-only and seen whole only by the meeting's stewards and
// organiser; the decision names the deciding stewards. That an official with a personal interest
// must not hear or decide a matter is the general rule of natural justice (nemo iudex in causa
// sua), applied to sports officials as common practice, no single source.
// Runs alone (scripts/test.sh): it counts every declared interest (nothing stored on refusal) and adds staff at the
// demo meeting.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import type { HttpSession } from '../support/http-session';
import { query } from '../support/db';
import { DEMO } from '../support/env';
import { extractPdfText } from '../support/pdf-text';
import {
  EVENT,
  STEWARD_ID,
  DEMO_ENTRY,
  competitor,
  person,
  lodgedProtest,
  publishResults,
  setUpMeeting,
  protestRow,
  type Competitor,
  type Person,
} from './protest-fixtures';

const COI_CLASS = '7e570000-0000-4000-8000-000000000705';
let steward: HttpSession; // the demo steward: no interest in anything here
let organiser: HttpSession;
let S1: Competitor; // a steward of the meeting who also races here, and protests
let S2: Person; // a steward who declares interests
let T: Competitor; // the protested entrant
let X: Competitor; // another entrant, party to nothing
let scrutineer: Person; // an official of the meeting who is not a steward
let elsewhere: Person; // a steward of another meeting
let stewardName: string;
let protestId: string;

const interests = (s: HttpSession, eventId = EVENT) => s.fetch(`/api/events/${eventId}/interests`);
const declare = (s: HttpSession, body: Record<string, unknown>) => s.json(`/api/events/${EVENT}/interests`, body);
const withdraw = (s: HttpSession, id: string, reason = 'Declared by mistake.') =>
  s.json(`/api/events/${EVENT}/interests/${id}/withdraw`, { reason });
const step = (s: HttpSession, path: string, body: Record<string, unknown>) =>
  s.json(`/api/protests/${protestId}/${path}`, body);
const boatOf = async (c: Competitor) =>
  (await query<{ boat_id: string }>('select boat_id from entries where id = $1', [c.entryId]))[0].boat_id;
const view = async (s: HttpSession) => (await (await s.fetch(`/api/protests/${protestId}`)).json()).data;

before(async () => {
  ({ steward, organiser } = await setUpMeeting());
  await query(
    `insert into race_classes (id, event_id, name, code) values ($1, $2, 'Test TC', 'TC') on conflict do nothing`,
    [COI_CLASS, EVENT],
  );
  [S1, T, X] = [
    await competitor('coi-steward-racer', COI_CLASS),
    await competitor('coi-target', COI_CLASS),
    await competitor('coi-other', COI_CLASS),
  ];
  [S2, scrutineer, elsewhere] = [
    await person('coi-steward-declares'),
    await person('coi-scrutineer'),
    await person('coi-steward-elsewhere'),
  ];
  await query(
    `insert into event_staff (event_id, user_id, role) values ($1, $2, 'steward'), ($1, $3, 'steward'), ($1, $4, 'scrutineer'), ($5, $6, 'steward')`,
    [EVENT, S1.id, S2.id, scrutineer.id, DEMO.meetingId, elsewhere.id],
  );
  [{ name: stewardName }] = await query<{ name: string }>('select name from users where id = $1', [STEWARD_ID]);
  await publishResults(organiser, COI_CLASS, [T, S1, X]);
});

test('a party steward refused: the steward who lodged the protest from their own boat cannot accept, reject, hear, re-inspect or decide it; another steward can', async () => {
  // An interest withdrawn before the protest was lodged does not count.
  const early = await declare(S2.s, {
    kind: 'entrant',
    entrantId: S1.id,
    statement: 'We share a trailer to meetings.',
  });
  assert.equal(early.res.status, 201, JSON.stringify(early.body));
  assert.equal((await withdraw(S2.s, early.body.data.id, 'We no longer share the trailer.')).res.status, 201);

  ({ id: protestId } = await lodgedProtest(S1, T, 'TC 2.1 nozzle exit diameter maximum'));
  const refused = await step(S1.s, 'accept', { note: '' });
  assert.equal(refused.res.status, 403, JSON.stringify(refused.body));
  assert.equal(refused.body.error.code, 'conflict_of_interest');
  assert.match(
    refused.body.error.message,
    /^You have an interest in this protest \(you lodged this protest\): another steward of this meeting must accept, hear and decide it\.$/,
  );
  assert.equal(
    (await step(S1.s, 'reject', { code: 'wrong_form', reasons: 'Not in the required form.' })).res.status,
    403,
  );
  assert.equal(
    (await step(S1.s, 'decision', { outcome: 'withdrawn', reasons: 'The protester withdrew it at the desk.' })).res
      .status,
    403,
  );
  assert.equal((await protestRow(protestId)).status, 'lodged', 'nothing changed');
  const seenByS1 = await view(S1.s);
  assert.ok(seenByS1.viewerConflict.includes('you lodged this protest'), JSON.stringify(seenByS1.viewerConflict));
  assert.equal(
    seenByS1.can.accept || seenByS1.can.reject || seenByS1.can.decide,
    false,
    'the page offers no steward step',
  );
  const seenByS2 = await view(S2.s);
  assert.deepEqual(seenByS2.viewerConflict, [], 'the withdrawn interest predates the protest');
  assert.equal(seenByS2.can.accept, true);

  const accepted = await step(steward, 'accept', { note: 'In time, fee paid.' });
  assert.equal(accepted.res.status, 200, JSON.stringify(accepted.body));
  assert.equal((await step(S1.s, 'hearing', { hearingAt: '2030-01-01T10:00', place: 'Race office' })).res.status, 403);
  assert.equal((await step(S1.s, 'reinspection', { reason: 'Measure the nozzle exit again.' })).res.status, 403);
  assert.equal(
    (await step(S1.s, 'decision', { outcome: 'upheld', reasons: 'The nozzle exit measured over the maximum.' })).res
      .status,
    403,
  );
  assert.equal((await protestRow(protestId)).status, 'accepted');
  const stewards = (await view(steward)).stewardConflicts as { name: string; reasons: string[] }[];
  assert.ok(
    stewards.some((c) => c.reasons.some((r) => /lodged this protest/.test(r))),
    'the other stewards see who has an interest',
  );
});

test('a steward who declared an interest in the protested boat is refused, and withdrawing it afterwards does not clear it; nor can they sit on the panel', async () => {
  const made = await declare(S2.s, {
    kind: 'boat',
    boatId: await boatOf(T),
    statement: 'I am the crew chief of this boat.',
  });
  assert.equal(made.res.status, 201, JSON.stringify(made.body));
  assert.match(made.body.data.subjectLabel, /coi-target boat \(TC\)$/);
  const again = await declare(S2.s, { kind: 'boat', boatId: await boatOf(T), statement: 'Crew chief, again.' });
  assert.equal(again.res.status, 409, 'one standing declaration per boat');
  const hearing = await step(S2.s, 'hearing', { hearingAt: '2030-01-01T10:00', place: 'Race office' });
  assert.equal(hearing.res.status, 403);
  assert.match(
    hearing.body.error.message,
    /you declared an interest in boat coi-target boat \("I am the crew chief of this boat\."\)/,
  );
  assert.equal((await withdraw(S2.s, made.body.data.id)).res.status, 201);
  const decided = await step(S2.s, 'decision', {
    outcome: 'dismissed',
    reasons: 'The nozzle exit measured within the maximum.',
  });
  assert.equal(decided.res.status, 403, 'withdrawn after the protest came in: still an interest in it');

  // The protested entrant, were they a steward of the meeting, is refused too.
  await query(`insert into event_staff (event_id, user_id, role) values ($1, $2, 'steward')`, [EVENT, T.id]);
  try {
    const own = await step(T.s, 'hearing', { hearingAt: '2030-01-01T10:00', place: 'Race office' });
    assert.equal(own.res.status, 403);
    assert.match(own.body.error.message, /you entered or own the protested boat/);
  } finally {
    await query(`delete from event_staff where event_id = $1 and user_id = $2 and role = 'steward'`, [EVENT, T.id]);
  }

  const panel = await step(steward, 'decision', {
    outcome: 'dismissed',
    reasons: 'The nozzle exit measured within the maximum.',
    panelIds: [S2.id],
  });
  assert.equal(panel.res.status, 400);
  assert.equal(panel.body.error.details[0].field, 'panelIds');
  assert.match(
    panel.body.error.details[0].message,
    /coi-steward-declares Tester has an interest in this protest and cannot sit on the panel\./,
  );
  assert.equal((await protestRow(protestId)).status, 'accepted', 'nothing decided');
});

test('a steward without an interest hears and decides; the decision, its page data and its PDF name the deciding steward', async () => {
  assert.equal(
    (await step(steward, 'hearing', { hearingAt: '2030-01-01T10:00', place: 'Race office' })).res.status,
    200,
  );
  const decided = await step(steward, 'decision', {
    outcome: 'dismissed',
    reasons: 'The nozzle exit measured within the maximum at re-inspection.',
  });
  assert.equal(decided.res.status, 200, JSON.stringify(decided.body));
  assert.deepEqual(decided.body.data.decidedByNames, [stewardName]);
  const row = await protestRow(protestId);
  assert.deepEqual(row.decided_by_ids, [STEWARD_ID]);
  assert.deepEqual(row.decided_by_names, [stewardName], 'the names are kept on the decision itself');
  // A later rename does not rewrite who decided.
  await query(`update users set name = name || ' (renamed)' where id = $1`, [STEWARD_ID]);
  try {
    assert.deepEqual((await view(T.s)).decidedByNames, [stewardName]);
    const pdf = await T.s.fetch(`/api/protests/${protestId}/decision.pdf`);
    assert.equal(pdf.status, 200);
    const text = (await extractPdfText(new Uint8Array(await pdf.arrayBuffer()))).join('\n');
    assert.match(text, new RegExp(`Stewards: ${stewardName}`));
  } finally {
    await query(`update users set name = $2 where id = $1`, [STEWARD_ID, stewardName]);
  }
  assert.deepEqual((await view(T.s)).stewardConflicts, [], 'the parties do not see the stewards’ interests');
});

test('the register: officials of the meeting declare their own; stewards and the organiser see all of it; an entrant and a steward of another meeting see none', async () => {
  const team = await declare(scrutineer.s, {
    kind: 'team',
    teamName: 'Kelda Jet Racing',
    statement: 'My brother runs this team.',
  });
  assert.equal(team.res.status, 201, JSON.stringify(team.body));
  const stewardTeam = await declare(S2.s, {
    kind: 'team',
    teamName: 'Tarn Valley Sprint',
    statement: 'I am a member of this club.',
  });
  assert.equal(stewardTeam.res.status, 201);

  for (const s of [steward, organiser]) {
    const res = await interests(s);
    assert.equal(res.status, 200);
    const { data } = await res.json();
    assert.equal(data.isWholeRegister, true);
    const mine = data.items.filter((i: { officialId: string }) => i.officialId === S2.id);
    assert.ok(mine.length >= 3, 'every declaration, withdrawn ones included');
    assert.ok(
      mine.some(
        (i: { withdrawal: { reason: string } | null }) => i.withdrawal?.reason === 'We no longer share the trailer.',
      ),
    );
    assert.ok(
      data.items.some((i: { officialId: string; kind: string }) => i.officialId === scrutineer.id && i.kind === 'team'),
    );
  }
  const own = await (await interests(scrutineer.s)).json();
  assert.equal(own.data.isWholeRegister, false);
  assert.deepEqual(
    own.data.items.map((i: { officialId: string }) => i.officialId),
    [scrutineer.id],
    'a scrutineer sees only their own',
  );
  assert.ok(
    own.data.choices.boats.some((b: { id: string }) => b.id),
    'and the meeting’s boats to declare against',
  );

  assert.equal((await interests(X.s)).status, 403, 'an entrant');
  assert.equal(
    (await declare(X.s, { kind: 'team', teamName: 'Anything', statement: 'I want to be in the register.' })).res.status,
    403,
  );
  assert.equal((await interests(elsewhere.s)).status, 403, 'a steward of another meeting');
  assert.equal((await interests(elsewhere.s, DEMO.meetingId)).status, 200, 'who does see their own meeting’s');
  // The stewards' protest page lists the stewards' team interests to check by hand.
  assert.ok(
    (await view(steward)).stewardTeamInterests.some((t: { teamName: string }) => t.teamName === 'Tarn Valley Sprint'),
  );
});

test('the register refuses bad input beside its field, others’ declarations are 404, and the database refuses edits', async () => {
  const countBefore = (await query('select count(*)::int as n from official_interests'))[0].n;
  const [demoBoat] = await query<{ boat_id: string }>('select boat_id from entries where id = $1', [DEMO_ENTRY]);
  const cases: [Record<string, unknown>, string][] = [
    [{ kind: 'boat', boatId: demoBoat.boat_id, statement: 'A boat of another meeting.' }, 'boatId'],
    [{ kind: 'entrant', entrantId: STEWARD_ID, statement: 'Not an entrant here.' }, 'entrantId'],
    [{ kind: 'team', teamName: 'Kelda Jet Racing', statement: '' }, 'statement'],
    [{ kind: 'spaceship', statement: 'Nothing of the kind.' }, 'kind'],
    [{ kind: 'team', teamName: 'X Team', statement: 'Fine statement.', extra: 1 }, '(body)'],
  ];
  for (const [body, field] of cases) {
    const r = await declare(S2.s, body);
    assert.equal(r.res.status, 400, JSON.stringify(r.body));
    assert.equal(r.body.error.details[0].field, field, JSON.stringify(r.body));
  }
  assert.equal(
    (
      await S2.s.fetch(`/api/events/${EVENT}/interests`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: '{"kind":',
      })
    ).status,
    400,
  );
  assert.equal((await query('select count(*)::int as n from official_interests'))[0].n, countBefore, 'nothing stored');

  const [theirs] = await query<{ id: string }>(
    'select id from official_interests where official_id = $1 order by declared_at limit 1',
    [S2.id],
  );
  assert.equal((await withdraw(scrutineer.s, theirs.id)).res.status, 404, 'another official’s declaration');
  assert.equal((await withdraw(S2.s, theirs.id)).res.status, 409, 'already withdrawn');
  assert.equal((await S2.s.fetch(`/api/events/${EVENT}/interests`, { method: 'DELETE' })).status, 405);
  await assert.rejects(
    query(`update official_interests set statement = 'changed' where id = $1`, [theirs.id]),
    /append-only/,
  );
  await assert.rejects(
    query(`delete from official_interest_withdrawals where interest_id = $1`, [theirs.id]),
    /append-only/,
  );
});
