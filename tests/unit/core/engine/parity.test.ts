// Class parity statistics, checked against simple-statistics on the same numbers and against
// the momentum-theory relations (Allison 1993; MIT 2.611 loss form).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { max, mean, median, min, sampleStandardDeviation } from 'simple-statistics';
import {
  EngineInputError,
  computeCrossoverSpeedMs,
  computeMedian,
  computeParity,
  computeStaticPerformance,
  type ParityBoatInput,
} from '../../../../lib/core/engine/index';

const relClose = (actual: number, expected: number, rel: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= rel * Math.abs(expected), `${what}: ${actual} vs ${expected}`);

// Shared model: fresh water 15 C (ITTC 7.5-02-01-03), MIT 2.611-style losses.
const model = { densityKgM3: 999.1026, pumpEfficiency: 0.9, inletLossCoefficient: 0.2, nozzleLossCoefficient: 0.02 };
const boats: ParityBoatInput[] = [
  { id: 'a', label: 'Alpha', powerKw: 300, nozzleDiameterMm: 100, uPowerKw: 6, uNozzleDiameterMm: 0.03 },
  { id: 'b', label: 'Bravo', powerKw: 310, nozzleDiameterMm: 96 },
  { id: 'c', label: 'Charlie', powerKw: 285, nozzleDiameterMm: 104, uPowerKw: 5 },
  { id: 'd', label: 'Delta', powerKw: 295, nozzleDiameterMm: 99, uNozzleDiameterMm: 0.05 },
  { id: 'e', label: 'Echo', powerKw: 320, nozzleDiameterMm: 92 },
];
const staticThrust = (b: ParityBoatInput) => computeStaticPerformance({ ...model, ...b }).thrustN;

test('summary statistics match simple-statistics', () => {
  const r = computeParity(boats, model);
  const t0 = boats.map(staticThrust);
  const s = r.summary;
  relClose(s.medianStaticThrustN, median(t0), 1e-14, 'median');
  relClose(s.minStaticThrustN, min(t0), 1e-14, 'min');
  relClose(s.maxStaticThrustN, max(t0), 1e-14, 'max');
  relClose(s.meanStaticThrustN, mean(t0), 1e-12, 'mean');
  relClose(s.sampleStandardDeviationN as number, sampleStandardDeviation(t0), 1e-9, 'sample SD');
  // Sample standard deviation and coefficient of variation CV = s / mean as in the NIST/SEMATECH e-Handbook of
  // Statistical Methods (section 1.3.5.6, measures of scale [memory for the section]); spread = range / median, in
  // per cent, is the report's own measure (common practice, no source).
  relClose(s.spreadPercent, ((max(t0) - min(t0)) / median(t0)) * 100, 1e-9, 'spread %');
  relClose(s.coefficientOfVariationPercent as number, (sampleStandardDeviation(t0) / mean(t0)) * 100, 1e-9, 'CV %');
  relClose(s.maxMinRatio, max(t0) / min(t0), 1e-14, 'max/min');
  assert.equal(s.boatCount, 5);
});

test('computeMedian matches simple-statistics for odd and even counts', () => {
  for (const xs of [[3, 1, 2], [4, 1, 3, 2], [5], [2, 2, 2, 9], [1.5, -2, 7.25, 0, 3]]) {
    assert.equal(computeMedian(xs), median(xs));
  }
  assert.throws(() => computeMedian([]), EngineInputError);
});

test('per-boat deviation from the median, in N and per cent', () => {
  const r = computeParity(boats, model);
  const med = median(boats.map(staticThrust));
  for (const b of r.boats) {
    relClose(b.staticThrustN, staticThrust(boats.find((x) => x.id === b.id) as ParityBoatInput), 1e-14, `T0 ${b.id}`);
    assert.ok(Math.abs(b.deviationFromMedianN - (b.staticThrustN - med)) <= 1e-9);
    assert.ok(Math.abs(b.deviationFromMedianPercent - ((b.staticThrustN - med) / med) * 100) <= 1e-9);
  }
});

test('odd count: the median boat is a real boat, with no crossover against itself', () => {
  const r = computeParity(boats, model);
  assert.equal(r.referenceSetup.kind, 'boat');
  const ref = r.boats.find((b) => b.isReferenceBoat);
  assert.ok(ref && ref.id === r.referenceSetup.boatId);
  assert.equal(ref.deviationFromMedianN, 0);
  assert.equal(ref.crossoverWithMedianMs, null);
  assert.ok(
    r.boats.some((b) => b.crossoverWithMedianMs !== null),
    'with losses some curves cross the median',
  );
  const refInput = boats.find((b) => b.id === ref.id) as ParityBoatInput;
  for (const b of r.boats.filter((x) => !x.isReferenceBoat)) {
    const own = boats.find((x) => x.id === b.id) as ParityBoatInput;
    const expected = computeCrossoverSpeedMs({ ...model, ...own }, { ...model, ...refInput });
    assert.equal(b.crossoverWithMedianMs === null, expected === null, b.id);
    if (expected !== null) relClose(b.crossoverWithMedianMs as number, expected, 1e-9, `crossover ${b.id}`);
  }
});

