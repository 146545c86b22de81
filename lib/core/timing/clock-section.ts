// The "model against the clock" section of a class: each boat's predicted run over the course beside its
// observed run times, and the comparison of the two (lib/core/stats/clock-comparison.ts). The thrust is the
// class's report model per boat (clock-thrust.ts): matched where the class reports on it and the boat declared
// both curves, else fixed power; a matched boat whose engine and pump do not settle at some speed of its run
// (or of its uncertainty's perturbed runs) falls back to fixed power, with the reason.
// Framework-free: the server gathers the inputs, this computes.

import { EngineOperatingPointError } from '../engine/engine-input-error';
import { fitQuadraticDragK, predictRun, type DragBasis } from '../engine/run-prediction';
import type { ThrustFunction } from '../engine/run-integrator';
import type { ReportBoatCurves, ReportModel } from '../reports/matched-figures';
import { compareModelToClock, type ClockComparison } from '../stats/clock-comparison';
import { clockBoatThrust, matchedThrust, type ClockThrustModel } from './clock-thrust';

/**
 * Masses added to the weight measured at inspection when the entrant has not declared them for the entry
 * (entry_mass_declarations): stated assumptions (common practice, no source: a driver and a navigator, part of a
 * tank). Each boat's row says which it used.
 */
export const CLOCK_ASSUMPTIONS = {
  crewKg: 160,
  fuelKg: 25,
  /** Top speed assumed for every boat when no boat of the class has a trap or GPS speed. */
  assumedTopSpeedMs: 30,
  referenceDistancesM: [100, 200],
} as const;

export type ClockBoat = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  powerKw: number;
  nozzleDiameterMm: number;
  /** Weighed at the inspection the figures come from; null when not weighed. */
  measuredWeightKg: number | null;
  /** Standard uncertainties (k = 1) of power and nozzle diameter, as the parity report carries them; absent: 0. */
  uPowerKw?: number;
  uNozzleDiameterMm?: number;
  /**
   * The engine curve and pump characteristic of its inspected declaration: given only where the parity report
   * figures the boat on the matched model (results.modelUsed[entryId].model === 'matched').
   */
  curves?: ReportBoatCurves | null;
  /** Why a boat of a matched class stays on fixed power (the report's reason), when it does. */
  fixedPowerReason?: string | null;
  /** Crew and fuel (kg) the entrant declared for the entry; null or absent: not declared, the assumption is used. */
  declaredCrewKg?: number | null;
  declaredFuelKg?: number | null;
};

export type MassSource = 'declared' | 'assumed';

export type ClockRun = {
  entryId: string;
  runLabel: string;
  courseLengthM: number;
  elapsedS: number;
  trapSpeedMs: number | null;
  gpsTopSpeedMs: number | null;
};

export type ClockBoatView = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  powerKw: number;
  nozzleDiameterMm: number;
  massKg: number | null;
  massBasis: string;
  /** The crew and fuel masses (kg) in massKg, and whether the entrant declared them or they are assumed (absent in sections stored before declarations). */
  crewKg?: number;
  crewSource?: MassSource;
  fuelKg?: number;
  fuelSource?: MassSource;
  dragK: number | null;
  dragBasis: DragBasis | null;
  dragNote: string;
  observedTopSpeedMs: number | null;
  /** Times to the reference distances, then to the course (s). */
  referenceTimesS: (number | null)[];
  courseTimeS: number | null;
  /**
   * Standard uncertainty (k = 1) of the course time (or the last reference distance's without a course) from the
   * boat's power, nozzle and mass uncertainties, first order with central differences through the whole
   * procedure, drag refitted (JCGM 100:2008, 5.1.2 and 5.1.3). The crew and fuel assumptions are not in it.
   */
  uTimeS: number | null;
  topSpeedMs: number | null;
  thrustToWeight: number | null;
  powerToWeightKwPerT: number | null;
  relativeAccuracy: number | null;
  observedS: number[];
  note: string | null;
  /** The thrust model its prediction used (absent in sections stored before it: fixed power). */
  thrustModel?: ClockThrustModel;
  /** Why a boat of a class on the matched model used fixed power; null otherwise. */
  thrustModelReason?: string | null;
  /** The declared curves (engine curve as declared) a matched boat's thrust came from, for what-if levers. */
  curves?: ReportBoatCurves;
};

