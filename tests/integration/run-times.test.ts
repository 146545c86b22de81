// Run times from the timing sheet through the real HTTP API and database: the preview stores nothing and
// names each line's problem, an import is all or nothing, a re-import stores nothing twice, other figures
// become a correction that supersedes, hand entry follows the same rules, the rows cannot be changed in the
// database, and only the meeting's organisers may do any of it. Then the model against the clock.
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { closeDb, query } from '../support/db';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
let classId: string;
let otherClassId: string;
const entries: TestEntry[] = [];
let otherClassEntry: TestEntry;
let withdrawn: TestEntry;

const countRuns = async () =>
  Number(
    (await query<{ n: string }>('select count(*) as n from run_times where event_id = $1', [meeting.eventId]))[0].n,
  );

function upload(
  path: string,
  fields: Record<string, string>,
  csv: string | Uint8Array<ArrayBuffer>,
  s = meeting.organiser,
) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'timing.csv');
  return s
    .fetch(path, { method: 'POST', body: form })
    .then(async (res) => ({ res, body: await res.json().catch(() => null) }));
}
const preview = (csv: string | Uint8Array<ArrayBuffer>, over: Record<string, string> = {}, s?: HttpSession) =>
  upload(`/api/events/${meeting.eventId}/run-times/preview`, { classId, courseLengthM: '400', ...over }, csv, s);
const importCsv = (csv: string, over: Record<string, string> = {}, s?: HttpSession) =>
  upload(`/api/events/${meeting.eventId}/run-times`, { classId, courseLengthM: '400', ...over }, csv, s);

async function addInspection(entry: TestEntry, cls: string, powerKw: number, weightKg: number | null) {
  const [rv] = await query<{ id: string }>(
    `select id from class_rule_versions where class_id = $1 and status = 'published' order by version desc limit 1`,
    [cls],
  );
  const [org] = await query<{ id: string }>('select id from users where email = $1', [DEMO.organiser]);
  await query(
    `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result)
     values ($1, $2, $3, $4, $5, $6, $7, now(), $8, $9, 'conforms')`,
    [
      meeting.eventId,
      entry.id,
      entry.boatId,
      cls,
      rv.id,
      org.id,
      randomUUID(),
      JSON.stringify({
        nozzle: { readings: [100, 100.02, 100.01].map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })) },
        power: { evidenceSeen: true, confirmedKw: powerKw },
        ...(weightKg !== null && { weight: { readingsKg: [weightKg] } }),
      }),
      JSON.stringify([{ rule: 'nozzle_max', expandedUncertainty: 0.05, verdict: 'conforms' }]),
    ],
  );
}

before(async () => {
  await meeting.create(`Timing Test ${Date.now()}`, [{ email: DEMO.steward, role: 'steward' }]);
  classId = await meeting.addClass(
    'RT',
    rulesWith({ weight: { minKg: 650, includesDriver: false, defaultUncertaintyKg: 1 } }),
  );
  otherClassId = await meeting.addClass('RX', rulesWith());
  for (let i = 0; i < 4; i++) entries.push(await meeting.addEntry(classId));
  otherClassEntry = await meeting.addEntry(otherClassId);
  withdrawn = await meeting.addEntry(classId);
  await query(`update entries set status = 'withdrawn' where id = $1`, [withdrawn.id]);
  // Four inspected boats of one power: different weights, one not weighed (the class minimum is used).
  for (const [i, w] of [700, 760, 820, null].entries()) await addInspection(entries[i], classId, 220, w);
});
after(closeDb);

const n = (i: number) => entries[i].raceNumber;

