// Engine benchmark: npx tsx scripts/bench-engine.ts
// 1. Thrust curves, 10,000 boats x 200 speeds (2 million points), through fillThrustCurve.
// 2. Baseline: the closed-form static formula T0 = (2 eta P/(1+K_n))^(2/3) (rho A)^(1/3) evaluated
//    for the same number of points (each point a different power, so nothing can be hoisted).
// 3. The matched model (engine curve x pump characteristic): 2,000 boats x 100 speeds through
//    evaluateMatchedPoint, as points per second and as a ratio to the fixed-power curve per point.
// 4. Class parity for 1,000 boats with uncertainties.
// Prints figures only; never asserts timing (exit 0). Checksums are printed so no loop is dead code.

import {
  computeParity,
  evaluateMatchedPoint,
  fillThrustCurve,
  prepareJetSetup,
  prepareMatchedSetup,
} from '../lib/core/engine/index';
import type { MatchedPoint, ParityBoatInput, PreparedJetSetup, PreparedMatchedSetup } from '../lib/core/engine/index';

const BOATS = 10_000;
const SPEEDS = 200;
const POINTS = BOATS * SPEEDS;
const RUNS = 7;
const model = {
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  inletLossCoefficient: 0.2,
  nozzleLossCoefficient: 0.02,
  wakeFraction: 0.03,
};

const setups: PreparedJetSetup[] = Array.from({ length: BOATS }, (_, i) =>
  prepareJetSetup({ ...model, powerKw: 150 + (i % 500), nozzleDiameterMm: 80 + ((i * 7) % 600) / 10 }),
);
const speedsMs = Float64Array.from({ length: SPEEDS }, (_, i) => (i * 100) / SPEEDS);
const powerSweepW = Float64Array.from({ length: SPEEDS }, (_, i) => 150_000 + i * 2_000);
const out = new Float64Array(SPEEDS);

function runCurves(): number {
  let checksum = 0;
  for (let b = 0; b < BOATS; b++) {
    fillThrustCurve(setups[b], speedsMs, out);
    checksum += out[b % SPEEDS] + out[SPEEDS - 1];
  }
  return checksum;
}

function runBaseline(): number {
  let checksum = 0;
  for (let b = 0; b < BOATS; b++) {
    const s = setups[b];
    const k = (2 * s.pumpEfficiency) / (1 + s.nozzleLossCoefficient);
    const rhoA = s.rhoAreaKgM;
    for (let i = 0; i < SPEEDS; i++) {
      const x = k * powerSweepW[i];
      out[i] = Math.cbrt(x * x * rhoA);
    }
    checksum += out[b % SPEEDS] + out[SPEEDS - 1];
  }
  return checksum;
}

function time(fn: () => number): { ms: number; checksum: number } {
  const start = process.hrtime.bigint();
  const checksum = fn();
  return { ms: Number(process.hrtime.bigint() - start) / 1e6, checksum };
}

function measure(name: string, fn: () => number, points = POINTS): number {
  for (let i = 0; i < 3; i++) time(fn); // warm-up: let the JIT optimise before timing
  const samples = Array.from({ length: RUNS }, () => time(fn));
  const ms = samples.map((s) => s.ms).sort((a, b) => a - b);
  const median = ms[RUNS >> 1];
  console.log(
    `${name.padEnd(34)} median ${median.toFixed(1).padStart(7)} ms  best ${ms[0].toFixed(1).padStart(7)} ms  ` +
      `${(((points / median) * 1e3) / 1e6).toFixed(2).padStart(6)} M points/s  (checksum ${samples[0].checksum.toExponential(6)})`,
  );
  return median;
}

console.log(
  `Boreline engine benchmark: ${BOATS} boats x ${SPEEDS} speeds = ${POINTS.toLocaleString('en')} points, node ${process.version}`,
);
const curveMs = measure('thrust curves (fillThrustCurve)', runCurves);
const baselineMs = measure('baseline (closed-form static)', runBaseline);
console.log(
  `ratio curve / baseline: ${(curveMs / baselineMs).toFixed(2)}x (target <= 4x); curve target >= 5 M points/s`,
);

// The matched model: an illustrative engine curve and mixed-flow pump characteristic (invented shapes).
const MATCHED_BOATS = 2_000;
const MATCHED_SPEEDS = 100;
const MATCHED_POINTS = MATCHED_BOATS * MATCHED_SPEEDS;
const matchedSetups: PreparedMatchedSetup[] = Array.from({ length: MATCHED_BOATS }, (_, i) =>
  prepareMatchedSetup({
    engine: {
      curve: [
        { rpm: 1500, powerKw: 60 },
        { rpm: 3000, powerKw: 170 },
        { rpm: 4500, powerKw: 260 + (i % 40) },
        { rpm: 5500, powerKw: 300 + (i % 50) },
        { rpm: 6200, powerKw: 290 + (i % 50) },
      ],
    },
    pump: {
      impellerDiameterMm: 240,
      curve: [
        { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
        { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
        { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
        { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
        { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
        { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
      ],
    },
    nozzleDiameterMm: 90 + ((i * 7) % 300) / 10,
    densityKgM3: model.densityKgM3,
    nozzleLossCoefficient: model.nozzleLossCoefficient,
    inletLossCoefficient: model.inletLossCoefficient,
    wakeFraction: model.wakeFraction,
  }),
);
const matchedSpeeds = Float64Array.from({ length: MATCHED_SPEEDS }, (_, i) => (i * 30) / MATCHED_SPEEDS);
const matchedOut: MatchedPoint = {
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
function runMatched(): number {
  let checksum = 0;
  for (let b = 0; b < MATCHED_BOATS; b++) {
    const s = matchedSetups[b];
    for (let i = 0; i < MATCHED_SPEEDS; i++) checksum += evaluateMatchedPoint(s, matchedSpeeds[i], matchedOut).thrustN;
  }
  return checksum;
}
const matchedMs = measure('matched model (evaluateMatchedPoint)', runMatched, MATCHED_POINTS);
const perPointMatched = matchedMs / MATCHED_POINTS;
const perPointCurve = curveMs / POINTS;
console.log(
  `matched: ${(1e3 / perPointMatched / 1e6).toFixed(2)} M points/s on one core (target >= 1 M/s); ` +
    `cost per point ${(perPointMatched / perPointCurve).toFixed(1)}x the fixed-power curve's, same run`,
);

const fleet: ParityBoatInput[] = Array.from({ length: 1000 }, (_, i) => ({
  id: `boat-${i}`,
  label: `Boat ${i}`,
  powerKw: 250 + ((i * 37) % 100),
  nozzleDiameterMm: 90 + ((i * 53) % 200) / 10,
  uPowerKw: 5,
  uNozzleDiameterMm: 0.05,
}));
const parityTimes: number[] = [];
let paritySink = 0;
for (let i = 0; i < 10 + RUNS; i++) {
  const start = process.hrtime.bigint();
  const report = computeParity(fleet, { ...model, referenceSpeedsMs: [10, 20, 30] });
  const ms = Number(process.hrtime.bigint() - start) / 1e6;
  paritySink += report.summary.spreadPercent + (report.boats[i % 1000].crossoverWithMedianMs ?? 0);
  if (i >= 10) parityTimes.push(ms); // first 10 runs warm the JIT
}
parityTimes.sort((a, b) => a - b);
console.log(
  `parity, 1,000 boats with uncertainty    median ${parityTimes[RUNS >> 1].toFixed(1)} ms  best ${parityTimes[0].toFixed(1)} ms ` +
    `(target well under 50 ms; checksum ${paritySink.toExponential(6)})`,
);
