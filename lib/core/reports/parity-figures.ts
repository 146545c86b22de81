// Figures of a class parity report from its stored inputs (framework-free: runs on the server,
// in the browser for what-if sandboxes, and in tests). The physics is the engine's; this module
// adds the class-level views people read: curves for the chart, jet-velocity spread, and the
// uncertainty of the class figures.
//
// Uncertainties are standard (k = 1), first-order (JCGM 100:2008, 5.1.2). For the class figures:
// u(min) and u(max) are those of the boats at the extremes; u(median) is that of the median boat
// (odd count) or half the root-sum-square of the middle two (even count); u(spread %) propagates
// u(max) and u(min) with the median held exact: 100·sqrt(u_max² + u_min²)/median.

import { computeParity, computeMedian, type ParityReport } from '../engine/parity';
import { computeParityMonteCarlo, type MonteCarloParity } from '../engine/parity-monte-carlo';
import { prepareJetSetup, withPowerAndDiameter, evaluateThrustN } from '../engine/jet';
import { computeMatchedCurve, prepareMatchedSetup, type PreparedMatchedSetup } from '../engine/jet-matched';
import type { SuctionInput } from '../engine/cavitation';
import {
  applyMatchedEqualising,
  applyMatchedFigures,
  computeMatchedBoat,
  levelledCurves,
  type BoatModelUsed,
  type ReportBoatCurves,
  type ReportModel,
} from './matched-figures';
import type { ClockSection } from '../timing/clock-section';

export type ReportAssumptions = {
  pumpEfficiency: number;
  nozzleLossCoefficient: number;
  inletLossCoefficient: number;
  wakeFraction: number;
  referenceSpeedsMs: number[];
  /** The class's report model (absent in reports before it: fixed power for every boat). */
  reportModel?: ReportModel;
  /** The power uncertainty shares by evidence the report used, and whose they are (absent in older reports). */
  powerEvidenceShares?: {
    dyno_sheet: number;
    maker_rating: number;
    declaration_only: number;
    source: 'class' | 'common_practice';
  };
};

export type ReportBoatInput = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  powerKw: number;
  uPowerKw: number;
  powerSource: 'declared' | 'verified';
  /** The kind of power evidence the inspection saw, which sets uPowerKw (absent in older reports). */
  powerEvidence?: 'dyno_sheet' | 'maker_rating' | 'declaration_only';
  /** The weight measured at the inspection the figures come from (kg), when the boat was weighed. */
  measuredWeightKg?: number | null;
  nozzleDiameterMm: number;
  uNozzleDiameterMm: number;
  inspectionId: string | null;
  inspectedAt: string | null;
  /** Set when the declaration changed after the inspection these figures come from: what changed. */
  awaitingReinspection?: string | null;
  /** The engine curve and pump characteristic of the declaration version inspected, when both were declared. */
  curves?: ReportBoatCurves | null;
  /** Its declared inlet depth and suction data (water temperature filled from the meeting's when not declared). */
  suction?: SuctionInput | null;
};

export type ReportExcluded = { entryId: string; raceNumber: number; boatName: string; reason: string };

export type ReportInputs = {
  eventName: string;
  classCode: string;
  className: string;
  ruleVersion: { id: string; version: number };
  assumptions: ReportAssumptions;
  density: { densityKgM3: number; description: string };
  boats: ReportBoatInput[];
  excluded: ReportExcluded[];
  computedAt: string;
};

export type ClassFigure = { value: number; u: number };

export type ReportResults = {
  parity: ParityReport | null;
  classFigures: {
    medianStaticThrustN: ClassFigure;
    minStaticThrustN: ClassFigure;
    maxStaticThrustN: ClassFigure;
    spreadPercent: ClassFigure;
    jetVelocityMinMs: number;
    jetVelocityMedianMs: number;
    jetVelocityMaxMs: number;
    jetVelocitySpreadPercent: number;
  } | null;
  curves: { speedsMs: number[]; reference: number[]; byEntry: Record<string, number[]> } | null;
  /**
   * Monte Carlo over every boat's uncertainties (JCGM 101:2008): each boat's coverage interval, the
   * chance that one out-thrusts another at each speed, and the spread's distribution. Absent in
   * reports published before it.
   */
  odds?: MonteCarloParity | null;
  /**
   * Per boat (entry id), the model its figures come from: present when the class chose the matched
   * model (lib/core/reports/matched-figures.ts); absent, every boat is on fixed power.
   */
  modelUsed?: Record<string, BoatModelUsed> | null;
  /**
   * The predicted time over a course and the model against the clock (lib/core/timing/clock-section.ts), with
   * the run times stored when the report was computed: frozen with a published report. Absent in reports before it.
   */
  clock?: ClockSection | null;
};

