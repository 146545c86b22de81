// The parity report's predicted-time section through the real HTTP API and database: the draft carries it with
// the class's current runs; a published version keeps what it was published with (JSON, CSV and PDF) when run
// times are imported after it, while the draft moves on; the PDF prints the section and its caution.
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { DEMO, BASE_URL } from '../support/env';
import { closeDb, query } from '../support/db';
import { extractPdfText } from '../support/pdf-text';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
let classId: string;
const boats: TestEntry[] = [];

async function addInspection(entry: TestEntry, powerKw: number, weightKg: number) {
  const [rv] = await query<{ id: string }>(
    `select id from class_rule_versions where class_id = $1 and status = 'published' order by version desc limit 1`,
    [classId],
  );
  const [org] = await query<{ id: string }>('select id from users where email = $1', [DEMO.organiser]);
  await query(
    `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result)
     values ($1, $2, $3, $4, $5, $6, $7, now(), $8, $9, 'conforms')`,
    [
      meeting.eventId,
      entry.id,
      entry.boatId,
      classId,
      rv.id,
      org.id,
      randomUUID(),
      JSON.stringify({
        nozzle: { readings: [100, 100.02, 100.01].map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })) },
        power: { evidenceSeen: true, confirmedKw: powerKw },
        weight: { readingsKg: [weightKg] },
      }),
      JSON.stringify([{ rule: 'nozzle_max', expandedUncertainty: 0.05, verdict: 'conforms' }]),
    ],
  );
}

function importRuns(lines: string[]) {
  const form = new FormData();
  form.append('classId', classId);
  form.append('courseLengthM', '400');
  const csv = ['race_number,run,elapsed_s,trap_speed_kmh,gps_top_speed_kmh', ...lines].join('\n');
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'timing.csv');
  return meeting.organiser
    .fetch(`/api/events/${meeting.eventId}/run-times`, { method: 'POST', body: form })
    .then(async (res) => ({ res, body: await res.json() }));
}

