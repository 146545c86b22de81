// The stored inspection record: one builder, checked against the one shape, and the one reader the
// parity report uses. Reference values:
// - reference temperature 20 °C for dimensional measurement (ISO 1:2022); linear expansion of
//   aluminium about 23e-6 /K [memory: typical handbook value], so 100 mm read at 30 °C is
//   100 / (1 + 23e-6 · 10) = 99.97700 mm at 20 °C;
// - an instrument's budget: error limit a as a rectangular distribution a/√3 (JCGM 100:2008, 4.3.7),
//   resolution δ as δ/√12 (F.2.2.1), expanded with k = 2 (6.2.1): a = 0.03 mm, δ = 0.01 mm give
//   U = 2·√(0.03²/3 + 0.01²/12) = 0.035119 mm;
// - repeat weighings: their mean is the estimate (JCGM 100:2008, 4.2.1) and s/√n its standard
//   uncertainty (4.2.2, 4.2.3): 405 and 406 kg give 405.5 kg and s/√n = 0.5 kg; with a scale of
//   U = 1 kg (u = 0.5 kg), U = 2·√(0.5² + 0.5²) = 1.41421 kg.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { decideInspection, type InstrumentFigures } from '../../../../lib/core/inspections/decide-inspection';
import {
  buildInspectionRecord,
  readRecordForReport,
  StoredInspectionRecord,
  type BuildInspectionRecordInput,
} from '../../../../lib/core/inspections/inspection-record';
import type { ClassRules } from '../../../../lib/core/inputs/class-rules';
import { RecordInspectionInput } from '../../../../lib/core/inputs/inspections';

const CALIPER: InstrumentFigures = {
  id: '00000000-0000-4000-8000-00000000c001',
  name: 'Test caliper',
  quantity: 'length',
  errorLimit: 0.03,
  resolution: 0.01,
  expandedUncertainty: null,
};
const SCALE: InstrumentFigures = {
  id: '00000000-0000-4000-8000-00000000c002',
  name: 'Test scale',
  quantity: 'mass',
  errorLimit: null,
  resolution: null,
  expandedUncertainty: 1,
};

const rules = (over: Partial<ClassRules> = {}): ClassRules => ({
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: null, maxKw: 300, defaultUncertaintyKw: 5 },
  weight: { minKg: 400, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: ['helmet'],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10],
  },
  ...over,
});

const parseInput = (nozzle: Record<string, unknown>, over: Record<string, unknown> = {}) =>
  RecordInspectionInput.parse({
    idempotencyKey: '00000000-0000-4000-8000-0000000000a1',
    entryId: '00000000-0000-4000-8000-0000000000e1',
    capturedAt: new Date().toISOString(),
    nozzle: {
      readings: [
        { diameterMm: 100, angleDeg: 0 },
        { diameterMm: 100.02, angleDeg: 60 },
        { diameterMm: 99.98, angleDeg: 120 },
      ],
      ...nozzle,
    },
    weight: { readingsKg: [405, 406], instrumentId: SCALE.id },
    power: { declaredKw: 250, evidenceSeen: true },
    safety: { helmet: true },
    ...over,
  });

// A seal action as the server hands it to the builder (invented numbers and component).
const SEAL_ACTION = {
  number: 'S-1',
  action: 'applied' as const,
  componentId: '00000000-0000-4000-8000-0000000000c1',
  component: 'engine Test Maker, serial 1',
  position: 'pump housing',
  reason: '',
};

function build(
  over: Partial<BuildInspectionRecordInput> & {
    nozzle?: Record<string, unknown>;
    classRules?: ClassRules;
    inputOver?: Record<string, unknown>;
  } = {},
) {
  const r = over.classRules ?? rules();
  const input = parseInput(
    over.nozzle ?? { instrumentId: CALIPER.id, temperatureC: 30, material: 'aluminium' },
    over.inputOver,
  );
  const nozzleInstrument = input.nozzle.instrumentId ? CALIPER : null;
  const decision = decideInspection({ input, rules: r, nozzleInstrument, weightInstrument: SCALE });
  return buildInspectionRecord({
    input,
    decision,
    rules: r,
    ruleVersion: 3,
    nozzleInstrument,
    weightInstrument: SCALE,
    boat: { declaredKw: 250, powerEvidence: 'dyno_sheet' },
    sealActions: [SEAL_ACTION],
    ...over,
  });
}

