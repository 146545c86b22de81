import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeClockSection } from '../../../../lib/core/timing/clock-section';
import {
  CLOCK_CSV_COLUMNS,
  clockCsvCells,
  clockReportLines,
  massWords,
} from '../../../../lib/core/reports/clock-report-lines';

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
  { entryId: 'b', raceNumber: 2, boatName: 'B', powerKw: 220, nozzleDiameterMm: 99, measuredWeightKg: null },
];
const withRuns = computeClockSection({
  boats,
  excluded: [],
  runs: [{ entryId: 'a', runLabel: '1', courseLengthM: 400, elapsedS: 16.5, trapSpeedMs: null, gpsTopSpeedMs: 31 }],
  minimumWeightKg: 650,
  uWeightKg: 0.5,
  model,
});
const noRuns = computeClockSection({ boats, excluded: [], runs: [], minimumWeightKg: 650, uWeightKg: 0.5, model });

test('the lines carry the assumptions with their sources, one line per boat, and the caution', () => {
  const text = clockReportLines(withRuns)
    .map((l) => l.text)
    .join('\n');
  assert.match(text, /Runge–Kutta/);
  assert.match(text, /160 kg crew and 25 kg fuel/);
  assert.match(text, /#1 A: 100 m \d+\.\d\d s, 200 m \d+\.\d\d s, 400 m \d+\.\d\d s/);
  assert.match(text, /#2 B: .*not weighed: class minimum 650 kg/);
  assert.match(text, /Drag: GPS top speed/);
  assert.match(text, /observed 16\.50 s/);
  assert.match(text, /officials decide/);
  assert.deepEqual(clockReportLines(null), []);
});

test('without runs the comparison is plain words, not figures', () => {
  const text = clockReportLines(noRuns)
    .map((l) => l.text)
    .join('\n');
  assert.match(text, /No run times are stored for this class yet\./);
  assert.doesNotMatch(text, /Pearson r/);
});

test('CSV cells line up with the columns and are the section figures; none without a section', () => {
  const cells = clockCsvCells(withRuns, 'a');
  assert.equal(cells.length, CLOCK_CSV_COLUMNS.length);
  const at = (c: (typeof CLOCK_CSV_COLUMNS)[number]) => cells[CLOCK_CSV_COLUMNS.indexOf(c)];
  const a = withRuns.boats[0];
  assert.equal(at('predicted_100_m_s'), a.referenceTimesS[0]);
  assert.equal(at('predicted_200_m_s'), a.referenceTimesS[1]);
  assert.equal(at('predicted_course_s'), a.courseTimeS);
  assert.equal(at('course_m'), 400);
  assert.equal(at('drag_basis'), 'gps_top_speed');
  assert.equal(at('observed_runs_s'), '16.5');
  assert.deepEqual(
    clockCsvCells(undefined, 'a'),
    CLOCK_CSV_COLUMNS.map(() => ''),
  );
  assert.deepEqual(
    clockCsvCells(withRuns, 'nobody'),
    CLOCK_CSV_COLUMNS.map(() => ''),
  );
});

test('the mass line says declared-or-assumed per boat; a section stored before declarations keeps its own words', () => {
  const declared = computeClockSection({
    boats: [{ ...boats[0], declaredCrewKg: 150, declaredFuelKg: null }, boats[1]],
    excluded: [],
    runs: [],
    minimumWeightKg: 650,
    uWeightKg: 0.5,
    model,
  });
  const text = clockReportLines(declared)
    .map((l) => l.text)
    .join('\n');
  assert.match(text, /the crew and fuel the entrant declared for the entry, else 160 kg crew and 25 kg fuel, assumed/);
  assert.match(text, /#1 A: .*Mass weighed 680 kg \+ 150 kg crew \(declared\) \+ 25 kg fuel \(assumed\)\./);
  assert.match(text, /#2 B: .*class minimum 650 kg \+ 160 kg crew \(assumed\) \+ 25 kg fuel \(assumed\)\./);
  // As stored before this change: no per-boat source, and the words it was published with.
  const old = {
    ...declared,
    boats: declared.boats.map(({ crewKg, crewSource, fuelKg, fuelSource, ...b }) => {
      void [crewKg, crewSource, fuelKg, fuelSource];
      return b;
    }),
  };
  assert.equal(massWords(old), '160 kg crew and 25 kg fuel, assumed (common practice, no source)');
});
