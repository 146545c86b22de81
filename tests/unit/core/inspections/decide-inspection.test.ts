// decideInspection against outside references:
// - four worked decisions (upper limit 102.00 mm, U 0.05 mm, chosen for the test) under simple and
//   guarded acceptance (ILAC-G8:09/2019) and ISO 14253-1:2017;
// - instrument budgets: rectangular a/√3 (JCGM 100:2008, 4.3.7), resolution δ/√12 (F.2.2.1), k = 2 (6.2.1);
// - reference temperature 20 °C (ISO 1:2022): aluminium grows about 0.023 mm per 10 K at 100 mm
//   (dL = alpha L dT, alpha about 23e-6/K [memory for the coefficient]);
// - mean of repeat observations and its standard deviation s/√n (JCGM 100:2008, 4.2.1–4.2.3).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  decideInspection,
  describeScope,
  scopeFromRequestedChecks,
  worstVerdict,
  type DecideInput,
  type InstrumentFigures,
} from '../../../../lib/core/inspections/decide-inspection';
import { EngineInputError } from '../../../../lib/core/engine/engine-input-error';
import type { ClassRules } from '../../../../lib/core/inputs/class-rules';
import type { DecisionRule, Verdict } from '../../../../lib/core/engine/conformity';

const rules = (over: Partial<ClassRules> = {}): ClassRules => ({
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
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
  ...over,
});

type In = DecideInput['input'];
const input = (readings: number[], over: Partial<In> = {}): In => ({
  nozzle: {
    readings: readings.map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })),
    instrumentId: null,
    expandedUncertaintyMm: 0.05,
    temperatureC: null,
    material: null,
  },
  weight: null,
  power: { declaredKw: 200, evidenceSeen: true, note: '' },
  safety: {},
  ...over,
});
const rule = (d: ReturnType<typeof decideInspection>, key: string) => {
  const r = d.rules.find((x) => x.rule === key);
  assert.ok(r, `rule ${key} present in ${d.rules.map((x) => x.rule).join(', ')}`);
  return r;
};

// Worked decisions (upper limit 102.00 mm, U = 0.05 mm), read off the zones of ILAC-G8:09/2019 and ISO 14253-1:2017.
const WORKED: [number, Record<DecisionRule, Verdict>][] = [
  [101.93, { simple: 'conforms', guarded: 'conforms', iso14253: 'conforms' }],
  [101.97, { simple: 'conforms', guarded: 'does_not_conform', iso14253: 'inconclusive' }],
  [102.02, { simple: 'does_not_conform', guarded: 'does_not_conform', iso14253: 'inconclusive' }],
  [102.06, { simple: 'does_not_conform', guarded: 'does_not_conform', iso14253: 'does_not_conform' }],
];

test('the four worked decisions under each decision rule (ILAC-G8:09/2019, ISO 14253-1:2017)', () => {
  for (const [largest, expected] of WORKED) {
    for (const decisionRule of ['simple', 'guarded', 'iso14253'] as const) {
      // The largest of three readings decides against a maximum (ISO 14405-1:2016).
      const d = decideInspection({ input: input([101.5, largest, 101.8]), rules: rules({ decisionRule }) });
      const r = rule(d, 'nozzle_max');
      assert.equal(r.verdict, expected[decisionRule], `${largest} mm under ${decisionRule}`);
      assert.equal(r.decisiveValue, largest);
      assert.equal(r.limit, 102);
      assert.equal(r.expandedUncertainty, 0.05);
      assert.equal(d.overall, expected[decisionRule], 'nozzle is the only rule here, so it is the overall result');
    }
  }
});

test('acceptance and rejection limits follow the rule (ILAC-G8:09/2019: guarded limit 101.95; ISO 14253-1:2017: 101.95 / 102.05)', () => {
  const simple = rule(
    decideInspection({ input: input([101.9, 101.9, 101.9]), rules: rules({ decisionRule: 'simple' }) }),
    'nozzle_max',
  );
  assert.equal(simple.acceptanceLimit, 102);
  assert.equal(simple.rejectionLimit, null);
  const guarded = rule(
    decideInspection({ input: input([101.9, 101.9, 101.9]), rules: rules({ decisionRule: 'guarded' }) }),
    'nozzle_max',
  );
  assert.ok(Math.abs(guarded.acceptanceLimit! - 101.95) < 1e-12);
  const iso = rule(decideInspection({ input: input([101.9, 101.9, 101.9]), rules: rules() }), 'nozzle_max');
  assert.ok(Math.abs(iso.acceptanceLimit! - 101.95) < 1e-12);
  assert.ok(Math.abs(iso.rejectionLimit! - 102.05) < 1e-12);
});

