// The matched model in a class's parity report (issue 19, items 1–3): where the class chose it and a boat
// declared both an engine curve and a pump characteristic, its static thrust and thrust at the reference
// speeds are where its engine and pump settle (lib/core/engine/jet-matched.ts: affinity laws, Karassik's
// Pump Handbook; Brennen, Hydrodynamics of Pumps, 1994), at the nozzle diameter the scrutineer measured.
//
// Uncertainty of those figures: first order (JCGM 100:2008, 5.1.2), sensitivities by central finite
// differences: to the power, the whole engine curve scaled by 1 ± h (the boat's relative power
// uncertainty from its evidence applies to the curve as a whole); to the nozzle diameter, D ± h·D.
// The declared curve is first scaled so that its peak is the power the inspection confirmed: the
// curve says how power varies with rpm, the evidence says how much there is.
// The curves' own shape uncertainty (the pump maker's points) is not computed.
//
// Cavitation: where the boat declared its inlet depth and suction data, each point is checked
// (lib/core/engine/cavitation.ts); a flagged point's thrust is an upper bound.
//
// The equalising nozzles (applyMatchedEqualising) and the Monte Carlo odds (parity-monte-carlo.ts) use
// the matched model for a matched boat. What still uses the fixed-power model for a matched boat: the
// crossover with the median boat, and the chart's median curve (the fixed-power median set-up); the
// report says so.

import { computeMedian, type ParityReport } from '../engine/parity';
import { computeMatchedCurve, type MatchedSetupInput, type PreparedMatchedSetup } from '../engine/jet-matched';
import { computeRangeEqualising } from '../engine/jet-equalising';
import {
  computeMatchedRangeEqualising,
  computeMatchedStaticEqualisingMm,
  createMatchedThrust,
} from '../engine/jet-equalising-matched';
import { evaluateThrustN, type PreparedJetSetup } from '../engine/jet';
import { computeEqualisingDiameterUncertaintyMm } from '../engine/jet-uncertainty';
import { checkSuction, prepareSuction, type SuctionInput } from '../engine/cavitation';
import { EngineInputError, EngineOperatingPointError } from '../engine/engine-input-error';

export const REPORT_MODELS = ['fixed_power', 'matched'] as const;
export type ReportModel = (typeof REPORT_MODELS)[number];

export type ReportBoatCurves = {
  engine: { curve: { rpm: number; powerKw: number }[]; limiterRpm?: number };
  pump: {
    impellerDiameterMm: number;
    curve: { flowCoefficient: number; headCoefficient: number; efficiency: number }[];
  };
};

export type MatchedReportPoint = {
  speedMs: number;
  rpm: number;
  shaftPowerKw: number;
  flowM3s: number;
  flowCoefficient: number;
  pumpEfficiency: number;
  jetVelocityMs: number;
  thrustN: number;
  /** Standard uncertainty (k = 1), first order by finite differences: the root sum of squares of the two parts below. */
  uThrustN: number;
  /** The part from the power (the engine curve scaled) and the part from the nozzle diameter. */
  uThrustFromPowerN: number;
  uThrustFromDiameterN: number;
  limitedBy: 'engine' | 'limiter';
  /** null: no suction data declared, so not checked. */
  cavitating: boolean | null;
  availableNpshM?: number;
  requiredNpshM?: number;
};

/** Which model gave a boat's figures, and why. */
export type BoatModelUsed = {
  model: ReportModel;
  /** Why a boat of a matched class stayed on fixed power (no curves, or no operating point). */
  reason?: string;
  /** Static (0 m/s) first, then each reference speed: only for matched boats. */
  points?: MatchedReportPoint[];
  /**
   * Matched boats: the declared engine curve's peak, and the power it was scaled to (the power the
   * inspection confirmed, as the fixed-power figures use). The curve gives the shape only.
   */
  declaredPeakKw?: number;
  scaledToKw?: number;
  /**
   * Matched boats: the model of its equalising nozzles ('fixed_power' when no nozzle between a quarter
   * and four times its own brings its matched static thrust to the median). Absent in older reports.
   */
  equalisingModel?: ReportModel;
};

