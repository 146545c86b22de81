// Measurement helpers: uncertainty budget (JCGM 100:2008), 20 C correction (ISO 1:2022),
// area-equivalent diameter.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  EngineInputError,
  THERMAL_EXPANSION_PER_K,
  computeAreaEquivalentDiameterFromReadingsMm,
  computeAreaEquivalentDiameterMm,
  computeUncertaintyBudget,
  correctLengthToReferenceTemperatureMm,
} from '../../../../lib/core/engine/index';
import { sampleStandardDeviation } from 'simple-statistics';

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} vs ${expected} (tol ${tol})`);

test('rectangular limit a/sqrt(3) and resolution delta/sqrt(12), combined in quadrature, k = 2', () => {
  // JCGM 100:2008 4.3.7 (rectangular: a/sqrt(3)), F.2.2.1 (resolution: delta/sqrt(12)), 5.1.2, 6.2.1.
  const b = computeUncertaintyBudget({ errorLimitMm: 0.03, resolutionMm: 0.01 });
  close(b.errorLimitContributionMm, 0.03 / Math.sqrt(3), 1e-15, 'a/sqrt(3)');
  close(b.resolutionContributionMm, 0.01 / Math.sqrt(12), 1e-15, 'delta/sqrt(12)');
  close(b.standardUncertaintyMm, Math.sqrt(0.03 ** 2 / 3 + 0.01 ** 2 / 12), 1e-15, 'u_c');
  close(b.expandedUncertaintyMm, 2 * b.standardUncertaintyMm, 1e-15, 'U = 2 u_c');
  assert.equal(b.coverageFactor, 2);
});

test('repeatability: standard deviation of a single reading (JCGM 100:2008, 4.2.2)', () => {
  // Reference: simple-statistics sampleStandardDeviation on the same repeats.
  const repeats = [101.93, 101.95, 101.94, 101.96, 101.94];
  const b = computeUncertaintyBudget({ repeatReadingsMm: repeats });
  close(b.repeatabilityContributionMm, sampleStandardDeviation(repeats), 1e-12, 's(q_k)');
  assert.throws(() => computeUncertaintyBudget({ repeatReadingsMm: [1] }), EngineInputError);
});

test('aluminium nozzle: about 0.023 mm per 10 K at 100 mm, corrected back to 20 C', () => {
  // Linear expansion dL = alpha L dT, alpha ≈ 23e-6/K for aluminium [memory]; reference temperature 20 C per ISO 1:2022.
  assert.equal(THERMAL_EXPANSION_PER_K.aluminium, 23e-6);
  const at30 = 100 + 0.023;
  close(
    correctLengthToReferenceTemperatureMm({ lengthMm: at30, temperatureC: 30, material: 'aluminium' }),
    100,
    1e-6,
    '30 C',
  );
  close(
    correctLengthToReferenceTemperatureMm({ lengthMm: 100, temperatureC: 20, material: 'aluminium' }),
    100,
    0,
    '20 C',
  );
  const cold = correctLengthToReferenceTemperatureMm({ lengthMm: 100, temperatureC: 10, material: 'aluminium' });
  close(cold, 100 + 0.023, 1e-5, '10 C reading is small');
});

test('stainless steel and an instrument at the same temperature', () => {
  // alpha stainless ≈ 17e-6/K, steel ≈ 11.5e-6/K [memory]; a steel scale at 30 C under-reads by (1 + alpha dt).
  const partOnly = correctLengthToReferenceTemperatureMm({
    lengthMm: 100,
    temperatureC: 30,
    material: 'stainless_steel',
  });
  close(partOnly, 100 / (1 + 17e-5), 1e-12, 'stainless');
  const withCaliper = correctLengthToReferenceTemperatureMm({
    lengthMm: 100,
    temperatureC: 30,
    material: 'aluminium',
    instrumentMaterial: 'steel',
  });
  close(withCaliper, (100 * (1 + 11.5e-5)) / (1 + 23e-5), 1e-12, 'differential');
  const same = correctLengthToReferenceTemperatureMm({
    lengthMm: 100,
    temperatureC: 35,
    material: 'steel',
    instrumentMaterial: 'steel',
  });
  close(same, 100, 1e-12, 'same material cancels');
});

test('area-equivalent diameter sqrt(d_max d_min) has the area of the ellipse', () => {
  // [memory] formula; geometry: an ellipse with diameters d_max, d_min has area pi d_max d_min / 4.
  const d = computeAreaEquivalentDiameterMm(101, 99);
  close((Math.PI * d * d) / 4, (Math.PI * 101 * 99) / 4, 1e-9, 'area');
  close(computeAreaEquivalentDiameterFromReadingsMm([100.2, 99.8, 100.0]), Math.sqrt(100.2 * 99.8), 1e-12, 'readings');
  close(computeAreaEquivalentDiameterMm(100, 100), 100, 1e-12, 'round');
});

test('refuses meaningless measurement input by field', () => {
  const refuses = (fn: () => unknown, field: string) =>
    assert.throws(fn, (e: unknown) => e instanceof EngineInputError && e.field === field);
  refuses(() => computeUncertaintyBudget({ errorLimitMm: -0.01 }), 'errorLimitMm');
  refuses(() => computeUncertaintyBudget({ resolutionMm: Number.NaN }), 'resolutionMm');
  refuses(() => computeUncertaintyBudget({ coverageFactor: 0 }), 'coverageFactor');
  refuses(
    () => correctLengthToReferenceTemperatureMm({ lengthMm: 100, temperatureC: 200, material: 'aluminium' }),
    'temperatureC',
  );
  refuses(
    () => correctLengthToReferenceTemperatureMm({ lengthMm: 100, temperatureC: 25, material: 'cheese' as never }),
    'material',
  );
  refuses(
    () => correctLengthToReferenceTemperatureMm({ lengthMm: 0, temperatureC: 25, material: 'steel' }),
    'lengthMm',
  );
  refuses(() => computeAreaEquivalentDiameterMm(99, 101), 'dMinMm');
  refuses(() => computeAreaEquivalentDiameterFromReadingsMm([]), 'readingsMm');
});
