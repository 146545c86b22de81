// The range equalising nozzle (lib/core/engine/jet-equalising.ts) on a 300/350 kW class: the static
// answer from the closed form, the range answer's worst deviation below the static one's, and the
// least-squares optimum checked from outside the search by computeThrustCurve.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeParity, computeThrustCurve } from '../../../../lib/core/engine/index';

// Class default assumptions: eta_p 0.9 and K_i 0.2 as in the MIT 2.611 notes, K_n 0.02 [partly memory].
const MODEL = { densityKgM3: 999.1026, pumpEfficiency: 0.9, inletLossCoefficient: 0.2, nozzleLossCoefficient: 0.02 };
const SPEEDS = [10, 20, 30];
const CLASS = [
  { id: 'a', label: 'A', powerKw: 300, nozzleDiameterMm: 100 },
  { id: 'b', label: 'B', powerKw: 300, nozzleDiameterMm: 100 },
  { id: 'c', label: 'C', powerKw: 350, nozzleDiameterMm: 100 },
];

test('300/350 kW: the static equalising nozzle leaves the stronger boat ahead at speed; the range nozzle cuts the worst deviation', () => {
  const report = computeParity(CLASS, { ...MODEL, referenceSpeedsMs: SPEEDS });
  const strong = report.boats[2];
  // Static thrust T0 ∝ (P D)^(2/3) at fixed power (momentum theory, Allison 1993), so equal T0 means
  // equal P·D: 100 mm x 300/350 = 85.714 mm.
  assert.ok(Math.abs(strong.equalisingNozzleDiameterMm - (100 * 300) / 350) < 1e-9);
  const range = strong.rangeEqualising;
  assert.ok(range, 'computed');
  // The static nozzle's deviation grows with speed: about +7.6 % at 20 m/s and +13 % at 30 m/s here.
  const at = (v: number) => range.deviations.find((d) => d.speedMs === v)!;
  assert.ok(Math.abs(at(20).staticEqualisedPercent - 7.64) < 0.01, `${at(20).staticEqualisedPercent}`);
  assert.ok(Math.abs(at(30).staticEqualisedPercent - 13.04) < 0.01, `${at(30).staticEqualisedPercent}`);
  assert.ok(
    range.worstDeviationPercent < range.staticWorstDeviationPercent,
    `range worst ${range.worstDeviationPercent} % below static worst ${range.staticWorstDeviationPercent} %`,
  );
  assert.ok(range.nozzleDiameterMm < strong.equalisingNozzleDiameterMm, 'a smaller nozzle than the static answer');
  // The boats already at the median stay where they are.
  assert.ok(Math.abs(report.boats[0].rangeEqualising!.nozzleDiameterMm - 100) < 1e-3);
});

test('the range nozzle is the least-squares optimum, checked with computeThrustCurve on either side', () => {
  const report = computeParity(CLASS, { ...MODEL, referenceSpeedsMs: SPEEDS });
  const range = report.boats[2].rangeEqualising!;
  const median = range.deviations.map((d) => d.medianThrustN);
  // The class median at each speed is the 300 kW boats' thrust (two of three boats).
  const ref = computeThrustCurve({ ...MODEL, powerKw: 300, nozzleDiameterMm: 100 }, SPEEDS);
  ref.forEach((p, j) => assert.ok(Math.abs(p.thrustN - median[j]) < 1e-9 * median[j]));
  const sumSq = (d: number) =>
    computeThrustCurve({ ...MODEL, powerKw: 350, nozzleDiameterMm: d }, SPEEDS).reduce(
      (s, p, j) => s + ((p.thrustN - median[j]) / median[j]) ** 2,
      0,
    );
  const best = sumSq(range.nozzleDiameterMm);
  for (const delta of [-0.5, -0.05, 0.05, 0.5]) {
    assert.ok(sumSq(range.nozzleDiameterMm + delta) >= best, `D* ${delta > 0 ? '+' : ''}${delta} mm is no better`);
  }
  assert.ok(Math.abs(Math.sqrt(best / SPEEDS.length) * 100 - range.rmsDeviationPercent) < 1e-9);
});

test('no range answer when the class median thrust is not positive at a reference speed', () => {
  // At 80 m/s the lossy jet of these boats no longer outruns the inflow (net thrust below zero).
  const report = computeParity(CLASS, { ...MODEL, referenceSpeedsMs: [10, 80] });
  assert.ok(report.boats[0].thrustAtReferenceSpeeds[1].thrustN <= 0);
  assert.equal(report.boats[2].rangeEqualising, null);
});