test("the preview names each line's problem and stores nothing", async () => {
  const csv = [
    'race_number,run,elapsed_s,trap_speed_kmh,gps_top_speed_kmh,rpm,conditions',
    `${n(0)},1,41.20,,112.0,6800,calm`,
    `${n(1)},1,fast,,,,`, // malformed time
    `9876,1,40.0,,,,`, // unknown race number
    `${otherClassEntry.raceNumber},1,40.0,,,,`, // another class
    `${withdrawn.raceNumber},1,40.0,,,,`, // not a confirmed entry
    `${n(0)},1,41.30,,,,`, // the same run twice in one file
    `${n(2)},1,42.0,900,,,`, // a speed in the wrong unit
  ].join('\n');
  const { res, body } = await preview(csv);
  assert.equal(res.status, 200, JSON.stringify(body));
  const lines = body.data.lines as { line: number; status: string; message: string }[];
  assert.deepEqual(
    lines.map((l) => [l.line, l.status]),
    [
      [2, 'new'],
      [3, 'error'],
      [4, 'error'],
      [5, 'error'],
      [6, 'error'],
      [7, 'error'],
      [8, 'error'],
    ],
  );
  assert.match(lines[1].message, /elapsed time "fast" is not seconds/);
  assert.match(lines[2].message, /No entry has race number 9876 at this meeting/);
  assert.match(lines[3].message, /is entered in RX, not RT/);
  assert.match(lines[4].message, /not a confirmed entry \(withdrawn\)/);
  assert.match(lines[5].message, /already on line 2: a run appears once/);
  assert.match(lines[6].message, /above 150 m\/s.*\(read in km\/h\)/);
  assert.equal(await countRuns(), 0);

  // The same file imported: refused whole, each line named, nothing stored.
  const imp = await importCsv(csv);
  assert.equal(imp.res.status, 400);
  assert.match(imp.body.error.message, /nothing was stored.*line 3: .*line 4: /i);
  assert.ok(imp.body.error.details.some((d: { field: string }) => d.field === 'lines.7'));
  assert.equal(await countRuns(), 0);
});