/** Trials and seed of the report's Monte Carlo: a fixed seed, so a report's figures reproduce exactly. */
export const REPORT_MONTE_CARLO = { trials: 10_000, seed: 20_261_203 } as const;

export const CHART_SPEED_STEP_MS = 1;

export function computeReportResults(inputs: ReportInputs): ReportResults {
  if (inputs.boats.length === 0) return { parity: null, classFigures: null, curves: null, odds: null };
  const a = inputs.assumptions;
  const model = {
    densityKgM3: inputs.density.densityKgM3,
    pumpEfficiency: a.pumpEfficiency,
    nozzleLossCoefficient: a.nozzleLossCoefficient,
    inletLossCoefficient: a.inletLossCoefficient,
    wakeFraction: a.wakeFraction,
  };
  const fixedParity = computeParity(
    inputs.boats.map((b) => ({
      id: b.entryId,
      label: `#${b.raceNumber} ${b.boatName}`,
      powerKw: b.powerKw,
      nozzleDiameterMm: b.nozzleDiameterMm,
      uPowerKw: b.uPowerKw,
      uNozzleDiameterMm: b.uNozzleDiameterMm,
    })),
    { ...model, referenceSpeedsMs: a.referenceSpeedsMs },
  );
  // The matched model for a boat only when the class chose it and the boat declared both curves.
  let modelUsed: Record<string, BoatModelUsed> | null = null;
  if (a.reportModel === 'matched') {
    modelUsed = {};
    for (const b of inputs.boats)
      modelUsed[b.entryId] = b.curves
        ? computeMatchedBoat({ ...b, curves: b.curves, suction: b.suction }, model, a.referenceSpeedsMs)
        : { model: 'fixed_power', reason: 'No engine curve and pump curve both declared' };
  }
  const matchedSetups = modelUsed ? inputs.boats.map((b) => matchedSetupFor(b, modelUsed, model)) : null;
  const fixedBase = prepareJetSetup({
    ...model,
    powerKw: inputs.boats[0].powerKw,
    nozzleDiameterMm: inputs.boats[0].nozzleDiameterMm,
  });
  const parity =
    modelUsed && matchedSetups
      ? applyMatchedEqualising(
          applyMatchedFigures(fixedParity, modelUsed),
          matchedSetups,
          inputs.boats.map((b) => withPowerAndDiameter(fixedBase, b.powerKw, b.nozzleDiameterMm)),
          inputs.boats.map((b) => b.uPowerKw),
          modelUsed,
        )
      : fixedParity;

  const byThrust = [...parity.boats].sort((x, y) => x.staticThrustN - y.staticThrustN);
  const n = byThrust.length;
  const lo = byThrust[0];
  const hi = byThrust[n - 1];
  const uMedian =
    n % 2 === 1
      ? byThrust[n >> 1].uStaticThrustN
      : 0.5 * Math.hypot(byThrust[n / 2 - 1].uStaticThrustN, byThrust[n / 2].uStaticThrustN);
  const median = parity.summary.medianStaticThrustN;
  const jets = parity.boats.map((b) => b.staticJetVelocityMs);
  const jetMedian = computeMedian(jets);

  // Curves for the chart: 0 m/s to 10 m/s past the highest reference speed (at most 60).
  const top = Math.min(60, Math.max(...a.referenceSpeedsMs, 20) + 10);
  const speedsMs = Array.from({ length: Math.floor(top / CHART_SPEED_STEP_MS) + 1 }, (_, i) => i * CHART_SPEED_STEP_MS);
  const base = prepareJetSetup({
    ...model,
    powerKw: inputs.boats[0].powerKw,
    nozzleDiameterMm: inputs.boats[0].nozzleDiameterMm,
  });
  const ref = withPowerAndDiameter(base, parity.referenceSetup.powerKw, parity.referenceSetup.nozzleDiameterMm);
  const byEntry: Record<string, number[]> = {};
  for (const b of inputs.boats) {
    if (modelUsed?.[b.entryId]?.model === 'matched' && b.curves) {
      const levelled = levelledCurves(b.curves, b.powerKw);
      const matched = levelled && computeMatchedChart(levelled, b.nozzleDiameterMm, model, speedsMs);
      if (matched) {
        byEntry[b.entryId] = matched;
        continue;
      }
    }
    const s = withPowerAndDiameter(base, b.powerKw, b.nozzleDiameterMm);
    byEntry[b.entryId] = speedsMs.map((v) => evaluateThrustN(s, v));
  }

  return {
    parity,
    classFigures: {
      medianStaticThrustN: { value: median, u: uMedian },
      minStaticThrustN: { value: lo.staticThrustN, u: lo.uStaticThrustN },
      maxStaticThrustN: { value: hi.staticThrustN, u: hi.uStaticThrustN },
      spreadPercent: {
        value: parity.summary.spreadPercent,
        u: (100 * Math.hypot(hi.uStaticThrustN, lo.uStaticThrustN)) / median,
      },
      jetVelocityMinMs: Math.min(...jets),
      jetVelocityMedianMs: jetMedian,
      jetVelocityMaxMs: Math.max(...jets),
      jetVelocitySpreadPercent: ((Math.max(...jets) - Math.min(...jets)) / jetMedian) * 100,
    },
    curves: { speedsMs, reference: speedsMs.map((v) => evaluateThrustN(ref, v)), byEntry },
    odds:
      n >= 2
        ? computeParityMonteCarlo(
            inputs.boats.map((b) => ({
              id: b.entryId,
              label: `#${b.raceNumber} ${b.boatName}`,
              powerKw: b.powerKw,
              nozzleDiameterMm: b.nozzleDiameterMm,
              uPowerKw: b.uPowerKw,
              uNozzleDiameterMm: b.uNozzleDiameterMm,
            })),
            model,
            {
              referenceSpeedsMs: a.referenceSpeedsMs,
              ...REPORT_MONTE_CARLO,
              ...(matchedSetups && { matched: matchedSetups }),
            },
          )
        : null,
    ...(modelUsed && { modelUsed }),
  };
}