type Model = {
  densityKgM3: number;
  nozzleLossCoefficient: number;
  inletLossCoefficient: number;
  wakeFraction: number;
};

const RELATIVE_STEP = 1e-4;

function scaledEngine(curves: ReportBoatCurves, factor: number): MatchedSetupInput['engine'] {
  return {
    curve: curves.engine.curve.map((p) => ({ rpm: p.rpm, powerKw: p.powerKw * factor })),
    ...(curves.engine.limiterRpm !== undefined && { limiterRpm: curves.engine.limiterRpm }),
  };
}

const curvePeakKw = (curves: ReportBoatCurves) => Math.max(...curves.engine.curve.map((p) => p.powerKw));

/** The factor that takes the declared curve's peak to the confirmed power; null when either is not above zero. */
function curveLevel(curves: ReportBoatCurves, powerKw: number): number | null {
  const peak = curvePeakKw(curves);
  return peak > 0 && powerKw > 0 ? powerKw / peak : null;
}

/** The declared curves with the engine curve's peak at the confirmed power (null: nothing to scale). */
export function levelledCurves(curves: ReportBoatCurves, powerKw: number): ReportBoatCurves | null {
  const level = curveLevel(curves, powerKw);
  if (level == null) return null;
  const { curve, limiterRpm } = scaledEngine(curves, level);
  return { ...curves, engine: { curve: [...curve], ...(limiterRpm !== undefined && { limiterRpm }) } };
}

/**
 * A boat's matched figures at 0 m/s and the reference speeds; an operating point that does not exist
 * on the declared curves leaves the boat on fixed power, with the reason.
 */
export function computeMatchedBoat(
  boat: {
    nozzleDiameterMm: number;
    uNozzleDiameterMm: number;
    powerKw: number;
    uPowerKw: number;
    curves: ReportBoatCurves;
    suction?: SuctionInput | null;
  },
  model: Model,
  referenceSpeedsMs: readonly number[],
): BoatModelUsed {
  const speeds = [0, ...referenceSpeedsMs];
  // The declared curve gives the engine's shape; its level is the power the inspection confirmed (dyno
  // sheet, maker's rating or declaration, as for the fixed-power figures). Taken as typed, an owner's
  // curve would set the boat's figures, and through the median every other boat's (attack finding, s7).
  const declaredPeakKw = curvePeakKw(boat.curves);
  const level = curveLevel(boat.curves, boat.powerKw);
  if (level == null)
    return { model: 'fixed_power', reason: 'The declared engine curve has no power above zero to scale.' };
  const setup = (engineFactor: number, nozzleMm: number): MatchedSetupInput => ({
    ...model,
    engine: scaledEngine(boat.curves, level * engineFactor),
    pump: boat.curves.pump,
    nozzleDiameterMm: nozzleMm,
  });
  try {
    const base = computeMatchedCurve(setup(1, boat.nozzleDiameterMm), speeds);
    const hP = RELATIVE_STEP;
    const hD = RELATIVE_STEP * boat.nozzleDiameterMm;
    const pUp = computeMatchedCurve(setup(1 + hP, boat.nozzleDiameterMm), speeds);
    const pDown = computeMatchedCurve(setup(1 - hP, boat.nozzleDiameterMm), speeds);
    const dUp = computeMatchedCurve(setup(1, boat.nozzleDiameterMm + hD), speeds);
    const dDown = computeMatchedCurve(setup(1, boat.nozzleDiameterMm - hD), speeds);
    const uRelPower = boat.powerKw > 0 ? boat.uPowerKw / boat.powerKw : 0;
    const suction = boat.suction ? prepareSuction(boat.suction) : null;
    const points = base.map((p, i): MatchedReportPoint => {
      // dT/d(scale) times the relative power uncertainty; dT/dD times u(D).
      const perScale = (pUp[i].thrustN - pDown[i].thrustN) / (2 * hP);
      const perMm = (dUp[i].thrustN - dDown[i].thrustN) / (2 * hD);
      const inflowMs = (1 - model.wakeFraction) * p.speedMs;
      const check = suction
        ? checkSuction(suction, model.densityKgM3, model.inletLossCoefficient, p.rpm, p.flowM3s, inflowMs)
        : null;
      return {
        speedMs: p.speedMs,
        rpm: p.rpm,
        shaftPowerKw: p.shaftPowerKw,
        flowM3s: p.flowM3s,
        flowCoefficient: p.flowCoefficient,
        pumpEfficiency: p.pumpEfficiency,
        jetVelocityMs: p.jetVelocityMs,
        thrustN: p.thrustN,
        uThrustN: Math.hypot(perScale * uRelPower, perMm * boat.uNozzleDiameterMm),
        uThrustFromPowerN: Math.abs(perScale * uRelPower),
        uThrustFromDiameterN: Math.abs(perMm * boat.uNozzleDiameterMm),
        limitedBy: p.limitedBy,
        cavitating: check ? check.cavitating : null,
        ...(check && { availableNpshM: check.availableNpshM, requiredNpshM: check.requiredNpshM }),
      };
    });
    return { model: 'matched', points, declaredPeakKw, scaledToKw: boat.powerKw };
  } catch (err) {
    if (err instanceof EngineOperatingPointError || err instanceof EngineInputError)
      return { model: 'fixed_power', reason: `No matched operating point on the declared curves: ${err.message}` };
    throw err;
  }
}

