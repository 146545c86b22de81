// A boat's predicted run from rest (run-integrator.ts) with its resistance R(V) = k V^2 fitted so that
// thrust equals resistance at its observed top speed (trap or GPS): k = T(V_top) / V_top^2, so the model's
// terminal speed is the observed one by construction. With no observed speed, a class default k is used
// (the class median of the fitted values) and the result says which. Framework-free.
//
// The fixed-power model's thrust is here (jet.ts: momentum theory at constant shaft power); the matched
// engine-and-pump model's is in lib/core/timing/clock-thrust.ts and plugs into the same functions.

import { EngineInputError } from './engine-input-error';
import { evaluateThrustN, prepareJetSetup, type JetSetupInput } from './jet';
import { findTerminalSpeedMs, integrateRunFromRest, type ThrustFunction } from './run-integrator';

/** Standard gravity (CGPM 1901; NIST SP 811, 2008, appendix B): 9.80665 m/s^2. */
export const STANDARD_GRAVITY_MS2 = 9.80665;

export type DragBasis = 'trap_speed' | 'gps_top_speed' | 'class_default';

/** The thrust function of the fixed-power model for one boat. */
export function fixedPowerThrust(setup: JetSetupInput): ThrustFunction {
  const prepared = prepareJetSetup(setup);
  return (v) => evaluateThrustN(prepared, v);
}

/** k (N s^2/m^2) of R = k V^2 so that T(V_top) = R(V_top); null when the model has no thrust at that speed. */
export function fitQuadraticDragK(thrustN: ThrustFunction, topSpeedMs: number): number | null {
  if (!(topSpeedMs > 0) || !Number.isFinite(topSpeedMs))
    throw new EngineInputError('topSpeedMs', `topSpeedMs must be a positive number (got ${topSpeedMs})`);
  const t = thrustN(topSpeedMs);
  return t > 0 ? t / (topSpeedMs * topSpeedMs) : null;
}

export type RunPredictionInput = {
  thrustN: ThrustFunction;
  /** Shaft power (kW) for the power-to-weight figure. */
  powerKw: number;
  massKg: number;
  dragK: number;
  distancesM: readonly number[];
};

export type RunPrediction = {
  timesS: (number | null)[];
  /** Terminal speed of the model, T(V) = k V^2 (m/s). */
  topSpeedMs: number;
  /** Static thrust over weight, T(0) / (m g). */
  thrustToWeight: number;
  /** kW per tonne. */
  powerToWeightKwPerT: number;
  stepS: number;
  relativeAccuracy: number;
  converged: boolean;
};

export function predictRun(input: RunPredictionInput): RunPrediction {
  if (!(input.dragK > 0) || !Number.isFinite(input.dragK))
    throw new EngineInputError('dragK', `dragK must be a positive number (got ${input.dragK})`);
  const resistanceN = (v: number) => input.dragK * v * v;
  const run = integrateRunFromRest({
    thrustN: input.thrustN,
    resistanceN,
    massKg: input.massKg,
    distancesM: input.distancesM,
  });
  return {
    timesS: run.timesS,
    topSpeedMs: findTerminalSpeedMs(input.thrustN, resistanceN),
    thrustToWeight: input.thrustN(0) / (input.massKg * STANDARD_GRAVITY_MS2),
    powerToWeightKwPerT: input.powerKw / (input.massKg / 1000),
    stepS: run.stepS,
    relativeAccuracy: run.relativeAccuracy,
    converged: run.converged,
  };
}
