// The stored document shapes of models/shapes/ against the names lib/ uses for the same documents.
// models/ imports nothing from lib/, so the two are written apart; these checks make typecheck fail
// when either side changes without the other. Type-only: nothing here runs.
import type { StoredClassRules } from '../../models/shapes/class-rules';
import type { StoredParity, StoredReportInputs, StoredReportResults } from '../../models/shapes/parity-report';
import type { ClassRules } from './inputs/class-rules';
import type { ParityReport } from './engine/parity';
import type { ReportInputs, ReportResults } from './reports/parity-figures';

/** true only when A and B are mutually assignable (the same shape for stored data). */
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
type Check<T extends true> = T;

export type StoredShapesMatch = [
  Check<Same<ClassRules, StoredClassRules>>,
  Check<Same<ReportInputs, StoredReportInputs>>,
  Check<Same<ReportResults, StoredReportResults>>,
  Check<Same<ParityReport, StoredParity>>,
];
