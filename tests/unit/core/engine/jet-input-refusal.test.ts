// Meaningless jet input is refused with EngineInputError naming the field; never NaN.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import {
  EngineInputError,
  computeCrossoverSpeedMs,
  computeJetPoint,
  computeNozzleDiameterForStaticThrustMm,
  computeStaticPerformance,
  computeStaticUncertainty,
  computeThrustCurve,
  evaluateThrustN,
  fillThrustCurve,
  prepareJetSetup,
  type JetSetupInput,
} from '../../../../lib/core/engine/index';

const good: JetSetupInput = {
  powerKw: 300,
  nozzleDiameterMm: 100,
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0.05,
};

function refuses(fn: () => unknown, field: string) {
  assert.throws(fn, (e: unknown) => {
    assert.ok(e instanceof EngineInputError, `expected EngineInputError, got ${String(e)}`);
    assert.equal(e.field, field);
    assert.ok(e.message.length > 10 && !e.message.includes('NaN is'), e.message);
    return true;
  });
}

const badValues: [keyof JetSetupInput, unknown[]][] = [
  ['powerKw', [0, -1, Number.NaN, Infinity, -Infinity, '300']],
  ['nozzleDiameterMm', [0, -100, Number.NaN, Infinity]],
  ['densityKgM3', [0, -999, Number.NaN, Infinity]],
  ['pumpEfficiency', [0, -0.1, 1.0001, 2, Number.NaN]],
  ['nozzleLossCoefficient', [-0.01, 1, 1.5, Number.NaN, Infinity]],
  ['inletLossCoefficient', [-0.01, 1, Number.NaN]],
  ['wakeFraction', [-0.01, 1, Number.NaN]],
];

test('each bad set-up field is refused by name', () => {
  for (const [field, values] of badValues) {
    for (const value of values) {
      const setup = { ...good, [field]: value } as JetSetupInput;
      refuses(() => prepareJetSetup(setup), field);
      refuses(() => computeStaticPerformance(setup), field);
      refuses(() => computeJetPoint(setup, 10), field);
    }
  }
});

test('boundary values that are meaningful are accepted', () => {
  // Efficiency 1 (ideal pump), zero losses and zero wake are the lossless case of momentum theory (Allison 1993).
  const p = computeJetPoint(
    { ...good, pumpEfficiency: 1, nozzleLossCoefficient: 0, inletLossCoefficient: 0, wakeFraction: 0 },
    0,
  );
  assert.ok(p.thrustN > 0);
  // A nozzle loss just below 1 is extreme but meaningful: finite, with thrust turned negative at 50 m/s.
  const extreme = computeJetPoint({ ...good, nozzleLossCoefficient: 0.999 }, 50);
  assert.ok(Number.isFinite(extreme.thrustN) && Number.isFinite(extreme.jetVelocityMs));
  assert.equal(extreme.isThrustPositive, extreme.thrustN > 0);
});

test('bad speeds are refused by name', () => {
  refuses(() => computeJetPoint(good, -1), 'speedMs');
  refuses(() => computeJetPoint(good, Number.NaN), 'speedMs');
  refuses(() => computeJetPoint(good, Infinity), 'speedMs');
  refuses(() => evaluateThrustN(prepareJetSetup(good), -0.001), 'speedMs');
  refuses(() => computeThrustCurve(good, [0, 10, Number.NaN]), 'speedsMs[2]');
  refuses(() => fillThrustCurve(prepareJetSetup(good), Float64Array.from([0, -5]), new Float64Array(2)), 'speedsMs[1]');
  refuses(() => fillThrustCurve(prepareJetSetup(good), new Float64Array(3), new Float64Array(2)), 'outThrustN');
  refuses(() => computeThrustCurve(good, 'fast' as never), 'speedsMs');
});

