// The pre-entry declaration check against worked decisions read off the ISO 14253-1:2017 zones (an
// upper limit of 102.00 mm and U = 0.05 mm chosen for the test) and the power band and weight edges, with boundary values
// classed as documented in lib/core/engine/conformity.ts (the limit itself is inclusive).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { checkDeclaration, formatFigure, type DeclaredFigures } from '../../../../lib/core/entries/check-declaration';
import { DEFAULT_CLASS_RULES, type ClassRules } from '../../../../lib/core/inputs/class-rules';

const rules = (over: {
  nozzle?: Partial<ClassRules['nozzle']>;
  power?: Partial<ClassRules['power']>;
  weight?: Partial<ClassRules['weight']>;
}): ClassRules => ({
  ...DEFAULT_CLASS_RULES,
  nozzle: { ...DEFAULT_CLASS_RULES.nozzle, ...over.nozzle },
  power: { ...DEFAULT_CLASS_RULES.power, ...over.power },
  weight: { ...DEFAULT_CLASS_RULES.weight, ...over.weight },
});
const boat = (over: Partial<DeclaredFigures>): DeclaredFigures => ({
  declaredNozzleMm: 100,
  declaredNozzleToleranceMm: 0.05,
  declaredPowerKw: 250,
  declaredWeightKg: null,
  ...over,
});
const row = (b: DeclaredFigures, r: ClassRules, key: string) => {
  const found = checkDeclaration(b, r).rows.find((x) => x.key === key);
  assert.ok(found, `a ${key} row`);
  return found;
};

test('nozzle maximum: the four worked decisions (ISO 14253-1:2017 zones)', () => {
  const r = rules({ nozzle: { maxMm: 102 } });
  // source: ISO 14253-1:2017 zones applied by hand, upper limit 102.00 mm, U 0.05 mm
  const cases: [number, string][] = [
    [101.93, 'within'], // conformity proven
    [101.97, 'too_close'], // undecided
    [102.02, 'too_close'], // undecided
    [102.06, 'outside'], // non-conformity proven
  ];
  for (const [declared, status] of cases) {
    const x = row(boat({ declaredNozzleMm: declared, declaredNozzleToleranceMm: 0.05 }), r, 'nozzle_max');
    assert.equal(x.status, status, `${declared} mm`);
    assert.equal(x.unit, 'mm');
    assert.equal(x.limit, 102);
    assert.equal(x.uncertainty, 0.05);
  }
});

test('each row explains itself in one line, with the figures and units', () => {
  const r = rules({ nozzle: { maxMm: 102 } });
  const within = row(boat({ declaredNozzleMm: 101.93 }), r, 'nozzle_max');
  assert.equal(
    within.explanation,
    'Declared 101.93 mm clears the maximum 102.00 mm by at least your declared tolerance 0.05 mm.',
  );
  const close = row(boat({ declaredNozzleMm: 102.02 }), r, 'nozzle_max');
  assert.match(
    close.explanation,
    /^Declared 102\.02 mm is within your declared tolerance 0\.05 mm of the maximum 102\.00 mm: too close to call/,
  );
  const out = row(boat({ declaredNozzleMm: 102.06 }), r, 'nozzle_max');
  assert.match(
    out.explanation,
    /above the maximum 102\.00 mm by more than your declared tolerance 0\.05 mm: as declared, the boat would not conform\./,
  );
  for (const x of [within, close, out]) assert.doesNotMatch(x.explanation, /\n/);
});

test('the declared tolerance is the uncertainty: a wider tolerance turns "within" into "too close to call"', () => {
  // ISO 14253-1:2017: conformity is proven only inside the limit reduced by U.
  const r = rules({ nozzle: { maxMm: 102 } });
  assert.equal(
    row(boat({ declaredNozzleMm: 101.93, declaredNozzleToleranceMm: 0.05 }), r, 'nozzle_max').status,
    'within',
  );
  assert.equal(
    row(boat({ declaredNozzleMm: 101.93, declaredNozzleToleranceMm: 0.1 }), r, 'nozzle_max').status,
    'too_close',
  );
});

