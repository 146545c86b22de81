// Measured items a class may limit besides the nozzle, power and weight: the units they come in,
// the formulas that turn readings into the limited value, and that value's expanded uncertainty.
// Pure maths (no framework, relative imports only): the verdict, the dock and tests call it.
//
// Which reading decides, per quantity (stated once, used everywhere):
//   - a length in mm is a size of a feature: each reading is a local (two-point) size and the limit
//     applies to every one of them, so the largest decides against a maximum and the smallest against
//     a minimum (ISO 14405-1:2016, the two-point size; as the nozzle).
//   - every other quantity (volume, mass, density, sound level, power) is one value of the thing
//     measured: repeated readings are repeated observations of it and their mean is the best
//     estimate (JCGM 100:2008, 4.2.1); their spread joins the uncertainty as s/√n (4.2.2, 4.2.3).
// U = k·u_c with k = 2 (JCGM 100:2008, 6.2.1, 6.3.3); input uncertainties are combined in
// quadrature as uncorrelated (5.1.2).
import { EngineInputError, assertNonNegative, assertPositive } from './engine-input-error';

/** Units a measured item may be limited in (the symbol is stored and shown). */
export const ITEM_UNITS = ['mm', 'cm³', 'L', 'kg', 'kg/m³', 'dB(A)', 'kW'] as const;
export type ItemUnit = (typeof ITEM_UNITS)[number];

export type ItemUnitFacts = {
  quantity: string;
  /** extreme: each reading is a local size (largest vs maximum, smallest vs minimum); mean: one quantity. */
  decisive: 'extreme' | 'mean';
  /** Digits shown for a value in this unit (U gets one more). */
  digits: number;
};
export const ITEM_UNIT_FACTS: Record<ItemUnit, ItemUnitFacts> = {
  mm: { quantity: 'length (size of a feature)', decisive: 'extreme', digits: 2 },
  'cm³': { quantity: 'volume (engine capacity)', decisive: 'mean', digits: 1 },
  L: { quantity: 'volume', decisive: 'mean', digits: 2 },
  kg: { quantity: 'mass', decisive: 'mean', digits: 1 },
  'kg/m³': { quantity: 'density', decisive: 'mean', digits: 1 },
  'dB(A)': { quantity: 'A-weighted sound level', decisive: 'mean', digits: 1 },
  kW: { quantity: 'power', decisive: 'mean', digits: 1 },
};

/** Formulas: direct (the reading is the value) or engine capacity from bore and stroke. */
export const ITEM_FORMULAS = ['direct', 'engine_capacity'] as const;
export type ItemFormulaKind = (typeof ITEM_FORMULAS)[number];
export type ItemFormula = { kind: 'direct' } | { kind: 'engine_capacity'; cylinders: number };

/** The names of one reading's fields per formula, with their unit ('item': the item's own unit). */
export const FORMULA_INPUTS = {
  direct: [{ name: 'value', label: 'Reading', unit: 'item' }],
  engine_capacity: [
    { name: 'boreMm', label: 'Bore', unit: 'mm' },
    { name: 'strokeMm', label: 'Stroke', unit: 'mm' },
  ],
} as const satisfies Record<ItemFormulaKind, readonly { name: string; label: string; unit: string }[]>;
export const READING_FIELDS = ['value', 'boreMm', 'strokeMm'] as const;
export type ReadingField = (typeof READING_FIELDS)[number];
export type ItemReading = Partial<Record<ReadingField, number>>;

/** Swept volume of a piston engine, cm³: V = n·(π/4)·b²·s (geometric cylinder volume; common practice, no source). */
export function engineCapacityCm3(cylinders: number, boreMm: number, strokeMm: number): number {
  assertPositive('cylinders', cylinders);
  if (!Number.isInteger(cylinders)) throw new EngineInputError('cylinders', 'The cylinder count is a whole number.');
  assertPositive('boreMm', boreMm);
  assertPositive('strokeMm', strokeMm);
  // mm³ → cm³: divide by 1000.
  return (cylinders * (Math.PI / 4) * boreMm * boreMm * strokeMm) / 1000;
}

const mean = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
/** Sample standard deviation (JCGM 100:2008, 4.2.2); 0 for one reading. */
export const sampleStdDev = (xs: readonly number[]) => {
  if (xs.length < 2) return 0;
  const m = mean(xs);
  return Math.sqrt(xs.reduce((a, x) => a + (x - m) ** 2, 0) / (xs.length - 1));
};

export type ItemEstimate = {
  /** What the verdict compares: every reading (extreme) or the one estimate (mean, formula). */
  decisiveValues: number[];
  /** The estimate shown (extreme: the largest reading; mean: the mean; formula: the computed value). */
  value: number;
  expandedUncertainty: number;
  /** One line on where U comes from, with the formula's figures. */
  basis: string;
};

/**
 * The estimate and U of a direct item. `instrumentStandardU`: u of one reading from the instrument, in
 * the item's unit, or null when no instrument's figure applies; then the class's default U stands for it.
 */
