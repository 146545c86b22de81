// Crossover speed of two jet set-ups: the lowest boat speed at which the thrust ordering changes.
// Lossless, the larger nozzle always has more thrust and there is none; with losses the curves
// cross near the speed where the two jet-to-boat velocity ratios straddle NVR* (see jet.ts).
//
// Method: walk the thrust difference along a fixed grid (0 to 100 m/s in 1 m/s steps), stop at
// the first bracket with a sign change and refine it with the Illinois variant of regula falsi
// (superlinear, never leaves the bracket) down to 1e-9 m/s. Choices, documented:
// - null when no sign change below the scan limit, including identical curves;
// - differences within 1e-12 of the thrust scale count as equal (so equal static thrust, as for an
//   equalised boat, is not reported as a crossing at 0 m/s; a later real crossing still is);
// - if two crossings fall inside one 1 m/s step they cancel and are missed (accepted: momentum
//   theory curves of two set-ups cross at most once in every case we have met, and their
//   difference is smooth on a 1 m/s scale).

import { EngineInputError, assertPositive } from './engine-input-error';
import { MAX_SPEED_MS, fillThrustCurve, prepareJetSetup, solveJetCubic } from './jet';
import type { JetSetupInput, PreparedJetSetup } from './jet';

export const CROSSOVER_MAX_SPEED_MS = 100;
export const CROSSOVER_SCAN_STEP_MS = 1;
const REFINE_TOLERANCE_MS = 1e-9;
const EQUAL_RELATIVE_TOLERANCE = 1e-12;

export interface CrossoverOptions {
  /** Upper end of the scan, m/s (default 100). */
  maxSpeedMs?: number;
  /** Scan step, m/s (default 1). */
  scanStepMs?: number;
}

interface CrossoverGrid {
  speedsMs: Float64Array;
  referenceThrustN: Float64Array;
}

function buildGrid(reference: PreparedJetSetup, options: CrossoverOptions): CrossoverGrid {
  const maxSpeedMs = assertPositive('maxSpeedMs', options.maxSpeedMs ?? CROSSOVER_MAX_SPEED_MS);
  const stepMs = assertPositive('scanStepMs', options.scanStepMs ?? CROSSOVER_SCAN_STEP_MS);
  if (maxSpeedMs > MAX_SPEED_MS) {
    throw new EngineInputError('maxSpeedMs', `maxSpeedMs must be at most ${MAX_SPEED_MS} m/s`);
  }
  const steps = Math.ceil(maxSpeedMs / stepMs - 1e-9);
  if (steps > 1e6) throw new EngineInputError('scanStepMs', 'scanStepMs is too small for the scan range');
  const speedsMs = new Float64Array(steps + 1);
  for (let i = 0; i <= steps; i++) speedsMs[i] = Math.min(i * stepMs, maxSpeedMs);
  const referenceThrustN = new Float64Array(steps + 1);
  fillThrustCurve(reference, speedsMs, referenceThrustN);
  return { speedsMs, referenceThrustN };
}

// Local binding: module-interop layers (tsx, bundlers) reach imports through a getter on every
// call, which costs more than the cubic itself in this loop.
const solveCubic = solveJetCubic;

/** Thrust at a speed already validated by the grid (same formula as jet.ts evaluateThrustN). */
function thrustAt(s: PreparedJetSetup, speedMs: number): number {
  const v = solveCubic(s.pSpeedFactor * speedMs * speedMs, s.q);
  return s.rhoAreaKgM * v * (v - s.inflowFactor * speedMs);
}

function signOfDifference(thrustA: number, thrustB: number): number {
  const d = thrustA - thrustB;
  if (Math.abs(d) <= EQUAL_RELATIVE_TOLERANCE * (Math.abs(thrustA) + Math.abs(thrustB))) return 0;
  return d > 0 ? 1 : -1;
}

/** Illinois regula falsi on d(V) = T_a(V) - T_b(V), given d(lo) and d(hi) of opposite sign. */
function refineCrossover(
  a: PreparedJetSetup,
  b: PreparedJetSetup,
  loMs: number,
  hiMs: number,
  dLo: number,
  dHi: number,
): number {
  let lo = loMs;
  let hi = hiMs;
  let fLo = dLo;
  let fHi = dHi;
  let side = 0;
  for (let i = 0; i < 100 && hi - lo > REFINE_TOLERANCE_MS; i++) {
    let x = (lo * fHi - hi * fLo) / (fHi - fLo);
    if (!(x > lo && x < hi)) x = 0.5 * (lo + hi); // guard against round-off at the ends
    const tA = thrustAt(a, x);
    const tB = thrustAt(b, x);
    const f = tA - tB;
    if (signOfDifference(tA, tB) === 0) return x;
    if (f > 0 === fLo > 0) {
      lo = x;
      fLo = f;
      if (side === -1) fHi *= 0.5; // same end kept twice: halve it so the bracket closes from both sides
      side = -1;
    } else {
      hi = x;
      fHi = f;
      if (side === 1) fLo *= 0.5;
      side = 1;
    }
  }
  return 0.5 * (lo + hi);
}

function scanForCrossover(a: PreparedJetSetup, b: PreparedJetSetup, grid: CrossoverGrid): number | null {
  const { speedsMs, referenceThrustN } = grid;
  let prevSign = 0;
  let prevIndex = 0;
  let prevDiff = 0;
  let zeroIndex = -1; // first grid point with equal thrust after a non-zero sign
  for (let i = 0; i < speedsMs.length; i++) {
    const tA = thrustAt(a, speedsMs[i]);
    const s = signOfDifference(tA, referenceThrustN[i]);
    if (s === 0) {
      if (prevSign !== 0 && zeroIndex < 0) zeroIndex = i;
      continue;
    }
    const diff = tA - referenceThrustN[i];
    if (prevSign !== 0 && s !== prevSign) {
      return zeroIndex >= 0
        ? speedsMs[zeroIndex]
        : refineCrossover(a, b, speedsMs[prevIndex], speedsMs[i], prevDiff, diff);
    }
    prevSign = s;
    prevIndex = i;
    prevDiff = diff;
    zeroIndex = -1;
  }
  return null;
}

/** Lowest speed (m/s) where the thrust curves of a and b cross below the scan limit, or null. */
export function computeCrossoverSpeedMs(
  a: JetSetupInput | PreparedJetSetup,
  b: JetSetupInput | PreparedJetSetup,
  options: CrossoverOptions = {},
): number | null {
  const pa = prepareJetSetup(a);
  const pb = prepareJetSetup(b);
  return scanForCrossover(pa, pb, buildGrid(pb, options));
}

/**
 * For many set-ups against one reference (class parity): the reference curve is sampled once, so
 * each call costs the set-up's walk up to the first sign change plus the refinement.
 */
export function createCrossoverFinder(
  reference: JetSetupInput | PreparedJetSetup,
  options: CrossoverOptions = {},
): (setup: JetSetupInput | PreparedJetSetup) => number | null {
  const ref = prepareJetSetup(reference);
  const grid = buildGrid(ref, options);
  return (setup) => scanForCrossover(prepareJetSetup(setup), ref, grid);
}
