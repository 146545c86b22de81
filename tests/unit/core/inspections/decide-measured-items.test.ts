// A class's own measured items and the nozzle's gauge check in the verdict, under both burdens of proof.
// Sources: ISO 14253-1:2017 (conformity proven inside the limit less U, non-conformity beyond the limit
// plus U; the entrant proves at inspection, the protester in a protest: common practice for the mapping,
// no source); ISO 14405-1:2016 (a two-point size is a local size; a plug gauge tests the inscribed size);
// JCGM 100:2008 (U = 2·u_c; 5.1.2 propagation). Engine capacity by hand: π·86³ = 1 998 228.9 mm³ = 1998.23 cm³,
// and with a 0.02 mm caliper U = 2·1998.23·(0.01/86)·√5 = 1.039 cm³ (tests/unit/core/engine/measured-item.test.ts).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  decideInspection,
  type DecideInput,
  type InstrumentFigures,
} from '../../../../lib/core/inspections/decide-inspection';
import { ClassRules, DEFAULT_CLASS_RULES } from '../../../../lib/core/inputs/class-rules';
import { RecordInspectionInput } from '../../../../lib/core/inputs/inspections';
import { buildInspectionRecord } from '../../../../lib/core/inspections/inspection-record';
import { EngineInputError } from '../../../../lib/core/engine/engine-input-error';
import type { MeasuredItemRule } from '../../../../lib/core/inputs/measured-item-rules';

const ENGINE: MeasuredItemRule = {
  key: 'engine_capacity',
  label: 'Engine capacity',
  unit: 'cm³',
  minimum: null,
  maximum: 2000,
  readings: 1,
  instrumentTypes: ['caliper', 'bore_gauge'],
  decisionRule: null,
  defaultUncertainty: 5,
  note: '',
  formula: { kind: 'engine_capacity', cylinders: 4 },
};
const BALLAST: MeasuredItemRule = {
  key: 'ballast',
  label: 'Ballast',
  unit: 'kg',
  minimum: 24.8,
  maximum: null,
  readings: 3,
  instrumentTypes: ['scale'],
  decisionRule: null,
  defaultUncertainty: 1,
  note: 'fixed ballast only',
  formula: { kind: 'direct' },
};

const rules = (over: Partial<ClassRules> = {}): ClassRules => ({
  ...DEFAULT_CLASS_RULES,
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  safetyItems: [],
  measuredItems: [ENGINE, BALLAST],
  ...over,
});

const caliper: InstrumentFigures = {
  id: '00000000-0000-4000-8000-00000000000a',
  name: 'Caliper C1',
  quantity: 'length',
  errorLimit: null,
  resolution: null,
  expandedUncertainty: 0.02,
};
const scale: InstrumentFigures = {
  ...caliper,
  id: '00000000-0000-4000-8000-00000000000b',
  name: 'Scale S1',
  quantity: 'mass',
  expandedUncertainty: 0.1,
};

const base = (over: Partial<DecideInput['input']> = {}): DecideInput['input'] => ({
  kind: 'pre_race',
  nozzle: {
    readings: [101.5, 101.6, 101.7].map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })),
    instrumentId: null,
    expandedUncertaintyMm: 0.05,
    temperatureC: null,
    material: null,
  },
  weight: null,
  power: { declaredKw: 200, evidenceSeen: true, note: '' },
  safety: {},
  measuredItems: [
    { key: 'engine_capacity', instrumentId: caliper.id, readings: [{ boreMm: 86, strokeMm: 86 }] },
    { key: 'ballast', instrumentId: scale.id, readings: [{ value: 25.0 }, { value: 25.2 }, { value: 25.1 }] },
  ],
  ...over,
});

test('engine capacity and ballast are decided like the nozzle: value, U and limit', () => {
  const d = decideInspection({
    input: base(),
    rules: rules(),
    itemInstruments: { engine_capacity: caliper, ballast: scale },
  });
  const engine = d.rules.find((r) => r.rule === 'item:engine_capacity')!;
  // 1998.23 + 1.04 = 1999.27 cm³ is inside 2000: conformity proven (ISO 14253-1).
  assert.equal(engine.unit, 'cm³');
  assert.ok(Math.abs(engine.decisiveValue! - 1998.2289) < 1e-3);
  assert.ok(Math.abs(engine.expandedUncertainty! - 1.0391) < 1e-3);
  assert.equal(engine.limit, 2000);
  assert.equal(engine.verdict, 'conforms');
  assert.equal(engine.outcome, 'conforms');
  // Ballast: mean 25.1 kg, U 0.153 kg; 25.1 − 0.153 = 24.947 > 24.8: conforms.
  const ballast = d.rules.find((r) => r.rule === 'item:ballast')!;
  assert.ok(Math.abs(ballast.decisiveValue! - 25.1) < 1e-9);
  assert.ok(Math.abs(ballast.expandedUncertainty! - 0.15275) < 1e-4);
  assert.equal(ballast.verdict, 'conforms');
  assert.equal(ballast.label, 'Ballast (fixed ballast only)');
  assert.equal(d.overall, 'conforms');
  assert.equal(d.items.length, 2);
});

