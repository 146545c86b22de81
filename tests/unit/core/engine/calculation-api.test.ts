// Public API bodies: zod schemas (lib/core/inputs/calculation.ts) and the one-line engine
// functions that return each response's data object.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  computeCrossover,
  computeJetPerformance,
  computeParity,
  decideConformity,
  resolveDensity,
} from '../../../../lib/core/engine/index';
import {
  conformityInputSchema,
  crossoverInputSchema,
  jetPerformanceInputSchema,
  parityInputSchema,
} from '../../../../lib/core/inputs/calculation';

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} vs ${expected} (tol ${tol})`);
const issuePaths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.join('.'));

test('jet performance with defaults reproduces the lossless worked values', () => {
  // Worked values of momentum theory (Allison 1993), computed independently; default water fresh at 15 C = 999.1026 kg/m^3 (ITTC 7.5-02-01-03).
  const body = jetPerformanceInputSchema.parse({ powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0, 20] });
  assert.deepEqual(body.water, { kind: 'fresh', temperatureC: 15, basis: 'ittc' });
  assert.equal(body.pumpEfficiency, 1);
  const data = computeJetPerformance(body);
  close(data.densityKgM3, 999.1026, 1e-9, 'density');
  assert.deepEqual(Object.keys(data.points[0]).sort(), [
    'isThrustPositive',
    'jetVelocityMs',
    'massFlowKgS',
    'speedMs',
    'thrustN',
  ]);
  close(data.points[0].thrustN, 14136.25, 0.01, 'T0');
  close(data.points[1].jetVelocityMs, 45.5802, 1e-4, 'v_j at 20');
  close(data.points[1].thrustN, 9149.11, 0.01, 'T at 20');
  close(
    data.points[1].massFlowKgS,
    999.1026 * ((Math.PI * 0.01) / 4) * data.points[1].jetVelocityMs,
    1e-9,
    'm_dot = rho A v_j',
  );
});

test('with losses through the API: T at 20 m/s = 7903.79 N', () => {
  // Worked value of momentum theory with the MIT 2.611 loss form, computed independently.
  const body = jetPerformanceInputSchema.parse({
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [20],
    pumpEfficiency: 0.9,
    inletLossCoefficient: 0.2,
    nozzleLossCoefficient: 0.02,
  });
  close(computeJetPerformance(body).points[0].thrustN, 7903.79, 0.01, 'T');
});

test('densityKgM3 wins over water', () => {
  const body = jetPerformanceInputSchema.parse({
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0],
    water: { kind: 'sea', temperatureC: 20 },
    densityKgM3: 1000,
  });
  assert.equal(computeJetPerformance(body).densityKgM3, 1000);
  const sea = jetPerformanceInputSchema.parse({
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0],
    water: { kind: 'sea', temperatureC: 20 },
  });
  close(computeJetPerformance(sea).densityKgM3, 1024.8103, 1e-9, 'ITTC sea 20 C'); // ITTC 7.5-02-01-03
  const cold = jetPerformanceInputSchema.parse({
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0],
    water: { kind: 'fresh', temperatureC: 5, basis: 'eos80' },
  });
  assert.ok(computeJetPerformance(cold).densityKgM3 > 999.9); // EOS-80 near the 4 C maximum [memory: ~999.97]
});

test('jet performance schema refuses strings, bad ranges, unknown keys and ITTC out of table', () => {
  const base = { powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0, 10] };
  const bad: [object, string][] = [
    [{ ...base, powerKw: '300' }, 'powerKw'],
    [{ ...base, powerKw: 0 }, 'powerKw'],
    [{ ...base, nozzleDiameterMm: -1 }, 'nozzleDiameterMm'],
    [{ ...base, speedsMs: [] }, 'speedsMs'],
    [{ ...base, speedsMs: Array.from({ length: 1001 }, () => 1) }, 'speedsMs'],
    [{ ...base, speedsMs: [0, 101] }, 'speedsMs.1'],
    [{ ...base, speedsMs: [-1] }, 'speedsMs.0'],
    [{ ...base, pumpEfficiency: 0 }, 'pumpEfficiency'],
    [{ ...base, pumpEfficiency: 1.2 }, 'pumpEfficiency'],
    [{ ...base, nozzleLossCoefficient: 1 }, 'nozzleLossCoefficient'],
    [{ ...base, inletLossCoefficient: -0.1 }, 'inletLossCoefficient'],
    [{ ...base, wakeFraction: 1 }, 'wakeFraction'],
    [{ ...base, densityKgM3: 1 }, 'densityKgM3'],
    [{ ...base, water: { kind: 'lake', temperatureC: 15 } }, 'water.kind'],
    [{ ...base, water: { kind: 'fresh', temperatureC: 30 } }, 'water.temperatureC'],
    [{ ...base, water: { kind: 'fresh', temperatureC: 50, basis: 'eos80' } }, 'water.temperatureC'],
    [{ ...base, pumpEfficency: 0.9 }, ''],
  ];
  for (const [body, path] of bad) {
    const r = jetPerformanceInputSchema.safeParse(body);
    assert.equal(r.success, false, JSON.stringify(body).slice(0, 80));
    assert.ok(issuePaths(r).includes(path), `${path} in ${issuePaths(r).join(', ')}`);
    assert.ok(r.error?.issues.every((i) => i.message.length > 5));
  }
});

test('crossover API: 33.49 m/s with losses, null lossless', () => {
  // Crossover of the two momentum-theory curves (MIT 2.611 loss form), found by bisection outside this project's
  // code; lossless: no crossover (T = 2P/(v_j + V), Allison 1993).
  const lossy = crossoverInputSchema.parse({
    powerKw: 300,
    nozzleDiametersMm: [100, 90],
    pumpEfficiency: 0.9,
    inletLossCoefficient: 0.2,
    nozzleLossCoefficient: 0.02,
  });
  close(computeCrossover(lossy).crossoverSpeedMs as number, 33.49, 0.01, 'crossover');
  const lossless = crossoverInputSchema.parse({ powerKw: 300, nozzleDiametersMm: [100, 90] });
  assert.deepEqual(computeCrossover(lossless), { crossoverSpeedMs: null });
  assert.equal(crossoverInputSchema.safeParse({ powerKw: 300, nozzleDiametersMm: [100] }).success, false);
  assert.equal(crossoverInputSchema.safeParse({ powerKw: 300, nozzleDiametersMm: [100, 90, 80] }).success, false);
  assert.equal(
    crossoverInputSchema.safeParse({ powerKw: 300, nozzleDiametersMm: [100, 90], speedsMs: [1] }).success,
    false,
  );
});

test('conformity API reproduces the worked decisions', () => {
  // Worked decisions read off the zones of ILAC-G8:09/2019 and ISO 14253-1:2017, upper limit 102.00, U 0.05.
  const verdict = (x: number, rule: string) =>
    decideConformity(conformityInputSchema.parse({ readingsMm: [x], maxMm: 102, expandedUncertaintyMm: 0.05, rule }))
      .verdict;
  assert.deepEqual(
    [101.93, 101.97, 102.02, 102.06].map((x) => verdict(x, 'simple')),
    ['conforms', 'conforms', 'does_not_conform', 'does_not_conform'],
  );
  assert.deepEqual(
    [101.93, 101.97, 102.02, 102.06].map((x) => verdict(x, 'guarded')),
    ['conforms', 'does_not_conform', 'does_not_conform', 'does_not_conform'],
  );
  assert.deepEqual(
    [101.93, 101.97, 102.02, 102.06].map((x) => verdict(x, 'iso14253')),
    ['conforms', 'inconclusive', 'inconclusive', 'does_not_conform'],
  );
  const data = decideConformity(
    conformityInputSchema.parse({
      readingsMm: [101.9, 101.97],
      maxMm: 102,
      expandedUncertaintyMm: 0.05,
      rule: 'guarded',
    }),
  );
  assert.equal(data.decisiveValueMm, 101.97);
  assert.ok(data.explanation.length > 0);
});

test('conformity schema refuses missing limits, inverted limits, strings and negative U', () => {
  const base = { readingsMm: [101.9], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'simple' };
  const bad: [object, string][] = [
    [{ ...base, maxMm: undefined }, 'maxMm'],
    [{ ...base, minMm: 103 }, 'minMm'],
    [{ ...base, readingsMm: [] }, 'readingsMm'],
    [{ ...base, readingsMm: ['101.9'] }, 'readingsMm.0'],
    [{ ...base, expandedUncertaintyMm: -0.01 }, 'expandedUncertaintyMm'],
    [{ ...base, expandedUncertaintyMm: undefined }, 'expandedUncertaintyMm'],
    [{ ...base, rule: 'lenient' }, 'rule'],
  ];
  for (const [body, path] of bad) {
    const r = conformityInputSchema.safeParse(body);
    assert.equal(r.success, false, path);
    assert.ok(issuePaths(r).includes(path), `${path} in ${issuePaths(r).join(', ')}`);
  }
});

test('parity schema and API', () => {
  const body = parityInputSchema.parse({
    boats: [
      { id: 'a', label: 'A', powerKw: 300, nozzleDiameterMm: 100 },
      { id: 'b', label: 'B', powerKw: 300, nozzleDiameterMm: 90 },
    ],
  });
  assert.deepEqual(body.referenceSpeedsMs, [10, 20, 30]);
  // The parity report computes through computeParity with the density resolved from the water (lib/core/reports/parity-figures.ts).
  const { densityKgM3 } = resolveDensity(body.water);
  const data = computeParity(body.boats, { densityKgM3, referenceSpeedsMs: body.referenceSpeedsMs });
  close(densityKgM3, 999.1026, 1e-9, 'default density');
  assert.equal(data.boats.length, 2);
  assert.equal(data.referenceSetup.kind, 'synthetic');
  const dup = parityInputSchema.safeParse({
    boats: [
      { id: 'a', label: 'A', powerKw: 300, nozzleDiameterMm: 100 },
      { id: 'a', label: 'B', powerKw: 300, nozzleDiameterMm: 90 },
    ],
  });
  assert.ok(issuePaths(dup).includes('boats'));
  assert.equal(parityInputSchema.safeParse({ boats: [] }).success, false);
});

test('conformity schema: burdenOfProof is optional and refuses anything but the two values', () => {
  const base = { readingsMm: [101.97], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'iso14253' };
  assert.equal(conformityInputSchema.parse(base).burdenOfProof, undefined);
  assert.equal('burdenOfProof' in conformityInputSchema.parse(base), false, 'no key added when not given');
  assert.equal(
    conformityInputSchema.parse({ ...base, burdenOfProof: 'non_conformity' }).burdenOfProof,
    'non_conformity',
  );
  for (const bad of ['entrant', '', null, 1]) {
    const r = conformityInputSchema.safeParse({ ...base, burdenOfProof: bad });
    assert.equal(r.success, false, `refuses ${JSON.stringify(bad)}`);
    assert.deepEqual(issuePaths(r), ['burdenOfProof']);
  }
});
