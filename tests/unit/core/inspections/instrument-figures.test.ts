// One mapping from an instrument row to the figures its uncertainty is made from. Reference values:
// a = 0.03 mm and δ = 0.01 mm give U = 2·√(a²/3 + δ²/12) = 0.035119 mm (JCGM 100:2008, 4.3.7,
// F.2.2.1, k = 2 from 6.2.1); a certificate's U is used as stated (JCGM 100:2008, 4.3.3 [memory for the clause number]).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { toInstrumentFigures } from '../../../../lib/core/inspections/instrument-figures';
import { instrumentUncertainty } from '../../../../lib/core/inspections/decide-inspection';

test('a model-like row maps to its figures; absent figures stay null, not zero', () => {
  assert.deepEqual(
    toInstrumentFigures({
      id: 'i1',
      name: 'Caliper',
      quantity: 'length',
      errorLimit: 0.03,
      resolution: 0.01,
      expandedUncertainty: null,
    }),
    { id: 'i1', name: 'Caliper', quantity: 'length', errorLimit: 0.03, resolution: 0.01, expandedUncertainty: null },
  );
  assert.deepEqual(toInstrumentFigures({ id: 'i2', name: 'Scale', quantity: 'mass', expandedUncertainty: 1 }), {
    id: 'i2',
    name: 'Scale',
    quantity: 'mass',
    errorLimit: null,
    resolution: null,
    expandedUncertainty: 1,
  });
});

test('numeric strings (pg numeric) become numbers; a non-number or an unknown quantity is refused', () => {
  assert.equal(
    toInstrumentFigures({ id: 'i3', name: 'Gauge', quantity: 'length', errorLimit: '0.004', resolution: '0.001' })
      .errorLimit,
    0.004,
  );
  assert.throws(
    () => toInstrumentFigures({ id: 'i4', name: 'Gauge', quantity: 'length', errorLimit: 'about 4 µm' }),
    /must be a number/,
  );
  assert.throws(() => toInstrumentFigures({ id: 'i5', name: 'Clock', quantity: 'time' }), /neither length nor mass/);
});

test('the figures give the budget U (JCGM 100:2008) and a certificate U as stated', () => {
  const caliper = instrumentUncertainty(
    toInstrumentFigures({ id: 'i1', name: 'Caliper', quantity: 'length', errorLimit: 0.03, resolution: 0.01 }),
    'mm',
  );
  assert.ok(Math.abs(caliper.expandedUncertainty - 0.035119) < 1e-6, `${caliper.expandedUncertainty}`);
  const scale = instrumentUncertainty(
    toInstrumentFigures({ id: 'i2', name: 'Scale', quantity: 'mass', expandedUncertainty: 1 }),
    'kg',
  );
  assert.equal(scale.expandedUncertainty, 1);
});
