// Conformity decisions for a measured size against a class limit.
//
// Decisive value (ISO 14405-1:2016: a two-point size limit applies to every local size): against
// a maximum the largest reading, against a minimum the smallest. With both limits each is
// evaluated and the worst verdict wins (does_not_conform > inconclusive > conforms).
//
// Rules (U = expanded uncertainty, k = 2; ILAC-G8:09/2019 and ISO 14253-1:2017):
//   simple   — guard band 0: conforms if the value does not exceed the limit; else does not.
//   guarded  — guard band U: acceptance limit = limit - U (max) or limit + U (min); binary.
//   iso14253 — conformity proven only inside the limit reduced by U, non-conformity only outside
//              the limit widened by U; between the two: inconclusive.
//
// Boundary classing (one principle: the specification limit itself is inclusive, "not exceeding"):
//   simple:   value == limit              -> conforms
//   guarded:  value == limit - U          -> conforms
//   iso14253: value == limit - U          -> conforms (the whole interval value ± U lies within
//                                            the closed specification zone)
//             value == limit + U          -> inconclusive (the interval still touches the limit,
//                                            which conforms; non-conformity needs value - U > limit)
// Floating point: 102.00 - 0.05 is 101.95000000000000284, so comparisons allow EPSILON_MM = 1e-9 mm
// (a millionth of a micrometre, far below any instrument) in the direction of the inclusive side.

import { EngineInputError, assertFiniteNumber, assertNonNegative, assertPositive } from './engine-input-error';
import { computeUncertaintyBudget } from './measurement';
import type { InstrumentUncertaintyInput } from './measurement';

export type DecisionRule = 'simple' | 'guarded' | 'iso14253';
export type Verdict = 'conforms' | 'does_not_conform' | 'inconclusive';
export const DECISION_RULES: readonly DecisionRule[] = ['simple', 'guarded', 'iso14253'];
export const EPSILON_MM = 1e-9;

const VERDICT_RANK: Record<Verdict, number> = { conforms: 0, inconclusive: 1, does_not_conform: 2 };
const RULE_NAMES: Record<DecisionRule, string> = {
  simple: 'simple acceptance',
  guarded: 'guarded acceptance',
  iso14253: 'ISO 14253-1',
};

export interface ConformityInput {
  readingsMm: readonly number[];
  maxMm?: number;
  minMm?: number;
  /** Expanded uncertainty U (k = 2), mm. Give this or `instrument`, not both. */
  expandedUncertaintyMm?: number;
  instrument?: InstrumentUncertaintyInput;
  rule: DecisionRule;
}

export interface LimitCheck {
  side: 'max' | 'min';
  limitMm: number;
  decisiveValueMm: number;
  /** Limit reduced by the guard band: at or inside it the value conforms (iso14253: proven). */
  acceptanceLimitMm: number;
  /** iso14253 only: beyond it non-conformity is proven. null for binary rules. */
  rejectionLimitMm: number | null;
  verdict: Verdict;
  explanation: string;
}

export interface ConformityResult {
  rule: DecisionRule;
  verdict: Verdict;
  /** Decisive value of the check that governs the verdict (on a tie, the maximum check). */
  decisiveValueMm: number;
  expandedUncertaintyMm: number;
  acceptanceLimitsMm: { maxMm: number | null; minMm: number | null };
  checks: LimitCheck[];
  explanation: string;
}

/** Shortest of 2, 3 or 4 decimals that shows the number exactly (to 1e-9), for explanations. */
export function formatMm(valueMm: number): string {
  for (let d = 2; d < 4; d++) {
    const f = 10 ** d;
    if (Math.abs(Math.round(valueMm * f) / f - valueMm) < EPSILON_MM) return valueMm.toFixed(d);
  }
  return valueMm.toFixed(4);
}

function assertRule(rule: unknown): DecisionRule {
  if (!DECISION_RULES.includes(rule as DecisionRule)) {
    throw new EngineInputError('rule', `rule must be one of ${DECISION_RULES.join(', ')} (got ${String(rule)})`);
  }
  return rule as DecisionRule;
}

function resolveExpandedUncertaintyMm(input: ConformityInput): number {
  const hasU = input.expandedUncertaintyMm !== undefined;
  const hasInstrument = input.instrument !== undefined;
  if (hasU && hasInstrument) {
    throw new EngineInputError('expandedUncertaintyMm', 'Give either expandedUncertaintyMm or instrument, not both');
  }
  if (hasInstrument) return computeUncertaintyBudget(input.instrument ?? {}).expandedUncertaintyMm;
  if (!hasU) {
    throw new EngineInputError('expandedUncertaintyMm', 'Give expandedUncertaintyMm (use 0 for none) or an instrument');
  }
  return assertNonNegative('expandedUncertaintyMm', input.expandedUncertaintyMm);
}

