// Class parity: how evenly matched a set of boats is under one shared jet model.
//
// Definitions (documented because reports quote them):
// - Class median static thrust: the median of the boats' T0 (mean of the middle two when even).
// - Median boat (the reference for crossover speeds): for an odd count, the boat whose T0 is the
//   median (first in input order on ties). For an even count no boat sits at the median, so a
//   synthetic reference is used: the median of the powers, with the nozzle that gives exactly the
//   class median T0 at that power. Its curve therefore starts at the median static thrust.
// - Spread % = (max - min) / median x 100.
// - Coefficient of variation % = sample standard deviation (n - 1) / mean x 100; null for one boat.
// - Equalising nozzle: D_eq = D (T_median/T0)^(3/2) (T0 ∝ D^(2/3) at fixed power); it equalises
//   static thrust only. The range equalising nozzle (jet-equalising.ts) minimises the least-squares
//   relative deviation from the class median thrust over the reference speeds instead; both are given.
// - Uncertainties are standard (k = 1) and come from each boat's own u(P) and u(D) (JCGM 100:2008,
//   5.1.2, see jet-uncertainty.ts); the class median and the reference set-up are held exact.

import { EngineInputError, assertNonNegative, assertPositive } from './engine-input-error';
import {
  MAX_SPEED_MS,
  computeNozzleDiameterForStaticThrustMm,
  evaluateThrustN,
  prepareJetSetup,
  withPowerAndDiameter,
} from './jet';
import type { JetModelAssumptions, PreparedJetSetup } from './jet';
import { createCrossoverFinder } from './jet-crossover';
import { computeRangeEqualising } from './jet-equalising';
import type { RangeEqualising } from './jet-equalising';
import {
  computeCrossoverUncertaintyMs,
  computeEqualisingDiameterUncertaintyMm,
  computeStaticUncertainty,
  createThrustSensitivity,
} from './jet-uncertainty';

export interface ParityBoatInput {
  id: string;
  label: string;
  powerKw: number;
  nozzleDiameterMm: number;
  /** Standard uncertainty of power, kW. */
  uPowerKw?: number;
  /** Standard uncertainty of nozzle diameter, mm. */
  uNozzleDiameterMm?: number;
}

export interface ParityAssumptions extends JetModelAssumptions {
  /** Boat speeds (m/s) at which thrust is reported; default 10, 20 and 30 m/s. */
  referenceSpeedsMs?: readonly number[];
}

export const DEFAULT_REFERENCE_SPEEDS_MS: readonly number[] = [10, 20, 30];

export interface ParityThrustAtSpeed {
  speedMs: number;
  thrustN: number;
  uThrustN: number;
  isThrustPositive: boolean;
}

export interface ParityBoatResult {
  id: string;
  label: string;
  powerKw: number;
  nozzleDiameterMm: number;
  isReferenceBoat: boolean;
  staticThrustN: number;
  uStaticThrustN: number;
  /** The parts of uStaticThrustN from power and from nozzle diameter (T0 ∝ (P D)^(2/3)); absent in older reports. */
  uStaticThrustFromPowerN?: number;
  uStaticThrustFromDiameterN?: number;
  staticJetVelocityMs: number;
  uStaticJetVelocityMs: number;
  thrustAtReferenceSpeeds: ParityThrustAtSpeed[];
  deviationFromMedianN: number;
  deviationFromMedianPercent: number;
  uDeviationFromMedianN: number;
  uDeviationFromMedianPercent: number;
  /** Lowest speed below 100 m/s where this boat's curve crosses the median boat's; else null. */
  crossoverWithMedianMs: number | null;
  uCrossoverWithMedianMs: number | null;
  /** Nozzle that would give the class median T0 at this boat's power. */
  equalisingNozzleDiameterMm: number;
  uEqualisingNozzleDiameterMm: number;
  /**
   * The nozzle that best equalises thrust over the reference speeds (least squares), with the
   * deviation at each speed for it and for the static equalising nozzle; null when the class median
   * thrust is not positive at some reference speed. Absent in reports computed before it.
   */
  rangeEqualising?: RangeEqualising | null;
}

export interface ParityReferenceSetup {
  kind: 'boat' | 'synthetic';
  boatId: string | null;
  powerKw: number;
  nozzleDiameterMm: number;
  staticThrustN: number;
}

export interface ParitySummary {
  boatCount: number;
  medianStaticThrustN: number;
  minStaticThrustN: number;
  maxStaticThrustN: number;
  meanStaticThrustN: number;
  sampleStandardDeviationN: number | null;
  maxMinRatio: number;
  spreadPercent: number;
  coefficientOfVariationPercent: number | null;
}