test('inconclusive asks for a re-measure with a better instrument (ISO 14253-1:2017: nothing is proven in the zone)', () => {
  const r = rule(decideInspection({ input: input([101.97, 101.9, 101.8]), rules: rules() }), 'nozzle_max');
  assert.equal(r.verdict, 'inconclusive');
  assert.match(r.explanation, /measure again with a better instrument/i);
});

test('instrument budget: a = 0.03 mm, δ = 0.01 mm gives U = 2·√(a²/3 + δ²/12) (JCGM 100:2008, 4.3.7, F.2.2.1, 6.2.1)', () => {
  const caliper: InstrumentFigures = {
    id: 'x',
    name: 'Caliper',
    quantity: 'length',
    errorLimit: 0.03,
    resolution: 0.01,
    expandedUncertainty: null,
  };
  const expectedU = 2 * Math.sqrt(0.03 ** 2 / 3 + 0.01 ** 2 / 12); // 0.035119…
  const base = input([101.9, 101.9, 101.98]);
  const d = decideInspection({
    input: { ...base, nozzle: { ...base.nozzle, expandedUncertaintyMm: null } },
    rules: rules(),
    nozzleInstrument: caliper,
  });
  const r = rule(d, 'nozzle_max');
  assert.ok(Math.abs(r.expandedUncertainty! - expectedU) < 1e-12, `U ${r.expandedUncertainty} vs ${expectedU}`);
  assert.ok(Math.abs(expectedU - 0.035119) < 1e-6, 'hand value 0.035119 mm');
  // 101.98 + 0.0351 > 102.00 while 101.98 - 0.0351 < 102.00: inconclusive under ISO 14253-1.
  assert.equal(r.verdict, 'inconclusive');
  // A bore gauge (a = 0.004, δ = 0.001): U = 2·√(0.004²/3 + 0.001²/12) ≈ 0.00476 mm, so 101.98 is proven to conform.
  const gauge: InstrumentFigures = {
    id: 'y',
    name: 'Bore gauge',
    quantity: 'length',
    errorLimit: 0.004,
    resolution: 0.001,
    expandedUncertainty: null,
  };
  const better = rule(
    decideInspection({
      input: { ...base, nozzle: { ...base.nozzle, expandedUncertaintyMm: null } },
      rules: rules(),
      nozzleInstrument: gauge,
    }),
    'nozzle_max',
  );
  assert.ok(Math.abs(better.expandedUncertainty! - 2 * Math.sqrt(0.004 ** 2 / 3 + 0.001 ** 2 / 12)) < 1e-12);
  assert.equal(better.verdict, 'conforms');
});

test('with no instrument and no U typed, the class default U applies; a scale for the nozzle is refused on its field', () => {
  const base = input([101.9, 101.9, 101.9]);
  const d = decideInspection({
    input: { ...base, nozzle: { ...base.nozzle, expandedUncertaintyMm: null } },
    rules: rules({ nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.08 } }),
  });
  assert.equal(rule(d, 'nozzle_max').expandedUncertainty, 0.08);
  const scale: InstrumentFigures = {
    id: 's',
    name: 'Scale',
    quantity: 'mass',
    errorLimit: null,
    resolution: null,
    expandedUncertainty: 1,
  };
  assert.throws(
    () => decideInspection({ input: base, rules: rules(), nozzleInstrument: scale }),
    (e: unknown) => e instanceof EngineInputError && e.field === 'nozzle.instrumentId',
  );
});

