// Issue 19, item 3: an entrant declares the boat's engine curve and pump characteristic (the maker's
// points, or an impeller model and trim from a meeting's catalogue that its organiser entered once).
// Through the real HTTP API and database. The curves are invented for this test; the limits of the
// matched calculator's schema are its own (lib/core/inputs/calculation.ts), not published figures.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const owner = new HttpSession();
const other = new HttpSession();
const scrutineer = new HttpSession();
const anonymous = new HttpSession();
let entry: TestEntry;

const engine = {
  kind: 'points',
  curve: [
    { rpm: 5000, powerKw: 220 },
    { rpm: 6000, powerKw: 280 },
    { rpm: 7000, powerKw: 300 },
  ],
  limiterRpm: 7200,
};
const pumpCurve = [
  { flowCoefficient: 0.08, headCoefficient: 6.0, efficiency: 0.8 },
  { flowCoefficient: 0.12, headCoefficient: 5.9, efficiency: 0.9 },
  { flowCoefficient: 0.16, headCoefficient: 5.5, efficiency: 0.85 },
];
const catalogueBody = {
  maker: 'Invented Jets',
  model: 'Mixed 212',
  trimCode: 'T3',
  impellerDiameterMm: 212,
  curve: pumpCurve,
};
const versions = (boatId: string) =>
  query<{ version: number; declared_performance: Record<string, unknown> | null }>(
    'select version, declared_performance from boat_declaration_versions where boat_id = $1 order by version',
    [boatId],
  );

