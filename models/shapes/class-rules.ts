// The stored class rules document (class_rule_versions.rules), as the model types its column. The
// input schema with its messages and cross-field checks is lib/core/inputs/class-rules.ts; the
// check in lib/core/stored-shapes.ts fails typecheck when the two drift apart.
// All figures in SI-based units: mm, kW, kg, m/s.
export const STORED_RULE_DECISION_RULES = ['simple', 'guarded', 'iso14253'] as const;
export const STORED_BURDENS_OF_PROOF = ['conformity', 'non_conformity'] as const;
type StoredBurden = (typeof STORED_BURDENS_OF_PROOF)[number];
type StoredDecisionRule = (typeof STORED_RULE_DECISION_RULES)[number];
/** How a size limit is checked: two-point readings, a go/no-go gauge, or both must pass (ISO 14405-1:2016). */
export const STORED_CHECK_METHODS = ['two_point', 'gauge', 'both'] as const;
export const STORED_ITEM_UNITS = ['mm', 'cm³', 'L', 'kg', 'kg/m³', 'dB(A)', 'kW'] as const;
export const STORED_INSTRUMENT_TYPES = [
  'caliper',
  'bore_gauge',
  'micrometer',
  'plug_gauge',
  'tape',
  'scale',
  'thermometer',
  'other',
] as const;

/** A measured item of the class's own (engine capacity, ballast, noise, fuel density…). */
export type StoredMeasuredItem = {
  key: string;
  label: string;
  unit: (typeof STORED_ITEM_UNITS)[number];
  minimum: number | null;
  maximum: number | null;
  readings: number;
  instrumentTypes: (typeof STORED_INSTRUMENT_TYPES)[number][];
  /** null: the class's decision rule. */
  decisionRule: StoredDecisionRule | null;
  defaultUncertainty: number;
  note: string;
  formula: { kind: 'direct' } | { kind: 'engine_capacity'; cylinders: number };
};

export type StoredClassRules = {
  nozzle: {
    maxMm: number | null;
    minMm: number | null;
    minReadings: number;
    defaultUncertaintyMm: number;
    /** Absent in rules stored before gauge checks: two-point readings govern. */
    checkMethod?: (typeof STORED_CHECK_METHODS)[number];
    /** The no-go plug gauge's size (against the maximum) and the go plug gauge's (against the minimum). */
    gaugeNoGoMm?: number | null;
    gaugeGoMm?: number | null;
  };
  power: {
    minKw: number | null;
    maxKw: number | null;
    defaultUncertaintyKw: number;
    /** Expanded power uncertainty (k = 2) per kind of evidence, as a share of the power; absent: common practice. */
    evidenceShares?: { dyno_sheet: number; maker_rating: number; declaration_only: number };
  };
  weight: { minKg: number | null; includesDriver: boolean; defaultUncertaintyKg: number };
  decisionRule: StoredDecisionRule;
  /** Safety item keys the class requires (lib/core/constants.ts SAFETY_ITEMS). */
  safetyItems: string[];
  parity: {
    pumpEfficiency: number;
    nozzleLossCoefficient: number;
    inletLossCoefficient: number;
    wakeFraction: number;
    referenceSpeedsMs: number[];
    /** Absent in rules stored before it: fixed power. */
    reportModel?: 'fixed_power' | 'matched';
  };
  /** Who must prove, per context; absent in rules stored before it (readers apply the defaults). */
  burdenOfProof?: { inspection: StoredBurden; protest: StoredBurden };
  /** The class's own measured items (absent in rules stored before them: none). */
  measuredItems?: StoredMeasuredItem[];
};
