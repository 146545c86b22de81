import { test } from 'node:test';
import assert from 'node:assert/strict';
import { findTerminalSpeedMs, integrateRunFromRest } from '../../../../lib/core/engine/run-integrator';
import { fitQuadraticDragK, fixedPowerThrust, predictRun } from '../../../../lib/core/engine/run-prediction';

// Closed form for constant thrust T and quadratic drag k V^2 from rest (Thornton & Marion, Classical Dynamics
// of Particles and Systems, 5th ed., 2004, section 2.4, motion with a resistive force proportional to v^2):
//   V(t) = V_t tanh(t sqrt(T k) / m),  x(t) = (m / k) ln cosh(t sqrt(T k) / m),  V_t = sqrt(T / k)
// so the time to distance d is t = m / sqrt(T k) * acosh(exp(d k / m)).
const closedFormTimeS = (T: number, k: number, m: number, d: number) =>
  (m / Math.sqrt(T * k)) * Math.acosh(Math.exp((d * k) / m));
const closedFormSpeedMs = (T: number, k: number, m: number, t: number) =>
  Math.sqrt(T / k) * Math.tanh((t * Math.sqrt(T * k)) / m);

test('RK4 with step halving matches the closed form for constant thrust and quadratic drag to 1e-6 relative', () => {
  // Three cases across light and heavy boats and drags (illustrative values, not reference data).
  for (const [T, k, m] of [
    [6000, 2.5, 750],
    [9000, 1.2, 1100],
    [3000, 4.0, 500],
  ]) {
    const run = integrateRunFromRest({
      thrustN: () => T,
      resistanceN: (v) => k * v * v,
      massKg: m,
      distancesM: [100, 200],
    });
    assert.ok(run.converged, 'the step-halving check met its tolerance');
    for (const [i, d] of [100, 200].entries()) {
      const exact = closedFormTimeS(T, k, m, d);
      const got = run.timesS[i]!;
      assert.ok(Math.abs(got - exact) / exact < 1e-6, `T=${T} k=${k} m=${m} d=${d}: ${got} vs ${exact}`);
      const vExact = closedFormSpeedMs(T, k, m, exact);
      assert.ok(Math.abs(run.speedsMs[i]! - vExact) / vExact < 1e-6, `speed at ${d} m`);
    }
    assert.ok(run.relativeAccuracy < 1e-6);
  }
});

test('distances asked out of order come back in the order asked', () => {
  const run = integrateRunFromRest({
    thrustN: () => 5000,
    resistanceN: (v) => 2 * v * v,
    massKg: 800,
    distancesM: [200, 50, 100],
  });
  assert.ok(run.timesS[1]! < run.timesS[2]! && run.timesS[2]! < run.timesS[0]!);
  assert.ok(Math.abs(run.timesS[1]! - closedFormTimeS(5000, 2, 800, 50)) / run.timesS[1]! < 1e-6);
});

test('a boat that cannot move reaches nothing, and bad inputs are refused by name', () => {
  const run = integrateRunFromRest({
    thrustN: () => 0,
    resistanceN: (v) => v * v,
    massKg: 800,
    distancesM: [100],
    maxTimeS: 5,
  });
  assert.deepEqual(run.timesS, [null]);
  assert.throws(
    () => integrateRunFromRest({ thrustN: () => 1, resistanceN: () => 0, massKg: 0, distancesM: [1] }),
    /massKg/,
  );
  assert.throws(
    () => integrateRunFromRest({ thrustN: () => 1, resistanceN: () => 0, massKg: 1, distancesM: [-1] }),
    /distance/,
  );
});

const setup = {
  powerKw: 300,
  nozzleDiameterMm: 100,
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
};

test('the drag fit reproduces the observed top speed exactly (fixed-power thrust)', () => {
  const thrust = fixedPowerThrust(setup);
  for (const vTop of [22, 30.5, 38]) {
    const k = fitQuadraticDragK(thrust, vTop)!;
    // T(V_top) = k V_top^2 by construction; the model's terminal speed is the observed one.
    assert.ok(Math.abs(thrust(vTop) - k * vTop * vTop) <= 1e-9 * thrust(vTop));
    const terminal = findTerminalSpeedMs(thrust, (v) => k * v * v);
    assert.ok(Math.abs(terminal - vTop) < 1e-9 * vTop, `${terminal} vs ${vTop}`);
    const p = predictRun({ thrustN: thrust, powerKw: 300, massKg: 800, dragK: k, distancesM: [100] });
    assert.ok(Math.abs(p.topSpeedMs - vTop) < 1e-9 * vTop);
  }
});

test('no fit where the model has no thrust: the fixed-power jet at a speed it cannot outrun', () => {
  assert.equal(fitQuadraticDragK(fixedPowerThrust(setup), 200), null);
  assert.throws(() => fitQuadraticDragK(() => 1, 0), /topSpeedMs/);
});

test('heavier boat, same thrust and drag: slower to every distance, same top speed, lower thrust- and power-to-weight', () => {
  const thrust = fixedPowerThrust(setup);
  const k = fitQuadraticDragK(thrust, 32)!;
  const light = predictRun({ thrustN: thrust, powerKw: 300, massKg: 700, dragK: k, distancesM: [100, 200] });
  const heavy = predictRun({ thrustN: thrust, powerKw: 300, massKg: 900, dragK: k, distancesM: [100, 200] });
  assert.ok(heavy.timesS[0]! > light.timesS[0]! && heavy.timesS[1]! > light.timesS[1]!);
  assert.ok(Math.abs(heavy.topSpeedMs - light.topSpeedMs) < 1e-9 * light.topSpeedMs);
  assert.ok(heavy.thrustToWeight < light.thrustToWeight);
  // 300 kW over 0.7 t: arithmetic.
  assert.ok(Math.abs(light.powerToWeightKwPerT - 300 / 0.7) < 1e-9);
  // T0 / (m g) with g = 9.80665 m/s^2 (NIST SP 811, 2008) and T0 from the same thrust function.
  assert.ok(Math.abs(light.thrustToWeight - thrust(0) / (700 * 9.80665)) < 1e-12);
});
