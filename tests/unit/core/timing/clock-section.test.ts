import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeClockSection, CLOCK_ASSUMPTIONS } from '../../../../lib/core/timing/clock-section';
import { fitQuadraticDragK, fixedPowerThrust } from '../../../../lib/core/engine/run-prediction';

// Loss figures as in the MIT 2.611 notes' example (eta 0.9, K_i 0.2) and K_n 0.02 [partly memory]; fresh water at
// 15 °C, 999.1026 kg/m^3 (ITTC 7.5-02-01-03). The boats are made up for the test.
const model = {
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0,
};
const boat = (id: string, raceNumber: number, measuredWeightKg: number | null) => ({
  entryId: id,
  raceNumber,
  boatName: `Boat ${raceNumber}`,
  powerKw: 250,
  nozzleDiameterMm: 100,
  measuredWeightKg,
});
const run = (entryId: string, elapsedS: number, speeds: { gps?: number; trap?: number } = {}, courseLengthM = 400) => ({
  entryId,
  runLabel: String(elapsedS),
  courseLengthM,
  elapsedS,
  trapSpeedMs: speeds.trap ?? null,
  gpsTopSpeedMs: speeds.gps ?? null,
});

test('drag basis per boat: own GPS speed, own trap speed, else the class median of the fitted values', () => {
  const s = computeClockSection({
    boats: [boat('a', 1, 700), boat('b', 2, 700), boat('c', 3, null)],
    excluded: [],
    runs: [run('a', 40, { gps: 30, trap: 28 }), run('b', 41, { trap: 29 }), run('c', 42), run('c', 20, {}, 200)],
    minimumWeightKg: 680,
    uWeightKg: 0.5,
    model,
  });
  const [a, b, c] = s.boats;
  assert.equal(a.dragBasis, 'gps_top_speed');
  assert.equal(b.dragBasis, 'trap_speed');
  assert.equal(c.dragBasis, 'class_default');
  const thrust = fixedPowerThrust({ ...model, powerKw: 250, nozzleDiameterMm: 100 });
  const kA = fitQuadraticDragK(thrust, 30)!;
  const kB = fitQuadraticDragK(thrust, 29)!;
  assert.ok(Math.abs(c.dragK! - (kA + kB) / 2) < 1e-12, 'median of two values is their mean');
  assert.equal(c.massKg, 680 + CLOCK_ASSUMPTIONS.crewKg + CLOCK_ASSUMPTIONS.fuelKg);
  assert.equal(s.courseLengthM, 400);
  assert.equal(s.otherCourseRuns, 1);
  assert.deepEqual(c.observedS, [42], 'only runs over the compared course');
  // A lower observed top speed means more drag at the same mass and thrust: slower over the course.
  assert.ok(b.dragK! > a.dragK! && b.courseTimeS! > a.courseTimeS!);
});

test('no speed anywhere in the class: an assumed top speed, said so; no weight and no minimum: no prediction', () => {
  const s = computeClockSection({
    boats: [boat('a', 1, 700), boat('b', 2, null)],
    excluded: [{ entryId: 'x', raceNumber: 9, boatName: 'Boat 9', reason: 'Not inspected yet' }],
    runs: [run('a', 40), run('x', 39)],
    minimumWeightKg: null,
    uWeightKg: 0.5,
    model,
  });
  assert.match(s.boats[0].dragNote, /assumed 108 km\/h top speed/);
  assert.ok(Math.abs(s.boats[0].topSpeedMs! - CLOCK_ASSUMPTIONS.assumedTopSpeedMs) < 1e-9);
  assert.equal(s.boats[1].courseTimeS, null);
  assert.equal(s.boats[1].note, 'No weight: no prediction');
  assert.deepEqual(
    s.comparison.leftOut.map((l) => l.reason),
    ['No run time', 'Not inspected yet'],
  );
  assert.match(s.comparison.notes.join(' '), /Only 1 boat has both a prediction and a run time/);
});

test("a boat's time uncertainty: zero without input uncertainties, else the first-order propagation (JCGM 100:2008, 5.1.2)", () => {
  const input = (uPowerKw: number) => ({
    boats: [{ ...boat('a', 1, 700), uPowerKw, uNozzleDiameterMm: 0 }],
    excluded: [],
    runs: [run('a', 40, { gps: 30 })],
    minimumWeightKg: null,
    uWeightKg: 0,
    model,
  });
  assert.equal(computeClockSection(input(0)).boats[0].uTimeS, 0);
  const u = computeClockSection(input(5)).boats[0].uTimeS!;
  // The same sensitivity by a much smaller central difference through the same procedure (drag refitted at 30 m/s).
  const time = (powerKw: number) =>
    computeClockSection({ ...input(0), boats: [{ ...boat('a', 1, 700), powerKw }] }).boats[0].courseTimeS!;
  const slope = (time(250.05) - time(249.95)) / 0.1;
  assert.ok(u > 0 && Math.abs(u - Math.abs(slope) * 5) / u < 0.01, `${u} vs ${Math.abs(slope) * 5}`);
});

test('declared crew and fuel replace the assumptions per boat and per mass, and each row says which it used', () => {
  const s = computeClockSection({
    boats: [
      { ...boat('a', 1, 700), declaredCrewKg: 140, declaredFuelKg: 30 },
      { ...boat('b', 2, 700), declaredCrewKg: 155, declaredFuelKg: null },
      boat('c', 3, 700),
    ],
    excluded: [],
    runs: [run('a', 40, { gps: 30 }), run('b', 40, { gps: 30 }), run('c', 40, { gps: 30 })],
    minimumWeightKg: null,
    uWeightKg: 0.5,
    model,
  });
  const [a, b, c] = s.boats;
  assert.equal(a.massKg, 700 + 140 + 30);
  assert.equal(a.massBasis, 'weighed 700 kg + 140 kg crew (declared) + 30 kg fuel (declared)');
  assert.deepEqual([a.crewSource, a.fuelSource], ['declared', 'declared']);
  assert.equal(b.massKg, 700 + 155 + CLOCK_ASSUMPTIONS.fuelKg);
  assert.equal(b.massBasis, `weighed 700 kg + 155 kg crew (declared) + ${CLOCK_ASSUMPTIONS.fuelKg} kg fuel (assumed)`);
  assert.deepEqual([b.crewSource, b.fuelSource], ['declared', 'assumed']);
  assert.equal(c.massKg, 700 + CLOCK_ASSUMPTIONS.crewKg + CLOCK_ASSUMPTIONS.fuelKg);
  assert.deepEqual([c.crewSource, c.fuelSource, c.crewKg, c.fuelKg], ['assumed', 'assumed', 160, 25]);
  // Same thrust and drag (same power, nozzle and top speed): only the mass differs, and the heavier boat is slower.
  assert.ok(a.dragK === b.dragK && b.dragK === c.dragK);
  assert.ok(a.massKg! < b.massKg! && b.massKg! < c.massKg!);
  assert.ok(a.courseTimeS! < b.courseTimeS! && b.courseTimeS! < c.courseTimeS!);
  // Declared 0 kg of fuel is a declaration, not a missing value.
  const zero = computeClockSection({
    boats: [{ ...boat('a', 1, 700), declaredFuelKg: 0 }],
    excluded: [],
    runs: [],
    minimumWeightKg: null,
    uWeightKg: 0.5,
    model,
  }).boats[0];
  assert.equal(zero.massKg, 700 + CLOCK_ASSUMPTIONS.crewKg);
  assert.equal(zero.fuelSource, 'declared');
});