function checkLimit(
  side: 'max' | 'min',
  limitMm: number,
  valueMm: number,
  uMm: number,
  rule: DecisionRule,
): LimitCheck {
  // s = +1 for a maximum, -1 for a minimum: "excess" e = s (value - limit) is positive beyond it.
  const s = side === 'max' ? 1 : -1;
  const excess = s * (valueMm - limitMm);
  const guard = rule === 'simple' ? 0 : uMm;
  const acceptanceLimitMm = limitMm - s * guard;
  let verdict: Verdict;
  if (rule === 'iso14253') {
    if (excess <= -uMm + EPSILON_MM) verdict = 'conforms';
    else if (excess > uMm + EPSILON_MM) verdict = 'does_not_conform';
    else verdict = 'inconclusive';
  } else {
    verdict = excess <= -guard + EPSILON_MM ? 'conforms' : 'does_not_conform';
  }
  const rejectionLimitMm = rule === 'iso14253' ? limitMm + s * uMm : null;
  return {
    side,
    limitMm,
    decisiveValueMm: valueMm,
    acceptanceLimitMm,
    rejectionLimitMm,
    verdict,
    explanation: explainCheck(side, limitMm, valueMm, uMm, rule, verdict),
  };
}

function explainCheck(
  side: 'max' | 'min',
  limitMm: number,
  valueMm: number,
  uMm: number,
  rule: DecisionRule,
  verdict: Verdict,
): string {
  const reading = `${side === 'max' ? 'Largest' : 'Smallest'} reading ${formatMm(valueMm)} mm`;
  const limit = `the ${side === 'max' ? 'maximum' : 'minimum'} ${formatMm(limitMm)} mm`;
  const u = `U ${formatMm(uMm)} mm`;
  const beyond = side === 'max' ? 'exceeds' : 'falls below';
  const notBeyond = side === 'max' ? 'does not exceed' : 'does not fall below';
  if (rule === 'simple') {
    return verdict === 'conforms'
      ? `${reading} ${notBeyond} ${limit} (simple acceptance): conforms.`
      : `${reading} ${beyond} ${limit} (simple acceptance): does not conform.`;
  }
  if (rule === 'guarded') {
    const acceptance = formatMm(side === 'max' ? limitMm - uMm : limitMm + uMm);
    const basis = `acceptance limit ${acceptance} mm (${limit} ${side === 'max' ? 'less' : 'plus'} ${u}, guarded acceptance)`;
    return verdict === 'conforms'
      ? `${reading} ${notBeyond} the ${basis}: conforms.`
      : `${reading} ${beyond} the ${basis}: does not conform.`;
  }
  if (verdict === 'conforms') return `${reading} is inside ${limit} by at least ${u}: conformity proven (ISO 14253-1).`;
  if (verdict === 'does_not_conform') {
    return `${reading} ${beyond} ${limit} by more than ${u}: non-conformity proven (ISO 14253-1).`;
  }
  return `${reading} is within ${u} of ${limit}: neither conformity nor non-conformity proven (ISO 14253-1); measure again with a better instrument or apply the event's stated rule.`;
}

export function evaluateConformity(input: ConformityInput): ConformityResult {
  if (input === null || typeof input !== 'object')
    throw new EngineInputError('input', 'A conformity input is required');
  const rule = assertRule(input.rule);
  const readings = input.readingsMm;
  if (!Array.isArray(readings) || readings.length === 0) {
    throw new EngineInputError('readingsMm', 'Give at least one reading');
  }
  let largest = -Infinity;
  let smallest = Infinity;
  readings.forEach((r, i) => {
    assertPositive(`readingsMm[${i}]`, r);
    largest = Math.max(largest, r);
    smallest = Math.min(smallest, r);
  });
  const maxMm = input.maxMm === undefined ? undefined : assertPositive('maxMm', input.maxMm);
  const minMm = input.minMm === undefined ? undefined : assertPositive('minMm', input.minMm);
  if (maxMm === undefined && minMm === undefined) {
    throw new EngineInputError('maxMm', 'Give a maximum (maxMm), a minimum (minMm) or both');
  }
  if (maxMm !== undefined && minMm !== undefined && !(minMm < maxMm)) {
    throw new EngineInputError('minMm', `minMm (${minMm}) must be below maxMm (${maxMm})`);
  }
  const uMm = resolveExpandedUncertaintyMm(input);
  const checks: LimitCheck[] = [];
  if (maxMm !== undefined) checks.push(checkLimit('max', maxMm, largest, uMm, rule));
  if (minMm !== undefined) checks.push(checkLimit('min', minMm, smallest, uMm, rule));
  let governing = checks[0];
  for (const c of checks) if (VERDICT_RANK[c.verdict] > VERDICT_RANK[governing.verdict]) governing = c;
  const maxCheck = checks.find((c) => c.side === 'max');
  const minCheck = checks.find((c) => c.side === 'min');
  const allConform = checks.length === 2 && checks.every((c) => c.verdict === 'conforms');
  const explanation =
    allConform && maxCheck && minCheck
      ? `Readings ${formatMm(smallest)}–${formatMm(largest)} mm lie within the acceptance limits ${formatMm(minCheck.acceptanceLimitMm)}–${formatMm(maxCheck.acceptanceLimitMm)} mm (${RULE_NAMES[rule]}, U ${formatMm(uMm)} mm): conforms.`
      : governing.explanation;
  return {
    rule,
    verdict: governing.verdict,
    decisiveValueMm: governing.decisiveValueMm,
    expandedUncertaintyMm: assertFiniteNumber('expandedUncertaintyMm', uMm),
    acceptanceLimitsMm: { maxMm: maxCheck?.acceptanceLimitMm ?? null, minMm: minCheck?.acceptanceLimitMm ?? null },
    checks,
    explanation,
  };
}
