// Inspection records through the real HTTP API and database: verdicts against the worked decisions,
// idempotency, corrections, append-only storage and who may record.
// Reference decisions: worked by hand for an upper limit of 102.00 mm and U 0.05 mm under
// simple and guarded acceptance (ILAC-G8:09/2019) and ISO 14253-1:2017.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { waitForMail } from '../support/mail';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
const classes: Record<'simple' | 'guarded' | 'iso14253', string> = { simple: '', guarded: '', iso14253: '' };
let entry: TestEntry;
const post = (s: HttpSession, body: unknown) => s.json(`/api/events/${meeting.eventId}/inspections`, body);
const countByKey = async (key: string) =>
  Number((await query<{ n: string }>('select count(*) as n from inspections where idempotency_key = $1', [key]))[0].n);

before(async () => {
  await meeting.create(`Inspection Test Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  classes.simple = await meeting.addClass('SIM', rulesWith({ decisionRule: 'simple' }));
  classes.guarded = await meeting.addClass('GRD', rulesWith({ decisionRule: 'guarded' }));
  classes.iso14253 = await meeting.addClass('ISO', rulesWith({ decisionRule: 'iso14253' }));
  entry = await meeting.addEntry(classes.iso14253);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

// Worked decisions read off the zones of ILAC-G8:09/2019 (simple, guarded w = U) and ISO 14253-1:2017.
const WORKED: [number, { simple: string; guarded: string; iso14253: string }][] = [
  [101.93, { simple: 'conforms', guarded: 'conforms', iso14253: 'conforms' }],
  [101.97, { simple: 'conforms', guarded: 'does_not_conform', iso14253: 'inconclusive' }],
  [102.02, { simple: 'does_not_conform', guarded: 'does_not_conform', iso14253: 'inconclusive' }],
  [102.06, { simple: 'does_not_conform', guarded: 'does_not_conform', iso14253: 'does_not_conform' }],
];

test('stored verdicts match the four worked decisions under each decision rule (ILAC-G8:09/2019, ISO 14253-1:2017)', async () => {
  for (const rule of ['simple', 'guarded', 'iso14253'] as const) {
    for (const [largest, expected] of WORKED) {
      const e = await meeting.addEntry(classes[rule]);
      const { res, body } = await post(scrutineer, inspectionBody(e.id, largest));
      assert.equal(res.status, 201, JSON.stringify(body));
      const [row] = await query<{
        results: {
          rules: {
            rule: string;
            verdict: string;
            decisiveValue: number;
            limit: number;
            acceptanceLimit: number;
            expandedUncertainty: number;
          }[];
          decisionRule: string;
        };
        overall_result: string;
      }>('select results, overall_result from inspections where id = $1', [body.data.id]);
      const nozzle = row.results.rules.find((r) => r.rule === 'nozzle_max')!;
      assert.equal(nozzle.verdict, expected[rule], `${largest} mm under ${rule}`);
      assert.equal(nozzle.decisiveValue, largest, 'the largest two-point size decides (ISO 14405-1:2016)');
      assert.equal(nozzle.limit, 102);
      assert.equal(nozzle.expandedUncertainty, 0.05);
      assert.ok(
        Math.abs(nozzle.acceptanceLimit - (rule === 'simple' ? 102 : 101.95)) < 1e-9,
        'guard band w = U except for simple acceptance',
      );
      assert.equal(row.results.decisionRule, rule);
      assert.equal(row.overall_result, expected[rule], 'the helmet is ticked, so the nozzle decides overall');
      assert.equal(body.data.overallResult, expected[rule]);
      const [en] = await query<{ inspection_result: string }>('select inspection_result from entries where id = $1', [
        e.id,
      ]);
      assert.equal(en.inspection_result, expected[rule], 'the entry carries its newest result');
    }
  }
});

test('the entrant is e-mailed the result, with the boat name and the result in the subject', async () => {
  const e = await meeting.addEntry(classes.iso14253);
  const { res } = await post(scrutineer, inspectionBody(e.id, 101.97));
  assert.equal(res.status, 201);
  const mail = await waitForMail(DEMO.entrant, { subject: new RegExp(e.boatName) });
  assert.match(mail.subject, /inconclusive/);
  assert.match(mail.text, /officials/);
});

// The dock sends the declaration version its card showed (such a record is written in one round trip);
// an older client sends none (the full transaction). Both must keep these promises.
for (const sender of [
  { name: 'as the dock sends it', extra: { declarationVersion: 1 } },
  { name: 'from an older client', extra: {} },
]) {
  test(`${sender.name}: the same key sent three times makes one record (201 then 200, 200); two keys make two`, async () => {
    const body = inspectionBody(entry.id, 101.9, sender.extra);
    const first = await post(scrutineer, body);
    const second = await post(scrutineer, body);
    const third = await post(scrutineer, { ...body, notes: 'a retry with the same key changes nothing' });
    assert.deepEqual([first.res.status, second.res.status, third.res.status], [201, 200, 200]);
    assert.equal(second.body.data.id, first.body.data.id);
    assert.equal(third.body.data.id, first.body.data.id);
    assert.equal(await countByKey(body.idempotencyKey), 1);
    // Sent at the same moment (a double tap on two connections): still one record.
    const parallel = inspectionBody(entry.id, 101.9, sender.extra);
    const answers = await Promise.all([
      post(scrutineer, parallel),
      post(scrutineer, parallel),
      post(scrutineer, parallel),
    ]);
    assert.deepEqual(answers.map((a) => a.res.status).sort(), [200, 200, 201]);
    assert.equal(new Set(answers.map((a) => a.body.data.id)).size, 1);
    assert.equal(await countByKey(parallel.idempotencyKey), 1);
    const a = inspectionBody(entry.id, 101.9, sender.extra);
    const b = inspectionBody(entry.id, 101.9, sender.extra);
    assert.equal((await post(scrutineer, a)).res.status, 201);
    assert.equal((await post(scrutineer, b)).res.status, 201);
    assert.equal((await countByKey(a.idempotencyKey)) + (await countByKey(b.idempotencyKey)), 2);
  });

  test(`${sender.name}: records for one entry sent at once: the entry ends with the result of the latest capture`, async () => {
    // The entry's stored result must follow the record that counts (the latest capture time) however
    // the requests interleave: each writer takes the entry's lock before it recomputes. Alternating
    // conforming and non-conforming readings (the worked decisions above, ISO 14253-1:2017) make a
    // wrong winner visible. Five rounds of eight.
    for (let round = 0; round < 5; round++) {
      const e = await meeting.addEntry(classes.iso14253);
      const base = Date.now() - 60_000;
      const bodies = Array.from({ length: 8 }, (_, i) =>
        inspectionBody(e.id, i % 2 ? 102.06 : 101.93, {
          ...sender.extra,
          capturedAt: new Date(base + ((i * 5 + round) % 8) * 1000).toISOString(),
        }),
      );
      const answers = await Promise.all(bodies.map((b) => post(scrutineer, b)));
      assert.deepEqual(
        answers.map((a) => a.res.status),
        Array(8).fill(201),
      );
      const latest = bodies.reduce((a, b) => (a.capturedAt > b.capturedAt ? a : b));
      const expected = latest.nozzle.readings[1].diameterMm === 102.06 ? 'does_not_conform' : 'conforms';
      const [en] = await query<{ inspection_result: string }>('select inspection_result from entries where id = $1', [
        e.id,
      ]);
      assert.equal(en.inspection_result, expected, `round ${round}`);
    }
  });
}

test('a correction supersedes and keeps the original; both are in the history; the entry takes the correction', async () => {
  const e = await meeting.addEntry(classes.iso14253);
  const original = await post(scrutineer, inspectionBody(e.id, 102.06));
  assert.equal(original.body.data.overallResult, 'does_not_conform');
  const noReason = await post(scrutineer, inspectionBody(e.id, 101.93, { supersedesId: original.body.data.id }));
  assert.equal(noReason.res.status, 400);
  assert.ok(noReason.body.error.details.some((d: { field: string }) => d.field === 'correctionReason'));
  const otherEntry = await post(
    scrutineer,
    inspectionBody(entry.id, 101.93, { supersedesId: original.body.data.id, correctionReason: 'wrong boat' }),
  );
  assert.equal(otherEntry.res.status, 400);
  assert.ok(otherEntry.body.error.details.some((d: { field: string }) => d.field === 'supersedesId'));

  const fix = await post(
    scrutineer,
    inspectionBody(e.id, 101.93, {
      supersedesId: original.body.data.id,
      correctionReason: 'reading 2 was typed as 102.06; the gauge showed 101.93',
    }),
  );
  assert.equal(fix.res.status, 201, JSON.stringify(fix.body));
  assert.equal(fix.body.data.supersedesId, original.body.data.id);
  const rows = await query<{ id: string; overall_result: string; supersedes_id: string | null }>(
    'select id, overall_result, supersedes_id from inspections where entry_id = $1 order by captured_at',
    [e.id],
  );
  assert.equal(rows.length, 2, 'the original is kept');
  assert.equal(rows[0].overall_result, 'does_not_conform');
  const [en] = await query<{ inspection_result: string }>('select inspection_result from entries where id = $1', [
    e.id,
  ]);
  assert.equal(en.inspection_result, 'conforms');
  const card = await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${e.raceNumber}`);
  const history = (await card.json()).data.inspections as {
    id: string;
    supersededById: string | null;
    supersedesId: string | null;
  }[];
  assert.equal(history.length, 2);
  assert.equal(history.find((h) => h.id === original.body.data.id)?.supersededById, fix.body.data.id);
  assert.equal(history.find((h) => h.id === fix.body.data.id)?.supersedesId, original.body.data.id);

  // A second correction of the same record would fork the history: refused, nothing stored; the way on is to
  // correct the correction. Two at once: the unique index keeps one.
  const second = await post(
    scrutineer,
    inspectionBody(e.id, 101.94, { supersedesId: original.body.data.id, correctionReason: 'again' }),
  );
  assert.equal(second.res.status, 409, JSON.stringify(second.body));
  assert.equal(second.body.error.code, 'already_corrected');
  const onward = await post(
    scrutineer,
    inspectionBody(e.id, 101.95, { supersedesId: fix.body.data.id, correctionReason: 'reading 2 again: 101.95' }),
  );
  assert.equal(onward.res.status, 201, JSON.stringify(onward.body));
  const racing = await Promise.all(
    [101.96, 101.97].map((mm) =>
      post(
        scrutineer,
        inspectionBody(e.id, mm, { supersedesId: onward.body.data.id, correctionReason: 'both at once' }),
      ),
    ),
  );
  assert.deepEqual(racing.map((r) => r.res.status).sort(), [201, 409]);
  const [{ n }] = await query<{ n: string }>('select count(*) as n from inspections where supersedes_id = $1', [
    onward.body.data.id,
  ]);
  assert.equal(Number(n), 1);
});

