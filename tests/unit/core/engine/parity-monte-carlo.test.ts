// Monte Carlo for the class (JCGM 101:2008): the generator's reproducibility and moments, agreement
// with first-order propagation (JCGM 100:2008, 5.1.2) on a small-uncertainty case, pair probabilities
// against the normal distribution function from mathjs (a general-purpose reference library), and
// the upward bias of the spread of a small class.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { erf } from 'mathjs';
import {
  computeParity,
  computeParityMonteCarlo,
  computeStaticUncertainty,
  createNormalGenerator,
  createWichmannHill,
  prepareJetSetup,
} from '../../../../lib/core/engine/index';

const MODEL = { densityKgM3: 999.1026, pumpEfficiency: 0.9, inletLossCoefficient: 0.2, nozzleLossCoefficient: 0.02 };

test('the generator: same seed, same numbers; U(0,1) and N(0,1) moments within sampling error', () => {
  const a = createWichmannHill(42);
  const b = createWichmannHill(42);
  const c = createWichmannHill(43);
  const xa = Array.from({ length: 1000 }, () => a.next());
  assert.deepEqual(
    xa,
    Array.from({ length: 1000 }, () => b.next()),
  );
  assert.notDeepEqual(
    xa,
    Array.from({ length: 1000 }, () => c.next()),
  );
  // U(0,1): mean 1/2, variance 1/12; with 1e5 draws the standard errors are 0.0009 and 0.0003,
  // so the bounds below are more than 3 standard errors (properties of the uniform distribution).
  const u = createWichmannHill(7);
  const m = 100_000;
  let sum = 0;
  let sq = 0;
  for (let i = 0; i < m; i++) {
    const x = u.next();
    assert.ok(x > 0 && x < 1);
    sum += x;
    sq += x * x;
  }
  const mean = sum / m;
  assert.ok(Math.abs(mean - 0.5) < 0.003, `mean ${mean}`);
  assert.ok(Math.abs(sq / m - mean * mean - 1 / 12) < 0.001, 'variance 1/12');
  const normal = createNormalGenerator(createWichmannHill(8));
  let ns = 0;
  let nsq = 0;
  for (let i = 0; i < m; i++) {
    const z = normal();
    ns += z;
    nsq += z * z;
  }
  assert.ok(Math.abs(ns / m) < 0.012, 'N(0,1) mean 0');
  assert.ok(Math.abs(Math.sqrt(nsq / m - (ns / m) ** 2) - 1) < 0.01, 'N(0,1) standard deviation 1');
});

test('Monte Carlo and first-order uncertainties agree within a few per cent on a small-uncertainty case', () => {
  const boats = [
    { id: 'a', label: 'A', powerKw: 300, nozzleDiameterMm: 100, uPowerKw: 3, uNozzleDiameterMm: 0.05 },
    { id: 'b', label: 'B', powerKw: 320, nozzleDiameterMm: 96, uPowerKw: 8, uNozzleDiameterMm: 0.1 },
  ];
  const mc = computeParityMonteCarlo(boats, MODEL, { referenceSpeedsMs: [20], trials: 50_000, seed: 2026 });
  assert.equal(mc.trials, 50_000);
  const firstOrder = computeParity(boats, { ...MODEL, referenceSpeedsMs: [20] });
  boats.forEach((b, i) => {
    const u0 = computeStaticUncertainty(prepareJetSetup({ ...MODEL, ...b }), b).uStaticThrustN;
    const mcStatic = mc.boats[i].thrust[0];
    assert.ok(
      Math.abs(mcStatic.standardUncertainty / u0 - 1) < 0.03,
      `static u: MC ${mcStatic.standardUncertainty} vs ${u0}`,
    );
    assert.ok(Math.abs(mcStatic.mean / firstOrder.boats[i].staticThrustN - 1) < 1e-3, 'mean near the nominal');
    const u20 = firstOrder.boats[i].thrustAtReferenceSpeeds[0].uThrustN;
    const mc20 = mc.boats[i].thrust[1];
    assert.equal(mc20.speedMs, 20);
    assert.ok(
      Math.abs(mc20.standardUncertainty / u20 - 1) < 0.03,
      `20 m/s u: MC ${mc20.standardUncertainty} vs ${u20}`,
    );
    // A normal output's 95 % interval is mean ± 1.96 u (JCGM 101:2008, 7.7 for a symmetric distribution).
    assert.ok(Math.abs((mcStatic.high95 - mcStatic.low95) / (2 * 1.96 * u0) - 1) < 0.04, 'coverage interval width');
  });
});