export type ClockSection = {
  courseLengthM: number | null;
  /** Runs over other course lengths are left out of the comparison (how many). */
  otherCourseRuns: number;
  boats: ClockBoatView[];
  comparison: ClockComparison;
  /** The class's report model (each boat's own is in its row). */
  thrustModel: ReportModel;
  /** The water and loss model the thrust came from (the class's parity assumptions), for what-if levers. */
  model: ClockSectionInput['model'];
  assumptions: typeof CLOCK_ASSUMPTIONS;
  /** Largest relative accuracy the integrator reached over the boats (step-halving check). */
  worstRelativeAccuracy: number | null;
};

export type ClockSectionInput = {
  boats: ClockBoat[];
  /** Entered boats left out of the figures (not inspected, not conforming), with why. */
  excluded: { entryId: string; raceNumber: number; boatName: string; reason: string }[];
  runs: ClockRun[];
  /** The class's report model; absent: fixed power for every boat. */
  reportModel?: ReportModel;
  minimumWeightKg: number | null;
  /** Standard uncertainty of a weighing (kg, k = 1): the class's default U / 2. */
  uWeightKg: number;
  model: {
    densityKgM3: number;
    pumpEfficiency: number;
    nozzleLossCoefficient: number;
    inletLossCoefficient: number;
    wakeFraction: number;
  };
};

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const maxOf = (xs: (number | null)[]) => {
  const v = xs.filter((x): x is number => x !== null);
  return v.length ? Math.max(...v) : null;
};

/** The course length most runs of the class were timed over (the longest on a tie). */
function commonCourseLengthM(runs: ClockRun[]): number | null {
  const counts = new Map<number, number>();
  for (const r of runs) counts.set(r.courseLengthM, (counts.get(r.courseLengthM) ?? 0) + 1);
  let best: number | null = null;
  for (const [len, n] of counts)
    if (best === null || n > counts.get(best)! || (n === counts.get(best)! && len > best)) best = len;
  return best;
}

/** Raised inside a run when a matched boat has no operating point: the section is recomputed with it on fixed power. */
class MatchedFallback extends Error {
  constructor(
    readonly entryId: string,
    readonly reason: string,
  ) {
    super(reason);
  }
}

export function computeClockSection(input: ClockSectionInput): ClockSection {
  const reasons = new Map<string, string>();
  const matched = new Set<string>();
  if (input.reportModel === 'matched')
    for (const b of input.boats) {
      if (!b.curves) {
        reasons.set(b.entryId, b.fixedPowerReason ?? 'No engine curve and pump curve both declared');
        continue;
      }
      try {
        matchedThrust(input.model, b.curves, b.powerKw, b.nozzleDiameterMm);
        matched.add(b.entryId);
      } catch (e) {
        reasons.set(b.entryId, e instanceof Error ? e.message : String(e));
      }
    }
  // Each fallback takes one boat off the matched model, so this ends after at most one pass per boat.
  for (;;) {
    try {
      return computeWith(input, matched, reasons);
    } catch (e) {
      if (!(e instanceof MatchedFallback)) throw e;
      matched.delete(e.entryId);
      reasons.set(e.entryId, e.reason);
    }
  }
}

