// Cavitation at the pump inlet: available against required net positive suction head (NPSH).
//
// Vapour pressure of water: the IAPWS-IF97 saturation-pressure equation (IAPWS, Revised Release on
// the IAPWS Industrial Formulation 1997, 2007, region 4, eq. 30) [coefficients from memory; they
// reproduce the release's check values, tested]. Sea water's vapour pressure is about 2 % lower
// (Raoult's law at 35 g/kg); using the fresh-water figure errs on the safe side.
//
// Available NPSH at the pump inlet, in metres of water (Karassik et al., Pump Handbook, 4th ed.,
// ch. 2; Brennen, Hydrodynamics of Pumps, 1994, 1.7):
//   NPSH_a = (p_atm - p_v) / (rho g) + z + (1 - K_i) V_in^2 / (2 g)
// with z the inlet's depth below the free surface and the inflow's recovered dynamic head (the same
// inlet loss K_i as the system head of the jet model).
// Required NPSH from the suction specific speed in its dimensionless form
//   S = omega Q^(1/2) / (g NPSH_r)^(3/4)   (Brennen 1994, 1.7; omega in rad/s)
// so NPSH_r = (omega Q^(1/2) / S)^(4/3) / g. A maker's NPSH_r at one rated rpm and flow fixes S.
// A point cavitates when NPSH_a < NPSH_r; its thrust is then an upper bound (the pump cannot
// deliver the flow the momentum balance assumes without the head breaking down).

import { EngineInputError, assertFiniteNumber, assertInRange, assertPositive } from './engine-input-error';

/** Standard gravity (CGPM 1901; ISO 80000-3), m/s^2. */
export const STANDARD_GRAVITY = 9.80665;
/** Standard atmosphere at sea level (ISO 2533:1975), Pa. */
export const STANDARD_ATMOSPHERE_PA = 101_325;

const IF97_N = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.1202082470247e5, -0.32325550322333e7,
  0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

/** Saturation (vapour) pressure of pure water, Pa, at temperature T in kelvin (273.15 to 647.096 K). */
export function saturationPressurePa(temperatureK: number): number {
  const t = assertInRange('temperatureK', temperatureK, 273.15, 647.096, 'K');
  const n = IF97_N;
  const v = t + n[8] / (t - n[9]);
  const a = v * v + n[0] * v + n[1];
  const b = n[2] * v * v + n[3] * v + n[4];
  const c = n[5] * v * v + n[6] * v + n[7];
  const pMPa = ((2 * c) / (-b + Math.sqrt(b * b - 4 * a * c))) ** 4;
  return pMPa * 1e6;
}

export interface SuctionInput {
  /** Depth of the pump inlet below the free surface, m (0 at the surface; up to 5 m). */
  inletDepthM: number;
  /** Water temperature for the vapour pressure, °C (0–100). */
  waterTemperatureC: number;
  /** Ambient pressure, Pa (default the standard atmosphere). */
  ambientPressurePa?: number;
  /** Either the dimensionless suction specific speed S ... */
  suctionSpecificSpeed?: number;
  /** ... or a maker's required NPSH at a rated point, which fixes S. */
  requiredNpshAtRated?: { npshM: number; rpm: number; flowM3s: number };
}

export interface PreparedSuction {
  readonly inletDepthM: number;
  readonly vapourPressurePa: number;
  readonly ambientPressurePa: number;
  readonly suctionSpecificSpeed: number;
}

export function prepareSuction(input: SuctionInput): PreparedSuction {
  if (input === null || typeof input !== 'object') throw new EngineInputError('cavitation', 'An object is required');
  const inletDepthM = assertInRange('cavitation.inletDepthM', input.inletDepthM, 0, 5, 'm');
  const tC = assertInRange('cavitation.waterTemperatureC', input.waterTemperatureC, 0, 100, '°C');
  const ambientPressurePa = assertInRange(
    'cavitation.ambientPressurePa',
    input.ambientPressurePa ?? STANDARD_ATMOSPHERE_PA,
    50_000,
    120_000,
    'Pa',
  );
  let s: number;
  if (input.suctionSpecificSpeed !== undefined && input.requiredNpshAtRated !== undefined) {
    throw new EngineInputError('cavitation', 'Give either suctionSpecificSpeed or requiredNpshAtRated, not both');
  } else if (input.suctionSpecificSpeed !== undefined) {
    s = assertInRange('cavitation.suctionSpecificSpeed', input.suctionSpecificSpeed, 0.5, 20);
  } else if (input.requiredNpshAtRated !== undefined) {
    const r = input.requiredNpshAtRated;
    if (r === null || typeof r !== 'object')
      throw new EngineInputError('cavitation.requiredNpshAtRated', 'An object is required');
    const npsh = assertPositive('cavitation.requiredNpshAtRated.npshM', r.npshM);
    const omega = (assertPositive('cavitation.requiredNpshAtRated.rpm', r.rpm) * 2 * Math.PI) / 60;
    const q = assertPositive('cavitation.requiredNpshAtRated.flowM3s', r.flowM3s);
    s = (omega * Math.sqrt(q)) / (STANDARD_GRAVITY * npsh) ** 0.75;
  } else {
    throw new EngineInputError('cavitation', 'Give suctionSpecificSpeed or requiredNpshAtRated');
  }
  return {
    inletDepthM,
    vapourPressurePa: saturationPressurePa(tC + 273.15),
    ambientPressurePa,
    suctionSpecificSpeed: s,
  };
}

export interface SuctionCheck {
  availableNpshM: number;
  requiredNpshM: number;
  cavitating: boolean;
}

/** NPSH available and required at one operating point (rpm, flow Q, inflow speed V_in, density). */
export function checkSuction(
  suction: PreparedSuction,
  densityKgM3: number,
  inletLossCoefficient: number,
  rpm: number,
  flowM3s: number,
  inflowMs: number,
): SuctionCheck {
  assertFiniteNumber('rpm', rpm);
  const g = STANDARD_GRAVITY;
  const available =
    (suction.ambientPressurePa - suction.vapourPressurePa) / (densityKgM3 * g) +
    suction.inletDepthM +
    ((1 - inletLossCoefficient) * inflowMs * inflowMs) / (2 * g);
  const omega = (rpm * 2 * Math.PI) / 60;
  const required = ((omega * Math.sqrt(Math.max(flowM3s, 0))) / suction.suctionSpecificSpeed) ** (4 / 3) / g;
  return { availableNpshM: available, requiredNpshM: required, cavitating: available < required };
}
