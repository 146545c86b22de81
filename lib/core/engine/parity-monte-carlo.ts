// Monte Carlo propagation of each boat's power and nozzle uncertainties through the fixed-power jet
// model for a whole class (JCGM 101:2008, "Propagation of distributions using a Monte Carlo method").
//
// - Each trial draws every boat's shaft power and nozzle diameter from normal distributions with the
//   boat's values as means and its standard uncertainties (JCGM 101:2008, 6.4.7), independently,
//   truncated to positive values (a draw at or below zero is drawn again; with the uncertainties a
//   class allows this practically never happens).
// - Uniform numbers come from the enhanced Wichmann–Hill generator (Wichmann and Hill, Computational
//   Statistics & Data Analysis 51, 2006), which JCGM 101:2008, annex C.3, recommends; normal numbers
//   from the Box–Muller transform (annex C.4). The seed makes a run reproducible.
// - Per trial: every boat's thrust at rest and at each reference speed, and the class spread
//   (max − min) / median at rest. From the M trials: each boat's mean, standard uncertainty and
//   probabilistically symmetric 95 % coverage interval (JCGM 101:2008, 7.7); for each pair of boats
//   and each speed the probability that the first out-thrusts the second (the share of trials where
//   it does); and the spread's distribution. The spread of the nominal values is biased upwards by
//   noise in a small class; the Monte Carlo mean shows by how much.
// - A boat given a matched set-up (options.matched, lib/core/engine/jet-matched.ts: engine curve ×
//   pump characteristic, levelled to the boat's confirmed power) takes each trial's thrust from the
//   matched model: its engine curve scaled by the trial's power over the confirmed power, its nozzle at
//   the trial's diameter. A trial with no operating point on the curves uses the fixed-power thrust of
//   that trial's draws instead, and is counted (`noOperatingPointTrials`).

import { EngineInputError, EngineOperatingPointError, assertNonNegative, assertPositive } from './engine-input-error';
import { MAX_SPEED_MS, prepareJetSetup, solveJetCubic, withPowerAndDiameter } from './jet';
import type { JetModelAssumptions, PreparedJetSetup } from './jet';
import type { ParityBoatInput } from './parity';
import { copyMatchedSetup, evaluateMatchedPoint, retuneMatchedSetup } from './jet-matched';
import type { MatchedPoint, PreparedMatchedSetup } from './jet-matched';

// Enhanced Wichmann–Hill (2006) four-cycle generator: multipliers and moduli [memory; as printed in
// the paper and in JCGM 101:2008, annex C.3]. Products stay below 2^53, so doubles are exact.
const WH_A = [11600, 47003, 23000, 33000] as const;
const WH_M = [2147483579, 2147483543, 2147483423, 2147483123] as const;

export interface UniformGenerator {
  /** A number in (0, 1). */
  next(): number;
}

/** The enhanced Wichmann–Hill generator seeded from one integer (each cycle's seed derived from it). */
export function createWichmannHill(seed: number): UniformGenerator {
  if (!Number.isSafeInteger(seed) || seed < 0)
    throw new EngineInputError('seed', `seed must be a non-negative whole number (got ${seed})`);
  // Four distinct cycle seeds in [1, m - 1], spread by a fixed odd multiplier (splitting one seed).
  const state = WH_M.map((m, i) => 1 + ((seed * 2654435761 + (i + 1) * 40503 * 65537) % (m - 1)));
  return {
    next() {
      for (;;) {
        let w = 0;
        for (let i = 0; i < 4; i++) {
          state[i] = (WH_A[i] * state[i]) % WH_M[i];
          w += state[i] / WH_M[i];
        }
        const u = w - Math.floor(w);
        if (u > 0) return u;
      }
    },
  };
}

/** Standard normal numbers by the Box–Muller transform, two per pair of uniforms. */
export function createNormalGenerator(uniform: UniformGenerator): () => number {
  let spare = NaN;
  return () => {
    if (!Number.isNaN(spare)) {
      const z = spare;
      spare = NaN;
      return z;
    }
    const r = Math.sqrt(-2 * Math.log(uniform.next()));
    const theta = 2 * Math.PI * uniform.next();
    spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  };
}

export interface MonteCarloOptions {
  /** Number of trials M asked for (default 20,000); capped so that samples kept stay under 4 million. */
  trials?: number;
  seed?: number;
  /** Reference speeds besides rest (m/s). */
  referenceSpeedsMs: readonly number[];
  /**
   * Per boat (same order), its matched set-up at its confirmed power and nozzle, or null for fixed
   * power. Absent: every boat on fixed power.
   */
  matched?: readonly (PreparedMatchedSetup | null | undefined)[];
}

