// The verdict's temperature correction for part and instrument (issue 16, item 2). References:
// - reference temperature 20 °C (ISO 1:2022); L20 = L·(1 + α_i(t_i − 20))/(1 + α_p(t_p − 20))
//   (JCGM 100:2008, Annex H.1 [memory for the equation's layout]);
// - aluminium 23e-6 /K, steel 11.5e-6 /K [memory: typical handbook values];
// - budget: law of propagation (JCGM 100:2008, 5.1.2), rectangular limits (4.3.7), k = 2 (6.2.1).
// The worked case: an aluminium nozzle and a steel caliper both at 35 °C, reading 102.000 mm, give
// 102·1.0001725/1.000345 = 101.982412 mm; with the class default U = 0.05 mm the budget gives
// U = 0.050215 mm (hand computation in tests/unit/core/engine/measurement-thermal.test.ts).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { decideInspection, type DecideInput } from '../../../../lib/core/inspections/decide-inspection';
import type { ClassRules } from '../../../../lib/core/inputs/class-rules';
import { RecordInspectionInput } from '../../../../lib/core/inputs/inspections';

const rules = (maxMm = 102): ClassRules => ({
  nozzle: { maxMm, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: null, maxKw: null, defaultUncertaintyKw: 5 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: [],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10],
  },
});

const input = (nozzle: Partial<DecideInput['input']['nozzle']>): DecideInput['input'] => ({
  nozzle: {
    readings: [102, 101.9, 101.95].map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })),
    instrumentId: null,
    expandedUncertaintyMm: null,
    temperatureC: null,
    material: 'aluminium',
    ...nozzle,
  },
  weight: null,
  power: { declaredKw: 200, evidenceSeen: true, note: '' },
  safety: {},
});

test('the worked case at the dock: part and caliper at 35 °C (one reading) give 101.982 mm and U 0.050215 mm', () => {
  const d = decideInspection({
    input: input({ temperatureC: 35, partTemperatureC: 35, instrumentAtPartTemperature: true }),
    rules: rules(102.03),
  });
  const r = d.rules.find((x) => x.rule === 'nozzle_max')!;
  assert.ok(Math.abs(r.decisiveValue! - (102 * 1.0001725) / 1.000345) < 1e-9, `${r.decisiveValue}`);
  assert.ok(Math.abs(r.expandedUncertainty! - 0.050215) < 1e-6, `${r.expandedUncertainty}`);
  assert.equal(d.nozzle.expandedUncertaintyMm, r.expandedUncertainty);
  assert.equal(r.budget?.terms.length, 4, 'class default U, t (once), α_p, α_i');
  assert.equal(d.nozzle.thermal?.instrumentTemperatureSource, 'same_as_part');
  assert.equal(d.nozzle.thermal?.instrumentMaterialSource, 'assumed_steel');
  assert.match(r.explanation, /steel assumed\) at the same temperature/);
  assert.match(r.explanation, /JCGM 100:2008, 5\.1\.2\): U = 2·u_c = 0\.0502 mm/);
  // 102.03 − 0.050215 = 101.979785 < 101.982412: conformity not proven (ISO 14253-1:2017). With the
  // part-only correction (101.964808) and U 0.05 it read as proven: the instrument's expansion matters.
  assert.equal(r.verdict, 'inconclusive');
});

test('the instrument’s material on file wins over the form’s; the form’s over the steel assumption', () => {
  const nozzle = { temperatureC: 35, partTemperatureC: 35, instrumentAtPartTemperature: true };
  const onFile = decideInspection({
    input: input({ ...nozzle, instrumentMaterial: 'steel' }),
    rules: rules(),
    nozzleInstrument: {
      id: 'i1',
      name: 'Aluminium gauge',
      quantity: 'length',
      errorLimit: 0.02,
      resolution: 0.01,
      expandedUncertainty: null,
      material: 'aluminium',
    },
  });
  // Same material, same temperature: the expansions cancel, L20 = L.
  assert.ok(Math.abs(onFile.nozzle.correctedReadingsMm[0] - 102) < 1e-12);
  assert.equal(onFile.nozzle.thermal?.instrumentMaterialSource, 'instrument');
  const fromForm = decideInspection({ input: input({ ...nozzle, instrumentMaterial: 'bronze' }), rules: rules() });
  // Bronze 18e-6 /K [memory]: 102·(1 + 18e-6·15)/(1 + 23e-6·15).
  assert.ok(Math.abs(fromForm.nozzle.correctedReadingsMm[0] - (102 * (1 + 18e-6 * 15)) / (1 + 23e-6 * 15)) < 1e-9);
  assert.equal(fromForm.nozzle.thermal?.instrumentMaterialSource, 'form');
});

