// The seal register's pure rules: batch numbers, the inputs' refusals, and the verdict line a seal
// check makes. That a broken or missing scrutineering seal means the sealed component is no longer in
// its verified state, so the boat does not conform until re-verified, is common practice, no source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  batchSealNumbers,
  InspectionSealsInput,
  IssueSealBatchInput,
  sealNumber,
  sealNumberKey,
} from '../../../../lib/core/inputs/seals';
import { decideInspection, decideSeals } from '../../../../lib/core/inspections/decide-inspection';
import { DEFAULT_CLASS_RULES } from '../../../../lib/core/inputs/class-rules';
import { RecordInspectionInput } from '../../../../lib/core/inputs/inspections';
import { describeComponent, describeSealState } from '../../../../lib/core/seals/seal-words';

const uuid = '00000000-0000-4000-8000-0000000000c1';

test('a batch numbers its seals prefix + number, padded to the width of the last number', () => {
  assert.deepEqual(batchSealNumbers('kr-', 8, 11), ['KR-08', 'KR-09', 'KR-10', 'KR-11']);
  assert.deepEqual(batchSealNumbers('', 1, 3), ['1', '2', '3']);
  assert.equal(batchSealNumbers('A', 1, 1000).length, 1000);
});

test('a batch of more than 1000, a last number below the first, or a bad prefix is refused by field', () => {
  const issue = (v: Record<string, unknown>) => IssueSealBatchInput.safeParse(v);
  assert.equal(issue({ prefix: 'A-', firstNumber: 1, lastNumber: 1000 }).success, true);
  const fields = (v: Record<string, unknown>) => issue(v).error?.issues.map((i) => i.path.join('.'));
  assert.deepEqual(fields({ firstNumber: 1, lastNumber: 1001 }), ['lastNumber']);
  assert.deepEqual(fields({ firstNumber: 5, lastNumber: 4 }), ['lastNumber']);
  assert.deepEqual(fields({ prefix: 'A B', firstNumber: 1, lastNumber: 2 }), ['prefix']);
  assert.deepEqual(fields({ firstNumber: 1.5, lastNumber: 2 }), ['firstNumber']);
});

test('a seal number is 1 to 40 letters, digits or dashes, kept in capitals', () => {
  assert.equal(sealNumber.parse(' kr-0042 '), 'KR-0042');
  for (const bad of ['', 'KR 42', 'KR/42', 'x'.repeat(41), 'seal #2'])
    assert.equal(sealNumber.safeParse(bad).success, false, bad);
});

test('seal actions: a number listed twice, or applied and checked at once, is refused; the old free-text list is refused clearly', () => {
  const dup = InspectionSealsInput.safeParse({
    checks: [
      { number: 'A-1', state: 'intact' },
      { number: 'a-1', state: 'broken' },
    ],
  });
  assert.deepEqual(
    dup.error?.issues.map((i) => i.path.join('.')),
    ['checks.1.number'],
  );
  const both = InspectionSealsInput.safeParse({
    checks: [{ number: 'A-1', state: 'intact' }],
    applied: [{ number: 'A-1', componentId: uuid, position: 'pump' }],
  });
  assert.deepEqual(
    both.error?.issues.map((i) => i.path.join('.')),
    ['applied.0.number'],
  );
  const ok = InspectionSealsInput.parse({
    checks: [{ number: 'A-1', state: 'broken' }],
    removed: [{ number: 'A-1', reason: 'engine opened' }],
  });
  assert.deepEqual(ok.applied, []);
  const old = InspectionSealsInput.safeParse([{ number: 'S-1', location: 'pump' }]);
  assert.match(old.error!.issues[0].message, /checks, applied and removed/);
});

