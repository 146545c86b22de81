// The stored document shapes of models/shapes/ against the names lib/ uses for the same documents.
// models/ imports nothing from lib/, so the two are written apart; these checks make typecheck fail
// when either side changes without the other. Type-only: nothing here runs.
import type { StoredClassRules, STORED_BURDENS_OF_PROOF } from '../../models/shapes/class-rules';
import type { StoredParity, StoredReportInputs, StoredReportResults } from '../../models/shapes/parity-report';
import type {
  StoredRuleResult,
  STORED_BURDENS_OF_PROOF as STORED_RECORD_BURDENS,
  STORED_OUTCOMES,
  STORED_CHECK_AREAS,
  STORED_DECISION_RULES,
  STORED_MATERIALS,
  STORED_POWER_EVIDENCE_KINDS,
  STORED_SEAL_ACTIONS,
  STORED_VERDICTS,
} from '../../models/shapes/inspection-record';
import type { SealAction } from '../../models/boat-record';
import type { PowerEvidenceKind } from './inputs/inspections';
import type { ClassRules } from './inputs/class-rules';
import type { DecisionRule, Verdict } from './engine/conformity';
import type { BurdenOfProof, Outcome } from './engine/conformity-burden';
import type { Material } from './engine/measurement';
import type { ParityReport } from './engine/parity';
import type { CheckArea, RuleResult } from './inspections/decide-inspection';
import type { ReportInputs, ReportResults } from './reports/parity-figures';
import type {
  StoredDeclaredEngine,
  StoredDeclaredPump,
  StoredDeclaredSuction,
  STORED_ENGINE_CURVE_SHAPES,
} from '../../models/shapes/boat-performance';
import type { DeclaredEngineInput, DeclaredPumpInput, DeclaredSuctionInput } from './inputs/boat-performance';
import type { EngineCurveShape } from './engine/engine-curve-shapes';
import type { z } from 'zod';

/** true only when A and B are mutually assignable (the same shape for stored data). */
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
type Check<T extends true> = T;
/** true when every A fits B (a decided value is storable as it stands). */
type Fits<A, B> = [A] extends [B] ? true : false;

export type StoredShapesMatch = [
  Check<Same<ClassRules, StoredClassRules>>,
  Check<Same<(typeof STORED_BURDENS_OF_PROOF)[number], BurdenOfProof>>,
  Check<Same<ReportInputs, StoredReportInputs>>,
  Check<Same<ReportResults, StoredReportResults>>,
  Check<Same<ParityReport, StoredParity>>,
  Check<Same<(typeof STORED_VERDICTS)[number], Verdict>>,
  Check<Same<(typeof STORED_DECISION_RULES)[number], DecisionRule>>,
  Check<Same<(typeof STORED_CHECK_AREAS)[number], CheckArea>>,
  Check<Same<(typeof STORED_MATERIALS)[number], Material>>,
  Check<Fits<RuleResult, StoredRuleResult>>,
  Check<Same<(typeof STORED_RECORD_BURDENS)[number], BurdenOfProof>>,
  Check<Same<(typeof STORED_OUTCOMES)[number], Outcome>>,
  Check<Same<(typeof STORED_POWER_EVIDENCE_KINDS)[number], PowerEvidenceKind>>,
  Check<Same<(typeof STORED_SEAL_ACTIONS)[number], SealAction>>,
  Check<Same<z.output<typeof DeclaredEngineInput>, StoredDeclaredEngine>>,
  Check<Same<z.output<typeof DeclaredSuctionInput>, StoredDeclaredSuction>>,
  Check<Fits<Extract<z.output<typeof DeclaredPumpInput>, { kind: 'points' }>, StoredDeclaredPump>>,
  Check<Same<(typeof STORED_ENGINE_CURVE_SHAPES)[number], EngineCurveShape>>,
];
