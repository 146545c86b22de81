// The stored class rules document (class_rule_versions.rules), as the model types its column. The
// input schema with its messages and cross-field checks is lib/core/inputs/class-rules.ts; the
// check in lib/core/stored-shapes.ts fails typecheck when the two drift apart.
// All figures in SI-based units: mm, kW, kg, m/s.
export const STORED_RULE_DECISION_RULES = ['simple', 'guarded', 'iso14253'] as const;
export const STORED_BURDENS_OF_PROOF = ['conformity', 'non_conformity'] as const;
type StoredBurden = (typeof STORED_BURDENS_OF_PROOF)[number];

export type StoredClassRules = {
  nozzle: { maxMm: number | null; minMm: number | null; minReadings: number; defaultUncertaintyMm: number };
  power: { minKw: number | null; maxKw: number | null; defaultUncertaintyKw: number };
  weight: { minKg: number | null; includesDriver: boolean; defaultUncertaintyKg: number };
  decisionRule: (typeof STORED_RULE_DECISION_RULES)[number];
  /** Safety item keys the class requires (lib/core/constants.ts SAFETY_ITEMS). */
  safetyItems: string[];
  parity: {
    pumpEfficiency: number;
    nozzleLossCoefficient: number;
    inletLossCoefficient: number;
    wakeFraction: number;
    referenceSpeedsMs: number[];
  };
  /** Who must prove, per context; absent in rules stored before it (readers apply the defaults). */
  burdenOfProof?: { inspection: StoredBurden; protest: StoredBurden };
};
