// Straight-line run from rest: m dV/dt = T(V) - R(V), dx/dt = V, integrated in time with the classical
// fourth-order Runge–Kutta method at a fixed step (Butcher, Numerical Methods for Ordinary Differential
// Equations, 3rd ed., 2016, section 23; Press et al., Numerical Recipes, 3rd ed., 2007, section 17.1).
// The step is checked by step halving (Press et al., 17.2): the whole run is integrated at h and at h/2 and
// the step is halved until the two times to every distance agree within the tolerance; the smaller step's
// answer is returned with that difference as its accuracy. A distance is reached inside a step: the last
// step's length is solved so that the RK4 step lands exactly on it (bisection on the step length), so the
// crossing keeps the method's order instead of the second order of interpolating x between steps.
//
// The thrust is any function T(V) in newtons: the fixed-power model (jet.ts) today; the matched engine-and-
// pump model (jet-matched.ts) plugs in the same way. Framework-free.

import { EngineInputError } from './engine-input-error';

export type ThrustFunction = (speedMs: number) => number;
export type ResistanceFunction = (speedMs: number) => number;

export type RunIntegrationInput = {
  thrustN: ThrustFunction;
  resistanceN: ResistanceFunction;
  massKg: number;
  /** Distances from the start (m), each above 0. */
  distancesM: readonly number[];
  /** Relative agreement asked of the step-halving check (default 1e-9). */
  relativeTolerance?: number;
  /** First step (s), default 0.05; halved at most maxHalvings times (default 12). */
  initialStepS?: number;
  maxHalvings?: number;
  /** Give up past this time (s): a boat that never reaches a distance (default 600 s). */
  maxTimeS?: number;
};

export type RunIntegrationResult = {
  /** Time to each distance (s), in the order asked; null when not reached within maxTimeS. */
  timesS: (number | null)[];
  /** Speed at each distance (m/s); null when not reached. */
  speedsMs: (number | null)[];
  /** The step of the returned answer (s). */
  stepS: number;
  /** Largest |t(h) - t(h/2)| / t(h/2) over the distances: the accuracy reached. */
  relativeAccuracy: number;
  /** Whether the tolerance was met within maxHalvings. */
  converged: boolean;
};

type State = { x: number; v: number };

function rk4Step(s: State, h: number, accel: (v: number) => number): State {
  const k1v = accel(s.v);
  const k1x = s.v;
  const v2 = s.v + (h / 2) * k1v;
  const k2v = accel(v2);
  const k2x = v2;
  const v3 = s.v + (h / 2) * k2v;
  const k3v = accel(v3);
  const k3x = v3;
  const v4 = s.v + h * k3v;
  const k4v = accel(v4);
  const k4x = v4;
  return {
    x: s.x + (h / 6) * (k1x + 2 * k2x + 2 * k3x + k4x),
    v: s.v + (h / 6) * (k1v + 2 * k2v + 2 * k3v + k4v),
  };
}

/** The step length tau in (0, h] whose RK4 step from s reaches distance d (x grows with tau while v > 0). */
function stepToDistance(s: State, h: number, d: number, accel: (v: number) => number): number {
  let lo = 0;
  let hi = h;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.max(1, hi); i++) {
    const mid = (lo + hi) / 2;
    if (rk4Step(s, mid, accel).x < d) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function integrateAtStep(
  input: RunIntegrationInput,
  order: number[],
  h: number,
  maxTimeS: number,
): { timesS: (number | null)[]; speedsMs: (number | null)[] } {
  const accel = (v: number) => (input.thrustN(v) - input.resistanceN(v)) / input.massKg;
  const timesS: (number | null)[] = input.distancesM.map(() => null);
  const speedsMs: (number | null)[] = input.distancesM.map(() => null);
  let s: State = { x: 0, v: 0 };
  let t = 0;
  let next = 0;
  while (next < order.length && t < maxTimeS) {
    const after = rk4Step(s, h, accel);
    while (next < order.length && after.x >= input.distancesM[order[next]]) {
      const d = input.distancesM[order[next]];
      const tau = stepToDistance(s, h, d, accel);
      timesS[order[next]] = t + tau;
      speedsMs[order[next]] = rk4Step(s, tau, accel).v;
      next++;
    }
    if (!(after.x > s.x)) break; // no longer moving forward: the rest is never reached
    s = after;
    t += h;
  }
  return { timesS, speedsMs };
}

/** Times (and speeds) to each distance of a run from rest, with the accuracy the step-halving check reached. */
export function integrateRunFromRest(input: RunIntegrationInput): RunIntegrationResult {
  if (!(input.massKg > 0) || !Number.isFinite(input.massKg))
    throw new EngineInputError('massKg', `massKg must be a positive number (got ${input.massKg})`);
  if (input.distancesM.length === 0 || input.distancesM.some((d) => !(d > 0) || !Number.isFinite(d)))
    throw new EngineInputError('distancesM', 'Every distance must be a positive number of metres');
  const tol = input.relativeTolerance ?? 1e-9;
  const maxHalvings = input.maxHalvings ?? 12;
  const maxTimeS = input.maxTimeS ?? 600;
  const order = input.distancesM.map((_, i) => i).sort((a, b) => input.distancesM[a] - input.distancesM[b]);
  let h = input.initialStepS ?? 0.05;
  let coarse = integrateAtStep(input, order, h, maxTimeS);
  let accuracy = Infinity;
  for (let k = 0; k <= maxHalvings; k++) {
    const fine = integrateAtStep(input, order, h / 2, maxTimeS);
    accuracy = 0;
    for (let i = 0; i < fine.timesS.length; i++) {
      const a = coarse.timesS[i];
      const b = fine.timesS[i];
      if (a === null || b === null) {
        if (a !== b) accuracy = Infinity;
        continue;
      }
      accuracy = Math.max(accuracy, Math.abs(a - b) / b);
    }
    h /= 2;
    coarse = fine;
    if (accuracy <= tol) return { ...fine, stepS: h, relativeAccuracy: accuracy, converged: true };
  }
  return { ...coarse, stepS: h, relativeAccuracy: accuracy, converged: false };
}

/** The speed where T(V) = R(V), by bisection on [0, upperMs] (T - R falls through zero once for these models). */
export function findTerminalSpeedMs(thrustN: ThrustFunction, resistanceN: ResistanceFunction, upperMs = 200): number {
  const net = (v: number) => thrustN(v) - resistanceN(v);
  if (net(0) <= 0) return 0;
  // Bracket by doubling from 1 m/s, so the thrust is asked only up to about twice the terminal speed (a matched
  // engine and pump may have no operating point far above the speeds a boat reaches).
  let lo = 0;
  let hi = Math.min(1, upperMs);
  while (net(hi) > 0) {
    if (hi >= upperMs) return upperMs;
    lo = hi;
    hi = Math.min(2 * hi, upperMs);
  }
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (net(mid) > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
