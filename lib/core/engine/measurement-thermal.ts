// Differential thermal expansion of a part and the instrument that measures it, corrected to the
// 20 °C reference temperature (ISO 1:2022), and the uncertainty budget of the corrected length.
//
// Model (JCGM 100:2008, Annex H.1, the end-gauge calibration example, which uses the same form [memory
// for the equation's layout]; also ISO/TR 16015:2003 on thermal influences in length measurement [memory]):
//   L20 = L · (1 + α_i (t_i − 20)) / (1 + α_p (t_p − 20))
// L the reading, α_i and t_i the instrument's expansion coefficient and temperature, α_p and t_p the part's.
// A scale that has grown with its temperature under-reads by (1 + α_i Δt_i); the part's own growth
// (1 + α_p Δt_p) is removed. The first-order form L · (1 + α_i Δt_i − α_p Δt_p) differs by terms of
// order (αΔt)², a few 1e-8 · L here: shown as a check, never used to decide.
//
// Uncertainty (JCGM 100:2008, 5.1.2, law of propagation for uncorrelated inputs): u_c² = Σ (c_k u(x_k))²
// with c_k = ∂L20/∂x_k evaluated at the estimates. When one thermometer reading stands for both the
// part and the instrument ("same as the part") t_p and t_i are one input quantity t, so it enters once
// with c_t = ∂L20/∂t_p + ∂L20/∂t_i (fully correlated, JCGM 100:2008, 5.2.2 with r = 1): the common
// temperature then matters only through α_i − α_p.

import { EngineInputError, assertInRange, assertNonNegative, assertPositive } from './engine-input-error';

export const REFERENCE_TEMPERATURE_C = 20;

/**
 * Assumed thermometer error limit ±1 °C, a rectangular distribution: u(t) = 1/√3 K (JCGM 100:2008,
 * 4.3.7). The ±1 °C is an assumption typical of a handheld contact or infrared thermometer [memory].
 */
export const DEFAULT_THERMOMETER_ERROR_LIMIT_C = 1;
/**
 * Assumed half-width of an expansion coefficient taken from a handbook table for an alloy not
 * identified further: ±10 % of α, rectangular, so u(α) = 0.1 α/√3 (JCGM 100:2008, 4.3.7) [memory for
 * the 10 %: handbook values of one alloy family spread by about that much].
 */
export const DEFAULT_EXPANSION_RELATIVE_HALF_WIDTH = 0.1;

export interface DifferentialExpansionInput {
  lengthMm: number;
  partTemperatureC: number;
  instrumentTemperatureC: number;
  partExpansionPerK: number;
  instrumentExpansionPerK: number;
}

function check(input: DifferentialExpansionInput) {
  return {
    L: assertPositive('lengthMm', input.lengthMm),
    tp: assertInRange('partTemperatureC', input.partTemperatureC, -30, 70, 'C'),
    ti: assertInRange('instrumentTemperatureC', input.instrumentTemperatureC, -30, 70, 'C'),
    ap: assertInRange('partExpansionPerK', input.partExpansionPerK, 0, 1e-4, '/K'),
    ai: assertInRange('instrumentExpansionPerK', input.instrumentExpansionPerK, 0, 1e-4, '/K'),
  };
}

/** L20 = L (1 + α_i Δt_i) / (1 + α_p Δt_p), the exact form of the model above. */
export function correctDifferentialExpansionMm(input: DifferentialExpansionInput): number {
  const { L, tp, ti, ap, ai } = check(input);
  return (L * (1 + ai * (ti - REFERENCE_TEMPERATURE_C))) / (1 + ap * (tp - REFERENCE_TEMPERATURE_C));
}

/** The first-order form L (1 + α_i Δt_i − α_p Δt_p): a check on the exact form, not used to decide. */
export function correctDifferentialExpansionFirstOrderMm(input: DifferentialExpansionInput): number {
  const { L, tp, ti, ap, ai } = check(input);
  return L * (1 + ai * (ti - REFERENCE_TEMPERATURE_C) - ap * (tp - REFERENCE_TEMPERATURE_C));
}

/** One row of an uncertainty budget: |c| · u is the contribution to u_c (JCGM 100:2008, 5.1.3). */
export type BudgetTerm = {
  /** The input quantity in words, with its symbol. */
  quantity: string;
  /** Its estimate, in `unit`. */
  value: number;
  unit: string;
  /** u(x_k), in `unit`. */
  standardUncertainty: number;
  /** How u(x_k) was found (distribution, source). */
  basis: string;
  /** c_k = ∂L20/∂x_k, mm per `unit`. */
  sensitivity: number;
  /** |c_k| u(x_k), mm. */
  contributionMm: number;
};

