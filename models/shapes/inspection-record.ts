// The stored inspection record: the two JSONB documents (measurements, results) an inspection's
// verdict writes and the board, the boat card and the parity report read. One shape, checked by
// zod; lib/core/inspections/inspection-record.ts builds it, and migrations bring older rows to it.
// Pure (zod only, nothing from lib/), so models/ can type its columns from it.
import { z } from 'zod';

export const STORED_VERDICTS = ['conforms', 'does_not_conform', 'inconclusive'] as const;
export const STORED_DECISION_RULES = ['simple', 'guarded', 'iso14253'] as const;
export const STORED_CHECK_AREAS = ['nozzle', 'weight', 'power', 'safety', 'items'] as const;
/** Units of a rule line: the nozzle's, weight's and power's, and a class's measured items' own. */
export const STORED_RULE_UNITS = ['mm', 'kg', 'kW', 'cm³', 'L', 'kg/m³', 'dB(A)'] as const;
export const STORED_VALUE_KINDS = ['measured', 'confirmed', 'declared'] as const;
export const STORED_BURDENS_OF_PROOF = ['conformity', 'non_conformity'] as const;
export const STORED_OUTCOMES = ['conforms', 'does_not_conform', 'not_accepted', 'non_conformity_not_proven'] as const;
/** Nozzle materials with a thermal expansion coefficient for the 20 °C correction. */
export const STORED_MATERIALS = ['aluminium', 'stainless_steel', 'steel', 'bronze'] as const;

const figure = z.number().nullable();

/** One row of an uncertainty budget (JCGM 100:2008, 5.1.2): u(x), c = ∂L20/∂x, contribution |c|·u in mm. */
export const StoredBudgetTerm = z.object({
  quantity: z.string(),
  value: z.number(),
  unit: z.string(),
  standardUncertainty: z.number(),
  basis: z.string(),
  sensitivity: z.number(),
  contributionMm: z.number(),
});
/** The nozzle's budget as decided: its terms, u_c, k and U = k·u_c. */
export const StoredLengthBudget = z.object({
  terms: z.array(StoredBudgetTerm),
  combinedStandardUncertaintyMm: z.number(),
  coverageFactor: z.number(),
  expandedUncertaintyMm: z.number(),
});
export const STORED_INSTRUMENT_TEMPERATURE_SOURCES = ['measured', 'same_as_part', 'assumed_reference'] as const;
export const STORED_INSTRUMENT_MATERIAL_SOURCES = ['instrument', 'form', 'assumed_steel'] as const;

/** The nozzle as measured, with what the verdict used: readings corrected to 20 °C and the applied U. */
export const StoredNozzleMeasurement = z.object({
  readings: z.array(z.object({ diameterMm: z.number(), angleDeg: z.number() })),
  instrumentId: z.string().nullable(),
  instrumentName: z.string().nullable(),
  /** U typed on the form (only without an instrument). */
  typedExpandedUncertaintyMm: figure,
  /** The nozzle's (part's) temperature. */
  temperatureC: figure,
  material: z.enum(STORED_MATERIALS).nullable(),
  // What the differential-expansion correction used (records from before it have none: optional).
  instrumentTemperatureC: figure.optional(),
  instrumentTemperatureSource: z.enum(STORED_INSTRUMENT_TEMPERATURE_SOURCES).nullable().optional(),
  instrumentMaterial: z.enum(STORED_MATERIALS).nullable().optional(),
  instrumentMaterialSource: z.enum(STORED_INSTRUMENT_MATERIAL_SOURCES).nullable().optional(),
  /** The budget of the decisive reading, term by term (records from before it have none). */
  uncertaintyBudget: StoredLengthBudget.optional(),
  /** The readings the verdict used: corrected to the 20 °C reference temperature when temperatureCorrected. */
  correctedReadingsMm: z.array(z.number()),
  temperatureCorrected: z.boolean(),
  appliedExpandedUncertaintyMm: z.number(),
  uncertaintyBasis: z.string(),
});

/** The weighings and, when the class has a minimum and the check was decided, their mean and U. */
export const StoredWeightMeasurement = z.object({
  readingsKg: z.array(z.number()),
  instrumentId: z.string().nullable(),
  instrumentName: z.string().nullable(),
  meanKg: figure,
  expandedUncertaintyKg: figure,
  uncertaintyBasis: z.string().nullable(),
});