test('the built record parses with the stored shape and carries the rule version, scope and decision rule', () => {
  const record = build();
  assert.ok(StoredInspectionRecord.safeParse(record).success);
  assert.equal(record.results.ruleVersion, 3);
  assert.equal(record.results.scope, null);
  assert.equal(record.results.decisionRule, 'iso14253');
  assert.deepEqual(
    record.results.rules.map((r) => r.rule),
    ['nozzle_max', 'weight_min', 'power_band', 'safety:helmet'],
  );
  assert.deepEqual(record.measurements.power, {
    declaredKw: 250,
    evidenceSeen: true,
    note: '',
    boatDeclaredKw: 250,
    boatPowerEvidence: 'dyno_sheet',
  });
  assert.deepEqual(record.measurements.seals, [], 'free-text seals belong to records from before the register');
  assert.deepEqual(record.measurements.sealActions, [SEAL_ACTION]);
  const plain = build({ sealActions: [] });
  assert.equal('sealActions' in plain.measurements, false, 'no seal actions: the key is left out');
  const withEvidence = build({
    inputOver: { power: { declaredKw: 250, evidenceSeen: true, evidenceKind: 'dyno_sheet' } },
    dynoDocument: { id: '00000000-0000-4000-8000-0000000000d1', fileName: 'dyno.pdf' },
  });
  assert.deepEqual(
    [withEvidence.measurements.power.evidenceKind, withEvidence.measurements.power.dynoDocument],
    ['dyno_sheet', { id: '00000000-0000-4000-8000-0000000000d1', fileName: 'dyno.pdf' }],
  );
});

test('the record stores the readings corrected to 20 °C (ISO 1:2022; aluminium 23e-6 /K [memory])', () => {
  const { nozzle } = build().measurements;
  assert.equal(nozzle.temperatureCorrected, true);
  assert.deepEqual(
    nozzle.readings.map((r) => r.diameterMm),
    [100, 100.02, 99.98],
    'the readings as read are kept beside the corrected ones',
  );
  assert.ok(Math.abs(nozzle.correctedReadingsMm[0] - 99.977005) < 1e-5, `${nozzle.correctedReadingsMm[0]}`);
  assert.equal(nozzle.temperatureC, 30);
  assert.equal(nozzle.material, 'aluminium');
});

test('the record stores the applied U from the instrument budget (JCGM 100:2008 4.3.7, F.2.2.1, 6.2.1) and names the instrument', () => {
  // Without a temperature the budget is the instrument's alone: U = 0.035119 mm, as before issue 16.
  const { nozzle } = build({ nozzle: { instrumentId: CALIPER.id } }).measurements;
  assert.ok(Math.abs(nozzle.appliedExpandedUncertaintyMm - 0.035119) < 1e-6, `${nozzle.appliedExpandedUncertaintyMm}`);
  assert.equal(nozzle.instrumentName, 'Test caliper');
  assert.equal('uncertaintyBudget' in nozzle, false, 'no correction: the nozzle keeps the older shape');
  const rule = build({ nozzle: { instrumentId: CALIPER.id } }).results.rules.find((r) => r.rule === 'nozzle_max')!;
  assert.equal(rule.budget?.terms.length, 2, 'a and δ only, stored with the rule');
  // With the older temperatureC (30 °C, aluminium): the part at 30 °C, the instrument taken as at 20 °C
  // (steel assumed, 11.5e-6 /K [memory]); the temperature terms join the budget (JCGM 100:2008, 5.1.2).
  // Hand computation of L20 = L·N/D, N = 1 + α_i·0, D = 1 + α_p·10, at the largest reading L = 100.02 mm:
  const L = 100.02;
  const D = 1 + 23e-6 * 10;
  const uT = 1 / Math.sqrt(3); // thermometer ±1 °C, rectangular (4.3.7)
  const contributions = [
    0.03 / Math.sqrt(3) / D, // a/√3 · ∂L20/∂L
    0.01 / Math.sqrt(12) / D, // δ/√12 · ∂L20/∂L
    ((L * 23e-6) / (D * D)) * uT, // |∂L20/∂t_p| u(t_p)
    ((L * 11.5e-6) / D) * uT, // |∂L20/∂t_i| u(t_i)
    ((L * 10) / (D * D)) * ((0.1 * 23e-6) / Math.sqrt(3)), // |∂L20/∂α_p| u(α_p), ±10 % rectangular
    0, // ∂L20/∂α_i = L·(t_i − 20)/D = 0 with the instrument at 20 °C
  ];
  const handU = 2 * Math.sqrt(contributions.reduce((a, c) => a + c * c, 0));
  const warm = build().measurements.nozzle;
  assert.ok(Math.abs(handU - 0.035336) < 1e-6, `hand U ${handU}`);
  assert.ok(Math.abs(warm.appliedExpandedUncertaintyMm - handU) < 1e-9, `${warm.appliedExpandedUncertaintyMm}`);
  assert.equal(warm.instrumentTemperatureSource, 'assumed_reference');
  assert.equal(warm.instrumentMaterialSource, 'assumed_steel');
  assert.equal(warm.uncertaintyBudget?.terms.length, 6);
  assert.equal(nozzle.typedExpandedUncertaintyMm, null);
  const typed = build({ nozzle: { expandedUncertaintyMm: 0.08 } }).measurements.nozzle;
  assert.equal(typed.typedExpandedUncertaintyMm, 0.08);
  assert.equal(typed.appliedExpandedUncertaintyMm, 0.08);
  assert.equal(typed.instrumentName, null);
  assert.equal(typed.temperatureCorrected, false);
  assert.deepEqual(
    typed.correctedReadingsMm,
    [100, 100.02, 99.98],
    'without a temperature the readings are used as read',
  );
});

