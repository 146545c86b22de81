import { test } from 'node:test';
import assert from 'node:assert/strict';
import * as ss from 'simple-statistics';
import {
  averageRanks,
  mean,
  pearsonCorrelation,
  sampleStandardDeviation,
  spearmanCorrelation,
} from '../../../../lib/core/stats/correlation';
import { normalQuantile, studentTQuantile } from '../../../../lib/core/stats/student-t';
import { compareModelToClock } from '../../../../lib/core/stats/clock-comparison';

// A fixed data set (made up for this test, with a tie in each column) checked against simple-statistics 7.12.1,
// an independent implementation (sampleCorrelation, sampleRankCorrelation, sampleStandardDeviation).
const xs = [41.2, 39.8, 43.1, 40.5, 42.0, 39.8, 44.6, 41.9];
const ys = [42.0, 40.1, 44.9, 41.0, 41.0, 40.6, 45.3, 43.2];

test('Pearson, Spearman, mean and sample SD agree with simple-statistics on a fixed data set', () => {
  assert.ok(Math.abs(pearsonCorrelation(xs, ys)! - ss.sampleCorrelation(xs, ys)) < 1e-12);
  assert.ok(Math.abs(spearmanCorrelation(xs, ys)! - ss.sampleRankCorrelation(xs, ys)) < 1e-12);
  assert.ok(Math.abs(mean(xs) - ss.mean(xs)) < 1e-12);
  assert.ok(Math.abs(sampleStandardDeviation(ys)! - ss.sampleStandardDeviation(ys)) < 1e-12);
});

test('average ranks share ties; too few pairs or no variation give no correlation', () => {
  assert.deepEqual(averageRanks([10, 20, 20, 5]), [2, 3.5, 3.5, 1]);
  assert.equal(pearsonCorrelation([1, 2], [2, 3]), null);
  assert.equal(pearsonCorrelation([1, 1, 1], [2, 3, 4]), null);
  assert.equal(sampleStandardDeviation([3]), null);
});

test("Student's t quantiles against published table values", () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.2, upper critical values of t, alpha = 0.025
  // (two-sided 95 %) [memory for the values]: nu = 1: 12.706, 2: 4.303, 3: 3.182, 5: 2.571, 10: 2.228, 30: 2.042.
  for (const [nu, t] of [
    [1, 12.706],
    [2, 4.303],
    [3, 3.182],
    [5, 2.571],
    [10, 2.228],
    [30, 2.042],
  ])
    assert.ok(Math.abs(studentTQuantile(0.975, nu) - t) < 0.0006, `nu=${nu}: ${studentTQuantile(0.975, nu)}`);
  // z(0.975) = 1.959964 (same handbook, 1.3.6.7.1) and simple-statistics' probit (its inverse error function
  // is itself an approximation, good to about 1e-5 here).
  assert.ok(Math.abs(normalQuantile(0.975) - 1.959964) < 1e-6);
  assert.ok(Math.abs(normalQuantile(0.3) - ss.probit(0.3)) < 1e-5);
});

test('the clock comparison: residuals, pooled run spread and the smallest difference, by hand', () => {
  const c = compareModelToClock([
    { entryId: 'a', raceNumber: 1, boatName: 'A', predictedS: 40, observedS: [41, 42] },
    { entryId: 'b', raceNumber: 2, boatName: 'B', predictedS: 42, observedS: [43, 45] },
    { entryId: 'c', raceNumber: 3, boatName: 'C', predictedS: 44, observedS: [46, 46] },
    { entryId: 'd', raceNumber: 4, boatName: 'D', predictedS: null, predictionNote: 'Not inspected', observedS: [50] },
    { entryId: 'e', raceNumber: 5, boatName: 'E', predictedS: 45, observedS: [] },
  ]);
  assert.equal(c.points.length, 3);
  assert.deepEqual(
    c.leftOut.map((l) => l.reason),
    ['Not inspected', 'No run time'],
  );
  assert.deepEqual(
    c.points.map((p) => p.residualS),
    [1.5, 2, 2],
  );
  // Pooled within-boat variance: (0.5 + 2 + 0) / 3 degrees of freedom.
  assert.ok(Math.abs(c.pooledRunSpreadS! - Math.sqrt(2.5 / 3)) < 1e-12);
  assert.equal(c.pooledDegreesOfFreedom, 3);
  // t(0.975, 3) s_p sqrt(2/2), with t from the same quantile function checked above.
  assert.ok(Math.abs(c.smallestDifferenceS! - studentTQuantile(0.975, 3) * Math.sqrt(2.5 / 3)) < 1e-12);
  assert.ok(Math.abs(c.pearson! - ss.sampleCorrelation([40, 42, 44], [41.5, 44, 46])) < 1e-12);
  assert.ok(c.notes.some((n) => /degrees of freedom/.test(n)));
});

test('too few data: plain words instead of figures', () => {
  const c = compareModelToClock([
    { entryId: 'a', raceNumber: 1, boatName: 'A', predictedS: 40, observedS: [41] },
    { entryId: 'b', raceNumber: 2, boatName: 'B', predictedS: 42, observedS: [43] },
  ]);
  assert.equal(c.pearson, null);
  assert.equal(c.smallestDifferenceS, null);
  assert.match(c.notes.join(' '), /Only 2 boats have both a prediction and a run time/);
  assert.match(c.notes.join(' '), /No boat has two runs/);
});