export type LengthBudget = {
  terms: BudgetTerm[];
  combinedStandardUncertaintyMm: number;
  coverageFactor: number;
  expandedUncertaintyMm: number;
};

/** A term of the instrument itself, already a standard uncertainty of the reading L (mm). */
export type ReadingUncertaintyTerm = {
  quantity: string;
  value: number;
  unit: string;
  standardUncertainty: number;
  basis: string;
};

export interface LengthBudgetInput {
  /** The instrument's own terms (error limit, resolution, certificate U/k, …), standard uncertainties of L in mm. */
  readingTerms: readonly ReadingUncertaintyTerm[];
  /** The temperature correction, or null when the reading is used as read (no temperature terms). */
  thermal: (DifferentialExpansionInput & { sharedTemperature: boolean }) | null;
  thermometerErrorLimitC?: number;
  expansionRelativeHalfWidth?: number;
  coverageFactor?: number;
}

const SQRT3 = Math.sqrt(3);

/** The budget of L20 (or of L when not corrected), terms combined in quadrature, U = k u_c. */
export function computeLengthBudget(input: LengthBudgetInput): LengthBudget {
  const k = assertPositive('coverageFactor', input.coverageFactor ?? 2);
  const terms: BudgetTerm[] = [];
  let cL = 1;
  if (input.thermal) {
    const { L, tp, ti, ap, ai } = check(input.thermal);
    const dtp = tp - REFERENCE_TEMPERATURE_C;
    const dti = ti - REFERENCE_TEMPERATURE_C;
    const N = 1 + ai * dti;
    const D = 1 + ap * dtp;
    cL = N / D;
    const limitC = assertNonNegative(
      'thermometerErrorLimitC',
      input.thermometerErrorLimitC ?? DEFAULT_THERMOMETER_ERROR_LIMIT_C,
    );
    const rel = assertNonNegative(
      'expansionRelativeHalfWidth',
      input.expansionRelativeHalfWidth ?? DEFAULT_EXPANSION_RELATIVE_HALF_WIDTH,
    );
    const uT = limitC / SQRT3;
    const tBasis = `thermometer ±${limitC} °C, rectangular: ${limitC}/√3`;
    // Partial derivatives of L20 = L N / D.
    const cTp = (-L * N * ap) / (D * D);
    const cTi = (L * ai) / D;
    const cAp = (-L * N * dtp) / (D * D);
    const cAi = (L * dti) / D;
    if (input.thermal.sharedTemperature) {
      terms.push({
        quantity: 't, part and instrument (one reading)',
        value: tp,
        unit: '°C',
        standardUncertainty: uT,
        basis: `${tBasis}; one reading for both, so it enters once (JCGM 100:2008, 5.2.2, r = 1)`,
        sensitivity: cTp + cTi,
        contributionMm: 0,
      });
    } else {
      terms.push(
        {
          quantity: 't_p, part temperature',
          value: tp,
          unit: '°C',
          standardUncertainty: uT,
          basis: tBasis,
          sensitivity: cTp,
          contributionMm: 0,
        },
        {
          quantity: 't_i, instrument temperature',
          value: ti,
          unit: '°C',
          standardUncertainty: uT,
          basis: tBasis,
          sensitivity: cTi,
          contributionMm: 0,
        },
      );
    }
    const aBasis = `±${Math.round(rel * 100)} % of α, rectangular: ${rel}·α/√3`;
    terms.push(
      {
        quantity: 'α_p, part expansion coefficient',
        value: ap,
        unit: '1/K',
        standardUncertainty: (rel * ap) / SQRT3,
        basis: aBasis,
        sensitivity: cAp,
        contributionMm: 0,
      },
      {
        quantity: 'α_i, instrument expansion coefficient',
        value: ai,
        unit: '1/K',
        standardUncertainty: (rel * ai) / SQRT3,
        basis: aBasis,
        sensitivity: cAi,
        contributionMm: 0,
      },
    );
  }
  const readingTerms: BudgetTerm[] = input.readingTerms.map((t, i) => ({
    ...t,
    standardUncertainty: assertNonNegative(`readingTerms[${i}].standardUncertainty`, t.standardUncertainty),
    sensitivity: cL,
    contributionMm: 0,
  }));
  const all = [...readingTerms, ...terms].map((t) => ({
    ...t,
    contributionMm: Math.abs(t.sensitivity) * t.standardUncertainty,
  }));
  if (all.length === 0) throw new EngineInputError('readingTerms', 'An uncertainty budget needs at least one term.');
  // One term alone is its own u_c (Math.hypot of one value is exact, but say it plainly).
  const uc = all.length === 1 ? all[0].contributionMm : Math.hypot(...all.map((t) => t.contributionMm));
  return { terms: all, combinedStandardUncertaintyMm: uc, coverageFactor: k, expandedUncertaintyMm: k * uc };
}
