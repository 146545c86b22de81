// Differential expansion of part and instrument to 20 °C and its uncertainty budget.
// Reference values, computed by hand below (not by the code under test):
// - reference temperature 20 °C for dimensional measurement (ISO 1:2022);
// - model L20 = L·(1 + α_i(t_i − 20))/(1 + α_p(t_p − 20)), as in JCGM 100:2008, Annex H.1 (end-gauge
//   calibration) [memory for the equation's layout]; first-order form L·(1 + α_i Δt_i − α_p Δt_p);
// - expansion coefficients: aluminium 23e-6 /K, steel 11.5e-6 /K [memory: typical handbook values of
//   the kind in the CRC Handbook of Chemistry and Physics' table of thermal expansion of metals];
// - law of propagation u_c² = Σ (c_k u(x_k))² (JCGM 100:2008, 5.1.2), rectangular limits a → a/√3
//   (4.3.7), U = 2 u_c (6.2.1, 6.3.3); one thermometer reading for both temperatures is one input (5.2.2, r = 1).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  computeLengthBudget,
  correctDifferentialExpansionFirstOrderMm,
  correctDifferentialExpansionMm,
} from '../../../../lib/core/engine/measurement-thermal';
import { correctLengthToReferenceTemperatureMm } from '../../../../lib/core/engine/measurement';
import { EngineInputError } from '../../../../lib/core/engine/engine-input-error';

const AL = 23e-6;
const STEEL = 11.5e-6;
const close = (a: number, b: number, tol: number, what: string) =>
  assert.ok(Math.abs(a - b) <= tol, `${what}: ${a} vs ${b} (tolerance ${tol})`);

test('aluminium nozzle and steel caliper both at 35 °C reading 102.000 mm: 101.982 mm at 20 °C (ISO 1:2022)', () => {
  // By hand: N = 1 + 11.5e-6·15 = 1.0001725, D = 1 + 23e-6·15 = 1.000345,
  // L20 = 102 · 1.0001725 / 1.000345 = 101.982412 mm.
  const byHand = (102 * 1.0001725) / 1.000345;
  close(byHand, 101.982412, 1e-6, 'hand');
  const exact = correctDifferentialExpansionMm({
    lengthMm: 102,
    partTemperatureC: 35,
    instrumentTemperatureC: 35,
    partExpansionPerK: AL,
    instrumentExpansionPerK: STEEL,
  });
  close(exact, byHand, 1e-12, 'exact form');
  assert.equal(exact.toFixed(3), '101.982');
  // The part-only correction (instrument treated as exact) gave 102 / 1.000345 = 101.964808 mm.
  const partOnly = correctLengthToReferenceTemperatureMm({ lengthMm: 102, temperatureC: 35, material: 'aluminium' });
  close(partOnly, 102 / 1.000345, 1e-12, 'part only');
  assert.equal(partOnly.toFixed(3), '101.965');
  // 0.018 mm larger: against a maximum-diameter rule this tells against the entrant, not for them.
  close(exact - partOnly, 0.0176, 1e-4, 'the steel caliper’s own expansion');
});

test('first-order form L·(1 + α_i Δt_i − α_p Δt_p) agrees with the exact form to second order', () => {
  // By hand at 35 °C: 102·(1 + 0.0001725 − 0.000345) = 102·0.9998275 = 101.982405 mm.
  const input = {
    lengthMm: 102,
    partTemperatureC: 35,
    instrumentTemperatureC: 35,
    partExpansionPerK: AL,
    instrumentExpansionPerK: STEEL,
  };
  const first = correctDifferentialExpansionFirstOrderMm(input);
  close(first, 102 * 0.9998275, 1e-12, 'first order');
  // exact − first = L·(N/D − (N − (D − 1))) = L·(D − 1)(D − N)/D: 102·0.000345·0.0001725/1.000345 ≈ 6.07e-6 mm.
  const diff = correctDifferentialExpansionMm(input) - first;
  close(diff, (102 * 0.000345 * 0.0001725) / 1.000345, 1e-11, 'second-order gap');
  // Different temperatures: part 40 °C, caliper 25 °C. N = 1 + 11.5e-6·5, D = 1 + 23e-6·20.
  const apart = { ...input, partTemperatureC: 40, instrumentTemperatureC: 25 };
  close(correctDifferentialExpansionMm(apart), (102 * (1 + 11.5e-6 * 5)) / (1 + 23e-6 * 20), 1e-12, 'apart, exact');
  close(correctDifferentialExpansionFirstOrderMm(apart), 102 * (1 + 11.5e-6 * 5 - 23e-6 * 20), 1e-12, 'apart, first');
  // Both at 20 °C: nothing to correct.
  assert.equal(correctDifferentialExpansionMm({ ...input, partTemperatureC: 20, instrumentTemperatureC: 20 }), 102);
});

