// Measurement helpers for nozzle inspection: an instrument uncertainty budget, correction of a
// length to the 20 C reference temperature, and the area-equivalent diameter.

import {
  EngineInputError,
  assertFiniteNumber,
  assertInRange,
  assertNonNegative,
  assertPositive,
} from './engine-input-error';
import { REFERENCE_TEMPERATURE_C } from './measurement-thermal';

export interface InstrumentUncertaintyInput {
  /** Rectangular error limit ±a of the instrument, mm: contributes a/sqrt(3) (JCGM 100:2008, 4.3.7). */
  errorLimitMm?: number;
  /** Digital resolution δ, mm: contributes δ/sqrt(12) (JCGM 100:2008, F.2.2.1). */
  resolutionMm?: number;
  /**
   * Repeated readings of ONE local size (same position), mm. Contributes the experimental
   * standard deviation of a single reading s(q_k) (JCGM 100:2008, 4.2.2), not of the mean
   * (4.2.3): the decision uses a single local size, the largest or smallest reading, not a mean.
   * The readings taken around the exit are different local sizes, so their spread is real form
   * deviation (ISO 14405-1:2016) and is deliberately NOT counted as uncertainty.
   */
  repeatReadingsMm?: readonly number[];
  /** Coverage factor k (default 2, about 95 %; JCGM 100:2008, 6.2.1 and 6.3.3). */
  coverageFactor?: number;
}

export interface UncertaintyBudget {
  errorLimitContributionMm: number;
  resolutionContributionMm: number;
  repeatabilityContributionMm: number;
  /** Combined standard uncertainty u_c, components in quadrature (JCGM 100:2008, 5.1.2). */
  standardUncertaintyMm: number;
  coverageFactor: number;
  /** U = k u_c. */
  expandedUncertaintyMm: number;
}

function computeSampleStandardDeviation(values: readonly number[]): number {
  const n = values.length;
  let mean = 0;
  for (const v of values) mean += v;
  mean /= n;
  let ss = 0;
  for (const v of values) ss += (v - mean) * (v - mean);
  return Math.sqrt(ss / (n - 1));
}

export function computeUncertaintyBudget(input: InstrumentUncertaintyInput): UncertaintyBudget {
  const a = assertNonNegative('errorLimitMm', input.errorLimitMm ?? 0);
  const delta = assertNonNegative('resolutionMm', input.resolutionMm ?? 0);
  const k = assertPositive('coverageFactor', input.coverageFactor ?? 2);
  let repeatabilityContributionMm = 0;
  if (input.repeatReadingsMm !== undefined) {
    const repeats = input.repeatReadingsMm;
    if (!Array.isArray(repeats) || repeats.length < 2) {
      throw new EngineInputError('repeatReadingsMm', 'Give at least two repeated readings for a standard deviation');
    }
    repeats.forEach((r, i) => assertFiniteNumber(`repeatReadingsMm[${i}]`, r));
    repeatabilityContributionMm = computeSampleStandardDeviation(repeats);
  }
  const errorLimitContributionMm = a / Math.sqrt(3);
  const resolutionContributionMm = delta / Math.sqrt(12);
  const standardUncertaintyMm = Math.hypot(
    errorLimitContributionMm,
    resolutionContributionMm,
    repeatabilityContributionMm,
  );
  return {
    errorLimitContributionMm,
    resolutionContributionMm,
    repeatabilityContributionMm,
    standardUncertaintyMm,
    coverageFactor: k,
    expandedUncertaintyMm: k * standardUncertaintyMm,
  };
}

/**
 * Linear thermal expansion coefficients, 1/K, near room temperature. All [memory]: typical
 * handbook values (of the kind tabulated in the CRC Handbook of Chemistry and Physics, "Thermal
 * expansion of metals and alloys"; pure aluminium 23.1e-6 /K at 25 C), not read from the table here;
 * use a measured value where it matters. The budget counts ±10 % of each (measurement-thermal.ts).
 */