before(async () => {
  await meeting.create(`Declared Curves Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  const classId = await meeting.addClass('DC', rulesWith());
  entry = await meeting.addEntry(classId, { declaredPowerKw: 250 });
  await owner.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const email = uniqueEmail('curves-other');
  await other.json('/api/accounts', { name: 'Curves Other', email, password: 'curves-password-1' });
  assert.equal((await other.signInWithPassword(email, 'curves-password-1')).status, 200);
});

test('the catalogue: the meeting’s organiser adds an impeller; an entrant is refused (403), anonymous 401, a bad curve 400 naming the point', async () => {
  const path = `/api/events/${meeting.eventId}/pump-catalogue`;
  const added = await meeting.organiser.json(path, catalogueBody);
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  assert.equal(added.body.data.maker, 'Invented Jets');
  assert.deepEqual(added.body.data.curve, pumpCurve);

  const byEntrant = await owner.json(path, catalogueBody);
  assert.equal(byEntrant.res.status, 403);
  const [{ n }] = await query<{ n: number }>(
    'select count(*)::int as n from pump_catalogue_entries where event_id = $1',
    [meeting.eventId],
  );
  assert.equal(n, 1, 'the refused entry was not stored');
  assert.equal((await anonymous.json(path, catalogueBody)).res.status, 401);

  const bad = await meeting.organiser.json(path, {
    ...catalogueBody,
    curve: [pumpCurve[1], pumpCurve[0]],
  });
  assert.equal(bad.res.status, 400);
  assert.equal(bad.body.error.details[0].field, 'curve.1.flowCoefficient');

  // Anyone signed in reads the catalogue (a maker's published curves), so an entrant can choose from it.
  const listed = await owner.fetch(path);
  assert.equal(listed.status, 200);
  assert.deepEqual(
    ((await listed.json()).data as { id: string }[]).map((e) => e.id),
    [added.body.data.id],
  );
  // Append-only: the database itself refuses to rewrite an entry a declaration may have copied.
  await assert.rejects(
    query('update pump_catalogue_entries set maker = $1 where id = $2', ['Rewritten', added.body.data.id]),
  );
});

test('the owner declares an engine curve and a catalogue impeller: a new version holding a copy of the curve', async () => {
  const [cat] = await query<{ id: string }>('select id from pump_catalogue_entries where event_id = $1', [
    meeting.eventId,
  ]);
  const put = await owner.json(
    `/api/boats/${entry.boatId}/performance`,
    {
      engine,
      pump: { kind: 'catalogue', catalogueEntryId: cat.id },
      suction: { inletDepthM: 0.3, suctionSpecificSpeed: 3 },
    },
    'PUT',
  );
  assert.equal(put.res.status, 200, JSON.stringify(put.body));
  const stored = put.body.data.declaredPerformance;
  assert.deepEqual(stored.engine, engine);
  assert.equal(stored.pump.kind, 'catalogue');
  assert.equal(stored.pump.impellerDiameterMm, 212);
  assert.deepEqual(stored.pump.curve, pumpCurve);

  const all = await versions(entry.boatId);
  assert.equal(all.length, 2);
  assert.equal(all[0].declared_performance, null);
  assert.deepEqual(all[1].declared_performance, stored);
  const read = await owner.fetch(`/api/boats/${entry.boatId}`);
  const listed = (await read.json()).data.declarationVersions as { version: number; changes: string }[];
  assert.match(
    listed[0].changes,
    /^engine and pump curves \(none\) → engine curve 3 points to 7000 rpm, pump Invented Jets Mixed 212 trim T3/,
  );

  // The same set again changes nothing: no new version.
  const again = await owner.json(
    `/api/boats/${entry.boatId}/performance`,
    {
      engine,
      pump: { kind: 'catalogue', catalogueEntryId: cat.id },
      suction: { inletDepthM: 0.3, suctionSpecificSpeed: 3 },
    },
    'PUT',
  );
  assert.equal(again.res.status, 200);
  assert.equal((await versions(entry.boatId)).length, 2);
});

test('another entrant cannot see or change the boat (404, as for a missing boat), anonymous 401; nothing is written', async () => {
  const body = { engine: { kind: 'rated', ratedPowerKw: 9000, ratedRpm: 7000, shape: 'flat' } };
  const before = (await versions(entry.boatId)).length;
  // The house rule for another owner's boat is the answer for a missing one (boat-view.ts: ids reveal nothing).
  assert.equal((await other.json(`/api/boats/${entry.boatId}/performance`, body, 'PUT')).res.status, 404);
  assert.equal((await anonymous.json(`/api/boats/${entry.boatId}/performance`, body, 'PUT')).res.status, 401);
  assert.equal((await versions(entry.boatId)).length, before);
});

test('a bad curve is a 400 naming the field, as the matched calculator names it; nothing is written', async () => {
  const before = (await versions(entry.boatId)).length;
  const bad = await owner.json(
    `/api/boats/${entry.boatId}/performance`,
    {
      engine: {
        kind: 'points',
        curve: [
          { rpm: 6000, powerKw: 280 },
          { rpm: 5000, powerKw: 220 },
        ],
      },
      pump: { kind: 'points', impellerDiameterMm: 212, curve: pumpCurve },
    },
    'PUT',
  );
  assert.equal(bad.res.status, 400);
  assert.deepEqual(
    bad.body.error.details.map((d: { field: string }) => d.field),
    ['engine.curve.1.rpm'],
  );
  // The matched API refuses the same curve with the same field (POST /api/v1/jet-performance/matched).
  const api = await anonymous.json('/api/v1/jet-performance/matched', {
    engine: {
      curve: [
        { rpm: 6000, powerKw: 280 },
        { rpm: 5000, powerKw: 220 },
      ],
    },
    pump: { impellerDiameterMm: 212, curve: pumpCurve },
    nozzleDiameterMm: 100,
    speedsMs: [0],
  });
  assert.equal(api.res.status, 400);
  assert.equal(api.body.error.details[0].field, 'engine.curve.1.rpm');
  assert.equal(api.body.error.details[0].message, bad.body.error.details[0].message);

  const missingEntry = await owner.json(
    `/api/boats/${entry.boatId}/performance`,
    { pump: { kind: 'catalogue', catalogueEntryId: '00000000-0000-4000-8000-000000000000' } },
    'PUT',
  );
  assert.equal(missingEntry.res.status, 400);
  assert.equal(missingEntry.body.error.details[0].field, 'pump.catalogueEntryId');
  assert.equal((await versions(entry.boatId)).length, before);
});

test('a curve changed after a conforming inspection flags re-inspection with what changed', async () => {
  const recorded = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entry.id, 101.9));
  assert.equal(recorded.res.status, 201, JSON.stringify(recorded.body));
  assert.equal(recorded.body.data.overallResult, 'conforms');
  const put = await owner.json(
    `/api/boats/${entry.boatId}/performance`,
    { engine: { kind: 'rated', ratedPowerKw: 320, ratedRpm: 7000, shape: 'spark_ignition' } },
    'PUT',
  );
  assert.equal(put.res.status, 200, JSON.stringify(put.body));
  const [task] = await query<{ reason: string }>(
    'select reason from reinspections where entry_id = $1 and done_at is null order by created_at desc limit 1',
    [entry.id],
  );
  assert.ok(task, 'a re-inspection task is open');
  assert.match(task.reason, /engine and pump curves .* → engine 320 kW at 7000 rpm \(spark ignition\)/);
});

test('a meeting still in draft keeps its catalogue (and its name) from entrants; its organiser still sees it', async () => {
  await query(`update events set status = 'draft' where id = $1`, [meeting.eventId]);
  try {
    const path = `/api/events/${meeting.eventId}/pump-catalogue`;
    const byEntrant = await owner.fetch(path);
    assert.equal(byEntrant.status, 200);
    assert.deepEqual((await byEntrant.json()).data, []);
    const byOrganiser = await meeting.organiser.fetch(path);
    const listed = (await byOrganiser.json()).data as { id: string; organisationName: string }[];
    assert.equal(listed.length, 1);
    assert.ok(listed[0].organisationName, 'each impeller names the club running its meeting');
    // Chosen by its id, a draft meeting's impeller is as unknown as in the list (attack s7, F5).
    const chosen = await owner.json(
      `/api/boats/${entry.boatId}/performance`,
      { pump: { kind: 'catalogue', catalogueEntryId: listed[0].id } },
      'PUT',
    );
    assert.equal(chosen.res.status, 400, JSON.stringify(chosen.body));
    assert.equal(chosen.body.error.details[0].field, 'pump.catalogueEntryId');
  } finally {
    await query(`update events set status = 'entries_open' where id = $1`, [meeting.eventId]);
  }
});
