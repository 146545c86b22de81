// Balance levers in seconds: what a nozzle restrictor, a minimum all-up mass (ballast up to it), a power cap or
// another impeller would do to each boat's predicted time over the course, and to the class's spread of predicted
// times. Each boat keeps its own fitted drag k (a hull's drag does not change with its nozzle, engine or impeller),
// so a lever that cuts thrust also lowers its top speed. Each boat's own thrust model (clock-thrust.ts): on the
// matched model a power cap scales its levelled engine curve, a restrictor changes its matched set-up's nozzle and
// an impeller change replaces its pump curve (a catalogue entry) or scales its efficiency; on fixed power an
// impeller enters only through the pump efficiency (momentum theory at fixed power: jet.ts), so only the factor
// applies there. A boat the levers leave without a time (no operating point, an impeller that cannot be figured)
// is listed with why, and the spreads are over the boats that have a time. Framework-free: runs in the browser.

import { EngineOperatingPointError } from '../engine/engine-input-error';
import { predictRun } from '../engine/run-prediction';
import { clockBoatThrustWithImpeller, ImpellerChangeError, type ImpellerChange } from './clock-thrust';
import type { ClockSection } from './clock-section';

export type BalanceLevers = {
  /** Nozzle exit diameters above this are restricted to it (mm); null: none. */
  nozzleCapMm: number | null;
  /** Boats lighter than this all-up mass carry ballast up to it (kg); null: none. */
  minimumMassKg: number | null;
  /** Shaft power above this is capped to it (kW), as a rev limit would; null: none. */
  powerCapKw: number | null;
  /** Another impeller per boat (entry id); a boat not named keeps its own. */
  impellers?: Readonly<Record<string, ImpellerChange>>;
};

/** One impeller of the meeting's pump catalogue, as the sandbox offers it. */
export type CatalogueImpeller = {
  id: string;
  /** Maker, model and trim. */
  label: string;
  impellerDiameterMm: number;
  curve: { flowCoefficient: number; headCoefficient: number; efficiency: number }[];
};

export type LeverBoat = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  beforeS: number;
  afterS: number;
  deltaS: number;
  ballastKg: number;
  /** The impeller change applied to it, in words; null: its own impeller. */
  impeller: string | null;
  /** Seconds from the class median predicted time after the levers (positive: slower than the median). */
  fromMedianS: number;
  /** Expanded uncertainty (k = 2) of today's predicted time, from the boat's power, nozzle and mass; null: unknown. */
  expandedUncertaintyS: number | null;
};

export type LeverOutcome = {
  boats: LeverBoat[];
  /** Boats with a time today that the levers leave without one, with why (not in the spreads). */
  leftOut: { entryId: string; raceNumber: number; boatName: string; reason: string }[];
  spreadBeforeS: number | null;
  spreadAfterS: number | null;
};

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const spread = (xs: number[]) => (xs.length >= 2 ? Math.max(...xs) - Math.min(...xs) : null);

/** An impeller change in words, for the boat's row. */
export function impellerChangeWords(change: ImpellerChange | undefined): string | null {
  if (!change || (change.pump === undefined && change.efficiencyFactor === undefined)) return null;
  const parts = [
    ...(change.pump ? [`${change.pump.label} (Ø ${change.pump.impellerDiameterMm} mm)`] : []),
    ...(change.efficiencyFactor !== undefined ? [`efficiency × ${change.efficiencyFactor}`] : []),
  ];
  return parts.join(', ');
}

export function applyBalanceLevers(section: ClockSection, levers: BalanceLevers): LeverOutcome {
  const distance =
    section.courseLengthM ??
    section.assumptions.referenceDistancesM[section.assumptions.referenceDistancesM.length - 1];
  const boats: Omit<LeverBoat, 'fromMedianS'>[] = [];
  const leftOut: LeverOutcome['leftOut'] = [];
  for (const b of section.boats) {
    if (b.massKg === null || b.dragK === null) continue;
    const before = section.courseLengthM !== null ? b.courseTimeS : b.referenceTimesS[b.referenceTimesS.length - 1];
    if (before === null) continue;
    const nozzle = levers.nozzleCapMm !== null ? Math.min(b.nozzleDiameterMm, levers.nozzleCapMm) : b.nozzleDiameterMm;
    const power = levers.powerCapKw !== null ? Math.min(b.powerKw, levers.powerCapKw) : b.powerKw;
    const ballastKg = levers.minimumMassKg !== null ? Math.max(0, levers.minimumMassKg - b.massKg) : 0;
    const change = levers.impellers?.[b.entryId];
    const out = (reason: string) =>
      leftOut.push({ entryId: b.entryId, raceNumber: b.raceNumber, boatName: b.boatName, reason });
    let after: number | null;
    try {
      after = predictRun({
        thrustN: clockBoatThrustWithImpeller(section.model, b, power, nozzle, change),
        powerKw: power,
        massKg: b.massKg + ballastKg,
        dragK: b.dragK,
        distancesM: [distance],
      }).timesS[0];
    } catch (e) {
      // A matched boat whose engine and pump do not settle under these levers has no time, as a boat with no thrust.
      if (e instanceof EngineOperatingPointError) {
        out(`Engine and pump do not settle with these levers: ${e.message}`);
        continue;
      }
      if (e instanceof ImpellerChangeError) {
        out(e.message);
        continue;
      }
      throw e;
    }
    if (after === null) {
      out('No thrust left to cover the course with these levers');
      continue;
    }
    boats.push({
      entryId: b.entryId,
      raceNumber: b.raceNumber,
      boatName: b.boatName,
      beforeS: before,
      afterS: after,
      deltaS: after - before,
      ballastKg,
      impeller: impellerChangeWords(change),
      expandedUncertaintyS: b.uTimeS === null ? null : 2 * b.uTimeS,
    });
  }
  const mid = boats.length ? median(boats.map((b) => b.afterS)) : 0;
  return {
    boats: boats.map((b) => ({ ...b, fromMedianS: b.afterS - mid })),
    leftOut,
    spreadBeforeS: spread(boats.map((b) => b.beforeS)),
    spreadAfterS: spread(boats.map((b) => b.afterS)),
  };
}