export function estimateDirectItem(o: {
  unit: ItemUnit;
  values: readonly number[];
  instrumentStandardU: number | null;
  defaultExpandedU: number;
  instrumentBasis: string | null;
}): ItemEstimate {
  if (o.values.length === 0) throw new EngineInputError('readings', 'Give at least one reading.');
  o.values.forEach((v, i) => assertPositive(`readings[${i}]`, v));
  assertNonNegative('defaultUncertainty', o.defaultExpandedU);
  const u0 = o.instrumentStandardU ?? o.defaultExpandedU / 2;
  const source = o.instrumentBasis ?? `the class default U ${fmt(o.defaultExpandedU)} ${o.unit}`;
  if (ITEM_UNIT_FACTS[o.unit].decisive === 'extreme') {
    // Each local size carries the instrument's U; the spread is the part's form, not noise, so it is not averaged.
    return {
      decisiveValues: [...o.values],
      value: Math.max(...o.values),
      expandedUncertainty: 2 * u0,
      basis: `${source}; each reading is a local size (ISO 14405-1:2016)`,
    };
  }
  const n = o.values.length;
  const m = mean(o.values);
  const s = sampleStdDev(o.values);
  const U = 2 * Math.hypot(u0, n > 1 ? s / Math.sqrt(n) : 0);
  return {
    decisiveValues: [m],
    value: m,
    expandedUncertainty: U,
    basis:
      n > 1
        ? `${source}, with the spread of ${n} readings (s ${fmt(s)} ${o.unit}, s/√n in quadrature, JCGM 100:2008 4.2.3): U = ${fmt(U)} ${o.unit}`
        : source,
  };
}

/**
 * Engine capacity from bore and stroke readings. Bore and stroke are each estimated by the mean of
 * their readings (one cylinder's bore and the crank's stroke: one quantity each, JCGM 100:2008 4.2.1),
 * and every cylinder is taken to have that bore (the class rule states the count; it is exact, not
 * measured). u(b), u(s): the instrument's u of a reading and the spread s/√n in quadrature.
 * V = n·(π/4)·b²·s is a product of powers, so (JCGM 100:2008, 5.1.2 with the sensitivity coefficients
 * ∂V/∂b = 2V/b and ∂V/∂s = V/s; the relative form for a product of powers, 5.1.6 [memory for the clause number]):
 *     u(V)/V = √((2·u(b)/b)² + (u(s)/s)²)
 * Without a length instrument the class's default U (in cm³) stands for the instrument's part.
 */
export function estimateEngineCapacity(o: {
  cylinders: number;
  boresMm: readonly number[];
  strokesMm: readonly number[];
  /** u of one length reading in mm (the instrument's U/2), or null: none applies. */
  instrumentStandardUMm: number | null;
  defaultExpandedUCm3: number;
  instrumentBasis: string | null;
}): ItemEstimate & { boreMm: number; strokeMm: number; uBoreMm: number; uStrokeMm: number } {
  if (o.boresMm.length === 0 || o.strokesMm.length === 0)
    throw new EngineInputError('readings', 'Give at least one bore and one stroke reading.');
  o.boresMm.forEach((v, i) => assertPositive(`readings[${i}].boreMm`, v));
  o.strokesMm.forEach((v, i) => assertPositive(`readings[${i}].strokeMm`, v));
  assertNonNegative('defaultUncertainty', o.defaultExpandedUCm3);
  const b = mean(o.boresMm);
  const s = mean(o.strokesMm);
  const V = engineCapacityCm3(o.cylinders, b, s);
  const ui = o.instrumentStandardUMm ?? 0;
  const spread = (xs: readonly number[]) => (xs.length > 1 ? sampleStdDev(xs) / Math.sqrt(xs.length) : 0);
  const uB = Math.hypot(ui, spread(o.boresMm));
  const uS = Math.hypot(ui, spread(o.strokesMm));
  const uFromInputs = V * Math.hypot((2 * uB) / b, uS / s);
  const uDefault = o.instrumentStandardUMm == null ? o.defaultExpandedUCm3 / 2 : 0;
  const uV = Math.hypot(uFromInputs, uDefault);
  const U = 2 * uV;
  const source = o.instrumentBasis ?? `the class default U ${fmt(o.defaultExpandedUCm3)} cm³ (no length instrument)`;
  return {
    decisiveValues: [V],
    value: V,
    expandedUncertainty: U,
    boreMm: b,
    strokeMm: s,
    uBoreMm: uB,
    uStrokeMm: uS,
    basis: `V = ${o.cylinders}·(π/4)·b²·s with bore ${fmt(b)} mm and stroke ${fmt(s)} mm (geometric cylinder volume, common practice); ${source}${
      uB === 0 && uS === 0
        ? ''
        : `; u(V)/V = √((2u(b)/b)² + (u(s)/s)²) with u(b) ${fmt(uB)} mm, u(s) ${fmt(uS)} mm (JCGM 100:2008, 5.1.2): U = 2·u(V) = ${fmt(U)} cm³`
    }`,
  };
}

function fmt(x: number): string {
  if (x === 0) return '0';
  const digits = Math.abs(x) >= 100 ? 1 : Math.abs(x) >= 1 ? 3 : 4;
  return String(Number(x.toFixed(digits)));
}
