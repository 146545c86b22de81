import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { findProtestForActor } from './find-protest-for-actor';
import { queryProtestSummaries, type ProtestSummary } from './protest-view';
import { listEvidence, type EvidenceView } from './list-evidence';
import { DECIDABLE_STATUSES, DECIDED_STATUSES, OPEN_STATUSES } from '../../core/protests/protest-states';
import { listStewardInterests } from '@/lib/server/interests/list-steward-interests';
import { resolveOutcome, worstOutcome, type BurdenOfProof, type Outcome } from '@/lib/core/engine/conformity-burden';
import type { Verdict } from '@/lib/core/engine/conformity';

export type ReinspectionLink = {
  id: string;
  reason: string;
  createdAt: string;
  doneAt: string | null;
  inspectionId: string | null;
  verdict: string | null;
  /** Who had to prove at that inspection and its overall result resolved for them (null: recorded before the burden of proof). */
  burdenOfProof: BurdenOfProof | null;
  outcome: Outcome | null;
};
export type ProtestDetail = ProtestSummary & {
  evidence: EvidenceView[];
  reinspections: ReinspectionLink[];
  can: {
    pay: boolean;
    addEvidence: boolean;
    linkInspection: boolean;
    accept: boolean;
    reject: boolean;
    orderReinspection: boolean;
    scheduleHearing: boolean;
    decide: boolean;
    downloadDecision: boolean;
  };
  viewerRole: 'lodger' | 'protested' | 'official';
  // Officials only (empty for the parties): the viewer's own interest, which takes away every
  // steward step; the meeting's stewards who have one; and the stewards' team interests, which
  // are free text and must be checked against the parties by hand.
  viewerConflict: string[];
  stewardConflicts: { officialId: string; name: string; reasons: string[] }[];
  stewardTeamInterests: { officialName: string; teamName: string; statement: string }[];
};

/** One protest for its parties and the meeting's officials, with evidence (hash-checked) and what the viewer may do next. */
export async function getProtest(
  actor: Actor | null,
  protestId: string,
  opts: { verifyEvidence?: boolean } = {},
): Promise<ProtestDetail> {
  const access = await findProtestForActor(actor, protestId);
  const { protest } = access;
  const [summary] = await queryProtestSummaries('p.id = :id', { id: protest.id });
  if (!summary) throw new AppError('not_found', 404, 'No such protest.');
  const [evidence, tasks] = await Promise.all([
    listEvidence(actor, protest.id, { verify: opts.verifyEvidence }),
    getDb().models.Reinspection.findAll({ where: { protestId: protest.id }, order: [['createdAt', 'ASC']] }),
  ]);
  // The inspection a task produced (recorded by the scrutineers), with its verdict.
  const done = tasks.map((t) => t.inspectionId).filter((x): x is string => Boolean(x));
  const verdicts = new Map(
    (done.length
      ? await getDb().models.Inspection.findAll({
          where: { id: done },
          attributes: ['id', 'overallResult', 'results'],
        })
      : []
    ).map((i) => {
      const burden = i.results?.rules?.find((r) => r.burdenOfProof)?.burdenOfProof ?? null;
      // The lines' own outcomes (a protester's burden can differ from the verdict), else from the verdict.
      const lineOutcomes = (i.results?.rules ?? []).map((r) => r.outcome).filter((o): o is Outcome => Boolean(o));
      const outcome = burden
        ? lineOutcomes.length
          ? worstOutcome(lineOutcomes)
          : resolveOutcome(i.overallResult as Verdict, burden).outcome
        : null;
      return [i.id, { verdict: i.overallResult, burdenOfProof: burden, outcome }] as const;
    }),
  );
  const s = summary.status;
  const isParty = access.isLodger || access.isProtested;
  const interests = access.isOfficial
    ? await listStewardInterests(protest.id, protest.eventId)
    : { conflicts: [], teamInterests: [] };
  const viewerConflict = interests.conflicts.find((c) => c.officialId === actor!.id)?.reasons ?? [];
  // A steward with an interest takes no steward step (the server refuses them too).
  const decides = access.canDecide && viewerConflict.length === 0;
  return {
    ...summary,
    evidence,
    reinspections: tasks.map((t) => ({
      id: t.id,
      reason: t.reason,
      createdAt: t.createdAt.toISOString(),
      doneAt: t.doneAt?.toISOString() ?? null,
      inspectionId: t.inspectionId ?? null,
      verdict: t.inspectionId ? (verdicts.get(t.inspectionId)?.verdict ?? null) : null,
      burdenOfProof: t.inspectionId ? (verdicts.get(t.inspectionId)?.burdenOfProof ?? null) : null,
      outcome: t.inspectionId ? (verdicts.get(t.inspectionId)?.outcome ?? null) : null,
    })),
    viewerRole: access.isLodger ? 'lodger' : access.isProtested ? 'protested' : 'official',
    viewerConflict,
    stewardConflicts: interests.conflicts.map((c) => ({
      officialId: c.officialId,
      name: c.name,
      reasons: c.reasonsAsOthers,
    })),
    stewardTeamInterests: interests.teamInterests,
    can: {
      pay: access.isLodger && s === 'awaiting_fee',
      addEvidence: (isParty || access.canDecide) && OPEN_STATUSES.includes(s),
      linkInspection: access.canDecide && OPEN_STATUSES.includes(s),
      accept: decides && s === 'lodged',
      reject: decides && (s === 'lodged' || s === 'awaiting_fee'),
      // One open task per protest: the form comes back once the scrutineers have recorded it.
      orderReinspection:
        decides && DECIDABLE_STATUSES.includes(s) && Boolean(summary.againstEntryId) && !tasks.some((t) => !t.doneAt),
      scheduleHearing: decides && DECIDABLE_STATUSES.includes(s),
      decide: decides && (DECIDABLE_STATUSES.includes(s) || s === 'lodged'),
      downloadDecision: DECIDED_STATUSES.includes(s),
    },
  };
}
