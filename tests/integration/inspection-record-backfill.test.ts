// The stored inspection record has one shape (models/shapes/inspection-record.ts). Through the real
// database: a row written the way the demo seed used to write it (no ruleVersion, no scope, the typed
// U under another name) is brought to that shape by the migration's own backfill, with the
// append-only trigger back on afterwards; a row that would need a figure invented stops it and
// nothing changes; a record made through the API is already in the shape and is left alone.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { Sequelize } from 'sequelize';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { decideInspection, type InstrumentFigures } from '../../lib/core/inspections/decide-inspection';
import { StoredInspectionRecord } from '../../lib/core/inspections/inspection-record';
import { RecordInspectionInput } from '../../lib/core/inputs/inspections';
import type { ClassRules } from '../../lib/core/inputs/class-rules';
import backfill from '../../migrations/20261203003000-bring-inspection-records-to-one-shape.js';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
let sequelize: Sequelize;
let classId = '';
let ruleVersionId = '';
let ruleVersion = 0;
let rules: ClassRules;
let scale: InstrumentFigures;
const run = (ids: string[]): Promise<number> => backfill.bringInspectionsToOneShape(sequelize, { ids });
const load = async (id: string) =>
  (
    await query<{ measurements: unknown; results: unknown; overall_result: string }>(
      'select measurements, results, overall_result from inspections where id = $1',
      [id],
    )
  )[0];

