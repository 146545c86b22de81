// Water density for the jet model. Two bases, never mixed in one result:
//
// 1. 'ittc'  — ITTC Recommended Procedure 7.5-02-01-03 (Fresh Water and Seawater Properties):
//    the product's tabulated basis. We hold the 10, 15, 20 and 25 C points (fresh water, and
//    seawater of absolute salinity 35.16504 g/kg) and interpolate linearly between them. No
//    extrapolation: outside 10–25 C callers must pick 'eos80' or enter a density. Linear
//    interpolation over 5 K steps errs by at most about 0.04 kg/m^3 (h^2/8 |rho''|), i.e. 4e-5.
// 2. 'eos80' — UNESCO 1981 one-atmosphere International Equation of State of Seawater (EOS-80;
//    Millero & Poisson 1981, coefficients as printed in Fofonoff & Millard 1983, UNESCO Technical
//    Paper in Marine Science 44) [coefficients from memory; they reproduce the check values
//    997.04796 at S = 0, 25 C and 1023.34306 at S = 35, 25 C].
//    Simplification: EOS-80 takes practical salinity (PSS-78) and IPTS-68 temperature. We pass the
//    user's temperature in as t68 unchanged. ITS-90 differs by t68 = 1.00024 t90, under 0.01 K in
//    0–40 C, which moves density by under 0.003 kg/m^3 — far below what a race-day thermometer
//    resolves. Salinity is practical salinity (about 35 for open ocean), not absolute salinity.
//
// The product default is fresh water at 15 C on the ITTC basis: 999.1026 kg/m^3.

import { EngineInputError, assertFiniteNumber, assertInRange } from './engine-input-error';

export type WaterKind = 'fresh' | 'sea';
export type DensityBasis = 'ittc' | 'eos80';

export const ITTC_DENSITY_TABLE = {
  source: 'ITTC Recommended Procedure 7.5-02-01-03, Fresh Water and Seawater Properties',
  temperaturesC: [10, 15, 20, 25],
  fresh: [999.7026, 999.1026, 998.2071, 997.0479],
  /** Absolute salinity 35.16504 g/kg. */
  sea: [1027.0, 1026.021, 1024.8103, 1023.3873],
} as const;

export const ITTC_TEMPERATURE_RANGE_C = { min: 10, max: 25 } as const;
export const EOS80_TEMPERATURE_RANGE_C = { min: 0, max: 40 } as const;
export const EOS80_SALINITY_RANGE = { min: 0, max: 42 } as const;
/** Practical salinity used for kind 'sea' on the EOS-80 basis. */
export const EOS80_STANDARD_SEAWATER_SALINITY = 35;
/** Sanity band for a manually entered density: catches g/cm^3 typed into a kg/m^3 field. */
export const MANUAL_DENSITY_RANGE_KG_M3 = { min: 900, max: 1100 } as const;

export const DEFAULT_WATER = { kind: 'fresh', temperatureC: 15 } as const;
export const DEFAULT_DENSITY_KG_M3 = 999.1026;

function assertWaterKind(kind: unknown): WaterKind {
  if (kind !== 'fresh' && kind !== 'sea') {
    throw new EngineInputError('kind', `Water kind must be 'fresh' or 'sea' (got ${String(kind)})`);
  }
  return kind;
}

/** Linear interpolation in the ITTC table (basis 'ittc'), 10–25 C only. */
export function interpolateDensityIttc(kind: WaterKind, temperatureC: number): number {
  const k = assertWaterKind(kind);
  const t = assertFiniteNumber('temperatureC', temperatureC);
  const { min, max } = ITTC_TEMPERATURE_RANGE_C;
  if (t < min || t > max) {
    throw new EngineInputError(
      'temperatureC',
      `The ITTC table covers ${min}–${max} C (got ${t} C); choose basis 'eos80' (0–40 C) or enter a density`,
    );
  }
  const ts = ITTC_DENSITY_TABLE.temperaturesC;
  const rhos = ITTC_DENSITY_TABLE[k];
  let i = 0;
  while (i < ts.length - 2 && t > ts[i + 1]) i++;
  const f = (t - ts[i]) / (ts[i + 1] - ts[i]);
  return rhos[i] + f * (rhos[i + 1] - rhos[i]);
}