test('inversion, crossover and uncertainty inputs are refused by name', () => {
  refuses(() => computeNozzleDiameterForStaticThrustMm({ ...good, targetStaticThrustN: 0 }), 'targetStaticThrustN');
  refuses(
    () => computeNozzleDiameterForStaticThrustMm({ ...good, targetStaticThrustN: Number.NaN }),
    'targetStaticThrustN',
  );
  refuses(() => computeNozzleDiameterForStaticThrustMm({ ...good, targetStaticThrustN: 1000, powerKw: -3 }), 'powerKw');
  refuses(() => computeCrossoverSpeedMs(good, { ...good, nozzleDiameterMm: 0 }), 'nozzleDiameterMm');
  refuses(() => computeCrossoverSpeedMs(good, good, { maxSpeedMs: 5000 }), 'maxSpeedMs');
  refuses(() => computeCrossoverSpeedMs(good, good, { scanStepMs: 0 }), 'scanStepMs');
  refuses(() => computeStaticUncertainty(good, { uPowerKw: -1 }), 'uPowerKw');
  refuses(() => computeStaticUncertainty(good, { uNozzleDiameterMm: Number.NaN }), 'uNozzleDiameterMm');
  refuses(() => prepareJetSetup(null as never), 'setup');
});

test('absurd magnitudes are refused rather than overflowing to NaN', () => {
  refuses(() => prepareJetSetup({ ...good, powerKw: 1e300, nozzleDiameterMm: 1e-100 }), 'powerKw');
  refuses(() => prepareJetSetup({ ...good, powerKw: 1e-300 }), 'powerKw');
  refuses(() => computeJetPoint(good, 1e200), 'speedMs');
});

test('never NaN: any finite input either gives finite output or a typed refusal (property)', () => {
  const anyNumber = fc.oneof(fc.double(), fc.constantFrom(0, -1, 1, 1e-300, 1e300));
  fc.assert(
    fc.property(
      anyNumber,
      anyNumber,
      anyNumber,
      anyNumber,
      anyNumber,
      anyNumber,
      anyNumber,
      anyNumber,
      (powerKw, nozzleDiameterMm, densityKgM3, pumpEfficiency, kn, ki, w, speed) => {
        try {
          const p = computeJetPoint(
            {
              powerKw,
              nozzleDiameterMm,
              densityKgM3,
              pumpEfficiency,
              nozzleLossCoefficient: kn,
              inletLossCoefficient: ki,
              wakeFraction: w,
            },
            speed,
          );
          return [p.jetVelocityMs, p.massFlowKgS, p.thrustN].every(Number.isFinite);
        } catch (e) {
          return e instanceof EngineInputError;
        }
      },
    ),
    { numRuns: 2000 },
  );
});

test('never NaN across wide valid magnitudes (property)', () => {
  fc.assert(
    fc.property(
      fc.double({ min: 1e-3, max: 1e6, noNaN: true }),
      fc.double({ min: 1, max: 5000, noNaN: true }),
      fc.double({ min: 1, max: 1e5, noNaN: true }),
      fc.double({ min: 1e-3, max: 1, noNaN: true }),
      fc.double({ min: 0, max: 0.999, noNaN: true }),
      fc.double({ min: 0, max: 0.999, noNaN: true }),
      fc.double({ min: 0, max: 0.999, noNaN: true }),
      fc.double({ min: 0, max: 1000, noNaN: true }),
      (powerKw, nozzleDiameterMm, densityKgM3, pumpEfficiency, kn, ki, w, speed) => {
        const p = computeJetPoint(
          {
            powerKw,
            nozzleDiameterMm,
            densityKgM3,
            pumpEfficiency,
            nozzleLossCoefficient: kn,
            inletLossCoefficient: ki,
            wakeFraction: w,
          },
          speed,
        );
        return [p.jetVelocityMs, p.massFlowKgS, p.thrustN].every(Number.isFinite) && p.jetVelocityMs > 0;
      },
    ),
    { numRuns: 2000 },
  );
});