export const THERMAL_EXPANSION_PER_K = {
  aluminium: 23e-6,
  stainless_steel: 17e-6, // austenitic (304/316)
  steel: 11.5e-6, // carbon and tool steel: most calipers and gauges
  bronze: 18e-6,
} as const;
export type Material = keyof typeof THERMAL_EXPANSION_PER_K;

export const MATERIAL_OPTIONS: readonly { value: Material; label: string }[] = [
  { value: 'aluminium', label: 'Aluminium' },
  { value: 'stainless_steel', label: 'Stainless steel' },
  { value: 'steel', label: 'Steel' },
  { value: 'bronze', label: 'Bronze' },
];

/** Dimensions are defined at 20 C (ISO 1:2022); the full part-and-instrument model is in ./measurement-thermal. */
export { REFERENCE_TEMPERATURE_C } from './measurement-thermal';

export interface ThermalCorrectionInput {
  lengthMm: number;
  /** Temperature of the part (and instrument, if given) when measured, -30 to 70 C. */
  temperatureC: number;
  material: Material;
  /**
   * Instrument scale material, if the instrument was at the same temperature as the part.
   * Omitted: the instrument is treated as exact at the measuring temperature (kept at 20 C,
   * or compensated), so only the part's expansion is removed.
   */
  instrumentMaterial?: Material;
}

function expansionOf(field: string, material: unknown): number {
  if (typeof material !== 'string' || !Object.prototype.hasOwnProperty.call(THERMAL_EXPANSION_PER_K, material)) {
    throw new EngineInputError(field, `Unknown material "${String(material)}"`);
  }
  return THERMAL_EXPANSION_PER_K[material as Material];
}

/**
 * Length at 20 C from a reading at temperature t: L20 = L_t (1 + alpha_instr dt) / (1 + alpha_part dt),
 * dt = t - 20. A scale that expanded with the part under-reads by (1 + alpha_instr dt).
 */
export function correctLengthToReferenceTemperatureMm(input: ThermalCorrectionInput): number {
  const lengthMm = assertPositive('lengthMm', input.lengthMm);
  const t = assertInRange('temperatureC', input.temperatureC, -30, 70, 'C');
  const alphaPart = expansionOf('material', input.material);
  const alphaInstrument =
    input.instrumentMaterial === undefined ? 0 : expansionOf('instrumentMaterial', input.instrumentMaterial);
  const dt = t - REFERENCE_TEMPERATURE_C;
  return (lengthMm * (1 + alphaInstrument * dt)) / (1 + alphaPart * dt);
}

/**
 * Area-equivalent diameter sqrt(d_max d_min) [memory for the formula]; exact for an elliptical
 * exit, whose area is pi d_max d_min / 4.
 */
export function computeAreaEquivalentDiameterMm(dMaxMm: number, dMinMm: number): number {
  const dMax = assertPositive('dMaxMm', dMaxMm);
  const dMin = assertPositive('dMinMm', dMinMm);
  if (dMin > dMax) throw new EngineInputError('dMinMm', 'dMinMm must not exceed dMaxMm');
  return Math.sqrt(dMax * dMin);
}

/** Area-equivalent diameter from a set of two-point readings (largest and smallest). */
export function computeAreaEquivalentDiameterFromReadingsMm(readingsMm: readonly number[]): number {
  if (!Array.isArray(readingsMm) || readingsMm.length === 0) {
    throw new EngineInputError('readingsMm', 'Give at least one reading');
  }
  let dMax = -Infinity;
  let dMin = Infinity;
  readingsMm.forEach((r, i) => {
    assertPositive(`readingsMm[${i}]`, r);
    dMax = Math.max(dMax, r);
    dMin = Math.min(dMin, r);
  });
  return computeAreaEquivalentDiameterMm(dMax, dMin);
}
