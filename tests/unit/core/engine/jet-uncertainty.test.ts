// First-order uncertainty propagation (JCGM 100:2008, 5.1.2) checked against independent
// finite differences and a seeded Monte Carlo run.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  computeCrossoverSpeedMs,
  computeCrossoverUncertaintyMs,
  computeEqualisingDiameterUncertaintyMm,
  computeJetPoint,
  computeNozzleDiameterForStaticThrustMm,
  computeStaticPerformance,
  computeStaticUncertainty,
  computeThrustUncertaintyAtSpeed,
  createThrustSensitivity,
} from '../../../../lib/core/engine/index';

const relClose = (actual: number, expected: number, rel: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= rel * Math.abs(expected), `${what}: ${actual} vs ${expected} (rel ${rel})`);

const lossy = {
  powerKw: 300,
  nozzleDiameterMm: 100,
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  inletLossCoefficient: 0.2,
  nozzleLossCoefficient: 0.02,
};

test('diameter only: u(T0)/T0 = (2/3) u(D)/D', () => {
  // T0 ∝ D^(2/3) at fixed power (momentum theory, Allison 1993); JCGM 100:2008 5.1.2 first-order propagation.
  const u = computeStaticUncertainty(lossy, { uNozzleDiameterMm: 0.5 });
  relClose(u.relativeUStaticThrust, (2 / 3) * (0.5 / 100), 1e-12, 'relative u(T0)');
  relClose(u.uStaticThrustN, (2 / 3) * 0.005 * computeStaticPerformance(lossy).thrustN, 1e-12, 'u(T0)');
});

/** Central difference with its own (larger) step, independent of the engine's sensitivity code. */
function centralDifference(f: (x: number) => number, x: number): number {
  const h = 1e-4 * x;
  return (f(x + h) - f(x - h)) / (2 * h);
}

test('static uncertainty equals JCGM 5.1.2 with finite-difference sensitivity coefficients', () => {
  const uP = 6; // kW, about 2 %
  const uD = 0.1; // mm
  const dTdP = centralDifference((p) => computeStaticPerformance({ ...lossy, powerKw: p }).thrustN, 300);
  const dTdD = centralDifference((d) => computeStaticPerformance({ ...lossy, nozzleDiameterMm: d }).thrustN, 100);
  const dVdP = centralDifference((p) => computeStaticPerformance({ ...lossy, powerKw: p }).jetVelocityMs, 300);
  const dVdD = centralDifference((d) => computeStaticPerformance({ ...lossy, nozzleDiameterMm: d }).jetVelocityMs, 100);
  const u = computeStaticUncertainty(lossy, { uPowerKw: uP, uNozzleDiameterMm: uD });
  relClose(u.uStaticThrustN, Math.hypot(dTdP * uP, dTdD * uD), 1e-6, 'u(T0)');
  relClose(u.uStaticJetVelocityMs, Math.hypot(dVdP * uP, dVdD * uD), 1e-6, 'u(v_j0)');
});

test('numerical sensitivities at V = 0 agree with the closed form (2/3 T0/P, 2/3 T0/D)', () => {
  // T0 = (2 eta P / (1 + K_n))^(2/3) (rho pi D^2/4)^(1/3) ∝ P^(2/3) D^(2/3) (static momentum theory, Allison 1993),
  // so dT0/dP = (2/3) T0/P and dT0/dD = (2/3) T0/D.
  const t0 = computeStaticPerformance(lossy).thrustN;
  const c = createThrustSensitivity(lossy).atSpeed(0);
  relClose(c.thrustPerPowerNPerKw, ((2 / 3) * t0) / 300, 1e-7, 'dT/dP');
  relClose(c.thrustPerDiameterNPerMm, ((2 / 3) * t0) / 100, 1e-7, 'dT/dD');
});