/**
 * The parity figures with each matched boat's static thrust and thrust at the reference speeds taken
 * from the matched model, and the class summary and every boat's deviation from the median recomputed
 * from them (the median is the class's, whatever model each boat used).
 */
export function applyMatchedFigures(parity: ParityReport, used: Record<string, BoatModelUsed>): ParityReport {
  const boats = parity.boats.map((b) => {
    const points = used[b.id]?.model === 'matched' ? used[b.id].points : undefined;
    if (!points) return b;
    const [rest, ...atSpeeds] = points;
    return {
      ...b,
      staticThrustN: rest.thrustN,
      uStaticThrustN: rest.uThrustN,
      uStaticThrustFromPowerN: rest.uThrustFromPowerN,
      uStaticThrustFromDiameterN: rest.uThrustFromDiameterN,
      thrustAtReferenceSpeeds: b.thrustAtReferenceSpeeds.map((t, j) => ({
        speedMs: t.speedMs,
        thrustN: atSpeeds[j].thrustN,
        uThrustN: atSpeeds[j].uThrustN,
        isThrustPositive: atSpeeds[j].thrustN > 0,
      })),
    };
  });
  const t0 = boats.map((b) => b.staticThrustN);
  const median = computeMedian(t0);
  const medianIndex = t0.indexOf(median);
  const n = t0.length;
  const min = Math.min(...t0);
  const max = Math.max(...t0);
  const mean = t0.reduce((s, t) => s + t, 0) / n;
  const sd = n > 1 ? Math.sqrt(t0.reduce((s, t) => s + (t - mean) ** 2, 0) / (n - 1)) : null;
  return {
    ...parity,
    summary: {
      boatCount: n,
      medianStaticThrustN: median,
      minStaticThrustN: min,
      maxStaticThrustN: max,
      meanStaticThrustN: mean,
      sampleStandardDeviationN: sd,
      maxMinRatio: max / min,
      spreadPercent: ((max - min) / median) * 100,
      coefficientOfVariationPercent: sd === null ? null : (sd / mean) * 100,
    },
    boats: boats.map((b, i) => ({
      ...b,
      // The median boat is the one at the middle of the new order (odd count); an even count has none.
      isReferenceBoat: n % 2 === 1 && i === medianIndex,
      deviationFromMedianN: b.staticThrustN - median,
      deviationFromMedianPercent: ((b.staticThrustN - median) / median) * 100,
      // The median held exact, as the fixed-power report does (lib/core/engine/parity.ts).
      uDeviationFromMedianN: b.uStaticThrustN,
      uDeviationFromMedianPercent: (b.uStaticThrustN / median) * 100,
    })),
  };
}