test('even count: synthetic reference with median power and the median static thrust', () => {
  const four = boats.slice(0, 4);
  const r = computeParity(four, model);
  assert.equal(r.referenceSetup.kind, 'synthetic');
  assert.equal(r.referenceSetup.boatId, null);
  assert.equal(r.referenceSetup.powerKw, median(four.map((b) => b.powerKw)));
  const t0 = computeStaticPerformance({
    ...model,
    powerKw: r.referenceSetup.powerKw,
    nozzleDiameterMm: r.referenceSetup.nozzleDiameterMm,
  }).thrustN;
  relClose(t0, median(four.map(staticThrust)), 1e-12, 'synthetic T0');
  assert.ok(r.boats.every((b) => !b.isReferenceBoat));
});

test('equalising nozzle brings each boat to the class median static thrust', () => {
  // The static relation T0 ∝ D^(2/3) (momentum theory, Allison 1993) solved for D.
  const r = computeParity(boats, model);
  for (const b of r.boats) {
    const t0 = computeStaticPerformance({
      ...model,
      powerKw: b.powerKw,
      nozzleDiameterMm: b.equalisingNozzleDiameterMm,
    }).thrustN;
    relClose(t0, r.summary.medianStaticThrustN, 1e-12, `equalised ${b.id}`);
  }
});

test('uncertainties: propagated where given, zero where not', () => {
  // JCGM 100:2008 5.1.2 with T0 ∝ P^(2/3) D^(2/3) (static momentum theory): u(T0)/T0 = sqrt((2/3 u_D/D)^2 + (2/3 u_P/P)^2).
  const r = computeParity(boats, model);
  const a = r.boats[0];
  relClose(
    a.uStaticThrustN / a.staticThrustN,
    Math.hypot((2 / 3) * (0.03 / 100), (2 / 3) * (6 / 300)),
    1e-12,
    'u(T0) a',
  );
  relClose(a.uEqualisingNozzleDiameterMm, (a.equalisingNozzleDiameterMm * 6) / 300, 1e-12, 'u(D_eq) a');
  assert.ok(a.thrustAtReferenceSpeeds.every((p) => p.uThrustN > 0));
  const b = r.boats[1];
  assert.equal(b.uStaticThrustN, 0);
  assert.ok(b.thrustAtReferenceSpeeds.every((p) => p.uThrustN === 0));
  for (const x of r.boats) assert.equal(x.crossoverWithMedianMs === null, x.uCrossoverWithMedianMs === null);
});

test('one boat: defined output', () => {
  const r = computeParity([boats[0]], model);
  assert.equal(r.summary.boatCount, 1);
  assert.equal(r.summary.spreadPercent, 0);
  assert.equal(r.summary.maxMinRatio, 1);
  assert.equal(r.summary.sampleStandardDeviationN, null);
  assert.equal(r.summary.coefficientOfVariationPercent, null);
  assert.equal(r.boats[0].deviationFromMedianN, 0);
  assert.equal(r.boats[0].crossoverWithMedianMs, null);
  relClose(r.boats[0].equalisingNozzleDiameterMm, 100, 1e-12, 'own diameter');
});

test('1,000 boats: every figure finite or an explicit null', () => {
  const many: ParityBoatInput[] = Array.from({ length: 1000 }, (_, i) => ({
    id: `boat-${i}`,
    label: `Boat ${i}`,
    powerKw: 250 + ((i * 37) % 100),
    nozzleDiameterMm: 90 + ((i * 53) % 200) / 10,
    uPowerKw: 5,
    uNozzleDiameterMm: 0.05,
  }));
  const r = computeParity(many, { ...model, referenceSpeedsMs: [0, 10, 20, 30, 40] });
  assert.equal(r.boats.length, 1000);
  for (const b of r.boats) {
    for (const [k, v] of Object.entries(b)) {
      if (typeof v === 'number') assert.ok(Number.isFinite(v), `${b.id}.${k}`);
    }
    assert.ok(b.thrustAtReferenceSpeeds.every((p) => Number.isFinite(p.thrustN) && Number.isFinite(p.uThrustN)));
  }
});

test('refuses empty or malformed boat sets by field', () => {
  const refuses = (fn: () => unknown, field: string) =>
    assert.throws(fn, (e: unknown) => e instanceof EngineInputError && e.field === field);
  refuses(() => computeParity([], model), 'boats');
  refuses(() => computeParity([boats[0], { ...boats[1], id: 'a' }], model), 'boats[1].id');
  refuses(() => computeParity([{ ...boats[0], powerKw: 0 }], model), 'boats[0].powerKw');
  refuses(() => computeParity([{ ...boats[0], uNozzleDiameterMm: -1 }], model), 'boats[0].uNozzleDiameterMm');
  refuses(() => computeParity([boats[0]], { ...model, referenceSpeedsMs: [10, -5] }), 'referenceSpeedsMs[1]');
  refuses(() => computeParity([boats[0]], { ...model, densityKgM3: 0 }), 'densityKgM3');
});
