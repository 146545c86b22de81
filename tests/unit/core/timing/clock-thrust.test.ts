// The predicted time over a course on the matched model (issue 20, item 2): lib/core/timing/clock-thrust.ts and
// its use in clock-section.ts, balance-levers.ts and equalisation.ts. Pump and engine curves are illustrative
// shapes (invented), not a maker's data; the boats are made up for the test.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeClockSection, type ClockBoat } from '../../../../lib/core/timing/clock-section';
import { matchedThrust } from '../../../../lib/core/timing/clock-thrust';
import { applyBalanceLevers } from '../../../../lib/core/timing/balance-levers';
import { fitQuadraticDragK, predictRun } from '../../../../lib/core/engine/run-prediction';
import { suggestEqualisation } from '../../../../lib/core/timing/equalisation';
import {
  evaluateMatchedPoint,
  prepareMatchedSetup,
  type MatchedPoint,
  type PumpCurvePoint,
} from '../../../../lib/core/engine/jet-matched';
import { levelledCurves, type ReportBoatCurves } from '../../../../lib/core/reports/matched-figures';
import { clockCsvCells, clockReportLines, CLOCK_CSV_COLUMNS } from '../../../../lib/core/reports/clock-report-lines';

// Fresh water at 15 °C, 999.1026 kg/m^3 (ITTC Recommended Procedure 7.5-02-01-03); loss figures as in the
// engine tests (K_n 0.02, K_i 0.2 [partly memory]).
const ETA = 0.88;
const model = {
  densityKgM3: 999.1026,
  pumpEfficiency: ETA,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0.05,
};
/** An illustrative mixed-flow characteristic (the engine tests' shape). */
const MIXED_FLOW: PumpCurvePoint[] = [
  { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
  { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
  { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
  { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
  { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
  { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
];
const flatCurves: ReportBoatCurves = {
  engine: {
    curve: [
      { rpm: 500, powerKw: 400 },
      { rpm: 20_000, powerKw: 400 },
    ],
  },
  pump: { impellerDiameterMm: 240, curve: MIXED_FLOW.map((p) => ({ ...p, efficiency: ETA })) },
};
/** An illustrative engine curve peaking at 300 kW (declared), rising and falling with rpm. */
const shapedCurves: ReportBoatCurves = {
  engine: {
    curve: [
      { rpm: 1500, powerKw: 60 },
      { rpm: 3000, powerKw: 170 },
      { rpm: 4500, powerKw: 260 },
      { rpm: 5500, powerKw: 300 },
      { rpm: 6200, powerKw: 290 },
    ],
  },
  pump: { impellerDiameterMm: 240, curve: MIXED_FLOW },
};

const boat = (id: string, raceNumber: number, powerKw: number, curves: ReportBoatCurves | null): ClockBoat => ({
  entryId: id,
  raceNumber,
  boatName: `Boat ${raceNumber}`,
  powerKw,
  nozzleDiameterMm: 100,
  measuredWeightKg: 700,
  uPowerKw: 10,
  uNozzleDiameterMm: 0.1,
  curves,
});
const run = (entryId: string, elapsedS: number, gps: number) => ({
  entryId,
  runLabel: `r${elapsedS}`,
  courseLengthM: 400,
  elapsedS,
  trapSpeedMs: null,
  gpsTopSpeedMs: gps,
});
const relDiff = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));

test('flat engine curve and constant pump efficiency: matched times equal the fixed-power ones', () => {
  // Reason: with eta constant and a flat curve the matched power balance is the fixed-power energy balance term for
  // term (Allison 1993; tests/unit/core/engine/jet-matched.test.ts checks the thrust to 1e-9), so the same
  // integration gives the same times; the tolerance allows for the solver's convergence only.
  const input = (reportModel: 'fixed_power' | 'matched') => ({
    reportModel,
    boats: [boat('a', 1, 250, flatCurves), boat('b', 2, 320, flatCurves)],
    excluded: [],
    runs: [run('a', 20, 30), run('b', 19, 33)],
    minimumWeightKg: 680,
    uWeightKg: 0.5,
    model,
  });
  const fixed = computeClockSection(input('fixed_power'));
  const matched = computeClockSection(input('matched'));
  assert.equal(matched.thrustModel, 'matched');
  for (let i = 0; i < 2; i++) {
    const f = fixed.boats[i];
    const m = matched.boats[i];
    assert.equal(f.thrustModel, 'fixed_power');
    assert.equal(m.thrustModel, 'matched', m.thrustModelReason ?? '');
    assert.equal(m.thrustModelReason, null);
    for (let j = 0; j < f.referenceTimesS.length; j++)
      assert.ok(relDiff(m.referenceTimesS[j]!, f.referenceTimesS[j]!) < 1e-8, `reference ${j}`);
    assert.ok(relDiff(m.courseTimeS!, f.courseTimeS!) < 1e-8, `${m.courseTimeS} vs ${f.courseTimeS}`);
    assert.ok(relDiff(m.dragK!, f.dragK!) < 1e-8);
    assert.ok(relDiff(m.thrustToWeight!, f.thrustToWeight!) < 1e-8);
    assert.ok(Math.abs(m.uTimeS! - f.uTimeS!) < 1e-6, 'uncertainty through the same procedure');
  }
});

test('non-flat curve: the matched ThrustFunction equals evaluateMatchedPoint on the levelled curve', () => {
  // Reason: the definition (matched-figures.ts levelledCurves: the declared peak scaled to the confirmed power).
  const powerKw = 240;
  const t = matchedThrust(model, shapedCurves, powerKw, 95);
  const levelled = levelledCurves(shapedCurves, powerKw)!;
  assert.equal(Math.max(...levelled.engine.curve.map((p) => p.powerKw)), powerKw);
  const prepared = prepareMatchedSetup({ ...model, ...levelled, nozzleDiameterMm: 95 });
  const out = {} as MatchedPoint;
  for (const v of [0, 7.5, 15, 25]) assert.equal(t(v), evaluateMatchedPoint(prepared, v, out).thrustN, `at ${v} m/s`);
  // Not the fixed-power thrust: the shape matters (the flat case above is the only one where they agree).
  const fixedSection = computeClockSection({
    boats: [boat('a', 1, powerKw, shapedCurves)],
    excluded: [],
    runs: [run('a', 20, 25)],
    minimumWeightKg: null,
    uWeightKg: 0.5,
    model,
  });
  assert.equal(fixedSection.boats[0].thrustModel, 'fixed_power', 'a fixed-power class ignores the curves');
});

test('the drag fit reproduces the observed top speed exactly with the matched thrust; a boat without curves stays fixed', () => {
  // Reason: k = T(V_top) / V_top^2 by construction (run-prediction.ts), so the terminal speed is the observed one.
  const s = computeClockSection({
    reportModel: 'matched',
    boats: [boat('a', 1, 240, shapedCurves), boat('b', 2, 240, null)],
    excluded: [],
    runs: [run('a', 21, 24), run('b', 20, 26)],
    minimumWeightKg: 680,
    uWeightKg: 0.5,
    model,
  });
  const [a, b] = s.boats;
  assert.equal(a.thrustModel, 'matched', a.thrustModelReason ?? '');
  assert.ok(Math.abs(a.topSpeedMs! - 24) < 1e-6, `top speed ${a.topSpeedMs}`);
  assert.equal(a.dragK, fitQuadraticDragK(matchedThrust(model, shapedCurves, 240, 100), 24));
  assert.ok(a.courseTimeS! > 0 && a.uTimeS! > 0);
  assert.equal(b.thrustModel, 'fixed_power');
  assert.equal(b.thrustModelReason, 'No engine curve and pump curve both declared');
  assert.ok(Math.abs(b.topSpeedMs! - 26) < 1e-6);
  // The word on the report's lines and the appended CSV cell (after the existing columns).
  const lines = clockReportLines(s).map((l) => l.text);
  assert.ok(lines.some((l) => l.startsWith('#1 Boat 1') && l.includes('Thrust: matched.')));
  assert.ok(lines.some((l) => l.startsWith('#2 Boat 2') && l.includes('Thrust: fixed power (No engine curve')));
  assert.equal(CLOCK_CSV_COLUMNS[CLOCK_CSV_COLUMNS.length - 1], 'predicted_time_thrust_model');
  assert.equal(CLOCK_CSV_COLUMNS[CLOCK_CSV_COLUMNS.length - 2], 'observed_runs_s', 'existing columns keep their order');
  assert.deepEqual([clockCsvCells(s, 'a').at(-1), clockCsvCells(s, 'b').at(-1)], ['matched', 'fixed_power']);
  // Levers: a power cap scales the levelled curve, a restrictor changes the matched set-up's nozzle.
  const cap = applyBalanceLevers(s, { nozzleCapMm: null, minimumMassKg: null, powerCapKw: 200 });
  const capped = cap.boats.find((x) => x.entryId === 'a')!;
  assert.ok(capped.afterS > capped.beforeS, 'less power: slower');
  const restricted = applyBalanceLevers(s, { nozzleCapMm: 90, minimumMassKg: null, powerCapKw: null });
  assert.ok(restricted.boats.find((x) => x.entryId === 'a')!.deltaS !== 0);
});

test('no operating point during the run: that boat falls back to fixed power, with the reason', () => {
  // Reason: the task's rule (as the report does per boat). A limiter below the curve's first rpm leaves the
  // engine with no operating point at any speed (jet-matched.ts raises EngineOperatingPointError).
  const limited: ReportBoatCurves = { ...shapedCurves, engine: { ...shapedCurves.engine, limiterRpm: 1000 } };
  const s = computeClockSection({
    reportModel: 'matched',
    boats: [boat('a', 1, 240, limited), boat('b', 2, 240, shapedCurves)],
    excluded: [],
    runs: [run('a', 21, 24), run('b', 20, 26)],
    minimumWeightKg: 680,
    uWeightKg: 0.5,
    model,
  });
  assert.equal(s.boats[0].thrustModel, 'fixed_power');
  assert.match(s.boats[0].thrustModelReason!, /no operating point/);
  assert.ok(s.boats[0].courseTimeS! > 0, 'still predicted, on fixed power');
  assert.equal(s.boats[1].thrustModel, 'matched');
});

test("the report's own fallback reason is kept; equalisation solves a matched boat's nozzle on its matched set-up", () => {
  // Reason: the task's rule (the clock says why a boat stays on fixed power as the report does); the equalising
  // nozzle must bring the boat's own predicted time to the class median (equalisation.ts, solved to 1e-4 s).
  const s = computeClockSection({
    reportModel: 'matched',
    boats: [
      boat('a', 1, 300, shapedCurves),
      { ...boat('b', 2, 240, null), fixedPowerReason: 'No operating point at 40 m/s' },
      boat('c', 3, 220, null),
    ],
    excluded: [],
    runs: [run('a', 19, 25), run('b', 20, 25), run('c', 21, 24)],
    minimumWeightKg: 680,
    uWeightKg: 0.5,
    model,
  });
  assert.equal(s.boats[1].thrustModelReason, 'No operating point at 40 m/s');
  const eq = suggestEqualisation(s);
  const a = eq.boats.find((x) => x.entryId === 'a')!;
  assert.ok(a.fromMedianS < 0, 'the most powerful boat is faster than the median');
  assert.ok(a.nozzleMm !== null && a.nozzleMm < 100, a.note ?? '');
  const view = s.boats[0];
  const t = predictRun({
    thrustN: matchedThrust(model, shapedCurves, 300, a.nozzleMm!),
    powerKw: 300,
    massKg: view.massKg!,
    dragK: view.dragK!,
    distancesM: [400],
  }).timesS[0]!;
  assert.ok(Math.abs(t - eq.medianS!) < 1e-3, `${t} vs median ${eq.medianS}`);
});