export const STORED_POWER_EVIDENCE_KINDS = ['dyno_sheet', 'maker_rating', 'declaration_only'] as const;
export const STORED_SEAL_ACTIONS = ['applied', 'intact', 'broken', 'missing', 'removed'] as const;

export const StoredPowerMeasurement = z.object({
  declaredKw: z.number(),
  evidenceSeen: z.boolean(),
  note: z.string(),
  /** The boat's declared figure and evidence when it was inspected. */
  boatDeclaredKw: z.number(),
  boatPowerEvidence: z.string(),
  /** The kind of evidence seen (records from before the seal register have none: optional). */
  evidenceKind: z.enum(STORED_POWER_EVIDENCE_KINDS).nullable().optional(),
  /** The boat's document that was the dyno sheet, by id and file name as it was then. */
  dynoDocument: z.object({ id: z.string(), fileName: z.string() }).nullable().optional(),
});

/** One thing done to a seal at this inspection, as the register wrote it (seal_events has the rows). */
export const StoredSealAction = z.object({
  number: z.string(),
  action: z.enum(STORED_SEAL_ACTIONS),
  componentId: z.string().nullable(),
  /** The component in words as it was then ("engine, Maker Model, serial X"). */
  component: z.string(),
  position: z.string(),
  reason: z.string(),
});
export type StoredSealAction = z.infer<typeof StoredSealAction>;

/** One measured item of the class: its readings as entered, the instrument, and the value and U decided on. */
export const StoredMeasuredItem = z.object({
  key: z.string(),
  label: z.string(),
  unit: z.enum(STORED_RULE_UNITS),
  readings: z.array(z.record(z.string(), z.number())),
  instrumentId: z.string().nullable(),
  instrumentName: z.string().nullable(),
  value: z.number(),
  expandedUncertainty: z.number(),
  uncertaintyBasis: z.string(),
});
export const StoredGaugeCheck = z.object({
  rule: z.string(),
  gauge: z.string(),
  instrumentId: z.string().nullable(),
  instrumentName: z.string().nullable(),
  passed: z.boolean(),
});

export const StoredMeasurements = z.object({
  nozzle: StoredNozzleMeasurement,
  weight: StoredWeightMeasurement.nullable(),
  power: StoredPowerMeasurement,
  /** Free-text seals of records written before the seal register (new records: empty). */
  seals: z.array(z.object({ number: z.string(), location: z.string() })),
  /** The register's seal actions at this inspection (records from before it have none). */
  sealActions: z.array(StoredSealAction).optional(),
  safety: z.record(z.string(), z.boolean()),
  /** A class's own measured items as read and decided (records without any have none). */
  measuredItems: z.array(StoredMeasuredItem).optional(),
  /** Go/no-go gauge checks (records without any have none). */
  gaugeChecks: z.array(StoredGaugeCheck).optional(),
});
export type StoredMeasurements = z.infer<typeof StoredMeasurements>;

/** One rule's verdict as decided. */
export const StoredRuleResult = z.object({
  rule: z.string(),
  label: z.string(),
  decisiveValue: figure,
  unit: z.enum(STORED_RULE_UNITS).nullable(),
  limit: figure,
  acceptanceLimit: figure,
  rejectionLimit: figure,
  expandedUncertainty: figure,
  /** The nozzle rule's budget (other rules and older records: none). */
  budget: StoredLengthBudget.optional(),
  verdict: z.enum(STORED_VERDICTS),
  explanation: z.string(),
  measured: z.boolean(),
  valueKind: z.enum(STORED_VALUE_KINDS).nullable().optional(),
  /** Who had to prove and the verdict resolved for them (records from before the burden of proof have none). */
  burdenOfProof: z.enum(STORED_BURDENS_OF_PROOF).optional(),
  outcome: z.enum(STORED_OUTCOMES).optional(),
});
export type StoredRuleResult = z.infer<typeof StoredRuleResult>;

export const StoredResults = z.object({
  rules: z.array(StoredRuleResult),
  decisionRule: z.enum(STORED_DECISION_RULES),
  /** The class rule version's number the record was decided under. */
  ruleVersion: z.number().int().positive(),
  /** A targeted re-inspection's checks (null: all). */
  scope: z.array(z.enum(STORED_CHECK_AREAS)).nullable(),
});
export type StoredResults = z.infer<typeof StoredResults>;

/** Both documents of one record, as written together. */
export const StoredInspectionRecord = z.object({ measurements: StoredMeasurements, results: StoredResults });
export type StoredInspectionRecord = z.infer<typeof StoredInspectionRecord>;