export interface CoverageSummary {
  mean: number;
  /** Standard deviation of the trials: the standard uncertainty (JCGM 101:2008, 7.6). */
  standardUncertainty: number;
  /** Probabilistically symmetric 95 % coverage interval (2.5 % and 97.5 % quantiles). */
  low95: number;
  high95: number;
}

export interface MonteCarloBoat {
  id: string;
  /** 'matched' when the trials used the boat's matched set-up (absent: fixed power). */
  model?: 'matched';
  /** Matched boats: trials with no operating point at some speed, which used fixed power for that speed. */
  noOperatingPointTrials?: number;
  /** [rest, ...reference speeds]: thrust summaries, N. */
  thrust: (CoverageSummary & { speedMs: number })[];
}

export interface MonteCarloPair {
  aId: string;
  bId: string;
  /** [rest, ...reference speeds]: the share of trials in which boat a out-thrusts boat b. */
  probabilityAAhead: { speedMs: number; probability: number }[];
}

export interface MonteCarloParity {
  trials: number;
  seed: number;
  speedsMs: number[];
  boats: MonteCarloBoat[];
  pairs: MonteCarloPair[];
  /** The static spread (max − min) / median, per cent: the nominal values' and its distribution. */
  spread: CoverageSummary & { nominalPercent: number };
}

const DEFAULT_TRIALS = 20_000;
const MAX_SAMPLES = 4_000_000;

function summarise(samples: Float64Array): CoverageSummary {
  const m = samples.length;
  let sum = 0;
  for (let i = 0; i < m; i++) sum += samples[i];
  const mean = sum / m;
  let ss = 0;
  for (let i = 0; i < m; i++) ss += (samples[i] - mean) ** 2;
  const sorted = Float64Array.from(samples).sort();
  // JCGM 101:2008, 7.7: with q = pM, the interval [y_(r), y_(r+q)], r = round(0.025 M) (1-based).
  const q = Math.round(0.95 * m);
  const r = Math.max(1, Math.round(0.025 * m));
  return {
    mean,
    standardUncertainty: m > 1 ? Math.sqrt(ss / (m - 1)) : 0,
    low95: sorted[r - 1],
    high95: sorted[Math.min(m, r + q) - 1],
  };
}

function median(values: Float64Array, scratch: Float64Array): number {
  scratch.set(values);
  scratch.sort();
  const n = scratch.length;
  const mid = n >> 1;
  return n % 2 === 1 ? scratch[mid] : 0.5 * (scratch[mid - 1] + scratch[mid]);
}