test('an item too close to its limit is inconclusive, resolved for whoever must prove', () => {
  // No instrument: the class default U 5 cm³; 1998.23 + 5 > 2000 and 1998.23 − 5 < 2000: inconclusive.
  const items = [{ key: 'engine_capacity', instrumentId: null, readings: [{ boreMm: 86, strokeMm: 86 }] }];
  const pre = decideInspection({ input: base({ measuredItems: items }), rules: rules({ measuredItems: [ENGINE] }) });
  const protest = decideInspection({
    input: base({ kind: 'protest', measuredItems: items }),
    rules: rules({ measuredItems: [ENGINE] }),
  });
  const a = pre.rules.find((r) => r.rule === 'item:engine_capacity')!;
  const b = protest.rules.find((r) => r.rule === 'item:engine_capacity')!;
  assert.equal(a.verdict, 'inconclusive');
  assert.equal(a.outcome, 'not_accepted');
  assert.equal(b.verdict, 'inconclusive');
  assert.equal(b.outcome, 'non_conformity_not_proven');
  // The item's own decision rule overrides the class's: simple acceptance decides at the limit itself.
  const simple = decideInspection({
    input: base({ measuredItems: items }),
    rules: rules({ measuredItems: [{ ...ENGINE, decisionRule: 'simple' }] }),
  });
  assert.equal(simple.rules.find((r) => r.rule === 'item:engine_capacity')!.verdict, 'conforms');
});

test('an item the class lists but the record lacks is inconclusive; one the class lacks is refused', () => {
  const d = decideInspection({ input: base({ measuredItems: [] }), rules: rules() });
  const missing = d.rules.find((r) => r.rule === 'item:ballast')!;
  assert.equal(missing.verdict, 'inconclusive');
  assert.equal(missing.measured, false);
  assert.throws(
    () =>
      decideInspection({
        input: base({ measuredItems: [{ key: 'noise', instrumentId: null, readings: [{ value: 90 }] }] }),
        rules: rules(),
      }),
    (e: unknown) =>
      e instanceof EngineInputError && e.field === 'measuredItems.0.key' && /no measured item “noise”/.test(e.message),
  );
  assert.throws(
    () =>
      decideInspection({
        input: base({ measuredItems: [{ key: 'ballast', instrumentId: null, readings: [{ value: 25 }] }] }),
        rules: rules(),
      }),
    (e: unknown) => e instanceof EngineInputError && /ask for 3 readings/.test(e.message),
  );
  assert.throws(
    () =>
      decideInspection({
        input: base({ measuredItems: [{ key: 'engine_capacity', instrumentId: null, readings: [{ boreMm: 86 }] }] }),
        rules: rules(),
      }),
    (e: unknown) => e instanceof EngineInputError && e.field === 'measuredItems.0.readings.0.strokeMm',
  );
});

test('a re-inspection of the nozzle only leaves the items out', () => {
  const d = decideInspection({ input: base({ measuredItems: [] }), rules: rules(), scope: ['nozzle'] });
  assert.ok(!d.rules.some((r) => r.rule.startsWith('item:')));
  assert.deepEqual(d.items, []);
});

// An oval exit: 101.8 mm across its narrow axis, 102.3 mm across its wide axis, maximum 102 mm.
const oval = base({
  measuredItems: [],
  nozzle: {
    readings: [101.8, 102.3, 102.0].map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })),
    instrumentId: null,
    expandedUncertaintyMm: 0.05,
    temperatureC: null,
    material: null,
  },
});
const gauged = (method: 'gauge' | 'both' | 'two_point') =>
  rules({
    measuredItems: [],
    nozzle: {
      maxMm: 102,
      minMm: null,
      minReadings: 3,
      defaultUncertaintyMm: 0.05,
      checkMethod: method,
      gaugeNoGoMm: 102,
    },
  });