test('the weighings are stored with their mean and U (JCGM 100:2008, 4.2.1–4.2.3)', () => {
  const w = build().measurements.weight!;
  assert.equal(w.instrumentName, 'Test scale');
  assert.equal(w.meanKg, 405.5);
  assert.ok(Math.abs(w.expandedUncertaintyKg! - 1.41421) < 1e-5, `${w.expandedUncertaintyKg}`);
  // A class without a minimum weight decides nothing on it: the weighings are kept, the figures are null.
  const none = build({ classRules: rules({ weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 } }) });
  assert.deepEqual(none.measurements.weight, {
    readingsKg: [405, 406],
    instrumentId: SCALE.id,
    instrumentName: 'Test scale',
    meanKg: null,
    expandedUncertaintyKg: null,
    uncertaintyBasis: null,
  });
  assert.ok(StoredInspectionRecord.safeParse(none).success);
});

test('a record that does not fit the shape is a programming error, not bad input', () => {
  assert.throws(
    () => build({ ruleVersion: 0 }),
    (e: Error) => e.constructor === Error && /stored shape/.test(e.message),
  );
});

test('the report reads the corrected readings the record stores, not a recomputation', () => {
  const record = build();
  const read = readRecordForReport(record.measurements, record.results);
  assert.deepEqual(read.correctedReadingsMm, record.measurements.nozzle.correctedReadingsMm);
  // The U the verdict decided with: the caliper's budget with the temperature terms (hand-computed above).
  assert.ok(Math.abs(read.nozzleExpandedUncertaintyMm! - 0.035336) < 1e-6, `${read.nozzleExpandedUncertaintyMm}`);
  assert.equal(read.evidenceSeen, true);
  // What is stored is what counts: a stored list is read as it stands.
  const stored = {
    ...record.measurements,
    nozzle: { ...record.measurements.nozzle, correctedReadingsMm: [99.5, 99.6, 99.7] },
  };
  assert.deepEqual(readRecordForReport(stored, record.results).correctedReadingsMm, [99.5, 99.6, 99.7]);
});

test('the report reader on rows written by hand: readings as read without a temperature, nothing it cannot know', () => {
  const bare = {
    nozzle: {
      readings: [
        { diameterMm: 101.2, angleDeg: 0 },
        { diameterMm: 101.35, angleDeg: 60 },
      ],
    },
  };
  assert.deepEqual(readRecordForReport(bare, { rules: [] }), {
    correctedReadingsMm: [101.2, 101.35],
    nozzleExpandedUncertaintyMm: null,
    evidenceSeen: false,
    evidenceKind: null,
    confirmedPowerKw: null,
    measuredWeightKg: null,
  });
  const warm = { nozzle: { ...bare.nozzle, temperatureC: 30, material: 'aluminium' } };
  assert.equal(
    readRecordForReport(warm, { rules: [] }).correctedReadingsMm,
    null,
    'a corrected reading that is not stored is not guessed',
  );
  assert.deepEqual(readRecordForReport(null, null), {
    correctedReadingsMm: [],
    nozzleExpandedUncertaintyMm: null,
    evidenceSeen: false,
    evidenceKind: null,
    confirmedPowerKw: null,
    measuredWeightKg: null,
  });
});

test('the report takes the power the scrutineer confirmed and the weight measured, from the record only', () => {
  // The boat declares 9000 kW now; the record confirmed 250 kW: the record's figure is the one read.
  const record = build({ boat: { declaredKw: 9000, powerEvidence: 'none' } });
  const read = readRecordForReport(record.measurements, record.results);
  assert.equal(read.confirmedPowerKw, 250);
  // Arithmetic mean of the weighings 405 and 406 kg (JCGM 100:2008, 4.2.1) when the class has no minimum.
  assert.equal(read.measuredWeightKg, 405.5);
  // A stored mean is taken as stored.
  const withMean = { ...record.measurements, weight: { ...record.measurements.weight!, meanKg: 410 } };
  assert.equal(readRecordForReport(withMean, record.results).measuredWeightKg, 410);
  // Not weighed, no power figure: nothing invented.
  const bare = { nozzle: record.measurements.nozzle, weight: null, power: { evidenceSeen: false } };
  assert.deepEqual(
    [
      readRecordForReport(bare, record.results).confirmedPowerKw,
      readRecordForReport(bare, record.results).measuredWeightKg,
    ],
    [null, null],
  );
});
