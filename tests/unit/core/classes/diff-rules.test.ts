// What changed between two versions of a class's rules (lib/core/classes/diff-rules.ts): nested
// settings compared leaf by leaf, lists compared whole, a missing setting read as null, rows in a
// stable order with readable labels. The rule values are invented; no reference value is involved.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { diffRules, ruleLabel } from '../../../../lib/core/classes/diff-rules';
import type { ClassRules } from '../../../../lib/core/inputs/class-rules';

const RULES: ClassRules = {
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: 150, maxKw: 300, defaultUncertaintyKw: 6 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: ['kill_switch', 'helmet'],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10, 20, 30],
  },
};

test('identical rules: no rows', () => {
  assert.deepEqual(diffRules(RULES, structuredClone(RULES)), []);
});

test('changed leaves are listed by their dotted path with before and after, sorted by path', () => {
  const after = structuredClone(RULES);
  after.power.maxKw = 280;
  after.nozzle.maxMm = 101.5;
  after.decisionRule = 'guarded';
  assert.deepEqual(diffRules(RULES, after), [
    { path: 'decisionRule', before: 'iso14253', after: 'guarded' },
    { path: 'nozzle.maxMm', before: 102, after: 101.5 },
    { path: 'power.maxKw', before: 300, after: 280 },
  ]);
});

test('lists are compared whole, order included', () => {
  const added = { ...RULES, safetyItems: ['kill_switch', 'helmet', 'fire_extinguisher'] };
  assert.deepEqual(diffRules(RULES, added), [
    { path: 'safetyItems', before: ['kill_switch', 'helmet'], after: ['kill_switch', 'helmet', 'fire_extinguisher'] },
  ]);
  const reordered = { ...RULES, safetyItems: ['helmet', 'kill_switch'] };
  assert.equal(diffRules(RULES, reordered).length, 1);
  const speeds = structuredClone(RULES);
  speeds.parity.referenceSpeedsMs = [10, 25, 30];
  assert.deepEqual(
    diffRules(RULES, speeds).map((c) => c.path),
    ['parity.referenceSpeedsMs'],
  );
});

test('a setting that appears or disappears reads as null on the other side; null and missing are the same', () => {
  const withMin = structuredClone(RULES);
  withMin.weight.minKg = 450;
  assert.deepEqual(diffRules(RULES, withMin), [{ path: 'weight.minKg', before: null, after: 450 }]);
  const { parity: _parity, ...withoutParity } = RULES;
  const rows = diffRules(RULES, withoutParity);
  assert.deepEqual(
    rows.map((c) => c.path),
    [
      'parity.inletLossCoefficient',
      'parity.nozzleLossCoefficient',
      'parity.pumpEfficiency',
      'parity.referenceSpeedsMs',
      'parity.wakeFraction',
    ],
  );
  assert.ok(rows.every((c) => c.after === null));
  const noMin = { ...RULES, nozzle: { maxMm: 102, minReadings: 3, defaultUncertaintyMm: 0.05 } }; // minMm was null: no change
  assert.deepEqual(diffRules(RULES, noMin), []);
});

test('a first version (nothing before) lists every set leaf; null or undefined on either side is read as no rules', () => {
  const rows = diffRules(null, RULES);
  // 17 leaves (4 nozzle, 3 power, 3 weight, decision rule, safety items, 5 parity) less the two null ones.
  assert.equal(rows.length, 15);
  assert.ok(
    !rows.some((c) => c.path === 'nozzle.minMm' || c.path === 'weight.minKg'),
    'a null leaf is no change from nothing',
  );
  assert.ok(rows.every((c) => c.before === null && c.after !== null));
  assert.deepEqual(diffRules(undefined, null), []);
  assert.equal(diffRules(RULES, undefined).length, 15);
});

test('labels: every rule path has a readable label; an unknown path is shown as itself', () => {
  for (const { path } of diffRules(null, RULES)) assert.notEqual(ruleLabel(path), path, `a label for ${path}`);
  assert.equal(ruleLabel('nozzle.maxMm'), 'Nozzle exit diameter, maximum (mm)');
  assert.equal(ruleLabel('power.maxKw'), 'Power, maximum (kW)');
  assert.equal(ruleLabel('something.new'), 'something.new');
});

test('the burden of proof has readable labels in the version history', () => {
  assert.equal(ruleLabel('burdenOfProof.inspection'), 'Burden of proof at inspection');
  assert.equal(ruleLabel('burdenOfProof.protest'), 'Burden of proof in a protest');
});

test('measured items are compared by key, field by field; the gauge method reads as a setting', () => {
  const item = {
    key: 'ballast',
    label: 'Ballast',
    unit: 'kg' as const,
    minimum: 20,
    maximum: null,
    readings: 2,
    instrumentTypes: ['scale' as const],
    decisionRule: null,
    defaultUncertainty: 0.5,
    note: '',
    formula: { kind: 'direct' as const },
  };
  const withItem = { ...RULES, measuredItems: [item] };
  assert.deepEqual(diffRules(RULES, { ...RULES, measuredItems: [] }), [], 'no items either way: no rows');
  const changed = diffRules(withItem, { ...RULES, measuredItems: [{ ...item, minimum: 21 }] });
  assert.deepEqual(changed, [{ path: 'measuredItems.ballast.minimum', before: 20, after: 21 }]);
  assert.equal(ruleLabel(changed[0].path), 'Measured item ballast: minimum');
  const added = diffRules(RULES, withItem).map((c) => c.path);
  assert.ok(added.includes('measuredItems.ballast.label') && added.includes('measuredItems.ballast.formula.kind'));
  assert.equal(ruleLabel('nozzle.checkMethod'), 'Nozzle limits checked by');
});
