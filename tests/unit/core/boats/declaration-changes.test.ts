import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  describeDeclarationChanges,
  listDeclarationChanges,
  type DeclarationFields,
} from '../../../../lib/core/boats/declaration-changes';

// Figures are an invented boat (no reference values: this is wording and comparison only).
const v1: DeclarationFields = {
  hullDescription: 'Aluminium mono hull',
  pumpDescription: 'Single-stage axial pump',
  impellerDescription: 'Three-blade, trim A',
  declaredNozzleMm: 101,
  declaredNozzleToleranceMm: 0.1,
  engineDescription: 'V8 petrol',
  declaredPowerKw: 250,
  powerEvidence: 'dyno_sheet',
  displacementL: 5.7,
  declaredWeightKg: null,
};

test('an unchanged declaration lists no change', () => {
  assert.deepEqual(listDeclarationChanges(v1, { ...v1 }), []);
});

test('changed figures and text are listed in declaration order with their units', () => {
  const v2 = { ...v1, declaredPowerKw: 9000, engineDescription: 'V12 petrol', declaredWeightKg: 410 };
  const changes = listDeclarationChanges(v1, v2);
  assert.deepEqual(
    changes.map((c) => c.field),
    ['engineDescription', 'declaredPowerKw', 'declaredWeightKg'],
  );
  assert.equal(
    describeDeclarationChanges(changes),
    'engine “V8 petrol” → “V12 petrol”; power 250 → 9000 kW; weight (none) → 410 kg',
  );
});

test('figures stored as text by the database compare as numbers', () => {
  const asText = { ...v1, declaredPowerKw: '250' as unknown as number };
  assert.deepEqual(listDeclarationChanges(v1, asText), []);
});

test('a long description is cut in the summary, never in the stored version', () => {
  const long = 'x'.repeat(500);
  const [c] = listDeclarationChanges(v1, { ...v1, pumpDescription: long });
  assert.ok(c.to.length < 70);
});

test('declared curves compare as documents (key order ignored) and read as a summary', () => {
  const engine = { kind: 'rated' as const, ratedPowerKw: 300, ratedRpm: 7000, shape: 'flat' as const };
  const withCurves: DeclarationFields = { ...v1, declaredPerformance: { engine, pump: null, suction: null } };
  const reordered: DeclarationFields = {
    ...v1,
    declaredPerformance: {
      suction: null,
      pump: null,
      engine: { shape: 'flat', ratedRpm: 7000, ratedPowerKw: 300, kind: 'rated' },
    },
  };
  assert.deepEqual(listDeclarationChanges(withCurves, reordered), []);
  assert.equal(
    describeDeclarationChanges(listDeclarationChanges(v1, withCurves)),
    'engine and pump curves (none) → engine 300 kW at 7000 rpm (flat)',
  );
});