/** A matched boat's set-up (its curves levelled to its confirmed power) for the Monte Carlo; null on fixed power. */
function matchedSetupFor(
  b: ReportBoatInput,
  modelUsed: Record<string, BoatModelUsed>,
  model: { densityKgM3: number; nozzleLossCoefficient: number; inletLossCoefficient: number; wakeFraction: number },
): PreparedMatchedSetup | null {
  if (modelUsed[b.entryId]?.model !== 'matched' || !b.curves) return null;
  const levelled = levelledCurves(b.curves, b.powerKw);
  return levelled && prepareMatchedSetup({ ...model, ...levelled, nozzleDiameterMm: b.nozzleDiameterMm });
}

/** A matched boat's chart curve, point by point; null when some chart speed has no operating point. */
function computeMatchedChart(
  curves: ReportBoatCurves,
  nozzleDiameterMm: number,
  model: { densityKgM3: number; nozzleLossCoefficient: number; inletLossCoefficient: number; wakeFraction: number },
  speedsMs: number[],
): number[] | null {
  try {
    return computeMatchedCurve({ ...model, ...curves, nozzleDiameterMm }, speedsMs).map((p) => p.thrustN);
  } catch {
    return null;
  }
}

/** What-if: the same inputs with some boats' nozzles or powers replaced (nothing is saved). */
export function applyWhatIf(
  inputs: ReportInputs,
  changes: { nozzleByEntry?: Record<string, number>; powerByEntry?: Record<string, number> },
): ReportInputs {
  return {
    ...inputs,
    boats: inputs.boats.map((b) => ({
      ...b,
      nozzleDiameterMm: changes.nozzleByEntry?.[b.entryId] ?? b.nozzleDiameterMm,
      powerKw: changes.powerByEntry?.[b.entryId] ?? b.powerKw,
    })),
  };
}

export type RuleWhatIf = {
  nozzleMaxMm?: number | null;
  nozzleMinMm?: number | null;
  powerMaxKw?: number | null;
  powerMinKw?: number | null;
};

/**
 * What-if for a rule change: each boat is projected to the nearest set-up the new limits allow
 * (a nozzle above a new maximum is taken down to it; a power above a new cap is detuned to it).
 */
export function applyRuleWhatIf(inputs: ReportInputs, rule: RuleWhatIf): ReportInputs {
  const clamp = (x: number, min?: number | null, max?: number | null) =>
    Math.min(max ?? Infinity, Math.max(min ?? -Infinity, x));
  return {
    ...inputs,
    boats: inputs.boats.map((b) => ({
      ...b,
      nozzleDiameterMm: clamp(b.nozzleDiameterMm, rule.nozzleMinMm, rule.nozzleMaxMm),
      powerKw: clamp(b.powerKw, rule.powerMinKw, rule.powerMaxKw),
    })),
  };
}
