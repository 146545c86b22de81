// An engine's power curve from its rated power and rpm and a named shape, for an entrant who has no
// dyno points. x = rpm / rated rpm, P / P_rated:
//   flat            1 (the fixed-power premise: the same power at every rpm of the curve)
//   spark_ignition  x + x^2 - x^3            (Leiderman's empirical formula for petrol engines [memory])
//   diesel          0.5 x + 1.5 x^2 - x^3    (the same formula's diesel coefficients [memory])
// Each shape gives exactly the rated power at the rated rpm. The curve runs from 40 % of the rated rpm
// in steps of 10 % (common practice, no source: a jet engine runs near its top rpm) to 110 % for a petrol
// or flat curve; a diesel's stops at the rated rpm, where its governor holds it (the formula's diesel
// coefficients still rise past it).

import { EngineInputError, assertPositive } from './engine-input-error';
import type { EngineCurvePoint } from './jet-matched';

export const ENGINE_CURVE_SHAPES = ['flat', 'spark_ignition', 'diesel'] as const;
export type EngineCurveShape = (typeof ENGINE_CURVE_SHAPES)[number];

export const ENGINE_CURVE_SHAPE_LABELS: Record<EngineCurveShape, string> = {
  flat: 'flat (the same power at every rpm)',
  spark_ignition: 'petrol engine (power rising to the rated rpm)',
  diesel: 'diesel engine',
};

const COEFFICIENTS: Record<EngineCurveShape, readonly [number, number, number]> = {
  flat: [0, 0, 0],
  spark_ignition: [1, 1, 1],
  diesel: [0.5, 1.5, 1],
};

/** Share of the rated power at x = rpm / rated rpm. */
export function engineShareAt(shape: EngineCurveShape, x: number): number {
  if (shape === 'flat') return 1;
  const [a, b, c] = COEFFICIENTS[shape];
  return a * x + b * x * x - c * x * x * x;
}

const STEPS = [0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1, 1.1] as const;
const GOVERNED_STEPS = STEPS.filter((x) => x <= 1);

/** The engine curve points (rpm increasing) for a rated power, rated rpm and shape. */
export function buildRatedEngineCurve(
  ratedPowerKw: number,
  ratedRpm: number,
  shape: EngineCurveShape,
): EngineCurvePoint[] {
  const p = assertPositive('engine.ratedPowerKw', ratedPowerKw);
  const n = assertPositive('engine.ratedRpm', ratedRpm);
  if (!(shape in COEFFICIENTS)) throw new EngineInputError('engine.shape', `Unknown curve shape ${String(shape)}`);
  return (shape === 'diesel' ? GOVERNED_STEPS : STEPS).map((x) => ({
    rpm: x * n,
    powerKw: p * engineShareAt(shape, x),
  }));
}
