// The thrust a boat's predicted run uses (issue 20, item 2): the class's report model. A boat of a class that
// reports on the matched model, whose inspected declaration holds both an engine curve and a pump
// characteristic, runs on the matched model (jet-matched.ts) with its engine curve levelled so that its peak
// is the power the inspection confirmed (matched-figures.ts, levelledCurves); every other boat on fixed power
// (jet.ts). A power lever scales the levelled curve, a nozzle lever changes the matched set-up's nozzle, an impeller
// change replaces its pump curve or scales its efficiency (clockBoatThrustWithImpeller).
// Framework-free; the matched ThrustFunction is allocation-free per call (one MatchedPoint reused).

import {
  evaluateMatchedPoint,
  prepareMatchedSetup,
  type MatchedPoint,
  type PumpCurvePoint,
} from '../engine/jet-matched';
import { EngineInputError } from '../engine/engine-input-error';
import { fixedPowerThrust } from '../engine/run-prediction';
import type { ThrustFunction } from '../engine/run-integrator';
import { levelledCurves, type ReportBoatCurves } from '../reports/matched-figures';

export type ClockThrustModel = 'fixed_power' | 'matched';

/** The water and loss model of the class (its parity assumptions). */
export type ClockWaterModel = {
  densityKgM3: number;
  pumpEfficiency: number;
  nozzleLossCoefficient: number;
  inletLossCoefficient: number;
  wakeFraction: number;
};

/**
 * The matched ThrustFunction of a boat at a power and nozzle: the declared curves with the engine curve's peak
 * at powerKw. Throws EngineInputError when the curve cannot be levelled or the curves are not valid; the
 * function itself throws EngineOperatingPointError at a speed where engine and pump do not settle.
 */
export function matchedThrust(
  model: ClockWaterModel,
  curves: ReportBoatCurves,
  powerKw: number,
  nozzleDiameterMm: number,
): ThrustFunction {
  const levelled = levelledCurves(curves, powerKw);
  if (!levelled)
    throw new EngineInputError('engine.curve', 'The declared engine curve has no power above zero to scale.');
  const prepared = prepareMatchedSetup({
    densityKgM3: model.densityKgM3,
    nozzleLossCoefficient: model.nozzleLossCoefficient,
    inletLossCoefficient: model.inletLossCoefficient,
    wakeFraction: model.wakeFraction,
    engine: levelled.engine,
    pump: levelled.pump,
    nozzleDiameterMm,
  });
  const out: MatchedPoint = {
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
  return (v) => evaluateMatchedPoint(prepared, v, out).thrustN;
}

/**
 * Another impeller for one boat in the what-if sandbox (issue 20, item 4). `pump`: another impeller's curve and
 * diameter (a meeting's catalogue entry), in place of the declared one: only a boat on the matched model has an
 * operating point to move. `efficiencyFactor`: the pump's efficiency times this factor (its curve's, or on fixed
 * power the class's pump efficiency, the one figure through which an impeller enters momentum theory at fixed
 * power: jet.ts), for a boat without a declared pump or to try a better or worse impeller of the same shape.
 */
export type ImpellerChange = {
  pump?: { label: string; impellerDiameterMm: number; curve: readonly PumpCurvePoint[] };
  efficiencyFactor?: number;
};

/** The efficiency factors the sandbox takes. */
export const IMPELLER_FACTOR_RANGE = { min: 0.5, max: 2 } as const;

/** Why an impeller change cannot be figured for a boat (the sandbox leaves the boat out and says why). */
export class ImpellerChangeError extends Error {}

/**
 * A boat's thrust at a power and nozzle with another impeller (ImpellerChange); an empty change is its own thrust.
 * Throws ImpellerChangeError for a catalogue impeller on a fixed-power boat, a factor outside IMPELLER_FACTOR_RANGE,
 * or an efficiency above 1 after the factor.
 */
export function clockBoatThrustWithImpeller(
  model: ClockWaterModel,
  boat: { thrustModel?: ClockThrustModel; curves?: ReportBoatCurves | null },
  powerKw: number,
  nozzleDiameterMm: number,
  change: ImpellerChange | undefined,
): ThrustFunction {
  if (!change || (change.pump === undefined && change.efficiencyFactor === undefined))
    return clockBoatThrust(model, boat, powerKw, nozzleDiameterMm);
  const factor = change.efficiencyFactor ?? 1;
  // A what-if, not a design tool: an impeller half as good or twice as good bounds the question (and keeps a
  // boat with almost no thrust from integrating to the run's time limit in the browser).
  if (!(factor >= IMPELLER_FACTOR_RANGE.min && factor <= IMPELLER_FACTOR_RANGE.max))
    throw new ImpellerChangeError(
      `The efficiency factor is from ${IMPELLER_FACTOR_RANGE.min} to ${IMPELLER_FACTOR_RANGE.max} (got ${factor}).`,
    );
  const matched = boat.thrustModel === 'matched' && boat.curves ? boat.curves : null;
  if (!matched) {
    if (change.pump)
      throw new ImpellerChangeError(
        'On fixed power an impeller enters only through its efficiency: choose an efficiency factor for this boat.',
      );
    const eta = model.pumpEfficiency * factor;
    if (eta > 1)
      throw new ImpellerChangeError(
        `The class's pump efficiency ${model.pumpEfficiency} times ${factor} is above 1: no pump gives more than it takes.`,
      );
    return fixedPowerThrust({ ...model, pumpEfficiency: eta, powerKw, nozzleDiameterMm });
  }
  const pump = change.pump ?? matched.pump;
  const curve = pump.curve.map((p) => ({ ...p, efficiency: p.efficiency * factor }));
  const best = Math.max(...curve.map((p) => p.efficiency));
  if (best > 1)
    throw new ImpellerChangeError(
      `The pump curve's best efficiency times ${factor} is ${best.toFixed(3)}, above 1: no pump gives more than it takes.`,
    );
  try {
    return matchedThrust(
      model,
      { ...matched, pump: { impellerDiameterMm: pump.impellerDiameterMm, curve } },
      powerKw,
      nozzleDiameterMm,
    );
  } catch (e) {
    if (e instanceof EngineInputError)
      throw new ImpellerChangeError(`This impeller's curve cannot be used: ${e.message}`);
    throw e;
  }
}

/** A boat's thrust at a power and nozzle on the model it uses (curves only for a boat on the matched model). */
export function clockBoatThrust(
  model: ClockWaterModel,
  boat: { thrustModel?: ClockThrustModel; curves?: ReportBoatCurves | null },
  powerKw: number,
  nozzleDiameterMm: number,
): ThrustFunction {
  return boat.thrustModel === 'matched' && boat.curves
    ? matchedThrust(model, boat.curves, powerKw, nozzleDiameterMm)
    : fixedPowerThrust({ ...model, powerKw, nozzleDiameterMm });
}
