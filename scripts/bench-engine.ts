// Engine benchmark: npx tsx scripts/bench-engine.ts
// 1. Thrust curves, 10,000 boats x 200 speeds (2 million points), through fillThrustCurve.
// 2. Baseline: the closed-form static formula T0 = (2 eta P/(1+K_n))^(2/3) (rho A)^(1/3) evaluated
//    for the same number of points (each point a different power, so nothing can be hoisted).
// 3. Class parity for 1,000 boats with uncertainties.
// Prints figures only; never asserts timing (exit 0). Checksums are printed so no loop is dead code.

import { computeParity, fillThrustCurve, prepareJetSetup } from '../lib/core/engine/index';
import type { ParityBoatInput, PreparedJetSetup } from '../lib/core/engine/index';

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

function measure(name: string, fn: () => number): number {
  for (let i = 0; i < 3; i++) time(fn); // warm-up: let the JIT optimise before timing
  const samples = Array.from({ length: RUNS }, () => time(fn));
  const ms = samples.map((s) => s.ms).sort((a, b) => a - b);
  const median = ms[RUNS >> 1];
  console.log(
    `${name.padEnd(34)} median ${median.toFixed(1).padStart(7)} ms  best ${ms[0].toFixed(1).padStart(7)} ms  ` +
      `${(((POINTS / median) * 1e3) / 1e6).toFixed(1).padStart(6)} M points/s  (checksum ${samples[0].checksum.toExponential(6)})`,
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
