// Balance levers in seconds: what a nozzle restrictor, a minimum all-up mass (ballast up to it) or a power
// cap would do to each boat's predicted time over the course, and to the class's spread of predicted times.
// Each boat keeps its own fitted drag k (a hull's drag does not change with its nozzle or engine), so a lever
// that cuts thrust also lowers its top speed. Fixed-power thrust (run-prediction.ts); an impeller change
// needs the matched engine-and-pump model and is not offered here yet. Framework-free: runs in the browser.

import { fixedPowerThrust, predictRun } from '../engine/run-prediction';
import type { ClockSection } from './clock-section';

export type BalanceLevers = {
  /** Nozzle exit diameters above this are restricted to it (mm); null: none. */
  nozzleCapMm: number | null;
  /** Boats lighter than this all-up mass carry ballast up to it (kg); null: none. */
  minimumMassKg: number | null;
  /** Shaft power above this is capped to it (kW), as a rev limit would; null: none. */
  powerCapKw: number | null;
};

export type LeverBoat = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  beforeS: number;
  afterS: number;
  deltaS: number;
  ballastKg: number;
  /** Seconds from the class median predicted time after the levers (positive: slower than the median). */
  fromMedianS: number;
  /** Expanded uncertainty (k = 2) of today's predicted time, from the boat's power, nozzle and mass; null: unknown. */
  expandedUncertaintyS: number | null;
};

export type LeverOutcome = {
  boats: LeverBoat[];
  spreadBeforeS: number | null;
  spreadAfterS: number | null;
};

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const spread = (xs: number[]) => (xs.length >= 2 ? Math.max(...xs) - Math.min(...xs) : null);

export function applyBalanceLevers(section: ClockSection, levers: BalanceLevers): LeverOutcome {
  const distance =
    section.courseLengthM ??
    section.assumptions.referenceDistancesM[section.assumptions.referenceDistancesM.length - 1];
  const boats: Omit<LeverBoat, 'fromMedianS'>[] = [];
  for (const b of section.boats) {
    if (b.massKg === null || b.dragK === null) continue;
    const before = section.courseLengthM !== null ? b.courseTimeS : b.referenceTimesS[b.referenceTimesS.length - 1];
    if (before === null) continue;
    const nozzle = levers.nozzleCapMm !== null ? Math.min(b.nozzleDiameterMm, levers.nozzleCapMm) : b.nozzleDiameterMm;
    const power = levers.powerCapKw !== null ? Math.min(b.powerKw, levers.powerCapKw) : b.powerKw;
    const ballastKg = levers.minimumMassKg !== null ? Math.max(0, levers.minimumMassKg - b.massKg) : 0;
    const thrust = fixedPowerThrust({ ...section.model, powerKw: power, nozzleDiameterMm: nozzle });
    const after = predictRun({
      thrustN: thrust,
      powerKw: power,
      massKg: b.massKg + ballastKg,
      dragK: b.dragK,
      distancesM: [distance],
    }).timesS[0];
    if (after === null) continue;
    boats.push({
      entryId: b.entryId,
      raceNumber: b.raceNumber,
      boatName: b.boatName,
      beforeS: before,
      afterS: after,
      deltaS: after - before,
      ballastKg,
      expandedUncertaintyS: b.uTimeS === null ? null : 2 * b.uTimeS,
    });
  }
  const mid = boats.length ? median(boats.map((b) => b.afterS)) : 0;
  return {
    boats: boats.map((b) => ({ ...b, fromMedianS: b.afterS - mid })),
    spreadBeforeS: spread(boats.map((b) => b.beforeS)),
    spreadAfterS: spread(boats.map((b) => b.afterS)),
  };
}
