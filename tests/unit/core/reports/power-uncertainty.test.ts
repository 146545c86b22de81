// Power uncertainty by evidence (lib/core/reports/power-uncertainty.ts): the shares are Boreline's
// common-practice defaults (no published source); the class's own figure is the floor.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { evidenceOf, powerExpandedUncertaintyKw } from '../../../../lib/core/reports/power-uncertainty';

test('the evidence sets the share; the class figure is the floor; older records read sensibly', () => {
  assert.equal(powerExpandedUncertaintyKw(300, 'dyno_sheet', 5), 9);
  assert.equal(powerExpandedUncertaintyKw(300, 'maker_rating', 5), 24);
  assert.equal(powerExpandedUncertaintyKw(300, 'declaration_only', 5), 45);
  assert.equal(powerExpandedUncertaintyKw(100, 'dyno_sheet', 5), 5, 'never below the class figure');
  assert.equal(evidenceOf(null, true), 'maker_rating');
  assert.equal(evidenceOf(null, false), 'declaration_only');
  assert.equal(evidenceOf('dyno_sheet', false), 'dyno_sheet');
});

test('a class’s own shares replace the common-practice ones; the class figure stays the floor', () => {
  const shares = { dyno_sheet: 0.05, maker_rating: 0.1, declaration_only: 0.25 };
  // 0.05 × 300 = 15, 0.25 × 300 = 75 (by hand); 0.05 × 60 = 3 is below the 5 kW floor.
  assert.equal(powerExpandedUncertaintyKw(300, 'dyno_sheet', 5, shares), 15);
  assert.equal(powerExpandedUncertaintyKw(300, 'declaration_only', 5, shares), 75);
  assert.equal(powerExpandedUncertaintyKw(60, 'dyno_sheet', 5, shares), 5);
  assert.equal(powerExpandedUncertaintyKw(300, 'dyno_sheet', 5, null), 9, 'null: the common-practice share');
});