test('nozzle minimum mirrors the maximum (ISO 14253-1:2017, lower limit)', () => {
  const r = rules({ nozzle: { minMm: 98 } });
  // lower limit 98.00 mm, U 0.05 mm: the same zones (ISO 14253-1:2017) reflected about the limit
  const cases: [number, string][] = [
    [98.07, 'within'],
    [98.03, 'too_close'],
    [97.98, 'too_close'],
    [97.94, 'outside'],
  ];
  for (const [declared, status] of cases)
    assert.equal(row(boat({ declaredNozzleMm: declared }), r, 'nozzle_min').status, status, `${declared} mm`);
});

test('power band edges with the class power uncertainty (boundaries per lib/core/engine/conformity.ts)', () => {
  // ISO 14253-1:2017 zones; band 200–300 kW, U 5 kW (invented class figures, not a reference)
  const r = rules({ nozzle: { maxMm: 102 }, power: { minKw: 200, maxKw: 300, defaultUncertaintyKw: 5 } });
  const cases: [number, string, string][] = [
    [295, 'power_max', 'within'], // limit - U exactly: the whole interval lies within the limit
    [295.01, 'power_max', 'too_close'],
    [300, 'power_max', 'too_close'], // on the limit: undecided
    [305, 'power_max', 'too_close'], // limit + U: the interval still touches the limit
    [305.01, 'power_max', 'outside'],
    [205, 'power_min', 'within'],
    [204.99, 'power_min', 'too_close'],
    [195, 'power_min', 'too_close'],
    [194.99, 'power_min', 'outside'],
  ];
  for (const [kw, key, status] of cases) {
    const x = row(boat({ declaredPowerKw: kw }), r, key);
    assert.equal(x.status, status, `${kw} kW against ${key}`);
    assert.equal(x.unit, 'kW');
  }
  const mid = checkDeclaration(boat({ declaredPowerKw: 250 }), r);
  assert.deepEqual(
    mid.rows.map((x) => [x.key, x.status]),
    [
      ['nozzle_max', 'within'],
      ['power_min', 'within'],
      ['power_max', 'within'],
    ],
  );
});

test('no power limits, no power rows; with zero uncertainty the limit itself is within (common practice, no source: "not exceeding")', () => {
  const r0 = rules({ nozzle: { maxMm: 102 } });
  assert.deepEqual(
    checkDeclaration(boat({}), r0).rows.map((x) => x.key),
    ['nozzle_max'],
  );
  const r = rules({ nozzle: { maxMm: 102 }, power: { maxKw: 300, defaultUncertaintyKw: 0 } });
  assert.equal(row(boat({ declaredPowerKw: 300 }), r, 'power_max').status, 'within');
  assert.equal(row(boat({ declaredPowerKw: 300.1 }), r, 'power_max').status, 'outside');
});

test('minimum weight is checked only when declared; otherwise a note says it is weighed at inspection', () => {
  const r = rules({ nozzle: { maxMm: 102 }, weight: { minKg: 450, includesDriver: true, defaultUncertaintyKg: 1 } });
  const none = checkDeclaration(boat({ declaredWeightKg: null }), r);
  assert.equal(
    none.rows.some((x) => x.key === 'weight_min'),
    false,
  );
  assert.equal(none.notes.length, 1);
  assert.match(none.notes[0], /450 kg \(with driver\)/);
  // ISO 14253-1:2017 zones, U 1 kg
  assert.equal(row(boat({ declaredWeightKg: 452 }), r, 'weight_min').status, 'within');
  assert.equal(row(boat({ declaredWeightKg: 450 }), r, 'weight_min').status, 'too_close');
  assert.equal(row(boat({ declaredWeightKg: 448.5 }), r, 'weight_min').status, 'outside');
});

test('worst status across rows: outside beats too close beats within', () => {
  const r = rules({ nozzle: { maxMm: 102 }, power: { maxKw: 300, defaultUncertaintyKw: 5 } });
  assert.equal(checkDeclaration(boat({ declaredNozzleMm: 101, declaredPowerKw: 200 }), r).worst, 'within');
  assert.equal(checkDeclaration(boat({ declaredNozzleMm: 101.98, declaredPowerKw: 200 }), r).worst, 'too_close');
  assert.equal(checkDeclaration(boat({ declaredNozzleMm: 101.98, declaredPowerKw: 320 }), r).worst, 'outside');
});

test('figures print exactly so a boundary never looks rounded across', () => {
  assert.equal(formatFigure(101.955, 2), '101.955');
  assert.equal(formatFigure(102, 2), '102.00');
  assert.equal(formatFigure(298.2799486329081, 0), '298.2799');
});