test('no API path edits or deletes a record (405), and the database refuses an update or delete', async () => {
  const { body } = await post(scrutineer, inspectionBody(entry.id, 101.9));
  const id = body.data.id;
  for (const method of ['PUT', 'PATCH', 'DELETE']) {
    for (const path of [
      `/api/events/${meeting.eventId}/inspections`,
      `/api/events/${meeting.eventId}/inspections/${id}/photos`,
    ]) {
      const res = await scrutineer.fetch(path, {
        method,
        headers: { 'content-type': 'application/json' },
        body: method === 'DELETE' ? undefined : JSON.stringify({ id, overallResult: 'conforms' }),
      });
      assert.equal(res.status, 405, `${method} ${path}`);
      assert.match(res.headers.get('allow') ?? '', /POST/);
    }
  }
  await assert.rejects(
    query(`update inspections set overall_result = 'conforms', notes = 'edited' where id = $1`, [id]),
    /append-only/,
  );
  await assert.rejects(query('delete from inspections where id = $1', [id]), /append-only/);
  const [row] = await query<{ notes: string }>('select notes from inspections where id = $1', [id]);
  assert.equal(row.notes, '');
});

test('only the meeting’s scrutineers record: entrant 403, scrutineer of another meeting 403, anonymous 401', async () => {
  const before = await query<{ n: string }>('select count(*) as n from inspections where entry_id = $1', [entry.id]);
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  assert.equal((await post(entrant, inspectionBody(entry.id, 101.9))).res.status, 403);
  const otherMeeting = new HttpSession();
  await otherMeeting.signInWithPassword(DEMO.chief, DEMO_PASSWORD); // a scrutineer at the demo meeting only
  assert.equal((await post(otherMeeting, inspectionBody(entry.id, 101.9))).res.status, 403);
  assert.equal((await post(new HttpSession(), inspectionBody(entry.id, 101.9))).res.status, 401);
  const after = await query<{ n: string }>('select count(*) as n from inspections where entry_id = $1', [entry.id]);
  assert.equal(after[0].n, before[0].n, 'nothing stored');
});

