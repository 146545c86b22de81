// The nozzle's temperature correction through the real HTTP API and database (issue 16, item 2).
// References, computed by hand here:
// - reference temperature 20 °C (ISO 1:2022); L20 = L·(1 + α_i(t_i − 20))/(1 + α_p(t_p − 20))
//   (JCGM 100:2008, Annex H.1 [memory for the equation's layout]);
// - aluminium 23e-6 /K, steel 11.5e-6 /K [memory: typical handbook values];
// - aluminium nozzle and steel caliper both at 35 °C reading 102.000 mm: 102·1.0001725/1.000345 = 101.982412 mm;
// - budget (JCGM 100:2008, 5.1.2; 4.3.7; 6.2.1): U typed 0.05 mm → u = 0.025 mm; t ± 1 °C rectangular, one
//   reading for both; α ± 10 % rectangular: U = 0.050215 mm (term by term in
//   tests/unit/core/engine/measurement-thermal.test.ts).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
let classId: string;
const post = (body: unknown) => scrutineer.json(`/api/events/${meeting.eventId}/inspections`, body);

type Stored = {
  measurements: {
    nozzle: {
      temperatureC: number | null;
      correctedReadingsMm: number[];
      appliedExpandedUncertaintyMm: number;
      instrumentTemperatureC?: number;
      instrumentTemperatureSource?: string;
      instrumentMaterialSource?: string;
      uncertaintyBudget?: { terms: { quantity: string }[]; coverageFactor: number; expandedUncertaintyMm: number };
    };
  };
  results: {
    rules: { rule: string; verdict: string; expandedUncertainty: number; budget?: { terms: unknown[] } }[];
  };
};
const stored = async (id: string) =>
  (await query<Stored>('select measurements, results from inspections where id = $1', [id]))[0];
const record = async (nozzle: Record<string, unknown>) => {
  const e = await meeting.addEntry(classId);
  const base = inspectionBody(e.id, 102);
  const { res, body } = await post({ ...base, nozzle: { ...base.nozzle, material: 'aluminium', ...nozzle } });
  assert.equal(res.status, 201, JSON.stringify(body));
  return { body, row: await stored(body.data.id) };
};

before(async () => {
  await meeting.create(`Inspection Temperature Meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  classId = await meeting.addClass(
    'TMP',
    rulesWith({ nozzle: { maxMm: 102.03, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
  );
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

test('part and caliper at 35 °C (one reading): the stored corrected reading is 101.982 mm and U 0.050215 mm', async () => {
  const { body, row } = await record({ partTemperatureC: 35, instrumentAtPartTemperature: true });
  const n = row.measurements.nozzle;
  assert.ok(Math.abs(n.correctedReadingsMm[1] - (102 * 1.0001725) / 1.000345) < 1e-9, `${n.correctedReadingsMm[1]}`);
  assert.ok(Math.abs(n.appliedExpandedUncertaintyMm - 0.050215) < 1e-6, `${n.appliedExpandedUncertaintyMm}`);
  assert.equal(n.temperatureC, 35, 'the part’s temperature');
  assert.equal(n.instrumentTemperatureC, 35);
  assert.equal(n.instrumentTemperatureSource, 'same_as_part');
  assert.equal(n.instrumentMaterialSource, 'assumed_steel');
  assert.equal(n.uncertaintyBudget?.terms.length, 4);
  assert.equal(n.uncertaintyBudget?.coverageFactor, 2);
  const rule = row.results.rules.find((r) => r.rule === 'nozzle_max')!;
  assert.ok(Math.abs(rule.expandedUncertainty - 0.050215) < 1e-6);
  assert.equal(rule.budget?.terms.length, 4, 'the budget is stored with the rule for the logbook and PDF');
  // 102.03 − 0.050215 = 101.979785 < 101.982412: conformity not proven (ISO 14253-1:2017).
  assert.equal(rule.verdict, 'inconclusive');
  const answered = (body.data.rules as { rule: string; budget?: unknown }[]).find((r) => r.rule === 'nozzle_max');
  assert.ok(answered?.budget, 'the dock gets the budget in the answer');
});

test('part and instrument at different temperatures; the older temperatureC keeps its meaning (instrument at 20 °C)', async () => {
  const apart = await record({ partTemperatureC: 40, instrumentTemperatureC: 25, instrumentMaterial: 'steel' });
  const a = apart.row.measurements.nozzle;
  assert.ok(Math.abs(a.correctedReadingsMm[1] - (102 * (1 + 11.5e-6 * 5)) / (1 + 23e-6 * 20)) < 1e-9);
  assert.equal(a.instrumentTemperatureSource, 'measured');
  assert.equal(a.instrumentMaterialSource, 'form');
  assert.equal(a.uncertaintyBudget?.terms.length, 5, 'U, t_p, t_i, α_p, α_i');

  const older = await record({ temperatureC: 35 });
  const o = older.row.measurements.nozzle;
  assert.ok(Math.abs(o.correctedReadingsMm[1] - 102 / 1.000345) < 1e-9, 'part only: 101.964808 mm, as before');
  assert.equal(o.temperatureC, 35);
  assert.equal(o.instrumentTemperatureSource, 'assumed_reference');
  assert.equal(o.instrumentTemperatureC, 20);
});

test('contradictory or out-of-range temperatures are refused with 400 on the field, and nothing is stored', async () => {
  const e = await meeting.addEntry(classId);
  const count = async () =>
    Number((await query<{ n: string }>('select count(*) as n from inspections where entry_id = $1', [e.id]))[0].n);
  const base = inspectionBody(e.id, 102);
  const cases: [Record<string, unknown>, string][] = [
    [{ partTemperatureC: 35, instrumentTemperatureC: 90 }, 'nozzle.instrumentTemperatureC'],
    [{ partTemperatureC: 35, temperatureC: 30 }, 'nozzle.partTemperatureC'],
    [
      { partTemperatureC: 35, instrumentTemperatureC: 30, instrumentAtPartTemperature: true },
      'nozzle.instrumentTemperatureC',
    ],
    [{ instrumentAtPartTemperature: true }, 'nozzle.partTemperatureC'],
    [{ partTemperatureC: 35, instrumentMaterial: 'granite' }, 'nozzle.instrumentMaterial'],
  ];
  for (const [nozzle, field] of cases) {
    const { res, body } = await post({
      ...base,
      idempotencyKey: randomUUID(),
      nozzle: { ...base.nozzle, material: 'aluminium', ...nozzle },
    });
    assert.equal(res.status, 400, JSON.stringify(body));
    const fields = (body.error?.details ?? []).map((d: { field: string }) => d.field);
    assert.ok(fields.includes(field), `${field} in ${JSON.stringify(fields)}`);
  }
  assert.equal(await count(), 0);
});
