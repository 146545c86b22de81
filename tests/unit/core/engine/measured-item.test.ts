// Measured items of a class: engine capacity from bore and stroke and its uncertainty, and direct items
// (a mass by the mean of repeated weighings, a size in mm by its extreme readings). Reference values
// are worked by hand in the comments, not by the code under test:
// - swept volume V = n·(π/4)·b²·s, the geometric volume of n cylinders (common practice, no source);
// - law of propagation of uncertainty (JCGM 100:2008, 5.1.2) with sensitivity coefficients ∂V/∂b = 2V/b
//   and ∂V/∂s = V/s, so u(V)/V = √((2u(b)/b)² + (u(s)/s)²); U = 2·u_c (6.2.1, 6.3.3);
// - the mean of repeated observations as the estimate and s/√n its standard uncertainty (4.2.1–4.2.3);
// - a two-point size limit applies to every local size (ISO 14405-1:2016).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  engineCapacityCm3,
  estimateDirectItem,
  estimateEngineCapacity,
} from '../../../../lib/core/engine/measured-item';
import { EngineInputError } from '../../../../lib/core/engine/engine-input-error';

const close = (a: number, b: number, tol: number, what: string) =>
  assert.ok(Math.abs(a - b) <= tol, `${what}: ${a} vs ${b} (tolerance ${tol})`);

test('a square four-cylinder engine, bore 86 mm and stroke 86 mm: 1998.23 cm³', () => {
  // By hand: 86³ = 636 056 mm³; 4·(π/4) = π; π·636 056 = 1 998 228.9 mm³ = 1998.23 cm³.
  close(engineCapacityCm3(4, 86, 86), 1998.2289, 1e-3, 'V');
  // One cylinder of bore 81 mm, stroke 77.8 mm, two cylinders: 2·(π/4)·6561·77.8 = 801 806 mm³ = 801.81 cm³.
  close(engineCapacityCm3(2, 81, 77.8), 801.806, 1e-2, 'V twin');
});

test('its expanded uncertainty by the sensitivity coefficients (JCGM 100:2008, 5.1.2)', () => {
  // Caliper U = 0.02 mm (u = 0.01 mm) on one bore and one stroke reading:
  // u(V)/V = √((2·0.01/86)² + (0.01/86)²) = (0.01/86)·√5 = 2.600 08e-4; u(V) = 0.519 56 cm³; U = 1.0391 cm³.
  const e = estimateEngineCapacity({
    cylinders: 4,
    boresMm: [86],
    strokesMm: [86],
    instrumentStandardUMm: 0.01,
    defaultExpandedUCm3: 5,
    instrumentBasis: 'caliper U 0.02 mm',
  });
  close(e.value, 1998.2289, 1e-3, 'V');
  close(e.expandedUncertainty, 1.0391, 1e-3, 'U');
  assert.deepEqual(e.decisiveValues, [e.value]);
  assert.match(e.basis, /JCGM 100:2008, 5\.1\.2/);
});

test('bore readings that spread add s/√n to u(b) (JCGM 100:2008, 4.2.3)', () => {
  // Bores 85.98 and 86.02: mean 86.00, s = 0.028 284 mm, s/√2 = 0.02 mm; u(b) = √(0.01² + 0.02²) = 0.022 361 mm.
  // u(s) = 0.01 mm (both strokes alike). u(V)/V = √((2·0.022361/86)² + (0.01/86)²) = √(2.7042e-7 + 1.3521e-8)
  // = 5.3286e-4; U = 2·1998.2289·5.3286e-4 = 2.1296 cm³.
  const e = estimateEngineCapacity({
    cylinders: 4,
    boresMm: [85.98, 86.02],
    strokesMm: [86, 86],
    instrumentStandardUMm: 0.01,
    defaultExpandedUCm3: 5,
    instrumentBasis: null,
  });
  close(e.uBoreMm, 0.022361, 1e-6, 'u(b)');
  close(e.uStrokeMm, 0.01, 1e-9, 'u(s)');
  close(e.expandedUncertainty, 2.1296, 1e-3, 'U');
});

test('without a length instrument the class default U in cm³ stands for it', () => {
  const e = estimateEngineCapacity({
    cylinders: 4,
    boresMm: [86],
    strokesMm: [86],
    instrumentStandardUMm: null,
    defaultExpandedUCm3: 5,
    instrumentBasis: null,
  });
  close(e.expandedUncertainty, 5, 1e-9, 'U');
  assert.match(e.basis, /class default U 5 cm³/);
});

test('a mass is decided on the mean of its weighings, their spread in U', () => {
  // Ballast 25.0, 25.2, 25.1 kg on a scale of U 0.1 kg (u 0.05): mean 25.1; s = 0.1; s/√3 = 0.057 735;
  // u = √(0.05² + 0.057735²) = 0.076 376; U = 0.152 75 kg.
  const e = estimateDirectItem({
    unit: 'kg',
    values: [25.0, 25.2, 25.1],
    instrumentStandardU: 0.05,
    defaultExpandedU: 1,
    instrumentBasis: 'scale U 0.1 kg',
  });
  close(e.value, 25.1, 1e-9, 'mean');
  assert.equal(e.decisiveValues.length, 1);
  close(e.expandedUncertainty, 0.15275, 1e-5, 'U');
});

test('a size in mm keeps every reading: each local size must meet the limit (ISO 14405-1:2016)', () => {
  const e = estimateDirectItem({
    unit: 'mm',
    values: [40.1, 40.4, 40.2],
    instrumentStandardU: null,
    defaultExpandedU: 0.04,
    instrumentBasis: null,
  });
  assert.deepEqual(e.decisiveValues, [40.1, 40.4, 40.2]);
  assert.equal(e.value, 40.4);
  close(e.expandedUncertainty, 0.04, 1e-12, 'U');
});

test('meaningless input is refused with the field named', () => {
  assert.throws(() => engineCapacityCm3(0, 86, 86), EngineInputError);
  assert.throws(() => engineCapacityCm3(2.5, 86, 86), EngineInputError);
  assert.throws(() => engineCapacityCm3(4, Number.NaN, 86), EngineInputError);
  assert.throws(() => engineCapacityCm3(4, 86, -1), EngineInputError);
  assert.throws(
    () =>
      estimateDirectItem({
        unit: 'kg',
        values: [],
        instrumentStandardU: null,
        defaultExpandedU: 1,
        instrumentBasis: null,
      }),
    EngineInputError,
  );
  assert.throws(
    () =>
      estimateDirectItem({
        unit: 'kg',
        values: [Infinity],
        instrumentStandardU: null,
        defaultExpandedU: 1,
        instrumentBasis: null,
      }),
    EngineInputError,
  );
});