test('an entrant who is also a scrutineer here cannot record for their own boat, but can for others', async () => {
  const email = uniqueEmail('scrut-entrant');
  const person = new HttpSession();
  // A staff role goes straight to a confirmed address only.
  await person.signUpAndConfirm({ name: 'Scrutineer Entrant', email, password: 'long-enough-pw' });
  const r = await meeting.organiser.json(`/api/events/${meeting.eventId}/staff`, { email, role: 'scrutineer' });
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  const own = await meeting.addEntry(classes.iso14253, { ownerEmail: email });
  await person.signInWithPassword(email, 'long-enough-pw');
  const refused = await post(person, inspectionBody(own.id, 101.9));
  assert.equal(refused.res.status, 403);
  assert.equal(refused.body.error.code, 'own_boat');
  assert.equal(
    Number((await query<{ n: string }>('select count(*) as n from inspections where entry_id = $1', [own.id]))[0].n),
    0,
  );
  assert.equal((await post(person, inspectionBody(entry.id, 101.9))).res.status, 201, 'another boat is fine');
});

test('a record is decided under the rule version in force when it was captured, not the newest', async () => {
  // Decision rules are fixed before measuring (ISO/IEC 17025:2017, 7.1.3): v1 caps the nozzle at
  // 102.00 mm; v2, in force from an hour ago, at 101.00 mm. Readings up to 101.93 mm with U 0.05 mm:
  // conformity proven under v1, non-conformity proven under v2 (ISO 14253-1:2017).
  const cls = await meeting.addClass('VER', rulesWith());
  const o = meeting.organiser;
  const draft = await o.json(
    `/api/events/${meeting.eventId}/classes/${cls}/rules`,
    {
      powerUnit: 'kW',
      rules: rulesWith({ nozzle: { maxMm: 101, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
    },
    'PUT',
  );
  assert.equal(draft.res.status, 200, JSON.stringify(draft.body));
  const v2 = await o.json(`/api/events/${meeting.eventId}/classes/${cls}/rules/publish`, {
    changeNote: 'smaller nozzle',
    effectiveFrom: new Date(Date.now() - 3_600_000).toISOString(),
  });
  assert.equal(v2.res.status, 201, JSON.stringify(v2.body));
  const e = await meeting.addEntry(cls);
  const earlier = await post(
    scrutineer,
    inspectionBody(e.id, 101.93, { capturedAt: new Date(Date.now() - 2 * 3_600_000).toISOString() }),
  );
  assert.equal(earlier.res.status, 201, JSON.stringify(earlier.body));
  assert.equal(earlier.body.data.ruleVersion, 1);
  assert.equal(earlier.body.data.overallResult, 'conforms');
  const now = await post(scrutineer, inspectionBody(e.id, 101.93));
  assert.equal(now.body.data.ruleVersion, 2);
  assert.equal(now.body.data.overallResult, 'does_not_conform');
  const stored = await query<{ v: number }>(
    'select v.version as v from inspections i join class_rule_versions v on v.id = i.rule_version_id where i.id = any($1) order by i.captured_at',
    [[earlier.body.data.id, now.body.data.id]],
  );
  assert.deepEqual(
    stored.map((r) => r.v),
    [1, 2],
  );
});

test('no rules in force at the time of capture: 409 with a clear message, nothing stored', async () => {
  const drafted = await meeting.addClass('DRF', rulesWith(), { publish: false });
  const e = await meeting.addEntry(drafted);
  const sent = inspectionBody(e.id, 101.9);
  const { res, body } = await post(scrutineer, sent);
  assert.equal(res.status, 409);
  assert.equal(body.error.code, 'no_rules_in_force');
  assert.match(body.error.message, /publish the class rules/);
  assert.equal(
    Number((await query<{ n: string }>('select count(*) as n from inspections where entry_id = $1', [e.id]))[0].n),
    0,
  );
  assert.equal(await countByKey(sent.idempotencyKey), 0);
});