test('budget with temperature terms against a hand computation (JCGM 100:2008, 5.1.2): the worked case, one thermometer reading', () => {
  // Inputs: class default U = 0.05 mm → u(L) = 0.025 mm (k = 2); t = 35 °C ± 1 °C rectangular → u(t) = 1/√3;
  // α ± 10 % rectangular → u(α) = 0.1·α/√3. N = 1.0001725, D = 1.000345.
  const L = 102;
  const N = 1.0001725;
  const D = 1.000345;
  const cL = N / D;
  const cT = (L * STEEL) / D - (L * N * AL) / (D * D); // ∂/∂t_i + ∂/∂t_p with t_i = t_p = t
  const cAp = (-L * N * 15) / (D * D);
  const cAi = (L * 15) / D;
  const u = [
    0.025 * cL,
    Math.abs(cT) / Math.sqrt(3),
    Math.abs(cAp) * ((0.1 * AL) / Math.sqrt(3)),
    cAi * ((0.1 * STEEL) / Math.sqrt(3)),
  ];
  // Numbers: 0.0249957, 6.768e-4, 2.0306e-3, 1.0155e-3 mm; U = 0.050215 mm (a tenth of a micrometre
  // above the class default alone: the temperature terms are small beside a caliper's).
  close(u[1], 6.768e-4, 1e-7, 'temperature contribution');
  close(u[2], 2.0306e-3, 1e-7, 'α_p contribution');
  close(u[3], 1.0155e-3, 1e-7, 'α_i contribution');
  const U = 2 * Math.sqrt(u.reduce((a, x) => a + x * x, 0));
  close(U, 0.050215, 1e-6, 'hand U');

  const b = computeLengthBudget({
    readingTerms: [{ quantity: 'class default U', value: 0.05, unit: 'mm', standardUncertainty: 0.025, basis: 'U/2' }],
    thermal: {
      lengthMm: L,
      partTemperatureC: 35,
      instrumentTemperatureC: 35,
      partExpansionPerK: AL,
      instrumentExpansionPerK: STEEL,
      sharedTemperature: true,
    },
  });
  assert.equal(b.terms.length, 4, 'reading, t (once), α_p, α_i');
  b.terms.forEach((t, i) => close(t.contributionMm, u[i], 1e-12, t.quantity));
  close(b.terms[1].sensitivity, cT, 1e-15, 'c_t');
  close(b.combinedStandardUncertaintyMm, U / 2, 1e-12, 'u_c');
  assert.equal(b.coverageFactor, 2);
  close(b.expandedUncertaintyMm, U, 1e-12, 'U');
});

test('budget with separate thermometer readings: t_p and t_i are two inputs; without a correction only the reading terms count', () => {
  // Part 40 °C, instrument 25 °C; u(t) = 1/√3 each. c_tp = −L N α_p / D², c_ti = L α_i / D.
  const L = 100;
  const N = 1 + STEEL * 5;
  const D = 1 + AL * 20;
  const b = computeLengthBudget({
    readingTerms: [
      { quantity: 'a', value: 0.03, unit: 'mm', standardUncertainty: 0.03 / Math.sqrt(3), basis: '' },
      { quantity: 'δ', value: 0.01, unit: 'mm', standardUncertainty: 0.01 / Math.sqrt(12), basis: '' },
    ],
    thermal: {
      lengthMm: L,
      partTemperatureC: 40,
      instrumentTemperatureC: 25,
      partExpansionPerK: AL,
      instrumentExpansionPerK: STEEL,
      sharedTemperature: false,
    },
  });
  const hand = [
    ((0.03 / Math.sqrt(3)) * N) / D,
    ((0.01 / Math.sqrt(12)) * N) / D,
    (L * N * AL) / (D * D) / Math.sqrt(3),
    (L * STEEL) / D / Math.sqrt(3),
    ((L * N * 20) / (D * D)) * ((0.1 * AL) / Math.sqrt(3)),
    ((L * 5) / D) * ((0.1 * STEEL) / Math.sqrt(3)),
  ];
  assert.equal(b.terms.length, 6);
  b.terms.forEach((t, i) => close(t.contributionMm, hand[i], 1e-12, t.quantity));
  close(b.expandedUncertaintyMm, 2 * Math.sqrt(hand.reduce((a, x) => a + x * x, 0)), 1e-12, 'U');
  // No correction: U = 2·√(a²/3 + δ²/12) = 0.035119 mm, as the instrument budget alone (4.3.7, F.2.2.1).
  const plain = computeLengthBudget({
    readingTerms: [
      { quantity: 'a', value: 0.03, unit: 'mm', standardUncertainty: 0.03 / Math.sqrt(3), basis: '' },
      { quantity: 'δ', value: 0.01, unit: 'mm', standardUncertainty: 0.01 / Math.sqrt(12), basis: '' },
    ],
    thermal: null,
  });
  close(plain.expandedUncertaintyMm, 0.035119, 1e-6, 'instrument only');
});

test('refuses a temperature out of range or a missing budget term by field', () => {
  assert.throws(
    () =>
      correctDifferentialExpansionMm({
        lengthMm: 100,
        partTemperatureC: 20,
        instrumentTemperatureC: 90,
        partExpansionPerK: AL,
        instrumentExpansionPerK: STEEL,
      }),
    (e: unknown) => e instanceof EngineInputError && e.field === 'instrumentTemperatureC',
  );
  assert.throws(
    () => computeLengthBudget({ readingTerms: [], thermal: null }),
    (e: unknown) => e instanceof EngineInputError && e.field === 'readingTerms',
  );
});