before(async () => {
  sequelize = new Sequelize(process.env.DATABASE_URL!, { logging: false });
  await meeting.create(`Record Shape Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  classId = await meeting.addClass(
    'SHP',
    rulesWith({ weight: { minKg: 400, includesDriver: true, defaultUncertaintyKg: 1 } }),
  );
  const [v] = await query<{ id: string; version: number; rules: ClassRules }>(
    `select id, version, rules from class_rule_versions where class_id = $1 and status = 'published'`,
    [classId],
  );
  ({ id: ruleVersionId, version: ruleVersion, rules } = v);
  const [s] = await query<{ id: string }>(
    `insert into instruments (event_id, name, quantity, expanded_uncertainty) values ($1, 'Test platform scale', 'mass', 1) returning id`,
    [meeting.eventId],
  );
  scale = {
    id: s.id,
    name: 'Test platform scale',
    quantity: 'mass',
    errorLimit: null,
    resolution: null,
    expandedUncertainty: 1,
  };
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});
after(async () => {
  await sequelize?.close();
});

/** Inserts a record shaped as scripts/seed-demo-inspections.ts wrote it before the one shape (its code, kept here as the fixture). */
async function insertOldSeedRow(
  entry: TestEntry,
  over: { temperatureC?: number | null; material?: string | null; dropCorrected?: boolean } = {},
) {
  const [{ id: scrutineerId }] = await query<{ id: string }>('select id from users where email = $1', [
    DEMO.scrutineer,
  ]);
  const input = RecordInspectionInput.parse({
    ...inspectionBody(entry.id, 101.9),
    nozzle: {
      readings: [
        { diameterMm: 101.5, angleDeg: 0 },
        { diameterMm: 101.9, angleDeg: 60 },
        { diameterMm: 101.8, angleDeg: 120 },
      ],
      expandedUncertaintyMm: 0.05,
    },
    weight: { readingsKg: [405, 406], instrumentId: scale.id },
  });
  const decision = decideInspection({ input, rules, weightInstrument: scale });
  const nozzle: Record<string, unknown> = {
    ...input.nozzle,
    temperatureC: over.temperatureC ?? null,
    material: over.material ?? null,
    instrumentName: null,
    correctedReadingsMm: decision.nozzle.correctedReadingsMm,
    appliedExpandedUncertaintyMm: decision.nozzle.expandedUncertaintyMm,
    uncertaintyBasis: decision.nozzle.uncertaintyBasis,
  };
  if (over.dropCorrected) delete nozzle.correctedReadingsMm;
  const measurements = {
    nozzle,
    weight: { ...input.weight, ...decision.weight },
    power: { declaredKw: input.power.declaredKw, evidenceSeen: input.power.evidenceSeen, note: input.power.note },
    // The free-text seals the old seed wrote (the register's actions came later).
    seals: [{ number: 'S-0001', location: 'pump housing' }],
    safety: input.safety,
  };
  const results = { rules: decision.rules, decisionRule: rules.decisionRule };
  const [row] = await query<{ id: string }>(
    `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, kind, recorded_by_id, device, idempotency_key, captured_at, measurements, results, overall_result, notes)
     values ($1, $2, $3, $4, $5, 'pre_race', $6, 'demo seed', $7, now() - interval '1 hour', $8, $9, $10, 'Demo record') returning id`,
    [
      meeting.eventId,
      entry.id,
      entry.boatId,
      classId,
      ruleVersionId,
      scrutineerId,
      randomUUID(),
      JSON.stringify(measurements),
      JSON.stringify(results),
      decision.overall,
    ],
  );
  return { id: row.id, decision };
}

test('a row in the old seed shape does not parse; the backfill brings it to the one shape without changing a verdict', async () => {
  const entry = await meeting.addEntry(classId, { declaredPowerKw: 230 });
  const { id, decision } = await insertOldSeedRow(entry);
  const before = await load(id);
  assert.equal(
    StoredInspectionRecord.safeParse({ measurements: before.measurements, results: before.results }).success,
    false,
    'the old seed shape lacks ruleVersion and scope',
  );

  assert.equal(await run([id]), 1, 'one row brought to the shape');
  const after = await load(id);
  const parsed = StoredInspectionRecord.safeParse({ measurements: after.measurements, results: after.results });
  assert.ok(parsed.success, parsed.success ? '' : parsed.error.message);
  const { measurements: m, results: r } = parsed.data;
  assert.equal(r.ruleVersion, ruleVersion, 'the number of the rule version the row names');
  assert.equal(r.scope, null, 'the seed never recorded a targeted re-inspection');
  assert.equal(r.decisionRule, 'iso14253');
  assert.deepEqual(r.rules, JSON.parse(JSON.stringify(decision.rules)), 'every verdict is kept as decided');
  assert.equal(after.overall_result, before.overall_result);
  assert.equal(m.nozzle.typedExpandedUncertaintyMm, 0.05, 'the typed U keeps its value under its new name');
  assert.equal(m.nozzle.temperatureCorrected, false);
  assert.deepEqual(m.nozzle.correctedReadingsMm, [101.5, 101.9, 101.8]);
  assert.equal(m.nozzle.appliedExpandedUncertaintyMm, 0.05);
  assert.equal(m.weight?.instrumentName, 'Test platform scale', 'named from the instrument the row points at');
  assert.equal(m.weight?.meanKg, 405.5);
  assert.deepEqual(
    [m.power.boatDeclaredKw, m.power.boatPowerEvidence],
    [230, 'dyno_sheet'],
    'from the boat the row names',
  );
  assert.deepEqual(m.seals, [{ number: 'S-0001', location: 'pump housing' }]);

  assert.equal(await run([id]), 0, 'running it again changes nothing');
  await assert.rejects(
    query(`update inspections set notes = 'changed' where id = $1`, [id]),
    /append-only/,
    'the append-only trigger is on again',
  );
});

test('a row whose corrected readings cannot be known stops the backfill: nothing changes and the trigger stays on', async () => {
  const good = await insertOldSeedRow(await meeting.addEntry(classId));
  const bad = await insertOldSeedRow(await meeting.addEntry(classId), {
    temperatureC: 30,
    material: 'aluminium',
    dropCorrected: true,
  });
  const goodBefore = await load(good.id);
  await assert.rejects(
    run([good.id, bad.id]),
    new RegExp(`inspection ${bad.id}: the readings were corrected for temperature`),
  );
  assert.deepEqual(await load(good.id), goodBefore, 'rolled back with the rest');
  await assert.rejects(query(`update inspections set notes = 'changed' where id = $1`, [good.id]), /append-only/);
});

test('a record made through the API is already in the one shape, and the backfill leaves it alone', async () => {
  const entry = await meeting.addEntry(classId);
  const { res, body } = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, {
    ...inspectionBody(entry.id, 101.9),
    weight: { readingsKg: [401], instrumentId: scale.id },
  });
  assert.equal(res.status, 201, JSON.stringify(body));
  const row = await load(body.data.id);
  const parsed = StoredInspectionRecord.safeParse({ measurements: row.measurements, results: row.results });
  assert.ok(parsed.success, parsed.success ? '' : parsed.error.message);
  assert.equal(parsed.data.results.ruleVersion, ruleVersion);
  assert.equal(parsed.data.measurements.weight?.instrumentName, 'Test platform scale');
  assert.equal(await run([body.data.id]), 0);
});