/** Density of pure water, EOS-80 (SMOW polynomial, Bigg 1967 as adopted in EOS-80). */
function computePureWaterDensityEos80(t: number): number {
  return 999.842594 + t * (6.793952e-2 + t * (-9.09529e-3 + t * (1.001685e-4 + t * (-1.120083e-6 + t * 6.536332e-9))));
}

/**
 * One-atmosphere density (basis 'eos80') for practical salinity 0–42 and temperature 0–40 C.
 * rho(S,t,0) = rho_w + S (b0 + b1 t + ...) + S^1.5 (c0 + c1 t + c2 t^2) + d0 S^2.
 */
export function computeDensityEos80(input: { salinityPsu: number; temperatureC: number }): number {
  const s = assertInRange('salinityPsu', input.salinityPsu, EOS80_SALINITY_RANGE.min, EOS80_SALINITY_RANGE.max);
  const t = assertInRange(
    'temperatureC',
    input.temperatureC,
    EOS80_TEMPERATURE_RANGE_C.min,
    EOS80_TEMPERATURE_RANGE_C.max,
    'C',
  );
  const b = 8.24493e-1 + t * (-4.0899e-3 + t * (7.6438e-5 + t * (-8.2467e-7 + t * 5.3875e-9)));
  const c = -5.72466e-3 + t * (1.0227e-4 + t * -1.6546e-6);
  const d = 4.8314e-4;
  return computePureWaterDensityEos80(t) + s * b + s * Math.sqrt(s) * c + d * s * s;
}

export type ResolveDensityInput =
  { kind: WaterKind; temperatureC: number; basis?: DensityBasis; salinityPsu?: number } | { densityKgM3: number };

export interface ResolvedDensity {
  densityKgM3: number;
  basis: DensityBasis | 'manual';
  /** Human-readable provenance for reports, e.g. "fresh water at 15 C (ITTC 7.5-02-01-03)". */
  description: string;
}

/**
 * The one entry point the product uses: a manual density, or water kind and temperature on one
 * basis (default 'ittc'). salinityPsu is accepted only for sea water on the 'eos80' basis.
 */
export function resolveDensity(input: ResolveDensityInput = DEFAULT_WATER): ResolvedDensity {
  if (input === null || typeof input !== 'object') {
    throw new EngineInputError('water', 'Give either a water kind and temperature or a density');
  }
  if ('densityKgM3' in input) {
    const { min, max } = MANUAL_DENSITY_RANGE_KG_M3;
    const rho = assertInRange('densityKgM3', input.densityKgM3, min, max, 'kg/m^3');
    return { densityKgM3: rho, basis: 'manual', description: `entered density ${rho} kg/m^3` };
  }
  const kind = assertWaterKind(input.kind);
  const basis = input.basis ?? 'ittc';
  const t = assertFiniteNumber('temperatureC', input.temperatureC);
  if (basis === 'ittc') {
    if (input.salinityPsu !== undefined) {
      throw new EngineInputError('salinityPsu', "Salinity can only be given on the 'eos80' basis");
    }
    return {
      densityKgM3: interpolateDensityIttc(kind, t),
      basis,
      description: `${kind} water at ${t} C (ITTC 7.5-02-01-03 table, linear interpolation)`,
    };
  }
  if (basis !== 'eos80') {
    throw new EngineInputError('basis', `Density basis must be 'ittc' or 'eos80' (got ${String(basis)})`);
  }
  if (kind === 'fresh' && input.salinityPsu !== undefined && input.salinityPsu !== 0) {
    throw new EngineInputError('salinityPsu', 'Fresh water has salinity 0; choose kind sea for brackish water');
  }
  const salinityPsu = kind === 'fresh' ? 0 : (input.salinityPsu ?? EOS80_STANDARD_SEAWATER_SALINITY);
  return {
    densityKgM3: computeDensityEos80({ salinityPsu, temperatureC: t }),
    basis,
    description: `${kind} water at ${t} C, practical salinity ${salinityPsu} (UNESCO EOS-80)`,
  };
}