const draft = async () => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`);
  assert.equal(res.status, 200);
  return (await res.json()).data.draft;
};

before(async () => {
  await meeting.create(`Report Clock ${Date.now()}`, []);
  classId = await meeting.addClass(
    'RK',
    rulesWith({ weight: { minKg: 650, includesDriver: false, defaultUncertaintyKg: 1 } }),
  );
  for (let i = 0; i < 3; i++) boats.push(await meeting.addEntry(classId));
  for (const [i, [kw, kg]] of [
    [220, 700],
    [230, 760],
    [210, 820],
  ].entries())
    await addInspection(boats[i], kw, kg);
});
after(closeDb);

test('the draft carries the predicted-time section; without runs it says so in plain words', async () => {
  const d = await draft();
  const clock = d.results.clock;
  assert.ok(clock, 'the draft has a clock section');
  assert.equal(clock.courseLengthM, null);
  assert.equal(clock.boats.length, 3);
  for (const b of clock.boats) {
    assert.equal(b.referenceTimesS.length, 2);
    assert.ok(b.referenceTimesS.every((t: number) => t > 0));
    assert.ok(b.topSpeedMs > 0 && b.thrustToWeight > 0 && b.powerToWeightKwPerT > 0);
    assert.equal(b.dragBasis, 'class_default');
    assert.match(b.massBasis, /^weighed \d+ kg \+ 160 kg crew \(assumed\) \+ 25 kg fuel \(assumed\)$/);
  }
  assert.ok(clock.comparison.notes.includes('No run times are stored for this class yet.'));
});

test('a published report keeps its section when runs are imported later; the draft moves on', async () => {
  const m = (i: number) => boats[i].raceNumber;
  const first = await importRuns([`${m(0)},1,41.2,,112`, `${m(1)},1,40.8,,114`, `${m(2)},1,43.0,104,`]);
  assert.equal(first.res.status, 201, JSON.stringify(first.body));
  const pub = await meeting.organiser.json(`/api/events/${meeting.eventId}/classes/${classId}/report/publish`, {
    note: 'with the first runs',
  });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const publicId = pub.body.data.publicId as string;
  const clock = (await (await fetch(`${BASE_URL}/api/reports/${publicId}`)).json()).data.results.clock;
  assert.equal(clock.courseLengthM, 400);
  assert.equal(clock.comparison.points.length, 3);
  const b0 = clock.boats.find((b: { raceNumber: number }) => b.raceNumber === m(0));
  assert.equal(b0.dragBasis, 'gps_top_speed');
  assert.deepEqual(b0.observedS, [41.2]);

  const readJson = async () => (await (await fetch(`${BASE_URL}/api/reports/${publicId}`)).json()).data.results.clock;
  const readCsv = async () => (await fetch(`${BASE_URL}/api/reports/${publicId}/csv`)).text();
  const readPdf = async () =>
    (await extractPdfText(new Uint8Array(await (await fetch(`${BASE_URL}/api/reports/${publicId}/pdf`)).arrayBuffer())))
      .join('\n')
      .replace(/\n/g, ' ');
  const [jsonBefore, csvBefore, pdfBefore] = [await readJson(), await readCsv(), await readPdf()];
  const header = csvBefore.split('\r\n')[0].split(',');
  for (const col of ['predicted_100_m_s', 'predicted_course_s', 'thrust_to_weight', 'mass_basis', 'drag_basis'])
    assert.ok(header.includes(col), col);
  const row0 = csvBefore
    .split('\r\n')
    .slice(1)
    .find((l) => l.startsWith(`${m(0)},`))!
    .split(',');
  assert.equal(Number(row0[header.indexOf('predicted_course_s')]), b0.courseTimeS);
  assert.equal(row0[header.indexOf('observed_runs_s')], '41.2');
  // The thrust model each boat's prediction used: appended after the existing columns (a fixed-power class here).
  assert.equal(header[header.length - 1], 'predicted_time_thrust_model');
  assert.equal(row0[header.indexOf('predicted_time_thrust_model')], 'fixed_power');
  assert.equal(b0.thrustModel, 'fixed_power');
  assert.match(pdfBefore, /Predicted time over a course/);
  assert.match(pdfBefore, /Runge/);
  assert.match(pdfBefore, /Thrust: fixed power/);
  assert.match(pdfBefore, /officials decide/);
  const page = await (await fetch(`${BASE_URL}/reports/${publicId}`)).text();
  assert.match(page, /data-testid="clock-section"/);
  assert.match(page, /data-testid="clock-caution"/);

  // New runs, and a correction of the first boat's time, after publishing.
  const second = await importRuns([`${m(0)},1,40.9,,113`, `${m(0)},2,41.0,,`, `${m(1)},2,40.7,,`]);
  assert.equal(second.res.status, 201, JSON.stringify(second.body));
  const moved = (await draft()).results.clock;
  assert.deepEqual(
    moved.boats.find((b: { raceNumber: number }) => b.raceNumber === m(0)).observedS.sort(),
    [40.9, 41.0],
  );
  assert.deepEqual(await readJson(), jsonBefore, 'the published JSON is unchanged');
  assert.equal(await readCsv(), csvBefore, 'the published CSV is unchanged');
  assert.equal(await readPdf(), pdfBefore, 'the published PDF text is unchanged');
  // The stored row itself holds the section (a record, not recomputed on read).
  const [row] = await query<{ clock: unknown }>(
    `select results->'clock' as clock from parity_reports where public_id = $1`,
    [publicId],
  );
  assert.deepEqual(row.clock, jsonBefore);
});

test('published results carry each boat’s best current run time beside its position', async () => {
  const cls = await meeting.addClass('RR', rulesWith());
  const [a, b] = [await meeting.addEntry(cls), await meeting.addEntry(cls)];
  const form = new FormData();
  form.append('classId', cls);
  form.append('courseLengthM', '400');
  form.append(
    'file',
    new Blob([['race_number,run,elapsed_s', `${a.raceNumber},1,42.30`, `${a.raceNumber},2,41.75`].join('\n')], {
      type: 'text/csv',
    }),
    'timing.csv',
  );
  const imp = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/run-times`, { method: 'POST', body: form });
  assert.equal(imp.status, 201);
  const pub = await meeting.organiser.json(`/api/events/${meeting.eventId}/results`, {
    classId: cls,
    rows: [
      { position: 1, raceNumber: a.raceNumber },
      { position: 2, raceNumber: b.raceNumber },
    ],
  });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const read = async () => {
    const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/results`);
    assert.equal(res.status, 200);
    const mine = (await res.json()).data.find((c: { classId: string }) => c.classId === cls);
    return mine.latest.rows as { raceNumber: number; position: number; bestRun: unknown }[];
  };
  const rows = await read();
  assert.deepEqual(rows.find((r) => r.raceNumber === a.raceNumber)!.bestRun, {
    elapsedS: 41.75,
    courseLengthM: 400,
    runLabel: '2',
    runs: 2,
  });
  assert.equal(rows.find((r) => r.raceNumber === b.raceNumber)!.bestRun, null, 'no run stored: no time');
  // A correction of run 2 supersedes it: the best time follows the current runs.
  const fix = await meeting.organiser.json(`/api/events/${meeting.eventId}/run-times`, {
    classId: cls,
    courseLengthM: 400,
    rows: [
      {
        raceNumber: a.raceNumber,
        runLabel: '2',
        elapsedS: 42.9,
        trapSpeedKmh: null,
        gpsTopSpeedKmh: null,
        rpm: null,
        conditions: '',
      },
    ],
  });
  assert.ok([200, 201].includes(fix.res.status), JSON.stringify(fix.body));
  const after2 = (await read()).find((r) => r.raceNumber === a.raceNumber)!.bestRun as {
    elapsedS: number;
    runs: number;
  };
  assert.equal(after2.elapsedS, 42.3);
  assert.equal(after2.runs, 2);
  const page = await (await meeting.organiser.fetch(`/organise/events/${meeting.eventId}/results`)).text();
  assert.match(page, /42\.30 s/);
});

test('the clock page shows the equalisation suggestion per boat, in seconds with its U', async () => {
  const res = await meeting.organiser.fetch(`/organise/events/${meeting.eventId}/clock?class=${classId}`);
  assert.equal(res.status, 200);
  const page = await res.text();
  assert.match(page, /data-testid="clock-equalisation"/);
  assert.match(page, /Class median predicted time \d+\.\d\d s/);
});
