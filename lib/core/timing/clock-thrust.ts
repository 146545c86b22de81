// The thrust a boat's predicted run uses (issue 20, item 2): the class's report model. A boat of a class that
// reports on the matched model, whose inspected declaration holds both an engine curve and a pump
// characteristic, runs on the matched model (jet-matched.ts) with its engine curve levelled so that its peak
// is the power the inspection confirmed (matched-figures.ts, levelledCurves); every other boat on fixed power
// (jet.ts). A power lever scales the levelled curve, a nozzle lever changes the matched set-up's nozzle.
// Framework-free; the matched ThrustFunction is allocation-free per call (one MatchedPoint reused).

import { evaluateMatchedPoint, prepareMatchedSetup, type MatchedPoint } from '../engine/jet-matched';
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
