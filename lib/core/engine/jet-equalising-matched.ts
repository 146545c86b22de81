// Equalising nozzles for a boat on the matched model (jet-matched.ts: engine curve × pump
// characteristic). At fixed power T0 ∝ D^(2/3) inverts in closed form; on real curves the operating
// point moves with the nozzle, so the diameter is searched with the matched model itself:
//
// - Static: the diameter D at which the boat's matched static thrust is the target (the class
//   median), by the Illinois variant of regula falsi (Dowell and Jarratt, BIT 11, 1971) on a bracket
//   found by stepping out geometrically from the boat's own nozzle towards the fixed-power guess.
//   Static thrust need not be monotone in D on real curves (past the limiter it falls again); the
//   bracket nearest the boat's own nozzle is the one taken.
// - Over the speed range: the least-squares objective of jet-equalising.ts (relative deviations from
//   the class median at each reference speed) with the matched thrust, minimised by the same grid and
//   golden-section search (Kiefer 1953); a diameter with no operating point at some speed scores Infinity.
//
// Both work on one copy of the prepared set-up retuned in place (retuneMatchedSetup): no allocation
// per evaluation.

import { EngineOperatingPointError } from './engine-input-error';
import { checkRangeInputs, describeRangeEqualising, minimiseRangeObjective } from './jet-equalising';
import type { RangeEqualising } from './jet-equalising';
import { copyMatchedSetup, evaluateMatchedPoint, retuneMatchedSetup } from './jet-matched';
import type { MatchedPoint, PreparedMatchedSetup } from './jet-matched';

const newPoint = (): MatchedPoint => ({
  speedMs: 0,
  rpm: 0,
  shaftPowerKw: 0,
  flowM3s: 0,
  flowCoefficient: 0,
  pumpEfficiency: 0,
  jetVelocityMs: 0,
  thrustN: 0,
  limitedBy: 'engine',
});

/** Matched thrust of `source` with its engine curve × powerFactor and nozzle d (mm) at each speed; NaN: no operating point. */
export function createMatchedThrust(
  source: PreparedMatchedSetup,
): (powerFactor: number, nozzleMm: number, speedMs: number) => number {
  const work = copyMatchedSetup(source);
  const point = newPoint();
  return (powerFactor, nozzleMm, speedMs) => {
    retuneMatchedSetup(work, source, powerFactor, nozzleMm);
    try {
      return evaluateMatchedPoint(work, speedMs, point).thrustN;
    } catch (err) {
      if (err instanceof EngineOperatingPointError) return NaN;
      throw err;
    }
  };
}

const MAX_BRACKET_STEPS = 40;
const BRACKET_RATIO = 1.1;

/**
 * The nozzle (mm) giving the matched static thrust `targetN` with the engine curve × powerFactor;
 * null when no diameter between a quarter and four times the boat's own nozzle brackets it.
 */
export function computeMatchedStaticEqualisingMm(
  source: PreparedMatchedSetup,
  targetN: number,
  powerFactor = 1,
  thrustAt = createMatchedThrust(source),
): number | null {
  if (!(targetN > 0)) return null;
  const d0 = source.nozzleDiameterMm;
  const f = (d: number) => thrustAt(powerFactor, d, 0) - targetN;
  const f0 = f(d0);
  if (Number.isNaN(f0)) return null;
  if (f0 === 0) return d0;
  // At fixed power a larger nozzle gives more static thrust, so a boat above the target looks below its
  // nozzle first; the other side is tried after (real curves can turn over).
  const directions = f0 > 0 ? [1 / BRACKET_RATIO, BRACKET_RATIO] : [BRACKET_RATIO, 1 / BRACKET_RATIO];
  for (const ratio of directions) {
    let a = d0;
    let fa = f0;
    for (let k = 0; k < MAX_BRACKET_STEPS; k++) {
      const b = a * ratio;
      if (b < 0.25 * d0 || b > 4 * d0) break;
      const fb = f(b);
      if (Number.isNaN(fb)) break;
      if (fb === 0) return b;
      if (Math.sign(fb) !== Math.sign(fa)) return illinois(f, a, fa, b, fb);
      a = b;
      fa = fb;
    }
  }
  return null;
}

/** Illinois regula falsi on a bracket [a, b] with f(a), f(b) of opposite signs. */
function illinois(f: (d: number) => number, a: number, fa: number, b: number, fb: number): number {
  let side = 0;
  for (let it = 0; it < 200; it++) {
    const c = (a * fb - b * fa) / (fb - fa);
    if (!(c > Math.min(a, b) && c < Math.max(a, b))) return c;
    const fc = f(c);
    if (Number.isNaN(fc)) return 0.5 * (a + b);
    if (fc === 0 || Math.abs(b - a) < 1e-13 * Math.abs(c)) return c;
    if (Math.sign(fc) === Math.sign(fb)) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
  }
  return (a * fb - b * fa) / (fb - fa);
}

/** The range equalising nozzle for a matched boat (least squares of relative deviations, as jet-equalising.ts). */
export function computeMatchedRangeEqualising(
  source: PreparedMatchedSetup,
  referenceSpeedsMs: readonly number[],
  medianThrustN: Float64Array,
  staticEqualisingMm: number,
): RangeEqualising {
  checkRangeInputs(referenceSpeedsMs, medianThrustN);
  const thrustAt = createMatchedThrust(source);
  const objective = (d: number) => {
    let sum = 0;
    for (let j = 0; j < referenceSpeedsMs.length; j++) {
      const t = thrustAt(1, d, referenceSpeedsMs[j]);
      if (Number.isNaN(t)) return Infinity;
      const r = (t - medianThrustN[j]) / medianThrustN[j];
      sum += r * r;
    }
    return sum;
  };
  const best = minimiseRangeObjective(objective, staticEqualisingMm);
  return describeRangeEqualising(
    best,
    referenceSpeedsMs,
    medianThrustN,
    (v) => thrustAt(1, best, v),
    (v) => thrustAt(1, staticEqualisingMm, v),
  );
}