test('an import stores each run once; a re-import stores nothing; other figures are a correction that supersedes', async () => {
  const rows = [
    `${n(0)},1,41.20,,112.0,6800,calm`,
    `${n(0)},2,41.60,,111.0,,calm`,
    `${n(1)},1,42.10,,108.0,,`,
    `${n(1)},2,42.50,,,,`,
    `${n(2)},1,43.40,104.0,,,"light chop, wind 5 kn"`,
    `${n(2)},2,43.00,,,,`,
    `${n(3)},1,1:02.5,,,,`,
  ];
  const csv = ['race_number,run,elapsed_s,trap_speed_kmh,gps_top_speed_kmh,rpm,conditions', ...rows].join('\r\n');
  const first = await importCsv(csv);
  assert.equal(first.res.status, 201, JSON.stringify(first.body));
  assert.deepEqual([first.body.data.stored, first.body.data.corrected, first.body.data.unchanged], [7, 0, 0]);
  assert.equal(await countRuns(), 7);
  const [stored] = await query<{ elapsed_s: number; gps_top_speed_ms: number; conditions: string }>(
    `select elapsed_s, gps_top_speed_ms, conditions from run_times where event_id = $1 and race_number = $2 and run_label = '1'`,
    [meeting.eventId, n(0)],
  );
  assert.equal(stored.elapsed_s, 41.2);
  assert.ok(Math.abs(stored.gps_top_speed_ms - 112 / 3.6) < 1e-12); // km/h is exactly 1/3.6 m/s (NIST SP 811, 2008)

  // The same file again: nothing stored twice, each line says why.
  const again = await importCsv(csv);
  assert.equal(again.res.status, 200);
  assert.deepEqual([again.body.data.stored, again.body.data.corrected, again.body.data.unchanged], [0, 0, 7]);
  assert.ok(
    again.body.data.lines.every((l: { message: string }) => /Already stored with the same figures/.test(l.message)),
  );
  assert.equal(await countRuns(), 7);

  // One figure corrected: the preview says so, the import adds one row that supersedes the stored run.
  const corrected = csv.replace(`${n(1)},2,42.50`, `${n(1)},2,42.45`);
  const p = await preview(corrected);
  const line = p.body.data.lines.find((l: { status: string }) => l.status === 'correction');
  assert.match(line.message, /Stored as 42\.5 s over 400 m; this corrects it/);
  assert.equal(await countRuns(), 7);
  const fix = await importCsv(corrected);
  assert.equal(fix.res.status, 201);
  assert.deepEqual([fix.body.data.stored, fix.body.data.corrected, fix.body.data.unchanged], [0, 1, 6]);
  assert.equal(await countRuns(), 8);
  const list = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/run-times`).then((r) => r.json());
  const mine = list.data.find((c: { classId: string }) => c.classId === classId).runs;
  assert.equal(mine.length, 7, 'the list shows the current runs only');
  const run = mine.find((r: { raceNumber: number; runLabel: string }) => r.raceNumber === n(1) && r.runLabel === '2');
  assert.equal(run.elapsedS, 42.45);
  assert.equal(run.isCorrection, true);

  // Append-only in the database itself.
  await assert.rejects(
    query(`update run_times set elapsed_s = 1 where event_id = $1`, [meeting.eventId]),
    /append-only|not allowed|cannot/i,
  );
  await assert.rejects(query(`delete from run_times where event_id = $1`, [meeting.eventId]));
  assert.equal(await countRuns(), 8);
});

test('hand entry: stored once, the same again is skipped, bad rows are named by field', async () => {
  const body = (rows: unknown[]) => ({ classId, courseLengthM: 400, rows });
  const run = {
    raceNumber: n(3),
    runLabel: '2',
    elapsedS: 61.9,
    trapSpeedKmh: null,
    gpsTopSpeedKmh: 96.5,
    rpm: null,
    conditions: '',
  };
  const first = await meeting.organiser.json(`/api/events/${meeting.eventId}/run-times`, body([run]));
  assert.equal(first.res.status, 201, JSON.stringify(first.body));
  const again = await meeting.organiser.json(`/api/events/${meeting.eventId}/run-times`, body([run]));
  assert.equal(again.res.status, 200);
  assert.equal(again.body.data.unchanged, 1);
  const before = await countRuns();
  const bad = await meeting.organiser.json(
    `/api/events/${meeting.eventId}/run-times`,
    body([
      { ...run, runLabel: '3', elapsedS: -2 },
      { ...run, raceNumber: 9876, runLabel: '4' },
    ]),
  );
  assert.equal(bad.res.status, 400);
  assert.ok(bad.body.error.details.some((d: { field: string }) => d.field === 'rows.0.elapsedS'));
  const unknown = await meeting.organiser.json(
    `/api/events/${meeting.eventId}/run-times`,
    body([{ ...run, raceNumber: 9876, runLabel: '4' }]),
  );
  assert.equal(unknown.res.status, 400);
  assert.deepEqual(unknown.body.error.details, [
    { field: 'rows.0.raceNumber', message: 'No entry has race number 9876 at this meeting.' },
  ]);
  const control = await meeting.organiser.json(
    `/api/events/${meeting.eventId}/run-times`,
    body([{ ...run, conditions: 'wind\u202Eeast' }]),
  );
  assert.equal(control.res.status, 400);
  assert.equal(await countRuns(), before);
});

test("only the meeting's organisers: entrants and officials 403, anonymous 401, before any body is read", async () => {
  const csv = `race_number,run,elapsed_s\n${n(0)},9,40`;
  const runsBefore = await countRuns();
  const sessions: [string, HttpSession, number][] = [['anonymous', new HttpSession(), 401]];
  for (const email of [DEMO.entrant, DEMO.steward, DEMO.chief, DEMO.scrutineer]) {
    const s = new HttpSession();
    await s.signInWithPassword(email, DEMO_PASSWORD);
    sessions.push([email, s, 403]);
  }
  for (const [who, s, status] of sessions) {
    assert.equal((await preview(csv, {}, s)).res.status, status, `preview as ${who}`);
    assert.equal((await importCsv(csv, {}, s)).res.status, status, `import as ${who}`);
    assert.equal((await s.fetch(`/api/events/${meeting.eventId}/run-times`)).status, status, `list as ${who}`);
    assert.equal(
      (await s.fetch(`/api/events/${meeting.eventId}/classes/${classId}/clock`)).status,
      status,
      `clock as ${who}`,
    );
    // A body far over the cap is refused for who is asking, not for its size.
    const big = await s.fetch(`/api/events/${meeting.eventId}/run-times`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: 'x'.repeat(300_000),
    });
    assert.equal(big.status, status, `big body as ${who}`);
  }
  assert.equal(await countRuns(), runsBefore);
});

test('bad bodies get clear errors: too large, wrong type, not UTF-8, no file, a class of another meeting', async () => {
  const over = await importCsv('race_number,run,elapsed_s\n' + `${n(0)},1,41.2\n`.repeat(30_000));
  assert.equal(over.res.status, 413);
  assert.match(over.body.error.message, /larger than 256 KB/);
  const wrongType = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/run-times/preview`, {
    method: 'POST',
    headers: { 'content-type': 'text/csv' },
    body: 'race_number,run,elapsed_s',
  });
  assert.equal(wrongType.status, 415);
  const latin1 = await preview(new Uint8Array([0x72, 0x61, 0x63, 0x65, 0xe9, 0x0a]));
  assert.equal(latin1.res.status, 400);
  assert.match(latin1.body.error.details[0].message, /not UTF-8/);
  const header = await preview('number,heat\n1,1');
  assert.equal(header.res.status, 400);
  assert.match(header.body.error.message, /must name the columns "race_number", "run" \(or "heat"\) and "elapsed_s"/);
  const unit = await preview('race_number,run,elapsed_s,trap_speed\n1,1,40,100');
  assert.match(unit.body.error.message, /does not say its unit/);
  const foreign = await preview(`race_number,run,elapsed_s\n${n(0)},1,41.2`, { classId: randomUUID() });
  assert.equal(foreign.res.status, 400);
  assert.match(foreign.body.error.message, /choose a class of this meeting/);
  const noCourse = await preview(`race_number,run,elapsed_s\n${n(0)},1,41.2`, { courseLengthM: '' });
  assert.equal(noCourse.res.status, 400);
  assert.ok(noCourse.body.error.details.some((d: { field: string }) => d.field === 'courseLengthM'));
});