function computeWith(
  input: ClockSectionInput,
  matched: ReadonlySet<string>,
  reasons: ReadonlyMap<string, string>,
): ClockSection {
  const A = CLOCK_ASSUMPTIONS;
  const thrustOf = (b: ClockBoat, powerKw: number, nozzleDiameterMm: number): ThrustFunction => {
    if (!matched.has(b.entryId)) return clockBoatThrust(input.model, {}, powerKw, nozzleDiameterMm);
    const t = matchedThrust(input.model, b.curves!, powerKw, nozzleDiameterMm);
    return (v) => {
      try {
        return t(v);
      } catch (e) {
        if (e instanceof EngineOperatingPointError)
          throw new MatchedFallback(
            b.entryId,
            `The matched model has no operating point at ${v.toFixed(1)} m/s of the run (${e.message}): fixed power used`,
          );
        throw e;
      }
    };
  };
  const courseLengthM = commonCourseLengthM(input.runs);
  const onCourse = input.runs.filter((r) => r.courseLengthM === courseLengthM);
  const runsOf = (id: string) => input.runs.filter((r) => r.entryId === id);
  const thrusts = new Map(input.boats.map((b) => [b.entryId, thrustOf(b, b.powerKw, b.nozzleDiameterMm)]));

  // Each boat's own drag from its observed top speed: the GPS top speed, else the trap speed (highest of its runs).
  const fitted = new Map<string, { k: number | null; basis: DragBasis; speed: number }>();
  for (const b of input.boats) {
    const mine = runsOf(b.entryId);
    const gps = maxOf(mine.map((r) => r.gpsTopSpeedMs));
    const trap = maxOf(mine.map((r) => r.trapSpeedMs));
    const speed = gps ?? trap;
    if (speed !== null)
      fitted.set(b.entryId, {
        k: fitQuadraticDragK(thrusts.get(b.entryId)!, speed),
        basis: gps !== null ? 'gps_top_speed' : 'trap_speed',
        speed,
      });
  }
  const goodKs = [...fitted.values()].flatMap((f) => (f.k !== null ? [f.k] : []));
  const classK = goodKs.length ? median(goodKs) : null;

  const distances = courseLengthM !== null ? [...A.referenceDistancesM, courseLengthM] : [...A.referenceDistancesM];
  let worst: number | null = null;
  const boats: ClockBoatView[] = input.boats.map((b) => {
    const thrust = thrusts.get(b.entryId)!;
    const observedS = onCourse.filter((r) => r.entryId === b.entryId).map((r) => r.elapsedS);
    const base = {
      entryId: b.entryId,
      raceNumber: b.raceNumber,
      boatName: b.boatName,
      powerKw: b.powerKw,
      nozzleDiameterMm: b.nozzleDiameterMm,
      observedS,
      thrustModel: (matched.has(b.entryId) ? 'matched' : 'fixed_power') as ClockThrustModel,
      thrustModelReason: reasons.get(b.entryId) ?? null,
      ...(matched.has(b.entryId) && b.curves && { curves: b.curves }),
    };
    const weighed = b.measuredWeightKg;
    const hull = weighed ?? input.minimumWeightKg;
    const crewSource: MassSource = b.declaredCrewKg != null ? 'declared' : 'assumed';
    const fuelSource: MassSource = b.declaredFuelKg != null ? 'declared' : 'assumed';
    const crewKg = b.declaredCrewKg ?? A.crewKg;
    const fuelKg = b.declaredFuelKg ?? A.fuelKg;
    const massKg = hull === null ? null : hull + crewKg + fuelKg;
    const added = `${crewKg} kg crew (${crewSource}) + ${fuelKg} kg fuel (${fuelSource})`;
    const massBasis =
      weighed !== null
        ? `weighed ${weighed} kg + ${added}`
        : hull !== null
          ? `not weighed: class minimum ${hull} kg + ${added}`
          : 'not weighed and the class sets no minimum weight';
    const own = fitted.get(b.entryId);
    let dragK: number | null = null;
    let dragBasis: DragBasis | null = null;
    let dragNote: string;
    if (own && own.k !== null) {
      dragK = own.k;
      dragBasis = own.basis;
      dragNote = `fitted at its ${own.basis === 'gps_top_speed' ? 'GPS top speed' : 'trap speed'} of ${(own.speed * 3.6).toFixed(1)} km/h`;
    } else if (classK !== null) {
      dragK = classK;
      dragBasis = 'class_default';
      dragNote = own
        ? `the model has no thrust left at its observed ${(own.speed * 3.6).toFixed(1)} km/h: class median drag used`
        : 'no speed recorded: class median drag used';
    } else {
      dragK = fitQuadraticDragK(thrust, A.assumedTopSpeedMs);
      dragBasis = dragK === null ? null : 'class_default';
      dragNote = `no boat of the class has a recorded speed: drag set for an assumed ${(A.assumedTopSpeedMs * 3.6).toFixed(0)} km/h top speed`;
    }
    const empty = {
      ...base,
      massKg,
      massBasis,
      crewKg,
      crewSource,
      fuelKg,
      fuelSource,
      dragK,
      dragBasis,
      dragNote,
      observedTopSpeedMs: own?.speed ?? null,
      referenceTimesS: A.referenceDistancesM.map(() => null),
      courseTimeS: null,
      uTimeS: null,
      topSpeedMs: null,
      thrustToWeight: null,
      powerToWeightKwPerT: null,
      relativeAccuracy: null,
    };
    if (massKg === null) return { ...empty, note: 'No weight: no prediction' };
    if (dragK === null) return { ...empty, note: 'No drag could be set: no prediction' };
    const p = predictRun({ thrustN: thrust, powerKw: b.powerKw, massKg, dragK, distancesM: distances });
    worst = Math.max(worst ?? 0, p.relativeAccuracy);
    // The time to the last distance as a function of power, nozzle and mass, the drag refitted as above.
    const last = distances[distances.length - 1];
    const timeWith = (powerKw: number, nozzleDiameterMm: number, mass: number) => {
      const t = thrustOf(b, powerKw, nozzleDiameterMm);
      const k = own && own.k !== null ? fitQuadraticDragK(t, own.speed) : dragK;
      if (k === null) return null;
      return predictRun({ thrustN: t, powerKw, massKg: mass, dragK: k, distancesM: [last] }).timesS[0];
    };
    const sensitivity = (u: number, f: (h: number) => number | null) => {
      if (!(u > 0)) return 0;
      const up = f(u);
      const down = f(-u);
      return up === null || down === null ? NaN : (up - down) / 2;
    };
    const uMass = b.measuredWeightKg !== null ? input.uWeightKg : 0;
    const parts = [
      sensitivity(b.uPowerKw ?? 0, (h) => timeWith(b.powerKw + h, b.nozzleDiameterMm, massKg)),
      sensitivity(b.uNozzleDiameterMm ?? 0, (h) => timeWith(b.powerKw, b.nozzleDiameterMm + h, massKg)),
      sensitivity(uMass, (h) => timeWith(b.powerKw, b.nozzleDiameterMm, massKg + h)),
    ];
    const uTimeS = parts.some(Number.isNaN) ? null : Math.sqrt(parts.reduce((a, x) => a + x * x, 0));
    return {
      ...empty,
      uTimeS,
      referenceTimesS: p.timesS.slice(0, A.referenceDistancesM.length),
      courseTimeS: courseLengthM !== null ? p.timesS[A.referenceDistancesM.length] : null,
      topSpeedMs: p.topSpeedMs,
      thrustToWeight: p.thrustToWeight,
      powerToWeightKwPerT: p.powerToWeightKwPerT,
      relativeAccuracy: p.relativeAccuracy,
      note: null,
    };
  });
  const comparison = compareModelToClock([
    ...boats.map((b) => ({
      entryId: b.entryId,
      raceNumber: b.raceNumber,
      boatName: b.boatName,
      predictedS: b.courseTimeS,
      predictionNote: b.note ?? undefined,
      observedS: b.observedS,
    })),
    ...input.excluded.map((e) => ({
      entryId: e.entryId,
      raceNumber: e.raceNumber,
      boatName: e.boatName,
      predictedS: null,
      predictionNote: e.reason,
      observedS: onCourse.filter((r) => r.entryId === e.entryId).map((r) => r.elapsedS),
    })),
  ]);
  if (courseLengthM === null) comparison.notes.unshift('No run times are stored for this class yet.');
  return {
    courseLengthM,
    otherCourseRuns: input.runs.length - onCourse.length,
    boats,
    comparison,
    thrustModel: input.reportModel ?? 'fixed_power',
    model: input.model,
    assumptions: A,
    worstRelativeAccuracy: worst,
  };
}