export interface ParityReport {
  summary: ParitySummary;
  referenceSetup: ParityReferenceSetup;
  boats: ParityBoatResult[];
}

/** Median of a numeric array (mean of the middle two for an even count). */
export function computeMedian(values: ArrayLike<number>): number {
  const sorted = Float64Array.from(values).sort();
  const n = sorted.length;
  if (n === 0) throw new EngineInputError('values', 'The median of an empty set is undefined');
  const mid = n >> 1;
  return n % 2 === 1 ? sorted[mid] : 0.5 * (sorted[mid - 1] + sorted[mid]);
}

function summarise(staticThrustN: Float64Array, medianN: number): ParitySummary {
  const n = staticThrustN.length;
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const t = staticThrustN[i];
    if (t < min) min = t;
    if (t > max) max = t;
    sum += t;
  }
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (staticThrustN[i] - mean) ** 2;
  const sd = n > 1 ? Math.sqrt(ss / (n - 1)) : null;
  return {
    boatCount: n,
    medianStaticThrustN: medianN,
    minStaticThrustN: min,
    maxStaticThrustN: max,
    meanStaticThrustN: mean,
    sampleStandardDeviationN: sd,
    maxMinRatio: max / min,
    spreadPercent: ((max - min) / medianN) * 100,
    coefficientOfVariationPercent: sd === null ? null : (sd / mean) * 100,
  };
}

function validateBoats(boats: readonly ParityBoatInput[]): void {
  if (!Array.isArray(boats) || boats.length === 0) {
    throw new EngineInputError('boats', 'Parity needs at least one boat');
  }
  const ids = new Set<string>();
  boats.forEach((b, i) => {
    if (b === null || typeof b !== 'object') throw new EngineInputError(`boats[${i}]`, 'Each boat must be an object');
    if (typeof b.id !== 'string' || b.id === '') throw new EngineInputError(`boats[${i}].id`, 'Each boat needs an id');
    if (ids.has(b.id)) throw new EngineInputError(`boats[${i}].id`, `Duplicate boat id "${b.id}"`);
    ids.add(b.id);
    if (typeof b.label !== 'string') throw new EngineInputError(`boats[${i}].label`, 'Each boat needs a label');
    assertPositive(`boats[${i}].powerKw`, b.powerKw);
    assertPositive(`boats[${i}].nozzleDiameterMm`, b.nozzleDiameterMm);
    assertNonNegative(`boats[${i}].uPowerKw`, b.uPowerKw ?? 0);
    assertNonNegative(`boats[${i}].uNozzleDiameterMm`, b.uNozzleDiameterMm ?? 0);
  });
}

