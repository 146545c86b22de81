// Several classes per boat (issue 21, item 6), through the HTTP API and the database: where the meeting
// allows it, one boat enters two classes, keeps one race number, and is inspected once under each class's
// rules, each record judged by its own class's limit. That a boat may race in more than one class at a
// meeting when the supplementary regulations allow it, keeping its number, is common practice (no source).
// The decision rule is ISO 14253-1:2017 (conformity proven when the measured value plus the expanded
// uncertainty is within the limit, non-conformity when the value minus it is beyond).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const single = new InspectionMeeting();
const entrant = new HttpSession();
const scrutineer = new HttpSession();
const chief = new HttpSession();
let wide = ''; // nozzle at most 102 mm
let narrow = ''; // nozzle at most 101.6 mm
let third = '';
let singleClass = '';
let singleOther = '';

/** The meeting's settings as the organiser's form sends them (the whole record, as PATCH takes it). */
const settings = (several: boolean) => ({
  name: 'Several Classes Meeting',
  venue: 'Test Reach',
  startsOn: '2027-05-01',
  endsOn: '2027-05-02',
  timeZone: 'Pacific/Auckland',
  status: 'entries_open',
  waterKind: 'fresh',
  waterTemperatureC: 15,
  waterDensityKgM3: null,
  protestWindowMinutes: 30,
  currency: 'NZD',
  entryFeeMinor: 10000,
  protestFeeMinor: 3000,
  severalClassesPerBoat: several,
});

async function ownBoat(name: string, hull: string): Promise<string> {
  const [owner] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  const [boat] = await query<{ id: string }>(
    `insert into boats (owner_id, name, hull_number, declared_nozzle_mm, declared_power_kw, power_evidence)
     values ($1, $2, $3, 101.5, 220, 'dyno_sheet') returning id`,
    [owner.id, `${name} ${randomBytes(2).toString('hex')}`, hull],
  );
  return boat.id;
}

const enter = (eventId: string, boatId: string, classId: string, requestedRaceNumber?: number) =>
  entrant.json('/api/entries', { boatId, eventId, classId, requestedRaceNumber });