test('a broken or missing seal is its own line that does not conform, naming the seal and component; intact conforms', () => {
  const component = describeComponent({ kind: 'engine', maker: 'Test', model: 'M1', serialNumber: '77' });
  assert.equal(component, 'engine Test M1, serial 77');
  const lines = decideSeals([
    { number: 'A-1', state: 'intact', component },
    { number: 'A-2', state: 'broken', component },
    { number: 'A-3', state: 'missing', component },
  ]);
  assert.deepEqual(
    lines.map((l) => [l.rule, l.verdict]),
    [
      ['seal:A-1', 'conforms'],
      ['seal:A-2', 'does_not_conform'],
      ['seal:A-3', 'does_not_conform'],
    ],
  );
  assert.match(lines[1].explanation, /^Seal A-2 on the engine Test M1, serial 77 was found broken/);
  assert.match(lines[2].explanation, /found missing/);
  assert.match(lines[1].explanation, /officials decide/);
});

test('a broken seal makes the overall verdict "does not conform", even in a re-inspection ordered for the nozzle only', () => {
  const rules = { ...DEFAULT_CLASS_RULES, nozzle: { ...DEFAULT_CLASS_RULES.nozzle, maxMm: 102, minReadings: 1 } };
  const input = {
    nozzle: {
      readings: [{ diameterMm: 101, angleDeg: 0 }],
      instrumentId: null,
      expandedUncertaintyMm: 0.05,
      temperatureC: null,
      material: null,
    },
    weight: null,
    power: { declaredKw: 200, evidenceSeen: true },
    safety: {},
  };
  const d = decideInspection({
    input,
    rules,
    scope: ['nozzle'],
    sealFindings: [{ number: 'A-2', state: 'broken', component: 'engine X, serial 1' }],
  });
  assert.deepEqual(
    d.rules.map((r) => [r.rule, r.verdict]),
    [
      ['nozzle_max', 'conforms'],
      ['seal:A-2', 'does_not_conform'],
    ],
  );
  assert.equal(d.overall, 'does_not_conform');
});

test('a seal’s state in words, from its latest event', () => {
  assert.equal(describeSealState({ lastAction: null, component: null, boatName: null }), 'Unused');
  assert.equal(
    describeSealState({ lastAction: 'applied', component: 'engine X, serial 1', boatName: 'Kestrel' }),
    'Applied to engine X, serial 1 of Kestrel',
  );
  assert.equal(
    describeSealState({ lastAction: 'intact', component: 'engine X, serial 1', boatName: 'Kestrel' }),
    'Intact at last check (engine X, serial 1 of Kestrel)',
  );
  assert.equal(describeSealState({ lastAction: 'removed', component: null, boatName: null }), 'Removed');
});

test('a record queued before the register (an empty seals list) still parses, with no seal actions', () => {
  const body = {
    idempotencyKey: '00000000-0000-4000-8000-0000000000a9',
    entryId: '00000000-0000-4000-8000-0000000000e9',
    capturedAt: new Date().toISOString(),
    nozzle: { readings: [{ diameterMm: 101, angleDeg: 0 }] },
    power: { declaredKw: 200, evidenceSeen: false },
  };
  assert.deepEqual(RecordInspectionInput.parse({ ...body, seals: [] }).seals, { checks: [], applied: [], removed: [] });
  assert.deepEqual(RecordInspectionInput.parse(body).seals, { checks: [], applied: [], removed: [] });
  const old = RecordInspectionInput.safeParse({ ...body, seals: [{ number: 'S-1', location: 'pump' }] });
  assert.equal(old.error?.issues[0].path.join('.'), 'seals');
});

test('seal numbers compare in capitals without the leading zeros of their number (common practice, no source)', () => {
  assert.equal(sealNumberKey('zz-01'), 'ZZ-1');
  assert.equal(sealNumberKey('ZZ-001'), sealNumberKey('ZZ-1'));
  assert.equal(sealNumberKey('KR-000'), 'KR-0', 'a number of zeros keeps one');
  assert.equal(sealNumberKey('KR-100'), 'KR-100', 'inner and trailing zeros stay');
  assert.equal(sealNumberKey('K9-05'), 'K9-5', 'only the final number is trimmed');
  assert.equal(sealNumberKey('ABC'), 'ABC', 'no number at the end: unchanged');
  assert.notEqual(sealNumberKey('ZZ-10'), sealNumberKey('ZZ-1'));
});
