// The model against the clock, per class: each boat's predicted time beside its observed runs, the
// correlation of the two (Pearson and Spearman), the residual scatter, each boat's run-to-run spread and
// the smallest difference between two boats' mean times the data can tell apart. Framework-free.
//
// Smallest difference: the pooled within-boat standard deviation s_p (one-way analysis of variance,
// NIST/SEMATECH e-Handbook of Statistical Methods, 2012, 7.4.3) with its degrees of freedom gives, for two
// boats with n runs each, the two-sided 95 % least significant difference t(0.975, df) * s_p * sqrt(2/n)
// (Fisher's LSD; Montgomery, Design and Analysis of Experiments, 8th ed., 2013, 3.5.4).
// A correlation's 5 % critical value for n pairs: r_c = t / sqrt(n - 2 + t^2), t = t(0.975, n - 2)
// (the t test of r = 0; NIST/SEMATECH e-Handbook, 1.3.5.x, [memory] for the section number).

import { mean, pearsonCorrelation, sampleStandardDeviation, spearmanCorrelation } from './correlation';
import { studentTQuantile } from './student-t';

export type ClockBoatInput = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  predictedS: number | null;
  /** Why there is no prediction, when there is none. */
  predictionNote?: string;
  observedS: number[];
};

export type ClockPoint = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  predictedS: number;
  meanObservedS: number;
  runs: number;
  /** Sample standard deviation of the boat's runs (s); null with one run. */
  runSpreadS: number | null;
  residualS: number;
};

export type ClockComparison = {
  points: ClockPoint[];
  /** Boats left out, with why. */
  leftOut: { raceNumber: number; boatName: string; reason: string }[];
  pearson: number | null;
  spearman: number | null;
  /** |r| below this is not told apart from no correlation (two-sided 5 %); null below three boats. */
  criticalR: number | null;
  meanResidualS: number | null;
  residualSpreadS: number | null;
  pooledRunSpreadS: number | null;
  pooledDegreesOfFreedom: number;
  /** Runs per boat the smallest difference assumes (the median of the boats'). */
  runsPerBoatForDifference: number | null;
  smallestDifferenceS: number | null;
  /** Plain words on what the data can and cannot say. */
  notes: string[];
};

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

export function compareModelToClock(boats: readonly ClockBoatInput[]): ClockComparison {
  const points: ClockPoint[] = [];
  const leftOut: ClockComparison['leftOut'] = [];
  for (const b of boats) {
    if (b.observedS.length === 0)
      leftOut.push({ raceNumber: b.raceNumber, boatName: b.boatName, reason: 'No run time' });
    else if (b.predictedS === null)
      leftOut.push({ raceNumber: b.raceNumber, boatName: b.boatName, reason: b.predictionNote ?? 'No prediction' });
    else {
      const m = mean(b.observedS);
      points.push({
        entryId: b.entryId,
        raceNumber: b.raceNumber,
        boatName: b.boatName,
        predictedS: b.predictedS,
        meanObservedS: m,
        runs: b.observedS.length,
        runSpreadS: sampleStandardDeviation(b.observedS),
        residualS: m - b.predictedS,
      });
    }
  }
  const notes: string[] = [];
  const n = points.length;
  const predicted = points.map((p) => p.predictedS);
  const observed = points.map((p) => p.meanObservedS);
  const pearson = n >= 3 ? pearsonCorrelation(predicted, observed) : null;
  const spearman = n >= 3 ? spearmanCorrelation(predicted, observed) : null;
  let criticalR: number | null = null;
  if (n >= 3) {
    const t = studentTQuantile(0.975, n - 2);
    criticalR = t / Math.sqrt(n - 2 + t * t);
  }
  if (n < 3)
    notes.push(
      `Only ${n} boat${n === 1 ? '' : 's'} ha${n === 1 ? 's' : 've'} both a prediction and a run time: at least three are needed before a correlation says anything.`,
    );
  else if (pearson === null)
    notes.push('The predicted or the observed times do not vary between boats, so there is no correlation to give.');
  else if (Math.abs(pearson) < criticalR!)
    notes.push(
      `With ${n} boats a correlation below ${criticalR!.toFixed(2)} cannot be told apart from none (two-sided 5 %): this one (${pearson.toFixed(2)}) does not show that the model orders the boats as the clock does.`,
    );
  const residuals = points.map((p) => p.residualS);
  const meanResidualS = n ? mean(residuals) : null;
  const residualSpreadS = sampleStandardDeviation(residuals);

  let ss = 0;
  let df = 0;
  for (const p of points)
    if (p.runSpreadS !== null) {
      ss += p.runSpreadS * p.runSpreadS * (p.runs - 1);
      df += p.runs - 1;
    }
  const pooledRunSpreadS = df > 0 ? Math.sqrt(ss / df) : null;
  const withRepeats = points.filter((p) => p.runs >= 2).map((p) => p.runs);
  const runsPerBoatForDifference = withRepeats.length ? median(withRepeats) : null;
  const smallestDifferenceS =
    pooledRunSpreadS !== null && runsPerBoatForDifference !== null
      ? studentTQuantile(0.975, df) * pooledRunSpreadS * Math.sqrt(2 / runsPerBoatForDifference)
      : null;
  if (pooledRunSpreadS === null)
    notes.push(
      'No boat has two runs over this course, so the run-to-run spread, and with it the smallest difference the clock can tell apart, is unknown.',
    );
  else if (df < 5)
    notes.push(
      `The run-to-run spread rests on ${df} degree${df === 1 ? '' : 's'} of freedom: the smallest difference is itself rough.`,
    );
  return {
    points,
    leftOut,
    pearson,
    spearman,
    criticalR,
    meanResidualS,
    residualSpreadS,
    pooledRunSpreadS,
    pooledDegreesOfFreedom: df,
    runsPerBoatForDifference,
    smallestDifferenceS,
    notes,
  };
}