test('temperature correction to 20 °C (ISO 1:2022): aluminium at 30 °C reading 100.023 mm is 100.000 mm', () => {
  // dL = alpha L dT = 23e-6/K x 100 mm x 10 K = 0.023 mm (alpha for aluminium [memory]).
  const base = input([100.023, 99.9, 99.95]);
  const d = decideInspection({
    input: { ...base, nozzle: { ...base.nozzle, temperatureC: 30, material: 'aluminium' } },
    rules: rules({ nozzle: { maxMm: 100, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
  });
  assert.ok(Math.abs(d.nozzle.correctedReadingsMm[0] - 100.0) < 1e-4, `corrected ${d.nozzle.correctedReadingsMm[0]}`);
  assert.equal(d.nozzle.temperatureCorrected, true);
  const r = rule(d, 'nozzle_max');
  assert.ok(Math.abs(r.decisiveValue! - 100.0) < 1e-4);
  assert.match(r.explanation, /corrected from 30 °C to 20 °C/);
  // Without the material nothing is corrected, and the explanation says so.
  const plain = decideInspection({
    input: { ...base, nozzle: { ...base.nozzle, temperatureC: 30, material: null } },
    rules: rules(),
  });
  assert.equal(plain.nozzle.correctedReadingsMm[0], 100.023);
  assert.match(rule(plain, 'nozzle_max').explanation, /Not corrected for temperature/);
});

test('fewer readings than the class asks for are refused on the field nozzle.readings (three at 60°: common practice, no source)', () => {
  assert.throws(
    () => decideInspection({ input: input([101.9, 101.9]), rules: rules() }),
    (e: unknown) => e instanceof EngineInputError && e.field === 'nozzle.readings' && /at least 3/.test(e.message),
  );
});

test('a nozzle window (minimum and maximum) is decided on each side: smallest against the minimum (ISO 14405-1:2016)', () => {
  const window = rules({
    decisionRule: 'simple',
    nozzle: { maxMm: 95, minMm: 85, minReadings: 3, defaultUncertaintyMm: 0.08 },
  });
  const d = decideInspection({ input: input([84.9, 90, 94]), rules: window });
  assert.equal(rule(d, 'nozzle_min').verdict, 'does_not_conform');
  assert.equal(rule(d, 'nozzle_min').decisiveValue, 84.9);
  assert.equal(rule(d, 'nozzle_max').verdict, 'conforms');
  assert.equal(d.overall, 'does_not_conform');
});

test('a missing safety item does not conform; ticked ones conform (common practice, no source: the class lists what is required)', () => {
  const r = rules({ safetyItems: ['kill_switch', 'helmet', 'tow_point'] });
  const d = decideInspection({
    input: input([101.5, 101.5, 101.5], { safety: { kill_switch: true, helmet: true } }),
    rules: r,
  });
  assert.equal(rule(d, 'safety:kill_switch').verdict, 'conforms');
  assert.equal(rule(d, 'safety:helmet').verdict, 'conforms');
  assert.equal(rule(d, 'safety:tow_point').verdict, 'does_not_conform');
  assert.match(rule(d, 'safety:tow_point').explanation, /Tow point/);
  assert.equal(d.overall, 'does_not_conform');
});

test('weight: the mean of the weighings decides, with their spread in U (JCGM 100:2008, 4.2.1–4.2.3, 6.2.1)', () => {
  const r = rules({ weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 }, decisionRule: 'iso14253' });
  const scale: InstrumentFigures = {
    id: 's',
    name: 'Platform scale',
    quantity: 'mass',
    errorLimit: null,
    resolution: null,
    expandedUncertainty: 1,
  };
  // Weighings 652 and 654: mean 653, s = √2, s/√2 = 1; U = 2·√(0.5² + 1²) = 2.2361 kg (hand value).
  const d = decideInspection({
    input: input([101.5, 101.5, 101.5], { weight: { readingsKg: [652, 654], instrumentId: 's' } }),
    rules: r,
    weightInstrument: scale,
  });
  const w = rule(d, 'weight_min');
  assert.equal(w.decisiveValue, 653);
  assert.ok(Math.abs(w.expandedUncertainty! - 2 * Math.sqrt(0.25 + 1)) < 1e-12);
  assert.equal(w.verdict, 'conforms', '653 - 2.24 = 650.76 ≥ 650: conformity proven');
  // 651 with the class default U 1 kg: 651 - 1 = 650, on the acceptance limit: proven (inclusive, as the engine classes it).
  const edge = rule(
    decideInspection({
      input: input([101.5, 101.5, 101.5], { weight: { readingsKg: [651], instrumentId: null } }),
      rules: r,
    }),
    'weight_min',
  );
  assert.equal(edge.verdict, 'conforms');
  const close = rule(
    decideInspection({
      input: input([101.5, 101.5, 101.5], { weight: { readingsKg: [650.5], instrumentId: null } }),
      rules: r,
    }),
    'weight_min',
  );
  assert.equal(close.verdict, 'inconclusive');
  assert.match(close.explanation, /measure again with a better instrument/i);
  const light = rule(
    decideInspection({
      input: input([101.5, 101.5, 101.5], { weight: { readingsKg: [647.5, 648.5] } as never }),
      rules: r,
    }),
    'weight_min',
  );
  assert.equal(light.verdict, 'does_not_conform');
  // Not weighed at all: nothing is shown, so the rule is inconclusive and asks for a weighing.
  const none = rule(decideInspection({ input: input([101.5, 101.5, 101.5]), rules: r }), 'weight_min');
  assert.equal(none.verdict, 'inconclusive');
  assert.equal(none.measured, false);
  assert.match(none.explanation, /Weigh the boat/);
});

test('power band with the class power uncertainty (ISO 14253-1:2017); without evidence seen conformity is not shown (Boreline’s own rule, no source)', () => {
  const r = rules({ power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 }, decisionRule: 'iso14253' });
  const at = (kw: number, evidenceSeen = true) =>
    rule(
      decideInspection({
        input: input([101.5, 101.5, 101.5], { power: { declaredKw: kw, evidenceSeen, note: '' } }),
        rules: r,
      }),
      'power_band',
    );
  assert.equal(at(220).verdict, 'conforms');
  assert.equal(at(258).verdict, 'inconclusive', '258 + 5 > 260: within U of the maximum (ISO 14253-1:2017)');
  assert.equal(at(258).limit, 260);
  assert.equal(at(266).verdict, 'does_not_conform');
  assert.equal(at(170).verdict, 'does_not_conform');
  assert.equal(at(170).limit, 180, 'the minimum decided');
  assert.equal(at(220, false).verdict, 'inconclusive');
  assert.match(at(220, false).explanation, /No evidence was seen/);
  assert.equal(
    at(300, false).verdict,
    'does_not_conform',
    'a figure outside the band does not conform, evidence or not',
  );
});

test('overall is the worst of all rules: does not conform > inconclusive > conforms', () => {
  assert.equal(worstVerdict(['conforms', 'inconclusive', 'conforms']), 'inconclusive');
  assert.equal(worstVerdict(['inconclusive', 'does_not_conform', 'conforms']), 'does_not_conform');
  assert.equal(worstVerdict(['conforms', 'conforms']), 'conforms');
  // Nozzle inconclusive (101.97, ISO 14253-1) with a missing safety item: does not conform overall.
  const d = decideInspection({
    input: input([101.97, 101.9, 101.9], { safety: {} }),
    rules: rules({ safetyItems: ['helmet'] }),
  });
  assert.equal(rule(d, 'nozzle_max').verdict, 'inconclusive');
  assert.equal(d.overall, 'does_not_conform');
  // Nozzle inconclusive, all else conforming: inconclusive overall.
  const d2 = decideInspection({
    input: input([101.97, 101.9, 101.9], { safety: { helmet: true } }),
    rules: rules({ safetyItems: ['helmet'] }),
  });
  assert.equal(d2.overall, 'inconclusive');
});

test('a targeted re-inspection decides only what it was ordered to check, with the same maths', () => {
  // Weight minimum 650 kg, power band 180–260 kW, helmet required; the boat is not weighed and no power evidence is seen.
  const r = rules({
    weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 },
    power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
    safetyItems: ['helmet'],
  });
  const i = input([101.93, 101.9, 101.9], { power: { declaredKw: 220, evidenceSeen: false, note: '' }, safety: {} });
  const full = decideInspection({ input: i, rules: r });
  assert.equal(full.overall, 'does_not_conform', 'a full inspection: the helmet is not ticked');
  const nozzleOnly = decideInspection({ input: i, rules: r, scope: scopeFromRequestedChecks(['nozzle_diameter']) });
  assert.deepEqual(
    nozzleOnly.rules.map((x) => x.rule),
    ['nozzle_max'],
    'weight, power and safety are not decided',
  );
  assert.equal(
    nozzleOnly.overall,
    'conforms',
    '101.93 mm under U 0.05 mm: conformity proven (ISO 14253-1:2017: inside the limit reduced by U)',
  );
  assert.deepEqual(nozzleOnly.scope, ['nozzle']);
  // The nozzle verdict is the very one the full inspection gives.
  assert.deepEqual(rule(nozzleOnly, 'nozzle_max'), rule(full, 'nozzle_max'));
  assert.match(describeScope(nozzleOnly.scope)!, /ordered to check the nozzle exit diameter only/);
  assert.equal(describeScope(full.scope), null);
});