/**
 * Every boat's equalising nozzles against the class medians of the figures shown (after
 * applyMatchedFigures): the static one brings the boat's static thrust to the class median, the range
 * one minimises the least-squares relative deviation from the class median thrust over the reference
 * speeds (jet-equalising.ts). A matched boat's are searched with the matched model
 * (jet-equalising-matched.ts: Illinois regula falsi, and grid with golden section); a fixed-power
 * boat's use the fixed-power model as in parity.ts. The static nozzle's uncertainty for a matched boat
 * is first order (JCGM 100:2008, 5.1.2) in the power, by central differences on the curve's scale.
 * `matched`, `fixed` and `uPowerKw` are per boat in the order of parity.boats; `used` is updated with
 * the model each matched boat's nozzles came from.
 */
export function applyMatchedEqualising(
  parity: ParityReport,
  matched: readonly (PreparedMatchedSetup | null)[],
  fixed: readonly PreparedJetSetup[],
  uPowerKw: readonly number[],
  used: Record<string, BoatModelUsed>,
): ParityReport {
  const median = parity.summary.medianStaticThrustN;
  const speeds = parity.boats[0]?.thrustAtReferenceSpeeds.map((t) => t.speedMs) ?? [];
  const medianAtSpeed = Float64Array.from(speeds, (_, j) =>
    computeMedian(parity.boats.map((b) => b.thrustAtReferenceSpeeds[j].thrustN)),
  );
  const medianPositive = speeds.length > 0 && medianAtSpeed.every((m) => m > 0);
  const boats = parity.boats.map((b, i) => {
    const setup = matched[i];
    if (setup) {
      const thrustAt = createMatchedThrust(setup);
      const eq = computeMatchedStaticEqualisingMm(setup, median, 1, thrustAt);
      if (eq !== null) {
        const h = RELATIVE_STEP;
        const up = computeMatchedStaticEqualisingMm(setup, median, 1 + h, thrustAt);
        const down = computeMatchedStaticEqualisingMm(setup, median, 1 - h, thrustAt);
        const uEq =
          up !== null && down !== null && b.powerKw > 0
            ? Math.abs((up - down) / (2 * h)) * (uPowerKw[i] / b.powerKw)
            : 0;
        used[b.id] = { ...used[b.id], equalisingModel: 'matched' };
        return {
          ...b,
          equalisingNozzleDiameterMm: eq,
          uEqualisingNozzleDiameterMm: uEq,
          rangeEqualising: medianPositive ? computeMatchedRangeEqualising(setup, speeds, medianAtSpeed, eq) : null,
        };
      }
      used[b.id] = { ...used[b.id], equalisingModel: 'fixed_power' };
    }
    // Fixed power: T0 ∝ D^(2/3), so D_eq = D (T_median / T0)^(3/2) (parity.ts).
    const t0 = setup ? evaluateThrustN(fixed[i], 0) : b.staticThrustN;
    const eq = b.nozzleDiameterMm * (median / t0) ** 1.5;
    return {
      ...b,
      equalisingNozzleDiameterMm: eq,
      uEqualisingNozzleDiameterMm: computeEqualisingDiameterUncertaintyMm(eq, b.powerKw, uPowerKw[i]),
      rangeEqualising: medianPositive ? computeRangeEqualising(fixed[i], speeds, medianAtSpeed, eq) : null,
    };
  });
  return { ...parity, boats };
}
