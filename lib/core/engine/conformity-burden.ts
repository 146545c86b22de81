// Burden of proof: who carries the measurement uncertainty when a verdict is inconclusive.
//
// ISO 14253-1:2017 (rules for proving conformity and non-conformity with specifications) makes the
// uncertainty count against whoever must prove: the supplier proving conformity, or the customer
// proving non-conformity; ILAC-G8:09/2019 says the decision rule and who carries the risk are fixed
// before measuring. At a race meeting (common practice, no source):
//   'conformity'     — the entrant must prove conformity (inspection before racing, like a supplier):
//                      an inconclusive result is not accepted; measure again with a better
//                      instrument or fix the part.
//   'non_conformity' — the protester must prove non-conformity (a protest, like a customer): an
//                      inconclusive result is "non-conformity not proven" and the part stands.
// A verdict that conforms or does not conform is the same under either burden. The verdict itself
// is never changed: the outcome is an extra statement beside it.

import { EngineInputError } from './engine-input-error';
import { evaluateConformity } from './conformity';
import type { ConformityInput, Verdict } from './conformity';

export const BURDENS_OF_PROOF = ['conformity', 'non_conformity'] as const;
export type BurdenOfProof = (typeof BURDENS_OF_PROOF)[number];

export const OUTCOMES = ['conforms', 'does_not_conform', 'not_accepted', 'non_conformity_not_proven'] as const;
export type Outcome = (typeof OUTCOMES)[number];

export interface ResolvedOutcome {
  burdenOfProof: BurdenOfProof;
  outcome: Outcome;
  /** true when the part is accepted or stands (conforms, or non-conformity not proven). */
  partStands: boolean;
  explanation: string;
}

/** Who must prove what, in words (the same on the rules screen, the verdict and the steward's screen). */
export const BURDEN_WORDS: Record<BurdenOfProof, string> = {
  conformity: 'The entrant must prove conformity (ISO 14253-1:2017: the supplier proves conformity)',
  non_conformity:
    'The protester must prove non-conformity (ISO 14253-1:2017: the customer proves non-conformity; ILAC-G8:09/2019)',
};

export const OUTCOME_WORDS: Record<Outcome, string> = {
  conforms: 'Conforms',
  does_not_conform: 'Does not conform',
  not_accepted: 'Not accepted',
  non_conformity_not_proven: 'Non-conformity not proven',
};

const EXPLANATIONS: Record<Outcome, string> = {
  conforms: 'Conforms under the class’s decision rule; the burden of proof does not change this result.',
  does_not_conform:
    'Does not conform under the class’s decision rule; the burden of proof does not change this result.',
  not_accepted:
    'Not accepted: the entrant must prove conformity and the result is inconclusive. Measure again with a better instrument or fix the part.',
  non_conformity_not_proven:
    'Non-conformity not proven: the protester must prove non-conformity and the result is inconclusive, so the part stands.',
};

export function assertBurdenOfProof(burden: unknown): BurdenOfProof {
  if (!BURDENS_OF_PROOF.includes(burden as BurdenOfProof)) {
    throw new EngineInputError(
      'burdenOfProof',
      `burdenOfProof must be one of ${BURDENS_OF_PROOF.join(', ')} (got ${String(burden)})`,
    );
  }
  return burden as BurdenOfProof;
}

/** The outcome of a verdict when `burden` says who must prove. */
export function resolveOutcome(verdict: Verdict, burden: BurdenOfProof): ResolvedOutcome {
  const burdenOfProof = assertBurdenOfProof(burden);
  let outcome: Outcome;
  if (verdict === 'conforms') outcome = 'conforms';
  else if (verdict === 'does_not_conform') outcome = 'does_not_conform';
  else if (verdict === 'inconclusive')
    outcome = burdenOfProof === 'conformity' ? 'not_accepted' : 'non_conformity_not_proven';
  else throw new EngineInputError('verdict', `Unknown verdict ${String(verdict)}`);
  return {
    burdenOfProof,
    outcome,
    partStands: outcome === 'conforms' || outcome === 'non_conformity_not_proven',
    explanation: EXPLANATIONS[outcome],
  };
}

/**
 * The outcome of a measurement under a burden of proof, whatever acceptance rule the class uses. The
 * one who must prove carries the uncertainty (ISO 14253-1:2017): a protester proves non-conformity
 * only beyond the limit by more than U (the rejection zone), so under that burden the outcome is
 * resolved from the ISO 14253-1 verdict even when the class accepts by a 'simple' or 'guarded' rule
 * (both would otherwise call a part inside the limit band non-conforming against the entrant). Under
 * the entrant's burden the class's own verdict stands (a 'simple' rule is the class's choice to share
 * the risk, ILAC-G8:09/2019). The verdict itself is never changed.
 */
