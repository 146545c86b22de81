// Balance levers in seconds: what a nozzle restrictor, a minimum all-up mass (ballast up to it) or a power
// cap would do to each boat's predicted time over the course, and to the class's spread of predicted times.
// Each boat keeps its own fitted drag k (a hull's drag does not change with its nozzle or engine), so a lever
// that cuts thrust also lowers its top speed. Each boat's own thrust model (clock-thrust.ts): on the matched
// model a power cap scales its levelled engine curve and a restrictor changes its matched set-up's nozzle; an
// impeller change is not offered here yet. Framework-free: runs in the browser.

import { EngineOperatingPointError } from '../engine/engine-input-error';
import { predictRun } from '../engine/run-prediction';
import { clockBoatThrust } from './clock-thrust';
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
    let after: number | null;
    try {
      after = predictRun({
        thrustN: clockBoatThrust(section.model, b, power, nozzle),
        powerKw: power,
        massKg: b.massKg + ballastKg,
        dragK: b.dragK,
        distancesM: [distance],
      }).timesS[0];
    } catch (e) {
      // A matched boat whose engine and pump do not settle under these levers has no time, as a boat with no thrust.
      if (e instanceof EngineOperatingPointError) continue;
      throw e;
    }
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
