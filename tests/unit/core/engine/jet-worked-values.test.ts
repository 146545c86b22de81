// Jet momentum theory against worked check values computed outside this project's code (a separate
// bisection of the power balance) from Allison, "Marine Waterjet Propulsion", SNAME Transactions 101, 1993;
// Faltinsen, Hydrodynamics of High-Speed Marine Vehicles, 2005, section 2.11; MIT 2.611 loss form; and against
// trade rules of thumb.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  computeCrossoverSpeedMs,
  computeJetPoint,
  computeOptimalVelocityRatio,
  computeStaticPerformance,
  computeThrustCurve,
  evaluateJetVelocityMs,
  evaluateThrustN,
  prepareJetSetup,
} from '../../../../lib/core/engine/index';

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} vs ${expected} (tol ${tol})`);

// Fresh water at 15 C, ITTC 7.5-02-01-03: 999.1026 kg/m^3.
const lossless = { powerKw: 300, nozzleDiameterMm: 100, densityKgM3: 999.1026 };
// MIT 2.611 course notes use K_i = 0.2 and eta_p = 0.9; K_n = 0.02 is a typical nozzle loss (common practice, no source).
const lossy = { ...lossless, pumpEfficiency: 0.9, inletLossCoefficient: 0.2, nozzleLossCoefficient: 0.02 };

test('lossless static: v_j = 42.4441 m/s, T = 14136.25 N', () => {
  // Worked check values (momentum theory, Allison 1993), computed independently of the engine.
  const p = computeJetPoint(lossless, 0);
  close(p.jetVelocityMs, 42.4441, 1e-4, 'v_j');
  close(p.thrustN, 14136.25, 0.01, 'T');
  const s = computeStaticPerformance(lossless); // closed form must agree with the cubic at V = 0
  close(s.jetVelocityMs, 42.4441, 1e-4, 'closed-form v_j0');
  close(s.thrustN, 14136.25, 0.01, 'closed-form T0');
});

test('lossless at 20 m/s: v_j = 45.5802 m/s, T = 9149.11 N', () => {
  // Worked check values (momentum theory, Allison 1993), computed independently of the engine.
  const p = computeJetPoint(lossless, 20);
  close(p.jetVelocityMs, 45.5802, 1e-4, 'v_j');
  close(p.thrustN, 9149.11, 0.01, 'T');
  assert.equal(p.isThrustPositive, true);
});

test('with losses static: v_j = 40.7097 m/s, T = 13004.56 N', () => {
  // Worked check values (eta_p 0.9, K_i 0.2, K_n 0.02; momentum theory with the MIT 2.611 loss form), computed independently.
  const p = computeJetPoint(lossy, 0);
  close(p.jetVelocityMs, 40.7097, 1e-4, 'v_j');
  close(p.thrustN, 13004.56, 0.01, 'T');
  close(computeStaticPerformance(lossy).thrustN, 13004.56, 0.01, 'closed form with K_n');
});

test('with losses at 20 m/s: T = 7903.79 N', () => {
  // Worked check value (momentum theory with the MIT 2.611 loss form), computed independently.
  close(computeJetPoint(lossy, 20).thrustN, 7903.79, 0.01, 'T');
});

test('100 mm vs 90 mm with losses cross at 33.49 m/s', () => {
  // Worked check value: where the two thrust curves of momentum theory (MIT 2.611 loss form) meet, found by
  // bisection outside this project's code.
  const v = computeCrossoverSpeedMs(lossy, { ...lossy, nozzleDiameterMm: 90 });
  assert.notEqual(v, null);
  close(v as number, 33.49, 0.01, 'crossover');
});

test('at the crossover the two velocity ratios straddle NVR*', () => {
  // NVR* = 1 + sqrt((K_i + K_n)/(1 + K_n)): dT/dv_j = 0 at fixed power and speed in the momentum relations with the
  // MIT 2.611 loss form (derived, not quoted); curves cross where the ratios straddle it.
  const small = { ...lossy, nozzleDiameterMm: 90 };
  const v = computeCrossoverSpeedMs(lossy, small) as number;
  const nvr = computeOptimalVelocityRatio(0.02, 0.2);
  close(nvr, 1 + Math.sqrt(0.22 / 1.02), 1e-15, 'NVR*');
  const ratioLarge = evaluateJetVelocityMs(prepareJetSetup(lossy), v) / v;
  const ratioSmall = evaluateJetVelocityMs(prepareJetSetup(small), v) / v;
  assert.ok(ratioLarge < nvr && nvr < ratioSmall, `${ratioLarge} < ${nvr} < ${ratioSmall}`);
});

test('thrust-best nozzle at one speed has velocity ratio NVR* (scan of diameters)', () => {
  // With losses the thrust-best jet-to-boat velocity ratio is NVR* (derived as above from the MIT 2.611 loss form).
  const speedMs = 20;
  let best = { thrustN: -Infinity, ratio: 0 };
  for (let d = 50; d <= 3000; d *= 1.0005) {
    // optimum near 1.1 m at 300 kW, 20 m/s
    const s = prepareJetSetup({ ...lossy, nozzleDiameterMm: d });
    const t = evaluateThrustN(s, speedMs);
    if (t > best.thrustN) best = { thrustN: t, ratio: evaluateJetVelocityMs(s, speedMs) / speedMs };
  }
  close(best.ratio, computeOptimalVelocityRatio(0.02, 0.2), 2e-3, 'ratio at best diameter');
});

test('ideal jet efficiency 2/(1 + v_j/V)', () => {
  // Froude efficiency of a jet (Faltinsen 2005, section 2.11). Lossless: eta = 2V/(V + v_j).
  const p = computeJetPoint(lossless, 20);
  close(p.idealJetEfficiency as number, 2 / (1 + p.jetVelocityMs / 20), 1e-12, 'eta_j');
  // Lossless it equals useful power T V over shaft power P exactly (momentum theory identity).
  close(p.idealJetEfficiency as number, (p.thrustN * 20) / 300e3, 1e-9, 'T V / P');
  assert.equal(computeJetPoint(lossless, 0).idealJetEfficiency, 0);
});

test('rule of thumb: +10 % diameter gives about +6 % static thrust, +40 % about +25 %', () => {
  // Common practice, no source (T0 ∝ D^(2/3) at fixed power: static momentum theory, Allison 1993).
  const t0 = (d: number) => computeStaticPerformance({ ...lossy, nozzleDiameterMm: d }).thrustN;
  const gain10 = t0(110) / t0(100) - 1;
  const gain40 = t0(140) / t0(100) - 1;
  close(gain10, 0.06, 0.01, '+10 %');
  close(gain40, 0.25, 0.01, '+40 %');
  close(t0(110) / t0(100), 1.1 ** (2 / 3), 1e-12, 'exact D^(2/3)');
});

test('rule of thumb: static jet velocity scales as D^(-2/3)', () => {
  // Common practice, no source (v_j0 ∝ D^(-2/3) at fixed power: static momentum theory, Allison 1993).
  const v0 = (d: number) => computeStaticPerformance({ ...lossless, nozzleDiameterMm: d }).jetVelocityMs;
  close(v0(120) / v0(100), 1.2 ** (-2 / 3), 1e-12, 'v_j0 ratio');
  assert.ok(v0(90) > v0(100), 'smaller nozzle, faster jet');
});

test('rule of thumb: doubling jet velocity at equal power needs 1/8 of the area', () => {
  // Common practice, no source (v_j0 ∝ A^(-1/3)).
  const v0 = (d: number) => computeStaticPerformance({ ...lossless, nozzleDiameterMm: d }).jetVelocityMs;
  close(v0(100 / Math.sqrt(8)) / v0(100), 2, 1e-12, 'doubling');
});

test('rule of thumb: larger nozzle advantage shrinks with speed, reverses at high speed with losses', () => {
  // Common practice, no source (large nozzles for acceleration, small for top speed).
  const speeds = [0, 10, 20, 30, 40, 50];
  const large = computeThrustCurve(lossy, speeds);
  const small = computeThrustCurve({ ...lossy, nozzleDiameterMm: 90 }, speeds);
  const advantage = large.map((p, i) => p.thrustN - small[i].thrustN);
  for (let i = 1; i < advantage.length; i++) assert.ok(advantage[i] < advantage[i - 1], `shrinks at ${speeds[i]} m/s`);
  assert.ok(advantage[0] > 0 && advantage[advantage.length - 1] < 0, 'reverses');
});

test('lossless: the larger nozzle always has more thrust, no crossover', () => {
  // Lossless identity T = 2P/(v_j + V) (momentum theory, Allison 1993): only losses make a crossover.
  const a = prepareJetSetup(lossless);
  const b = prepareJetSetup({ ...lossless, nozzleDiameterMm: 90 });
  for (let v = 0; v <= 100; v += 0.5) assert.ok(evaluateThrustN(a, v) > evaluateThrustN(b, v), `at ${v} m/s`);
  assert.equal(computeCrossoverSpeedMs(lossless, { ...lossless, nozzleDiameterMm: 90 }), null);
  // Larger nozzle advantage still shrinks with speed (common practice, no source).
  assert.ok(evaluateThrustN(a, 40) - evaluateThrustN(b, 40) < evaluateThrustN(a, 0) - evaluateThrustN(b, 0));
});

test('identical set-ups have no crossover; crossover is symmetric in its arguments', () => {
  assert.equal(computeCrossoverSpeedMs(lossy, { ...lossy }), null);
  const ab = computeCrossoverSpeedMs(lossy, { ...lossy, nozzleDiameterMm: 90 }) as number;
  const ba = computeCrossoverSpeedMs({ ...lossy, nozzleDiameterMm: 90 }, lossy) as number;
  close(ab, ba, 1e-8, 'symmetric');
});

test('negative net thrust is reported as computed and flagged', () => {
  // Design decision (jet.ts header): no clamping. With losses, thrust turns negative at high speed.
  const p = computeJetPoint({ ...lossy, powerKw: 20 }, 100);
  assert.equal(p.isThrustPositive, false);
  assert.ok(p.thrustN < 0 && Number.isFinite(p.thrustN));
  assert.equal(p.idealJetEfficiency, null);
  // T = m_dot (v_j - V_in) holds on the negative side too (momentum theory, Allison 1993).
  close(p.thrustN, p.massFlowKgS * (p.jetVelocityMs - p.inflowSpeedMs), 1e-9 * Math.abs(p.thrustN), 'T');
});

test('wake fraction reduces inflow speed: V_in = (1 - w) V', () => {
  // V_in = (1 - w) V, w the wake fraction (Faltinsen 2005, section 2.11). A wake of w at speed V equals no wake at (1 - w) V.
  const withWake = computeJetPoint({ ...lossy, wakeFraction: 0.1 }, 30);
  const equivalent = computeJetPoint(lossy, 27);
  close(withWake.inflowSpeedMs, 27, 1e-12, 'V_in');
  close(withWake.thrustN, equivalent.thrustN, 1e-9 * equivalent.thrustN, 'T');
});