export function resolveOutcomeForMeasurement(
  input: ConformityInput,
  classVerdict: Verdict,
  burden: BurdenOfProof,
): ResolvedOutcome {
  const burdenOfProof = assertBurdenOfProof(burden);
  if (burdenOfProof === 'conformity' || input.rule === 'iso14253') return resolveOutcome(classVerdict, burdenOfProof);
  const proven = evaluateConformity({ ...input, rule: 'iso14253' }).verdict;
  const resolved = resolveOutcome(proven, burdenOfProof);
  if (proven === classVerdict) return resolved;
  return {
    ...resolved,
    explanation: `${resolved.explanation} The protester must show the value beyond the limit by more than the expanded uncertainty (ISO 14253-1:2017), whatever the class's acceptance rule.`,
  };
}

const OUTCOME_ORDER: Outcome[] = ['does_not_conform', 'not_accepted', 'non_conformity_not_proven', 'conforms'];

/** The overall outcome of several lines: the worst for the part (does not conform > not accepted > not proven > conforms). */
export function worstOutcome(outcomes: readonly Outcome[]): Outcome {
  for (const o of OUTCOME_ORDER) if (outcomes.includes(o)) return o;
  return 'conforms';
}

/**
 * The verdict a protester has proven on one decided line: non-conformity only beyond the limit by
 * more than U, conformity shown inside it by more than U, else inconclusive (ISO 14253-1:2017). The
 * side of the limit is read from the acceptance limit (guarded rules) or from where the value lies
 * against the limit for the verdict given. A line without a value, limit or U keeps its verdict.
 */
export function verdictProvenByProtester(line: {
  verdict: Verdict;
  decisiveValue: number | null;
  limit: number | null;
  acceptanceLimit: number | null;
  rejectionLimit: number | null;
  expandedUncertainty: number | null;
}): Verdict {
  const { verdict, decisiveValue: x, limit, acceptanceLimit, rejectionLimit, expandedUncertainty: u } = line;
  // ISO 14253-1 lines already carry the zone of doubt; non-numeric lines (ticks, seals, gauges) have no U.
  if (verdict === 'inconclusive' || rejectionLimit !== null || x === null || limit === null || u === null || u <= 0)
    return verdict;
  let side: 'max' | 'min';
  if (acceptanceLimit !== null && acceptanceLimit < limit) side = 'max';
  else if (acceptanceLimit !== null && acceptanceLimit > limit) side = 'min';
  else if (verdict === 'conforms') side = x <= limit ? 'max' : 'min';
  else side = x >= limit ? 'max' : 'min';
  const beyond = side === 'max' ? x - limit : limit - x;
  if (beyond > u) return 'does_not_conform';
  if (beyond < -u) return 'conforms';
  return 'inconclusive';
}

/** Where a class rule's burden applies: an inspection by the scrutineers, or a protest's re-check. */
export const BURDEN_CONTEXTS = ['inspection', 'protest'] as const;
export type BurdenContext = (typeof BURDEN_CONTEXTS)[number];
export type BurdenOfProofRules = Record<BurdenContext, BurdenOfProof>;

/** The class default (ISO 14253-1:2017; ILAC-G8:09/2019): at inspection the entrant proves, in a protest the protester. */
export const DEFAULT_BURDEN_OF_PROOF: Readonly<BurdenOfProofRules> = Object.freeze({
  inspection: 'conformity',
  protest: 'non_conformity',
});

export const BURDEN_CONTEXT_WORDS: Record<BurdenContext, string> = {
  inspection: 'At inspection (before or after racing, spot checks)',
  protest: 'In a protest (the re-check a protest asks for)',
};

/** The class's burden of proof per context; rules stored before it existed get the defaults. */
export function resolveBurdenRules(rules: { burdenOfProof?: Partial<BurdenOfProofRules> | null }): BurdenOfProofRules {
  return { ...DEFAULT_BURDEN_OF_PROOF, ...(rules.burdenOfProof ?? {}) };
}

/** A protest's inspection is decided in the protest context; every other kind of inspection in the inspection context. */
export const burdenContextOfInspection = (kind: string | null | undefined): BurdenContext =>
  kind === 'protest' ? 'protest' : 'inspection';

/** Who must prove at an inspection of this kind, under these class rules. */
export function burdenForInspection(
  rules: { burdenOfProof?: Partial<BurdenOfProofRules> | null },
  kind: string | null | undefined,
): BurdenOfProof {
  return resolveBurdenRules(rules)[burdenContextOfInspection(kind)];
}
