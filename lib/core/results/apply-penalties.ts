// A class's results with the penalties in force applied: the organiser's latest published order is the
// base; the stewards' (or the appeal body's) penalties make an amended order. Framework-free so the rule
// is unit tested. The rule, in order (common practice in motorsport codes, no single source; the
// governing body's own rules decide, and a meeting whose rules differ must not rely on this order):
//  1. Time penalties (time added, a run struck out) rank the classified boats by their best current run
//     plus the time added, ties kept in the base order; every classified boat then needs a run time,
//     else the penalty cannot be applied (an error naming the boats without one). A boat whose every run
//     is struck out is disqualified from the meeting's results.
//  2. Places deducted move the boat down that many places (not past the last classified boat), in the
//     order the penalties were decided.
//  3. Disqualified and excluded boats leave the classification and are listed after it, in base order.
// Points deducted, fines and warnings leave the order as it is; they are shown beside the row.
import type { PenaltyKind } from '../penalties/penalty-kinds';

export type BaseRow = { position: number; raceNumber: number; entryId: string };
export type AmendedRow = BaseRow & { status?: 'dsq' | 'excluded' };
export type PenaltyInForce = {
  id: string;
  entryId: string;
  kind: PenaltyKind;
  amount: number | null;
  runLabel: string | null;
  decidedAt: Date;
};
export type RunTimeOf = { runLabel: string; elapsedS: number };

export class PenaltyApplicationError extends Error {
  constructor(
    message: string,
    readonly raceNumbers: number[],
  ) {
    super(message);
    this.name = 'PenaltyApplicationError';
  }
}

const TIME_KINDS: readonly PenaltyKind[] = ['time_added', 'run_disqualification'];

export function applyPenalties(
  base: readonly BaseRow[],
  penalties: readonly PenaltyInForce[],
  runs: ReadonlyMap<string, readonly RunTimeOf[]>,
): AmendedRow[] {
  const order = [...base].sort((a, b) => a.position - b.position);
  const baseIndex = new Map(order.map((r, i) => [r.entryId, i]));
  const mine = penalties
    .filter((p) => baseIndex.has(p.entryId))
    .sort((a, b) => a.decidedAt.getTime() - b.decidedAt.getTime() || a.id.localeCompare(b.id));
  const out = new Map<string, 'dsq' | 'excluded'>();
  for (const p of mine) {
    if (p.kind === 'exclusion') out.set(p.entryId, 'excluded');
    else if (p.kind === 'meeting_disqualification' && out.get(p.entryId) !== 'excluded') out.set(p.entryId, 'dsq');
  }

  let classified = order.filter((r) => !out.has(r.entryId));
  if (mine.some((p) => TIME_KINDS.includes(p.kind) && !out.has(p.entryId))) {
    const missing = classified.filter((r) => !(runs.get(r.entryId)?.length ?? 0));
    if (missing.length)
      throw new PenaltyApplicationError(
        `A time penalty ranks the class by run times, and ${missing.length === 1 ? 'this boat has' : 'these boats have'} none: #${missing
          .map((r) => r.raceNumber)
          .join(', #')}. Import the run times first.`,
        missing.map((r) => r.raceNumber),
      );
    const timed = classified.map((r) => {
      const struck = new Set(
        mine.filter((p) => p.entryId === r.entryId && p.kind === 'run_disqualification').map((p) => p.runLabel),
      );
      const left = runs.get(r.entryId)!.filter((x) => !struck.has(x.runLabel));
      const added = mine
        .filter((p) => p.entryId === r.entryId && p.kind === 'time_added')
        .reduce((s, p) => s + (p.amount ?? 0), 0);
      const best = left.length ? Math.min(...left.map((x) => x.elapsedS)) : null;
      return { row: r, timeS: best === null ? null : best + added };
    });
    for (const t of timed) if (t.timeS === null) out.set(t.row.entryId, 'dsq');
    classified = timed
      .filter((t) => t.timeS !== null)
      .sort((a, b) => a.timeS! - b.timeS! || baseIndex.get(a.row.entryId)! - baseIndex.get(b.row.entryId)!)
      .map((t) => t.row);
  }

  for (const p of mine) {
    if (p.kind !== 'places_deducted' || out.has(p.entryId)) continue;
    const at = classified.findIndex((r) => r.entryId === p.entryId);
    const to = Math.min(classified.length - 1, at + (p.amount ?? 0));
    const [row] = classified.splice(at, 1);
    classified.splice(to, 0, row);
  }

  const listedAfter = order.filter((r) => out.has(r.entryId));
  return [
    ...classified.map((r, i) => ({ position: i + 1, raceNumber: r.raceNumber, entryId: r.entryId })),
    ...listedAfter.map((r, i) => ({
      position: classified.length + i + 1,
      raceNumber: r.raceNumber,
      entryId: r.entryId,
      status: out.get(r.entryId)!,
    })),
  ];
}