export function computeParityMonteCarlo(
  boats: readonly ParityBoatInput[],
  model: JetModelAssumptions,
  options: MonteCarloOptions,
): MonteCarloParity {
  if (!Array.isArray(boats) || boats.length === 0) throw new EngineInputError('boats', 'Give at least one boat');
  const n = boats.length;
  const speeds = [0, ...options.referenceSpeedsMs.filter((v) => v !== 0)];
  speeds.forEach((v, j) => {
    if (!(typeof v === 'number' && v >= 0 && v <= MAX_SPEED_MS))
      throw new EngineInputError(`referenceSpeedsMs[${j}]`, `Reference speeds must be 0 to ${MAX_SPEED_MS} m/s`);
  });
  const s = speeds.length;
  const seed = options.seed ?? 1;
  const asked = options.trials ?? DEFAULT_TRIALS;
  if (!Number.isInteger(asked) || asked < 100)
    throw new EngineInputError('trials', 'Ask for at least 100 trials (a whole number)');
  const trials = Math.max(100, Math.min(asked, Math.floor(MAX_SAMPLES / (n * s))));

  const base = prepareJetSetup({ ...model, powerKw: boats[0].powerKw, nozzleDiameterMm: boats[0].nozzleDiameterMm });
  const setups: PreparedJetSetup[] = boats.map((b, i) =>
    withPowerAndDiameter(
      base,
      assertPositive(`boats[${i}].powerKw`, b.powerKw),
      assertPositive(`boats[${i}].nozzleDiameterMm`, b.nozzleDiameterMm),
    ),
  );
  const uP = boats.map((b, i) => assertNonNegative(`boats[${i}].uPowerKw`, b.uPowerKw ?? 0));
  const uD = boats.map((b, i) => assertNonNegative(`boats[${i}].uNozzleDiameterMm`, b.uNozzleDiameterMm ?? 0));

  if (options.matched !== undefined && options.matched.length !== n)
    throw new EngineInputError('matched', 'Give one matched set-up or null per boat');
  const matchedSource = boats.map((_, i) => options.matched?.[i] ?? null);
  // One working copy per matched boat, retuned in place each trial (no allocation in the loop).
  const matchedWork = matchedSource.map((m) => (m ? copyMatchedSetup(m) : null));
  const fallbacks = new Float64Array(n);
  const point: MatchedPoint = {
    speedMs: 0,
    rpm: 0,
    shaftPowerKw: 0,
    flowM3s: 0,
    flowCoefficient: 0,
    pumpEfficiency: 0,
    jetVelocityMs: 0,
    thrustN: 0,
    limitedBy: 'engine',
  };

  const normal = createNormalGenerator(createWichmannHill(seed));
  const positiveDraw = (mean: number, u: number) => {
    if (u === 0) return mean;
    for (;;) {
      const x = mean + u * normal();
      if (x > 0) return x;
    }
  };
  // samples[(i * s + j) * trials + t]: boat i, speed j, trial t.
  const samples = new Float64Array(n * s * trials);
  const spread = new Float64Array(trials);
  const staticNow = new Float64Array(n);
  const scratch = new Float64Array(n);
  const ahead = new Float64Array(((n * (n - 1)) / 2) * s);

  for (let t = 0; t < trials; t++) {
    for (let i = 0; i < n; i++) {
      const st = setups[i];
      const p = positiveDraw(st.powerKw, uP[i]);
      const d = positiveDraw(st.nozzleDiameterMm, uD[i]);
      // rho A ∝ D^2 and q = 2 eta P / ((1 + K_n) rho A) ∝ P / D^2 (jet.ts).
      const area = (d / st.nozzleDiameterMm) ** 2;
      const rhoA = st.rhoAreaKgM * area;
      const q = (st.q * (p / st.powerKw)) / area;
      const work = matchedWork[i];
      const source = matchedSource[i];
      if (work && source) retuneMatchedSetup(work, source, p / st.powerKw, d);
      let fellBack = false;
      for (let j = 0; j < s; j++) {
        const v = speeds[j];
        if (work) {
          try {
            samples[(i * s + j) * trials + t] = evaluateMatchedPoint(work, v, point).thrustN;
            continue;
          } catch (err) {
            if (!(err instanceof EngineOperatingPointError)) throw err;
            fellBack = true;
          }
        }
        const vj = solveJetCubic(st.pSpeedFactor * v * v, q);
        samples[(i * s + j) * trials + t] = rhoA * vj * (vj - st.inflowFactor * v);
      }
      if (fellBack) fallbacks[i]++;
      staticNow[i] = samples[i * s * trials + t];
    }
    let pair = 0;
    for (let a = 0; a < n; a++) {
      for (let b = a + 1; b < n; b++) {
        for (let j = 0; j < s; j++) {
          if (samples[(a * s + j) * trials + t] > samples[(b * s + j) * trials + t]) ahead[pair * s + j]++;
        }
        pair++;
      }
    }
    let min = Infinity;
    let max = -Infinity;
    for (let i = 0; i < n; i++) {
      if (staticNow[i] < min) min = staticNow[i];
      if (staticNow[i] > max) max = staticNow[i];
    }
    spread[t] = ((max - min) / median(staticNow, scratch)) * 100;
  }

  const nominal = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    nominal[i] = setups[i].rhoAreaKgM * Math.cbrt(setups[i].q) ** 2;
    const m = matchedSource[i];
    if (m) {
      try {
        nominal[i] = evaluateMatchedPoint(m, 0, point).thrustN;
      } catch (err) {
        if (!(err instanceof EngineOperatingPointError)) throw err;
      }
    }
  }
  let nMin = Infinity;
  let nMax = -Infinity;
  for (const x of nominal) {
    nMin = Math.min(nMin, x);
    nMax = Math.max(nMax, x);
  }

  const pairs: MonteCarloPair[] = [];
  let pair = 0;
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      pairs.push({
        aId: boats[a].id,
        bId: boats[b].id,
        probabilityAAhead: speeds.map((speedMs, j) => ({ speedMs, probability: ahead[pair * s + j] / trials })),
      });
      pair++;
    }
  }
  return {
    trials,
    seed,
    speedsMs: speeds,
    boats: boats.map((b, i) => ({
      id: b.id,
      ...(matchedSource[i] && { model: 'matched' as const, noOperatingPointTrials: fallbacks[i] }),
      thrust: speeds.map((speedMs, j) => ({
        speedMs,
        ...summarise(samples.subarray((i * s + j) * trials, (i * s + j + 1) * trials)),
      })),
    })),
    pairs,
    spread: { ...summarise(spread), nominalPercent: ((nMax - nMin) / median(nominal, scratch)) * 100 },
  };
}
