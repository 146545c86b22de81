import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeClockSection } from '../../../../lib/core/timing/clock-section';
import { EQUALISATION_TOLERANCE_S, suggestEqualisation } from '../../../../lib/core/timing/equalisation';
import { fixedPowerThrust, predictRun } from '../../../../lib/core/engine/run-prediction';

// Made-up boats; fresh water at 15 °C, 999.1026 kg/m^3 (ITTC 7.5-02-01-03); losses eta 0.9, K_i 0.2, K_n 0.02 [partly memory].
const model = {
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0,
};
const boats = [
  { entryId: 'a', raceNumber: 1, boatName: 'A', powerKw: 260, nozzleDiameterMm: 101, measuredWeightKg: 680 },
  { entryId: 'b', raceNumber: 2, boatName: 'B', powerKw: 220, nozzleDiameterMm: 99, measuredWeightKg: 720 },
  { entryId: 'c', raceNumber: 3, boatName: 'C', powerKw: 240, nozzleDiameterMm: 100, measuredWeightKg: 700 },
  { entryId: 'd', raceNumber: 4, boatName: 'D', powerKw: 250, nozzleDiameterMm: 100.5, measuredWeightKg: 690 },
  { entryId: 'e', raceNumber: 5, boatName: 'E', powerKw: 230, nozzleDiameterMm: 99.5, measuredWeightKg: 710 },
].map((b) => ({ ...b, uPowerKw: 5, uNozzleDiameterMm: 0.02 }));
const section = computeClockSection({
  boats,
  excluded: [],
  runs: boats.map((b, i) => ({
    entryId: b.entryId,
    runLabel: '1',
    courseLengthM: 400,
    elapsedS: 16 + i / 10,
    trapSpeedMs: null,
    gpsTopSpeedMs: 30 + i / 2,
  })),
  minimumWeightKg: null,
  uWeightKg: 0.5,
  model,
});
const eq = suggestEqualisation(section);
const view = new Map(section.boats.map((b) => [b.entryId, b]));

/** The integrator's own answer for a boat with a changed nozzle or mass, its drag kept (the levers' model). */
function integrate(entryId: string, over: { nozzleMm?: number; addKg?: number }) {
  const b = view.get(entryId)!;
  return predictRun({
    thrustN: fixedPowerThrust({ ...model, powerKw: b.powerKw, nozzleDiameterMm: over.nozzleMm ?? b.nozzleDiameterMm }),
    powerKw: b.powerKw,
    massKg: b.massKg! + (over.addKg ?? 0),
    dragK: b.dragK!,
    distancesM: [400],
  }).timesS[0]!;
}

test('the median is the middle predicted time; each boat is placed against it in seconds', () => {
  const times = section.boats.map((b) => b.courseTimeS!).sort((x, y) => x - y);
  assert.equal(eq.distanceM, 400);
  assert.equal(eq.medianS, times[2]);
  for (const b of eq.boats) assert.ok(Math.abs(b.fromMedianS - (view.get(b.entryId)!.courseTimeS! - times[2])) < 1e-12);
  assert.equal(eq.boats.filter((b) => b.fromMedianS < -EQUALISATION_TOLERANCE_S).length, 2);
});

test('applying the suggested ballast or restrictor brings the predicted time to the median (integrator, 1e-3 s)', () => {
  const faster = eq.boats.filter((b) => b.fromMedianS < -EQUALISATION_TOLERANCE_S);
  assert.ok(faster.length > 0);
  for (const b of faster) {
    assert.ok(b.ballastKg! > 0, `${b.boatName} ballast`);
    assert.ok(b.nozzleMm! < view.get(b.entryId)!.nozzleDiameterMm, `${b.boatName} restrictor`);
    assert.ok(Math.abs(integrate(b.entryId, { addKg: b.ballastKg! }) - eq.medianS!) < 1e-3, `${b.boatName} ballast`);
    assert.ok(Math.abs(integrate(b.entryId, { nozzleMm: b.nozzleMm! }) - eq.medianS!) < 1e-3, `${b.boatName} nozzle`);
    assert.equal(b.note, null);
  }
});

test('slower boats and the median boat get no lever', () => {
  for (const b of eq.boats.filter((x) => x.fromMedianS >= -EQUALISATION_TOLERANCE_S)) {
    assert.equal(b.ballastKg, null);
    assert.equal(b.nozzleMm, null);
    assert.match(b.note!, /Slower than the median|At the median/);
  }
});

test("uncertainty: U of the gap is 2·u(t); a lever's U is 2·u(t) over the time's slope at the solution (first order)", () => {
  for (const b of eq.boats) {
    const u = view.get(b.entryId)!.uTimeS!;
    assert.ok(u > 0);
    assert.ok(Math.abs(b.uFromMedianS! - 2 * u) < 1e-12);
    if (b.ballastKg === null) continue;
    // JCGM 100:2008, 5.1.3: u(lever) = u(t) / |dt/dlever|. The slope measured here on the integrator with a step of
    // U/10 either side: a tenth of U must move the time by a tenth of 2·u(t), to 1 % (the curvature is left over).
    const slope = (f: (h: number) => number, h: number) => (f(h) - f(-h)) / 2;
    const dtBallast = slope((h) => integrate(b.entryId, { addKg: b.ballastKg! + h }), b.uBallastKg! / 10);
    assert.ok(
      Math.abs(dtBallast / ((2 * u) / 10) - 1) < 0.01,
      `${b.boatName} ballast: ${dtBallast} vs ${(2 * u) / 10}`,
    );
    const dtNozzle = -slope((h) => integrate(b.entryId, { nozzleMm: b.nozzleMm! + h }), b.uNozzleMm! / 10);
    assert.ok(Math.abs(dtNozzle / ((2 * u) / 10) - 1) < 0.01, `${b.boatName} nozzle: ${dtNozzle} vs ${(2 * u) / 10}`);
  }
});

test('fewer than two predicted boats: no median, no suggestion', () => {
  const one = computeClockSection({
    boats: [boats[0]],
    excluded: [],
    runs: [],
    minimumWeightKg: null,
    uWeightKg: 0.5,
    model,
  });
  assert.deepEqual(suggestEqualisation(one).boats, []);
  assert.equal(suggestEqualisation(one).medianS, null);
});