test('the probability that one boat out-thrusts another matches Φ(Δ / √(u_a² + u_b²))', () => {
  // Two boats 1.3 % apart in static thrust with about 1 % standard uncertainty each.
  const boats = [
    { id: 'a', label: 'A', powerKw: 304, nozzleDiameterMm: 100, uPowerKw: 4, uNozzleDiameterMm: 0.3 },
    { id: 'b', label: 'B', powerKw: 300, nozzleDiameterMm: 100, uPowerKw: 4, uNozzleDiameterMm: 0.3 },
  ];
  const mc = computeParityMonteCarlo(boats, MODEL, { referenceSpeedsMs: [], trials: 40_000, seed: 11 });
  const [a, b] = boats.map((x) => ({
    t: computeParity([x], MODEL).boats[0].staticThrustN,
    u: computeStaticUncertainty(prepareJetSetup({ ...MODEL, ...x }), x).uStaticThrustN,
  }));
  const z = (a.t - b.t) / Math.hypot(a.u, b.u);
  const phi = 0.5 * (1 + (erf(z / Math.SQRT2) as number));
  const p = mc.pairs[0].probabilityAAhead[0].probability;
  assert.ok(p > 0.5 && p < 1, `a is ahead more often than not (${p})`);
  // Binomial standard error at 40,000 trials is under 0.0025; first-order vs MC adds a little.
  assert.ok(Math.abs(p - phi) < 0.012, `MC ${p} vs normal ${phi}`);
});

test('a fixed seed reproduces the run; the spread of a small class is biased upwards by noise', () => {
  const same = Array.from({ length: 5 }, (_, i) => ({
    id: `b${i}`,
    label: `B${i}`,
    powerKw: 300,
    nozzleDiameterMm: 100,
    uPowerKw: 5,
    uNozzleDiameterMm: 0.05,
  }));
  const one = computeParityMonteCarlo(same, MODEL, { referenceSpeedsMs: [20], trials: 5000, seed: 99 });
  const two = computeParityMonteCarlo(same, MODEL, { referenceSpeedsMs: [20], trials: 5000, seed: 99 });
  assert.deepEqual(one, two);
  const other = computeParityMonteCarlo(same, MODEL, { referenceSpeedsMs: [20], trials: 5000, seed: 100 });
  assert.notEqual(other.spread.mean, one.spread.mean);
  // Identical boats: the nominal spread is 0, yet measured values would show one.
  assert.equal(one.spread.nominalPercent, 0);
  assert.ok(one.spread.mean > 0.5 && one.spread.low95 > 0, `spread ${one.spread.mean} %`);
  // Every pair of identical boats is a coin toss.
  for (const pair of one.pairs) assert.ok(Math.abs(pair.probabilityAAhead[0].probability - 0.5) < 0.03);
});

test('trials are capped so that the kept samples stay bounded; bad options are refused', () => {
  const many = Array.from({ length: 100 }, (_, i) => ({
    id: `b${i}`,
    label: `B${i}`,
    powerKw: 250 + i,
    nozzleDiameterMm: 100,
    uPowerKw: 5,
  }));
  const mc = computeParityMonteCarlo(many, MODEL, { referenceSpeedsMs: [10, 20, 30], trials: 100_000, seed: 1 });
  assert.equal(mc.trials, 10_000);
  assert.equal(mc.pairs.length, (100 * 99) / 2);
  assert.throws(
    () => computeParityMonteCarlo(many, MODEL, { referenceSpeedsMs: [], trials: 5 }),
    /at least 100 trials/,
  );
  assert.throws(() => createWichmannHill(-1), /seed/);
});
