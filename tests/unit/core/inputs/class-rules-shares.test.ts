// A class's own power-uncertainty shares by evidence: each above 0 and at most 1, and ordered — a dyno
// sheet at most a maker's rating, that at most a bare declaration (better evidence never carries more
// doubt: common practice, no source). Found by an outside test: any order was accepted.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { ClassRules, DEFAULT_CLASS_RULES } from '../../../../lib/core/inputs/class-rules';

const withShares = (evidenceShares: Record<string, number>) => ({
  ...DEFAULT_CLASS_RULES,
  nozzle: { ...DEFAULT_CLASS_RULES.nozzle, maxMm: 102 },
  power: { ...DEFAULT_CLASS_RULES.power, evidenceShares },
});

test('ordered shares are kept as sent; equal neighbours are allowed', () => {
  const ok = ClassRules.parse(withShares({ dyno_sheet: 0.03, maker_rating: 0.08, declaration_only: 0.15 }));
  assert.deepEqual(ok.power.evidenceShares, { dyno_sheet: 0.03, maker_rating: 0.08, declaration_only: 0.15 });
  assert.equal(
    ClassRules.safeParse(withShares({ dyno_sheet: 0.05, maker_rating: 0.05, declaration_only: 0.05 })).success,
    true,
  );
});

test('a dyno sheet less sure than a maker’s rating, or a rating less sure than a declaration, is refused on the field', () => {
  const dyno = ClassRules.safeParse(withShares({ dyno_sheet: 1, maker_rating: 0.08, declaration_only: 0.15 }));
  assert.equal(dyno.success, false);
  assert.deepEqual(
    dyno.error!.issues.map((i) => i.path.join('.')),
    ['power.evidenceShares.maker_rating'],
  );
  const rating = ClassRules.safeParse(withShares({ dyno_sheet: 0.03, maker_rating: 0.2, declaration_only: 0.001 }));
  assert.equal(rating.success, false);
  assert.deepEqual(
    rating.error!.issues.map((i) => i.path.join('.')),
    ['power.evidenceShares.declaration_only'],
  );
  assert.match(rating.error!.issues[0].message, /cannot be surer than a maker’s rating/);
});