const plugPassed = [
  { rule: 'nozzle' as const, gauge: 'No-go plug 102.00 mm, serial P-7', instrumentId: null, passed: true },
];

test('gauge governs: an oval exit that stops the no-go plug passes, and the disagreement is said', () => {
  const d = decideInspection({ input: { ...oval, gaugeChecks: plugPassed }, rules: gauged('gauge') });
  assert.ok(!d.rules.some((r) => r.rule === 'nozzle_max'), 'the two-point line does not decide');
  const g = d.rules.find((r) => r.rule === 'gauge:nozzle')!;
  assert.equal(g.verdict, 'conforms');
  assert.match(g.explanation, /No-go plug 102\.00 mm, serial P-7: passed/);
  assert.match(g.explanation, /largest 102\.30 mm above the maximum/);
  assert.equal(d.overall, 'conforms');
});

test('both must pass: the same oval exit fails on its two-point size (ISO 14405-1:2016)', () => {
  const d = decideInspection({ input: { ...oval, gaugeChecks: plugPassed }, rules: gauged('both') });
  assert.equal(d.rules.find((r) => r.rule === 'gauge:nozzle')!.verdict, 'conforms');
  assert.equal(d.rules.find((r) => r.rule === 'nozzle_max')!.verdict, 'does_not_conform');
  assert.equal(d.overall, 'does_not_conform');
  // A failed gauge does not conform; no gauge check at all leaves the line inconclusive.
  const failed = decideInspection({
    input: { ...base({ measuredItems: [] }), gaugeChecks: [{ ...plugPassed[0], passed: false }] },
    rules: gauged('both'),
  });
  assert.equal(failed.rules.find((r) => r.rule === 'gauge:nozzle')!.verdict, 'does_not_conform');
  const none = decideInspection({ input: base({ measuredItems: [] }), rules: gauged('gauge') });
  assert.equal(none.rules.find((r) => r.rule === 'gauge:nozzle')!.outcome, 'not_accepted');
});

test('a gauge check under a two-point rule is refused: the rules do not ask for it', () => {
  assert.throws(
    () => decideInspection({ input: { ...oval, gaugeChecks: plugPassed }, rules: gauged('two_point') }),
    (e: unknown) => e instanceof EngineInputError && e.field === 'gaugeChecks.0.rule',
  );
});

test('the stored record keeps item readings, values and the gauge check', () => {
  const input = { ...base({ gaugeChecks: plugPassed }), power: { declaredKw: 200, evidenceSeen: true, note: '' } };
  const r = rules({ nozzle: { ...gauged('both').nozzle } });
  const decision = decideInspection({ input, rules: r, itemInstruments: { engine_capacity: caliper, ballast: scale } });
  const record = buildInspectionRecord({
    input,
    decision,
    rules: r,
    ruleVersion: 1,
    nozzleInstrument: null,
    weightInstrument: null,
    itemInstruments: { engine_capacity: caliper, ballast: scale },
    boat: { declaredKw: 200, powerEvidence: '' },
  });
  const engine = record.measurements.measuredItems!.find((m) => m.key === 'engine_capacity')!;
  assert.deepEqual(engine.readings, [{ boreMm: 86, strokeMm: 86 }]);
  assert.equal(engine.instrumentName, 'Caliper C1');
  assert.equal(record.measurements.gaugeChecks![0].passed, true);
  assert.ok(record.results.rules.some((x) => x.rule === 'gauge:nozzle'));
});