test('a measured instrument temperature is used as given; without one the instrument is taken as at 20 °C (today’s meaning)', () => {
  const measured = decideInspection({
    input: input({ temperatureC: 40, partTemperatureC: 40, instrumentTemperatureC: 25 }),
    rules: rules(),
  });
  assert.ok(Math.abs(measured.nozzle.correctedReadingsMm[0] - (102 * (1 + 11.5e-6 * 5)) / (1 + 23e-6 * 20)) < 1e-9);
  assert.equal(measured.nozzle.budget.terms.length, 5, 'U, t_p, t_i, α_p, α_i');
  const older = decideInspection({ input: input({ temperatureC: 35 }), rules: rules() });
  assert.ok(Math.abs(older.nozzle.correctedReadingsMm[0] - 102 / 1.000345) < 1e-9, 'part only, as before');
  assert.equal(older.nozzle.thermal?.instrumentTemperatureSource, 'assumed_reference');
  assert.match(older.rules[0].explanation, /not measured, taken as at 20 °C/);
  // No temperature: no correction and no temperature terms; U is the class default as before.
  const cold = decideInspection({ input: input({}), rules: rules() });
  assert.equal(cold.nozzle.thermal, null);
  assert.equal(cold.nozzle.expandedUncertaintyMm, 0.05);
  assert.equal(cold.nozzle.budget.terms.length, 1);
});

test('the input: the older temperatureC is the part’s temperature; contradictions are refused by field', () => {
  const base = {
    idempotencyKey: '00000000-0000-4000-8000-0000000000a1',
    entryId: '00000000-0000-4000-8000-0000000000e1',
    capturedAt: new Date().toISOString(),
    power: { declaredKw: 250, evidenceSeen: true },
  };
  const readings = [{ diameterMm: 100, angleDeg: 0 }];
  const older = RecordInspectionInput.parse({ ...base, nozzle: { readings, temperatureC: 30 } });
  assert.equal(older.nozzle.partTemperatureC, 30);
  assert.equal(older.nozzle.instrumentAtPartTemperature, false);
  const newer = RecordInspectionInput.parse({ ...base, nozzle: { readings, partTemperatureC: 31 } });
  assert.equal(newer.nozzle.temperatureC, 31, 'readers of temperatureC see the part’s temperature');
  const fieldOf = (nozzle: Record<string, unknown>) => {
    const r = RecordInspectionInput.safeParse({ ...base, nozzle: { readings, ...nozzle } });
    assert.equal(r.success, false);
    return r.error!.issues.map((i) => i.path.join('.'));
  };
  assert.deepEqual(fieldOf({ temperatureC: 30, partTemperatureC: 31 }), ['nozzle.partTemperatureC']);
  assert.deepEqual(fieldOf({ partTemperatureC: 30, instrumentTemperatureC: 25, instrumentAtPartTemperature: true }), [
    'nozzle.instrumentTemperatureC',
  ]);
  assert.deepEqual(fieldOf({ instrumentAtPartTemperature: true }), ['nozzle.partTemperatureC']);
  assert.deepEqual(fieldOf({ instrumentTemperatureC: 71 }), ['nozzle.instrumentTemperatureC']);
  assert.deepEqual(fieldOf({ instrumentMaterial: 'cheese' }), ['nozzle.instrumentMaterial']);
});