before(async () => {
  const staff = [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.chief, role: 'chief_scrutineer' },
  ];
  await meeting.create(`Several Classes ${Date.now()}`, staff);
  await single.create(`One Class Each ${Date.now()}`, staff);
  wide = await meeting.addClass('SW', rulesWith());
  narrow = await meeting.addClass(
    'SN',
    rulesWith({ nozzle: { maxMm: 101.6, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
  );
  third = await meeting.addClass('ST', rulesWith());
  singleClass = await single.addClass('OA', rulesWith());
  singleOther = await single.addClass('OB', rulesWith());
  for (const [s, email] of [
    [entrant, DEMO.entrant],
    [scrutineer, DEMO.scrutineer],
    [chief, DEMO.chief],
  ] as const)
    assert.equal((await s.signInWithPassword(email, DEMO_PASSWORD)).status, 200);
});

test('a meeting takes one class per boat unless its organiser allows several; the setting is the organiser’s', async () => {
  const boat = await ownBoat('Lone Heron', '7301');
  const first = await enter(single.eventId, boat, singleClass);
  assert.equal(first.res.status, 201, JSON.stringify(first.body));
  const second = await enter(single.eventId, boat, singleOther);
  assert.equal(second.res.status, 409);
  assert.equal(second.body.error.code, 'already_entered');
  assert.match(second.body.error.message, /takes one class per boat/);
  // The database keeps the rule too, whoever writes (a second live entry in another class, straight in SQL).
  await assert.rejects(
    query(
      `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency)
       select event_id, $2, boat_id, entrant_id, race_number, 'entered', 0, 'NZD' from entries where id = $1`,
      [first.body.data.entry.id, singleOther],
    ),
    /one class per boat/,
  );
  // Only the meeting's organiser changes the setting (the scrutineer of the meeting may not).
  const byScrutineer = await scrutineer.json(`/api/events/${meeting.eventId}`, settings(true), 'PATCH');
  assert.equal(byScrutineer.res.status, 403);
  const on = await meeting.organiser.json(`/api/events/${meeting.eventId}`, settings(true), 'PATCH');
  assert.equal(on.res.status, 200, JSON.stringify(on.body));
  assert.equal(on.body.data.severalClassesPerBoat, true);
  // A client that does not send the field leaves it as it is.
  const { severalClassesPerBoat: _omitted, ...older } = settings(true);
  const kept = await meeting.organiser.json(`/api/events/${meeting.eventId}`, older, 'PATCH');
  assert.equal(kept.res.status, 200);
  assert.equal(kept.body.data.severalClassesPerBoat, true);
});

test('a boat in two classes keeps one number, is inspected under each class’s rules, and each verdict is its own', async () => {
  await meeting.organiser.json(`/api/events/${meeting.eventId}`, settings(true), 'PATCH');
  const boat = await ownBoat('Twin Kestrel', '7302');
  const a = await enter(meeting.eventId, boat, wide, 7302);
  assert.equal(a.res.status, 201, JSON.stringify(a.body));
  const number = a.body.data.entry.raceNumber as number;
  assert.equal(number, 7302);
  const b = await enter(meeting.eventId, boat, narrow, 4444);
  assert.equal(b.res.status, 201, JSON.stringify(b.body));
  assert.equal(b.body.data.entry.raceNumber, number, 'the second class keeps the boat’s number, not the one typed');
  assert.match(b.body.data.raceNumberNote, /keeps race number 7302 in every class/);
  // The same class twice is still refused.
  const again = await enter(meeting.eventId, boat, wide);
  assert.equal(again.res.status, 409);
  assert.match(again.body.error.message, /already entered in Class SW/);
  // Another boat asking for that number gets another one; SQL giving it to another boat is refused.
  const other = await ownBoat('Other Petrel', '7399');
  const c = await enter(meeting.eventId, other, wide, number);
  assert.equal(c.res.status, 201);
  assert.notEqual(c.body.data.entry.raceNumber, number);
  await assert.rejects(
    query(`update entries set race_number = $2 where id = $1`, [c.body.data.entry.id, number]),
    /another boat's at this meeting/,
  );

  // Paid, so both count; then the dock finds the boat by its number: one card per class, the others named.
  await query(`update entries set status = 'entered', paid_at = now() where boat_id = $1`, [boat]);
  const entryA = a.body.data.entry.id as string;
  const entryB = b.body.data.entry.id as string;
  const card = await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${number}`).then((r) => r.json());
  // Neither class inspected yet: the first by class code (SN) opens, SW is offered beside it.
  assert.equal(card.data.entry.id, entryB);
  const shown = [
    card.data.raceClass.code,
    ...card.data.otherEntries.map((e: { classCode: string }) => e.classCode),
  ].sort();
  assert.deepEqual(shown, ['SN', 'SW']);
  const cardB = await scrutineer
    .fetch(`/api/events/${meeting.eventId}/race-numbers/${number}?entry=${entryB}`)
    .then((r) => r.json());
  assert.equal(cardB.data.entry.id, entryB);
  assert.equal(cardB.data.ruleVersion.rules.nozzle.maxMm, 101.6, 'the card shows that class’s rules');
  assert.deepEqual(
    cardB.data.otherEntries.map((e: { entryId: string }) => e.entryId),
    [entryA],
  );
  // Another boat's entry named in ?entry= does not open it: the card stays this boat's.
  const foreign = await scrutineer
    .fetch(`/api/events/${meeting.eventId}/race-numbers/${number}?entry=${c.body.data.entry.id}`)
    .then((r) => r.json());
  assert.notEqual(foreign.data.entry.id, c.body.data.entry.id);
  assert.equal(
    (await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${number}?entry=not-an-id`)).status,
    404,
  );
  // By its tag too.
  const [tag] = await query<{ token: string }>(
    `insert into boat_tags (boat_id, token) values ($1, $2) returning token`,
    [boat, randomBytes(18).toString('base64url')],
  );
  const byTag = await scrutineer
    .fetch(`/api/events/${meeting.eventId}/tags/${tag.token}?entry=${entryB}`)
    .then((r) => r.json());
  assert.equal(byTag.data.entry.id, entryB);

  // The same measurements, recorded under each class: largest reading 101.8 mm, U = 0.05 mm.
  // Class SW (at most 102 mm): 101.8 + 0.05 ≤ 102, conformity proven. Class SN (at most 101.6 mm):
  // 101.8 − 0.05 > 101.6, non-conformity proven (ISO 14253-1:2017, 5.2 and 5.3).
  const post = (entryId: string) =>
    scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entryId, 101.8));
  const recA = await post(entryA);
  const recB = await post(entryB);
  assert.equal(recA.res.status, 201, JSON.stringify(recA.body));
  assert.equal(recB.res.status, 201, JSON.stringify(recB.body));
  assert.equal(recA.body.data.overallResult, 'conforms');
  assert.equal(recB.body.data.overallResult, 'does_not_conform');
  const rows = await query<{ entry_id: string; class_id: string; max_mm: number; overall_result: string }>(
    `select i.entry_id, i.class_id, (v.rules->'nozzle'->>'maxMm')::float as max_mm, i.overall_result
       from inspections i join class_rule_versions v on v.id = i.rule_version_id where i.boat_id = $1`,
    [boat],
  );
  assert.deepEqual(
    rows.map((r) => [r.entry_id, r.class_id, r.max_mm, r.overall_result]).sort(),
    [
      [entryA, wide, 102, 'conforms'],
      [entryB, narrow, 101.6, 'does_not_conform'],
    ].sort(),
    'one record per class, each under its own class’s published rules',
  );
  const results = await query<{ id: string; inspection_result: string }>(
    'select id, inspection_result from entries where boat_id = $1 order by id',
    [boat],
  );
  assert.deepEqual(Object.fromEntries(results.map((r) => [r.id, r.inspection_result])), {
    [entryA]: 'conforms',
    [entryB]: 'does_not_conform',
  });

  // Damage in one class's run is the boat's: every class's entry must be inspected again.
  await query(
    `update events set time_zone = 'UTC', starts_on = current_date - 1, ends_on = current_date + 1 where id = $1`,
    [meeting.eventId],
  );
  const incident = await chief.json(`/api/events/${meeting.eventId}/incidents`, {
    entryId: entryA,
    occurredAt: new Date(Date.now() - 10 * 60_000).toISOString(),
    description: 'Hit the marker buoy; intake grille bent.',
    damage: true,
  });
  assert.equal(incident.res.status, 201, JSON.stringify(incident.body));
  const open = await query<{ entry_id: string }>(
    'select entry_id from reinspections where entry_id = any($1::uuid[]) and done_at is null',
    [[entryA, entryB]],
  );
  assert.deepEqual(open.map((r) => r.entry_id).sort(), [entryA, entryB].sort());

  // Run times for class SN by the shared number go to the SN entry.
  const runs = await meeting.organiser.json(`/api/events/${meeting.eventId}/run-times`, {
    classId: narrow,
    courseLengthM: 400,
    rows: [
      {
        raceNumber: number,
        runLabel: '1',
        elapsedS: 40.5,
        trapSpeedKmh: null,
        gpsTopSpeedKmh: null,
        rpm: null,
        conditions: '',
      },
    ],
  });
  assert.equal(runs.res.status, 201, JSON.stringify(runs.body));
  const [run] = await query<{ entry_id: string }>(`select entry_id from run_times where class_id = $1`, [narrow]);
  assert.equal(run.entry_id, entryB);

  // With a boat in two classes, the organiser cannot go back to one class per boat: refused, nothing saved.
  const off = await meeting.organiser.json(`/api/events/${meeting.eventId}`, settings(false), 'PATCH');
  assert.equal(off.res.status, 409);
  assert.equal(off.body.error.code, 'several_classes_in_use');
  const [ev] = await query<{ several_classes_per_boat: boolean }>(
    'select several_classes_per_boat from events where id = $1',
    [meeting.eventId],
  );
  assert.equal(ev.several_classes_per_boat, true);
});

test('two entries of one boat sent at once into two classes keep one number between them', async () => {
  await meeting.organiser.json(`/api/events/${meeting.eventId}`, settings(true), 'PATCH');
  const boat = await ownBoat('Race Tern', 'RT-1');
  const [x, y] = await Promise.all([enter(meeting.eventId, boat, third), enter(meeting.eventId, boat, narrow)]);
  assert.deepEqual([x.res.status, y.res.status], [201, 201], JSON.stringify([x.body, y.body]));
  assert.equal(x.body.data.entry.raceNumber, y.body.data.entry.raceNumber);
});
