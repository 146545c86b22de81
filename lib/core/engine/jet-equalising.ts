// Equalising nozzle over the speed range. The static equalising nozzle (parity.ts) gives a boat the
// class median static thrust; a stronger boat so equalised still out-thrusts the class at speed,
// because at fixed power thrust at speed depends on power more than on diameter. Here the nozzle
// minimises the boat's thrust deviation from the class median curve over the reference speeds:
//
//   D* = argmin_D  sum over reference speeds V of ((T(D; P, V) - T_med(V)) / T_med(V))^2
//
// (least squares of the relative deviations, so each speed counts equally). T_med(V) is the median
// of the class's thrusts at V (mean of the middle two for an even count). The search is a grid over
// [0.5, 2] x the static answer followed by golden-section refinement (Kiefer 1953) around the best
// grid point; the objective is smooth, and the grid guards against a second, worse local minimum.

import { EngineInputError } from './engine-input-error';
import { evaluateThrustN, solveJetCubic, withPowerAndDiameter } from './jet';
import type { PreparedJetSetup } from './jet';

export interface RangeDeviation {
  speedMs: number;
  /** The class median thrust at this speed, N. */
  medianThrustN: number;
  /** Deviation (per cent of the median) with the static equalising nozzle. */
  staticEqualisedPercent: number;
  /** Deviation (per cent of the median) with the range equalising nozzle. */
  rangeEqualisedPercent: number;
}

export interface RangeEqualising {
  nozzleDiameterMm: number;
  /** Root mean square of the relative deviations over the reference speeds, per cent. */
  rmsDeviationPercent: number;
  /** The largest absolute deviation over the reference speeds, per cent (range nozzle). */
  worstDeviationPercent: number;
  /** The same for the static equalising nozzle, for comparison. */
  staticWorstDeviationPercent: number;
  deviations: RangeDeviation[];
}

const GRID = 24;
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Sum of squared relative deviations at diameter d (mm): the set-up's cubic constants scaled to d, no allocation. */
function objective(setup: PreparedJetSetup, d: number, speeds: readonly number[], med: Float64Array): number {
  // rho A scales with d^2 and q = 2 eta P / ((1 + K_n) rho A) with 1/d^2 (jet.ts).
  const scale = (d / setup.nozzleDiameterMm) ** 2;
  const rhoA = setup.rhoAreaKgM * scale;
  const q = setup.q / scale;
  let sum = 0;
  for (let j = 0; j < speeds.length; j++) {
    const v = speeds[j];
    const vj = solveJetCubic(setup.pSpeedFactor * v * v, q);
    const r = (rhoA * vj * (vj - setup.inflowFactor * v) - med[j]) / med[j];
    sum += r * r;
  }
  return sum;
}

/**
 * The range equalising nozzle for one boat (`setup` carries its model and power) given the class
 * median thrust at each reference speed and the boat's static equalising nozzle.
 */
export function computeRangeEqualising(
  setup: PreparedJetSetup,
  referenceSpeedsMs: readonly number[],
  medianThrustN: Float64Array,
  staticEqualisingMm: number,
): RangeEqualising {
  checkRangeInputs(referenceSpeedsMs, medianThrustN);
  const p = setup.powerKw;
  const best = minimiseRangeObjective((d) => objective(setup, d, referenceSpeedsMs, medianThrustN), staticEqualisingMm);
  const rangeSetup = withPowerAndDiameter(setup, p, best);
  const staticSetup = withPowerAndDiameter(setup, p, staticEqualisingMm);
  return describeRangeEqualising(
    best,
    referenceSpeedsMs,
    medianThrustN,
    (v) => evaluateThrustN(rangeSetup, v),
    (v) => evaluateThrustN(staticSetup, v),
  );
}

/** Refuses an empty speed list or a median thrust that is not positive (the objective divides by it). */
export function checkRangeInputs(referenceSpeedsMs: readonly number[], medianThrustN: Float64Array): void {
  if (referenceSpeedsMs.length === 0) throw new EngineInputError('referenceSpeedsMs', 'Give at least one speed');
  for (let j = 0; j < medianThrustN.length; j++) {
    if (!(medianThrustN[j] > 0))
      throw new EngineInputError(
        'referenceSpeedsMs',
        `The class median thrust at ${referenceSpeedsMs[j]} m/s is not positive: drop that speed`,
      );
  }
}

/**
 * The diameter minimising `f` (the least-squares objective above): a grid over [0.5, 2] x the static
 * answer, then golden-section refinement (Kiefer 1953) in the grid cell either side of the best point.
 * `f` may answer Infinity where a diameter has no answer (a matched set-up with no operating point).
 */
export function minimiseRangeObjective(f: (d: number) => number, staticEqualisingMm: number): number {
  const lo = 0.5 * staticEqualisingMm;
  const hi = 2 * staticEqualisingMm;
  let best = staticEqualisingMm;
  let bestF = f(best);
  const step = (hi - lo) / GRID;
  for (let i = 0; i <= GRID; i++) {
    const d = lo + i * step;
    const fd = f(d);
    if (fd < bestF) {
      bestF = fd;
      best = d;
    }
  }
  let a = Math.max(lo, best - step);
  let b = Math.min(hi, best + step);
  let c = b - GOLDEN * (b - a);
  let d = a + GOLDEN * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let it = 0; it < 80 && b - a > 1e-8 * b; it++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - GOLDEN * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + GOLDEN * (b - a);
      fd = f(d);
    }
  }
  const refined = 0.5 * (a + b);
  if (f(refined) < bestF) best = refined;
  return best;
}

/** The deviations at each reference speed for the range and static nozzles, and their summaries. */
export function describeRangeEqualising(
  nozzleDiameterMm: number,
  referenceSpeedsMs: readonly number[],
  medianThrustN: Float64Array,
  rangeThrustAt: (speedMs: number) => number,
  staticThrustAt: (speedMs: number) => number,
): RangeEqualising {
  let sumSq = 0;
  let worst = 0;
  let staticWorst = 0;
  const deviations = referenceSpeedsMs.map((speedMs, j) => {
    const m = medianThrustN[j];
    const range = ((rangeThrustAt(speedMs) - m) / m) * 100;
    const stat = ((staticThrustAt(speedMs) - m) / m) * 100;
    sumSq += range * range;
    worst = Math.max(worst, Math.abs(range));
    staticWorst = Math.max(staticWorst, Math.abs(stat));
    return { speedMs, medianThrustN: m, staticEqualisedPercent: stat, rangeEqualisedPercent: range };
  });
  return {
    nozzleDiameterMm,
    rmsDeviationPercent: Math.sqrt(sumSq / referenceSpeedsMs.length),
    worstDeviationPercent: worst,
    staticWorstDeviationPercent: staticWorst,
    deviations,
  };
}