test('class rules refuse what an attacker or a slip would send', () => {
  const ok = ClassRules.safeParse(rules());
  assert.ok(ok.success, ok.success ? '' : JSON.stringify(ok.error.issues));
  const bad = (over: Partial<MeasuredItemRule> | Record<string, unknown>, message: RegExp) => {
    const r = ClassRules.safeParse(rules({ measuredItems: [{ ...ENGINE, ...over } as MeasuredItemRule] }));
    assert.ok(!r.success, `should refuse ${JSON.stringify(over)}`);
    assert.match(r.error!.issues.map((i) => i.message).join(' | '), message);
  };
  bad({ maximum: null, minimum: null }, /Set a maximum or a minimum/);
  bad({ minimum: 2100 }, /minimum must be below the maximum/);
  bad({ maximum: Number.NaN }, /as a number/);
  bad({ readings: -1 }, /at least one reading/);
  bad({ readings: 2.5 }, /whole number/);
  bad({ key: 'Engine Capacity' }, /lower-case/);
  bad({ unit: 'kg' }, /cm³/);
  bad({ unit: 'furlongs' }, /unit from the list/);
  bad({ instrumentTypes: [] }, /at least one kind/);
  bad({ instrumentTypes: ['caliper', 'caliper'] }, /once/);
  bad({ formula: { kind: 'engine_capacity', cylinders: 0 } }, /at least one cylinder/);
  bad({ formula: { kind: 'sorcery' } }, /how the value is obtained/);
  const twice = ClassRules.safeParse(rules({ measuredItems: [ENGINE, ENGINE] }));
  assert.match(twice.error!.issues[0].message, /used twice/);
  const many = ClassRules.safeParse(
    rules({ measuredItems: Array.from({ length: 21 }, (_, i) => ({ ...BALLAST, key: `ballast_${i}` })) }),
  );
  assert.match(many.error!.issues[0].message, /at most 20/);
  const noSize = ClassRules.safeParse(rules({ nozzle: { ...gauged('gauge').nozzle, gaugeNoGoMm: null } }));
  assert.match(noSize.error!.issues[0].message, /no-go plug gauge’s size/);
  const bigGauge = ClassRules.safeParse(rules({ nozzle: { ...gauged('gauge').nozzle, gaugeNoGoMm: 102.5 } }));
  assert.match(bigGauge.error!.issues[0].message, /may not be larger than the maximum/);
  // Rules stored before measured items and gauges stay valid.
  const { measuredItems: _unused, ...old } = rules();
  void _unused;
  assert.ok(ClassRules.safeParse(old).success);
});

test('the inspection input refuses duplicate items, unknown reading fields and floods', () => {
  const input = {
    idempotencyKey: '00000000-0000-4000-8000-000000000001',
    entryId: '00000000-0000-4000-8000-000000000002',
    capturedAt: new Date().toISOString(),
    nozzle: { readings: [{ diameterMm: 100, angleDeg: 0 }] },
    power: { declaredKw: 100, evidenceSeen: true },
  };
  assert.ok(RecordInspectionInput.safeParse(input).success, 'older clients send no items');
  const msg = (over: Record<string, unknown>) => {
    const r = RecordInspectionInput.safeParse({ ...input, ...over });
    assert.ok(!r.success, JSON.stringify(over).slice(0, 80));
    return r.error!.issues.map((i) => i.message).join(' | ');
  };
  const item = { key: 'ballast', readings: [{ value: 25 }] };
  assert.match(msg({ measuredItems: [item, item] }), /given twice/);
  assert.match(msg({ measuredItems: [{ key: 'ballast', readings: [{ volts: 3 }] }] }), /Unrecognized key: "volts"/);
  assert.match(msg({ measuredItems: [{ key: 'ballast', readings: [{ value: -2 }] }] }), /above 0/);
  assert.match(msg({ measuredItems: [{ key: 'ballast', readings: [{ value: '25' }] }] }), /as a number/);
  assert.match(msg({ measuredItems: [{ key: 'ballast', readings: Array(25).fill({ value: 1 }) }] }), /at most 24/);
  assert.match(
    msg({ measuredItems: Array.from({ length: 21 }, (_, i) => ({ key: `k_${i}`, readings: [{ value: 1 }] })) }),
    /at most 20/,
  );
  assert.match(msg({ measuredItems: [{ key: '../x', readings: [{ value: 1 }] }] }), /not an item key/);
  assert.match(msg({ gaugeChecks: [{ rule: 'nozzle', passed: true }] }), /which gauge/);
  assert.match(msg({ gaugeChecks: [{ rule: 'weight', gauge: 'G', passed: true }] }), /nozzle exit/);
});

test('an item keyed “constructor” finds no instrument on Object.prototype', () => {
  const odd = { ...BALLAST, key: 'constructor', readings: 1 };
  const d = decideInspection({
    input: base({ measuredItems: [{ key: 'constructor', instrumentId: null, readings: [{ value: 25 }] }] }),
    rules: rules({ measuredItems: [odd] }),
    itemInstruments: {},
  });
  const line = d.rules.find((r) => r.rule === 'item:constructor')!;
  assert.match(line.explanation, /the class default U 1 kg/);
  assert.doesNotMatch(line.explanation, /Object/);
});
