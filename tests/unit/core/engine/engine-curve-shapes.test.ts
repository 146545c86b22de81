import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  ENGINE_CURVE_SHAPES,
  buildRatedEngineCurve,
  engineShareAt,
} from '../../../../lib/core/engine/engine-curve-shapes';
import { computeMatchedCurve } from '../../../../lib/core/engine/jet-matched';
import { computeThrustCurve } from '../../../../lib/core/engine/jet';

test('every shape gives exactly the rated power at the rated rpm (what "rated" means: common practice, no source)', () => {
  for (const shape of ENGINE_CURVE_SHAPES) {
    const curve = buildRatedEngineCurve(300, 7000, shape);
    const rated = curve.find((p) => p.rpm === 7000);
    assert.ok(rated, shape);
    assert.ok(Math.abs(rated.powerKw - 300) < 1e-12, `${shape}: ${rated.powerKw}`);
    for (let i = 1; i < curve.length; i++) assert.ok(curve[i].rpm > curve[i - 1].rpm, 'rpm increasing');
  }
});

test('Leiderman’s petrol-engine formula P/Pmax = x + x² − x³ at half the rated rpm is 0.625 [memory for the formula]', () => {
  // 0.5 + 0.25 − 0.125 = 0.625, by hand.
  assert.equal(engineShareAt('spark_ignition', 0.5), 0.625);
  // Its peak is at x = 1 (dP/dx = 1 + 2x − 3x² = 0 at x = 1): power falls past the rated rpm.
  assert.ok(engineShareAt('spark_ignition', 1.1) < 1);
  // The diesel coefficients still rise past x = 1 (0.5 + 3x − 3x² > 0 there): its curve stops at the governed rpm.
  const diesel = buildRatedEngineCurve(300, 2000, 'diesel');
  assert.equal(diesel[diesel.length - 1].rpm, 2000);
});

test('a flat rated curve and a constant pump efficiency give the fixed-power model (Karassik, Pump Handbook; Brennen 1994: eta P = rho g Q H)', () => {
  // The identity of issue 19: with a flat engine curve and constant efficiency, matched = fixed power.
  const eta = 0.9;
  const pump = {
    impellerDiameterMm: 212,
    curve: [
      { flowCoefficient: 0.05, headCoefficient: 8, efficiency: eta },
      { flowCoefficient: 0.5, headCoefficient: 0.5, efficiency: eta },
    ],
  };
  const engine = { curve: buildRatedEngineCurve(300, 7000, 'flat') };
  const model = {
    densityKgM3: 999.1026,
    nozzleDiameterMm: 100,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
  };
  const matched = computeMatchedCurve({ engine, pump, ...model }, [0, 20]);
  const fixed = computeThrustCurve({ ...model, powerKw: 300, pumpEfficiency: eta }, [0, 20]);
  for (let i = 0; i < 2; i++) {
    assert.equal(matched[i].limitedBy, 'engine');
    assert.ok(
      Math.abs(matched[i].thrustN / fixed[i].thrustN - 1) < 1e-9,
      `${matched[i].thrustN} vs ${fixed[i].thrustN}`,
    );
  }
});