test('the model against the clock: each boat predicted from its inspection, its drag fitted at its own top speed', async () => {
  // A class of its own, so this test owns its runs.
  const cls = await meeting.addClass(
    'RC',
    rulesWith({ weight: { minKg: 650, includesDriver: false, defaultUncertaintyKg: 1 } }),
  );
  const boats: TestEntry[] = [];
  for (let i = 0; i < 4; i++) boats.push(await meeting.addEntry(cls));
  for (const [i, w] of [700, 760, 820, null].entries()) await addInspection(boats[i], cls, 220, w);
  const m = (i: number) => boats[i].raceNumber;
  const csv = [
    'race_number,run,elapsed_s,trap_speed_kmh,gps_top_speed_kmh',
    `${m(0)},1,41.20,,112.0`,
    `${m(0)},2,41.60,,111.0`,
    `${m(1)},1,42.10,,108.0`,
    `${m(1)},2,42.50,,`,
    `${m(2)},1,43.40,104.0,`,
    `${m(2)},2,43.00,,`,
    `${m(3)},1,44.1,,`,
  ].join('\n');
  const imp = await importCsv(csv, { classId: cls });
  assert.equal(imp.res.status, 201, JSON.stringify(imp.body));
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${cls}/clock`);
  assert.equal(res.status, 200);
  const { data } = await res.json();
  assert.equal(data.thrustModel, 'fixed_power');
  assert.equal(data.courseLengthM, 400);
  type Boat = Record<string, number & string>;
  const byNumber = new Map<number, Boat>(data.boats.map((b: Boat) => [b.raceNumber, b]));
  const b0 = byNumber.get(m(0))!;
  // The highest GPS top speed of its runs (112 km/h) is where thrust equals the fitted drag.
  assert.equal(b0.dragBasis, 'gps_top_speed');
  assert.equal(b0.thrustModel, 'fixed_power', 'a fixed-power class: every boat on fixed power');
  assert.ok(Math.abs(b0.topSpeedMs - 112 / 3.6) < 1e-6);
  assert.equal(b0.massKg, 700 + 160 + 25);
  assert.equal(byNumber.get(m(2))!.dragBasis, 'trap_speed');
  const b3 = byNumber.get(m(3))!;
  assert.equal(b3.dragBasis, 'class_default');
  assert.equal(b3.massKg, 650 + 160 + 25, 'not weighed: the class minimum');
  assert.match(b3.massBasis, /not weighed: class minimum 650 kg/);
  // Same power and nozzle, heavier: less thrust per weight.
  assert.ok(b0.thrustToWeight > byNumber.get(m(1))!.thrustToWeight);
  assert.equal(data.comparison.points.length, 4);
  assert.equal(typeof data.comparison.pearson, 'number');
  assert.ok(data.comparison.pooledRunSpreadS > 0);
  assert.ok(data.worstRelativeAccuracy < 1e-6);
});

test('the demo seed (an invented scenario) gives the Sprint Sport class two runs per entered boat, once', async () => {
  // Other test files enter boats into the demo class too, so the seed's boats are the ones with runs:
  // every one of them entered, two runs each, no run twice.
  const [row] = await query<{ runs: string; boats: string; enteredWithRuns: string }>(
    `select (select count(*) from run_times r where r.class_id = c.id) as runs,
            (select count(distinct r.entry_id) from run_times r where r.class_id = c.id) as boats,
            (select count(distinct r.entry_id) from run_times r join entries e on e.id = r.entry_id
              where r.class_id = c.id and e.status = 'entered') as "enteredWithRuns"
       from race_classes c where c.event_id = $1 and c.code = 'SS'`,
    [DEMO.meetingId],
  );
  assert.ok(Number(row.boats) >= 3);
  assert.equal(Number(row.enteredWithRuns), Number(row.boats), 'every boat with runs is entered');
  assert.equal(Number(row.runs), 2 * Number(row.boats), 'two runs each');
  const [dupes] = await query<{ n: string }>(
    `select count(*) as n from (select r.entry_id, r.run_label from run_times r join race_classes c on c.id = r.class_id
       where c.event_id = $1 and c.code = 'SS' and r.supersedes_id is null group by r.entry_id, r.run_label having count(*) > 1) d`,
    [DEMO.meetingId],
  );
  assert.equal(Number(dupes.n), 0, 'no run stored twice');
});

test('the same file imported twice at once: each run is stored once', async () => {
  const cls = await meeting.addClass('RP', rulesWith());
  const boats: TestEntry[] = [];
  for (let i = 0; i < 3; i++) boats.push(await meeting.addEntry(cls));
  const csv = ['race_number,run,elapsed_s', ...boats.map((b, i) => `${b.raceNumber},1,${40 + i}`)].join('\n');
  const answers = await Promise.all([importCsv(csv, { classId: cls }), importCsv(csv, { classId: cls })]);
  const statuses = answers.map((a) => a.res.status).sort();
  // The class row lock makes the second wait and then find every run stored (200, nothing new); a 409 from the
  // unique import key would also be honest. Never two 201s.
  assert.ok(
    JSON.stringify(statuses) === '[200,201]' || JSON.stringify(statuses) === '[201,409]',
    JSON.stringify(answers.map((a) => a.body)),
  );
  const [row] = await query<{ n: string }>('select count(*) as n from run_times where class_id = $1', [cls]);
  assert.equal(Number(row.n), 3);
});
