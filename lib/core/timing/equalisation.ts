// An equalisation suggestion per boat, in seconds: how far its predicted time over the course lies from the class
// median, and the ballast or the nozzle restrictor that would bring a faster boat's predicted time to that median,
// each with its uncertainty. Same model as the balance levers (balance-levers.ts): each boat's own thrust model, each boat
// keeping its own fitted drag k. A slower boat gets no lever: adding speed is not a balance measure offered here.
//
// The lever is solved by the Illinois variant of regula falsi (Dowell & Jarratt, BIT 11, 1971) on the integrated
// time. Uncertainty: the boat's standard uncertainty of its predicted time u(t) (clock-section.ts) with the median
// taken as exact (stated); a lever's u is u(t) divided by the time's sensitivity to the lever at the solution
// (first order, JCGM 100:2008, 5.1.3), the sensitivity by central differences. Expanded U = 2u (k = 2).
// Framework-free.

import { EngineOperatingPointError } from '../engine/engine-input-error';
import { predictRun } from '../engine/run-prediction';
import { clockBoatThrust } from './clock-thrust';
import type { ClockSection } from './clock-section';

/** The predicted time after a lever is solved to this (s). */
export const EQUALISATION_TOLERANCE_S = 1e-4;
/** Ballast is not suggested beyond this fraction of the boat's mass, nor a nozzle below this fraction of its own. */
const MAX_BALLAST_FRACTION = 0.5;
const MIN_NOZZLE_FRACTION = 0.7;

export type EqualisationBoat = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  predictedS: number;
  /** Predicted minus the class median (s): negative, faster than the median. */
  fromMedianS: number;
  /** Expanded uncertainty (k = 2) of fromMedianS (s), the median taken as exact; null: unknown. */
  uFromMedianS: number | null;
  /** Ballast (kg) that brings the predicted time to the median; null: none suggested (see note). */
  ballastKg: number | null;
  uBallastKg: number | null;
  /** Nozzle exit diameter (mm) that brings the predicted time to the median; null: none suggested. */
  nozzleMm: number | null;
  uNozzleMm: number | null;
  note: string | null;
};

export type Equalisation = { distanceM: number; medianS: number | null; boats: EqualisationBoat[] };

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/** x in [lo, hi] with f(x) = 0, f(lo) and f(hi) of opposite signs (Illinois regula falsi). */
function solveIllinois(f: (x: number) => number, lo: number, hi: number, fLo: number, fHi: number): number {
  let side = 0;
  for (let i = 0; i < 100; i++) {
    const x = (lo * fHi - hi * fLo) / (fHi - fLo);
    const fx = f(x);
    if (Math.abs(fx) < EQUALISATION_TOLERANCE_S / 10 || hi - lo < 1e-12 * Math.max(1, Math.abs(x))) return x;
    if (fx * fHi > 0) {
      hi = x;
      fHi = fx;
      if (side === 1) fLo /= 2;
      side = 1;
    } else {
      lo = x;
      fLo = fx;
      if (side === -1) fHi /= 2;
      side = -1;
    }
  }
  return (lo + hi) / 2;
}

export function suggestEqualisation(section: ClockSection): Equalisation {
  const refs = section.assumptions.referenceDistancesM;
  const distanceM = section.courseLengthM ?? refs[refs.length - 1];
  const timed = section.boats.flatMap((b) => {
    const t = section.courseLengthM !== null ? b.courseTimeS : b.referenceTimesS[b.referenceTimesS.length - 1];
    return t !== null && b.massKg !== null && b.dragK !== null ? [{ b, t, massKg: b.massKg, dragK: b.dragK }] : [];
  });
  if (timed.length < 2) return { distanceM, medianS: null, boats: [] };
  const medianS = median(timed.map((x) => x.t));
  const boats = timed.map(({ b, t, massKg, dragK }): EqualisationBoat => {
    const timeAt = (nozzleMm: number, mass: number) =>
      predictRun({
        thrustN: clockBoatThrust(section.model, b, b.powerKw, nozzleMm),
        powerKw: b.powerKw,
        massKg: mass,
        dragK,
        distancesM: [distanceM],
      }).timesS[0];
    const fromMedianS = t - medianS;
    const u = b.uTimeS;
    const out: EqualisationBoat = {
      entryId: b.entryId,
      raceNumber: b.raceNumber,
      boatName: b.boatName,
      predictedS: t,
      fromMedianS,
      uFromMedianS: u === null ? null : 2 * u,
      ballastKg: null,
      uBallastKg: null,
      nozzleMm: null,
      uNozzleMm: null,
      note: null,
    };
    if (fromMedianS >= -EQUALISATION_TOLERANCE_S) {
      out.note =
        fromMedianS > EQUALISATION_TOLERANCE_S ? 'Slower than the median: no lever suggested' : 'At the median';
      return out;
    }
    const notes: string[] = [];
    try {
      // Ballast: time rises with mass.
      const fMass = (x: number) => (timeAt(b.nozzleDiameterMm, massKg + x) ?? Infinity) - medianS;
      const maxBallast = MAX_BALLAST_FRACTION * massKg;
      const fMax = fMass(maxBallast);
      if (fMax > 0) {
        const x = solveIllinois(fMass, 0, maxBallast, fromMedianS, fMax);
        out.ballastKg = x;
        const h = Math.max(0.5, x * 0.01);
        const dtdm = (fMass(x + h) - fMass(x - h)) / (2 * h);
        out.uBallastKg = u === null || !(dtdm > 0) ? null : (2 * u) / dtdm;
      } else notes.push(`no ballast up to ${maxBallast.toFixed(0)} kg reaches the median`);
      // Nozzle restrictor: a smaller exit at the same power; the time at the smallest allowed must reach the median.
      const fNozzle = (d: number) => (timeAt(d, massKg) ?? Infinity) - medianS;
      const dMin = MIN_NOZZLE_FRACTION * b.nozzleDiameterMm;
      const fMin = fNozzle(dMin);
      if (fMin > 0) {
        const d = solveIllinois(fNozzle, dMin, b.nozzleDiameterMm, fMin, fromMedianS);
        out.nozzleMm = d;
        const h = 0.01;
        const dtdd = (fNozzle(d + h) - fNozzle(d - h)) / (2 * h);
        out.uNozzleMm = u === null || dtdd === 0 || !Number.isFinite(dtdd) ? null : (2 * u) / Math.abs(dtdd);
      } else notes.push(`no restrictor down to ${dMin.toFixed(1)} mm reaches the median`);
    } catch (e) {
      // A matched boat whose engine and pump do not settle at a trial lever: no lever suggested, and why.
      if (!(e instanceof EngineOperatingPointError)) throw e;
      out.ballastKg = out.uBallastKg = out.nozzleMm = out.uNozzleMm = null;
      notes.splice(0, notes.length, `the matched model has no operating point at a trial lever (${e.message})`);
    }
    out.note = notes.length ? notes.join('; ') : null;
    return out;
  });
  return { distanceM, medianS, boats };
}