export function computeParity(boats: readonly ParityBoatInput[], assumptions: ParityAssumptions): ParityReport {
  validateBoats(boats);
  const speeds = assumptions.referenceSpeedsMs ?? DEFAULT_REFERENCE_SPEEDS_MS;
  if (!Array.isArray(speeds)) throw new EngineInputError('referenceSpeedsMs', 'referenceSpeedsMs must be an array');
  const model: JetModelAssumptions = {
    densityKgM3: assumptions.densityKgM3,
    pumpEfficiency: assumptions.pumpEfficiency,
    nozzleLossCoefficient: assumptions.nozzleLossCoefficient,
    inletLossCoefficient: assumptions.inletLossCoefficient,
    wakeFraction: assumptions.wakeFraction,
  };
  const n = boats.length;
  // Validate the shared model once, then derive each boat's set-up from it.
  const base = prepareJetSetup({ ...model, powerKw: boats[0].powerKw, nozzleDiameterMm: boats[0].nozzleDiameterMm });
  const prepared: PreparedJetSetup[] = boats.map((b) => withPowerAndDiameter(base, b.powerKw, b.nozzleDiameterMm));
  speeds.forEach((v, j) => {
    if (!(typeof v === 'number' && v >= 0 && v <= MAX_SPEED_MS)) {
      throw new EngineInputError(
        `referenceSpeedsMs[${j}]`,
        `Reference speeds must be 0 to ${MAX_SPEED_MS} m/s (got ${String(v)})`,
      );
    }
  });
  const t0 = new Float64Array(n);
  const v0 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    v0[i] = Math.cbrt(prepared[i].q);
    t0[i] = prepared[i].rhoAreaKgM * v0[i] * v0[i];
  }
  const medianN = computeMedian(t0);

  let reference: ParityReferenceSetup;
  let referenceIndex = -1;
  if (n % 2 === 1) {
    referenceIndex = t0.indexOf(medianN);
    const b = boats[referenceIndex];
    reference = {
      kind: 'boat',
      boatId: b.id,
      powerKw: b.powerKw,
      nozzleDiameterMm: b.nozzleDiameterMm,
      staticThrustN: medianN,
    };
  } else {
    const powerKw = computeMedian(boats.map((b) => b.powerKw));
    const nozzleDiameterMm = computeNozzleDiameterForStaticThrustMm({
      ...model,
      targetStaticThrustN: medianN,
      powerKw,
    });
    reference = { kind: 'synthetic', boatId: null, powerKw, nozzleDiameterMm, staticThrustN: medianN };
  }
  const referenceSetup =
    referenceIndex >= 0
      ? prepared[referenceIndex]
      : withPowerAndDiameter(base, reference.powerKw, reference.nozzleDiameterMm);
  const findCrossover = createCrossoverFinder(referenceSetup);

  const results: ParityBoatResult[] = boats.map((b, i) => {
    const s = prepared[i];
    const u = { uPowerKw: b.uPowerKw ?? 0, uNozzleDiameterMm: b.uNozzleDiameterMm ?? 0 };
    const hasUncertainty = u.uPowerKw > 0 || u.uNozzleDiameterMm > 0;
    const staticU = computeStaticUncertainty(s, u);
    const sensitivity = hasUncertainty ? createThrustSensitivity(s) : null;
    const thrustAtReferenceSpeeds = speeds.map((speedMs) => {
      const thrustN = evaluateThrustN(s, speedMs);
      let uThrustN = 0;
      if (sensitivity) {
        const c = sensitivity.atSpeed(speedMs);
        uThrustN = Math.hypot(c.thrustPerPowerNPerKw * u.uPowerKw, c.thrustPerDiameterNPerMm * u.uNozzleDiameterMm);
      }
      return { speedMs, thrustN, uThrustN, isThrustPositive: thrustN > 0 };
    });
    const crossover = i === referenceIndex ? null : findCrossover(s);
    let uCrossover: number | null = null;
    if (crossover !== null) {
      uCrossover = sensitivity ? computeCrossoverUncertaintyMs(sensitivity, referenceSetup, crossover, u) : 0;
    }
    // At fixed power T0 ∝ D^(2/3), so D_eq = D (T_median/T0)^(3/2): the same inversion as
    // computeNozzleDiameterForStaticThrustMm, without rebuilding a set-up per boat.
    const equalising = b.nozzleDiameterMm * (medianN / t0[i]) ** 1.5;
    return {
      id: b.id,
      label: b.label,
      powerKw: b.powerKw,
      nozzleDiameterMm: b.nozzleDiameterMm,
      isReferenceBoat: i === referenceIndex,
      staticThrustN: t0[i],
      uStaticThrustN: staticU.uStaticThrustN,
      uStaticThrustFromPowerN: (2 / 3) * (u.uPowerKw / b.powerKw) * t0[i],
      uStaticThrustFromDiameterN: (2 / 3) * (u.uNozzleDiameterMm / b.nozzleDiameterMm) * t0[i],
      staticJetVelocityMs: v0[i],
      uStaticJetVelocityMs: staticU.uStaticJetVelocityMs,
      thrustAtReferenceSpeeds,
      deviationFromMedianN: t0[i] - medianN,
      deviationFromMedianPercent: ((t0[i] - medianN) / medianN) * 100,
      uDeviationFromMedianN: staticU.uStaticThrustN,
      uDeviationFromMedianPercent: (staticU.uStaticThrustN / medianN) * 100,
      crossoverWithMedianMs: crossover,
      uCrossoverWithMedianMs: uCrossover,
      equalisingNozzleDiameterMm: equalising,
      uEqualisingNozzleDiameterMm: computeEqualisingDiameterUncertaintyMm(equalising, b.powerKw, u.uPowerKw),
    };
  });

  // The class median thrust at each reference speed, then each boat's range equalising nozzle.
  const medianAtSpeed = Float64Array.from(speeds, (_, j) =>
    computeMedian(results.map((r) => r.thrustAtReferenceSpeeds[j].thrustN)),
  );
  const medianPositive = speeds.length > 0 && medianAtSpeed.every((m) => m > 0);
  results.forEach((r, i) => {
    r.rangeEqualising = medianPositive
      ? computeRangeEqualising(prepared[i], speeds, medianAtSpeed, r.equalisingNozzleDiameterMm)
      : null;
  });

  return { summary: summarise(t0, medianN), referenceSetup: reference, boats: results };
}