test('thrust uncertainty at 20 m/s matches finite differences of the full model', () => {
  const u = { uPowerKw: 6, uNozzleDiameterMm: 0.1 };
  const tAt = (s: typeof lossy) => computeJetPoint(s, 20).thrustN;
  const dTdP = centralDifference((p) => tAt({ ...lossy, powerKw: p }), 300);
  const dTdD = centralDifference((d) => tAt({ ...lossy, nozzleDiameterMm: d }), 100);
  const r = computeThrustUncertaintyAtSpeed(lossy, 20, u);
  relClose(r.thrustN, tAt(lossy), 1e-15, 'T');
  relClose(r.uThrustN, Math.hypot(dTdP * 6, dTdD * 0.1), 1e-6, 'u(T)');
});

// mulberry32 PRNG and Box-Muller normal deviates: a seeded, reproducible Monte Carlo.
function createNormalSampler(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

test('first-order u(T) agrees with a Monte Carlo propagation for small input uncertainties', () => {
  // Propagation of distributions (Monte Carlo method of GUM Supplement 1, JCGM 101:2008 [memory]):
  // for small, near-linear uncertainties it must agree with JCGM 100:2008 5.1.2 to a few per cent.
  const normal = createNormalSampler(20240601);
  const uP = 3;
  const uD = 0.05;
  const n = 20000;
  let sum = 0;
  let sumSq = 0;
  for (let i = 0; i < n; i++) {
    const t = computeJetPoint(
      { ...lossy, powerKw: 300 + uP * normal(), nozzleDiameterMm: 100 + uD * normal() },
      20,
    ).thrustN;
    sum += t;
    sumSq += t * t;
  }
  const mean = sum / n;
  const sd = Math.sqrt((sumSq - n * mean * mean) / (n - 1));
  const firstOrder = computeThrustUncertaintyAtSpeed(lossy, 20, { uPowerKw: uP, uNozzleDiameterMm: uD }).uThrustN;
  relClose(firstOrder, sd, 0.03, 'u(T) vs Monte Carlo SD');
});

test('crossover uncertainty matches a finite difference of the crossover speed itself', () => {
  // Implicit-function sensitivity (jet-uncertainty.ts) vs brute force: re-solve the crossover.
  const reference = { ...lossy, nozzleDiameterMm: 90 };
  const vAt = (s: typeof lossy) => computeCrossoverSpeedMs(s, reference) as number;
  const v = vAt(lossy);
  const dVdP = centralDifference((p) => vAt({ ...lossy, powerKw: p }), 300);
  const dVdD = centralDifference((d) => vAt({ ...lossy, nozzleDiameterMm: d }), 100);
  const u = { uPowerKw: 6, uNozzleDiameterMm: 0.1 };
  const ours = computeCrossoverUncertaintyMs(createThrustSensitivity(lossy), reference, v, u);
  assert.notEqual(ours, null);
  relClose(ours as number, Math.hypot(dVdP * 6, dVdD * 0.1), 1e-4, 'u(V*)');
});

test('equalising diameter uncertainty: u(D_eq)/D_eq = u(P)/P', () => {
  // D_eq ∝ P^(-1) at fixed target thrust (the static relation above solved for D); checked by finite difference.
  const target = 12000;
  const dAt = (p: number) =>
    computeNozzleDiameterForStaticThrustMm({ ...lossy, powerKw: p, targetStaticThrustN: target });
  const d = dAt(300);
  const slope = centralDifference(dAt, 300);
  relClose(computeEqualisingDiameterUncertaintyMm(d, 300, 6), Math.abs(slope) * 6, 1e-6, 'u(D_eq)');
  assert.equal(computeEqualisingDiameterUncertaintyMm(d, 300, 0), 0);
});

test('zero input uncertainty gives zero output uncertainty', () => {
  const r = computeThrustUncertaintyAtSpeed(lossy, 15, {});
  assert.equal(r.uThrustN, 0);
  assert.equal(r.uJetVelocityMs, 0);
  assert.equal(computeStaticUncertainty(lossy, {}).uStaticThrustN, 0);
});