test('protest checks map to decision areas; "something else" or none cannot be narrowed', () => {
  assert.deepEqual(scopeFromRequestedChecks(['engine_power', 'nozzle_diameter']), ['nozzle', 'power']);
  assert.deepEqual(scopeFromRequestedChecks(['weight', 'safety_items', 'seals']), ['weight', 'safety']);
  assert.equal(scopeFromRequestedChecks(['nozzle_diameter', 'other']), null);
  assert.equal(scopeFromRequestedChecks([]), null);
  assert.equal(scopeFromRequestedChecks(['seals']), null, 'seals decide nothing: the whole inspection is decided');
});

test('each value names its kind: readings measured, power confirmed with evidence seen or declared without', () => {
  const r = rules({
    weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 },
    power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
  });
  const seen = decideInspection({
    input: input([101.5, 101.5, 101.5], { weight: { readingsKg: [690, 691] } as never }),
    rules: r,
  });
  assert.equal(rule(seen, 'nozzle_max').valueKind, 'measured');
  assert.equal(rule(seen, 'weight_min').valueKind, 'measured');
  assert.equal(rule(seen, 'power_band').valueKind, 'confirmed');
  const unseen = decideInspection({
    input: input([101.5, 101.5, 101.5], { power: { declaredKw: 220, evidenceSeen: false, note: '' } }),
    rules: r,
  });
  assert.equal(rule(unseen, 'power_band').valueKind, 'declared');
  assert.equal(rule(unseen, 'weight_min').valueKind, null, 'not weighed: no value');
});
