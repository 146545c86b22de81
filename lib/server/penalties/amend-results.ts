import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import type { ResultAmendment, ResultRow } from '@/models/provisional-results';
import { applyPenalties, PenaltyApplicationError, type RunTimeOf } from '../../core/results/apply-penalties';
import { diffResultsRows } from '../../core/results/diff-results-rows';
import type { PenaltyKind } from '../../core/penalties/penalty-kinds';

/** A penalty counts until an appeal annuls it or amends it (the amending penalty then counts instead). */
export const PENALTY_IN_FORCE_SQL = `not exists (select 1 from appeals x where x.penalty_id = p.id and x.status in ('annulled', 'amended'))`;

type InForceRow = {
  id: string;
  entryId: string;
  kind: PenaltyKind;
  amount: number | null;
  runLabel: string | null;
  decidedAt: Date;
  code: string;
  label: string;
  reason: string;
  appealId: string | null;
};

/**
 * Writes the class's next results version when the penalties in force change what it shows: the
 * organiser's latest version (form or CSV) with every penalty in force applied (lib/core/results/
 * apply-penalties.ts), each penalty beside its row. Inside the caller's transaction, under the class's
 * row lock (the same lock publishing takes), so two amendments never take one version number. Nothing is
 * written when the class has no published results yet (the penalty still stands, and is applied when the
 * organiser publishes) or when the latest version already reads the same. Standings read these versions.
 */
export async function amendClassResults(
  opts: { eventId: string; classId: string; actorId: string; source: 'stewards' | 'appeal'; note: string },
  transaction: Transaction,
): Promise<{ id: string; version: number } | null> {
  const { models, sequelize } = getDb();
  const cls = await models.RaceClass.findByPk(opts.classId, { lock: transaction.LOCK.UPDATE, transaction });
  const [base, latest] = await Promise.all([
    models.ProvisionalResults.findOne({
      where: { classId: opts.classId, source: ['form', 'csv'] },
      order: [['version', 'DESC']],
      transaction,
    }),
    models.ProvisionalResults.findOne({ where: { classId: opts.classId }, order: [['version', 'DESC']], transaction }),
  ]);
  if (!base || !latest) return null;
  const entryIds = base.rows.map((r) => r.entryId);
  const [penalties, runRows] = await Promise.all([
    sequelize.query<InForceRow>(
      `select p.id, p.entry_id as "entryId", p.kind, p.amount, p.run_label as "runLabel", p.decided_at as "decidedAt",
              p.code, p.label, p.reason, p.appeal_id as "appealId"
         from penalties p
        where p.entry_id in (:entryIds) and ${PENALTY_IN_FORCE_SQL}
        order by p.decided_at, p.id`,
      { replacements: { entryIds }, type: QueryTypes.SELECT, transaction },
    ),
    // Current runs (nothing supersedes them) of the boats in the base version.
    sequelize.query<{ entryId: string; runLabel: string; elapsedS: number }>(
      `select r.entry_id as "entryId", r.run_label as "runLabel", r.elapsed_s as "elapsedS"
         from run_times r
        where r.entry_id in (:entryIds) and not exists (select 1 from run_times c where c.supersedes_id = r.id)`,
      { replacements: { entryIds }, type: QueryTypes.SELECT, transaction },
    ),
  ]);
  const runs = new Map<string, RunTimeOf[]>();
  for (const r of runRows) {
    const list = runs.get(r.entryId) ?? [];
    list.push({ runLabel: r.runLabel, elapsedS: Number(r.elapsedS) });
    runs.set(r.entryId, list);
  }
  let rows: ResultRow[];
  try {
    rows = applyPenalties(base.rows, penalties, runs);
  } catch (err) {
    if (err instanceof PenaltyApplicationError) throw new AppError('needs_run_times', 409, err.message);
    throw err;
  }
  const amendments: ResultAmendment[] = penalties.map((p) => ({
    entryId: p.entryId,
    penaltyId: p.id,
    code: p.code,
    kind: p.kind,
    amount: p.amount,
    label: p.label,
    reason: p.reason,
    appealId: p.appealId,
  }));
  const changedEntryIds = diffResultsRows(latest.rows, rows);
  const sameAmendments =
    JSON.stringify((latest.amendments ?? []).map((a) => a.penaltyId)) ===
    JSON.stringify(amendments.map((a) => a.penaltyId));
  if (changedEntryIds.length === 0 && sameAmendments) return null;
  const created = await models.ProvisionalResults.create(
    {
      eventId: opts.eventId,
      classId: opts.classId,
      version: latest.version + 1,
      publishedById: opts.actorId,
      rows,
      changedEntryIds,
      source: opts.source,
      note: `${opts.note} (applied to version ${base.version})`.slice(0, 500),
      amendments,
    },
    { transaction },
  );
  await recordAuditEvent(
    {
      eventId: opts.eventId,
      actorId: opts.actorId,
      subjectType: 'results',
      subjectId: created.id,
      action: 'results.amended',
      details: {
        classId: opts.classId,
        classCode: cls?.code ?? '',
        version: created.version,
        baseVersion: base.version,
        source: opts.source,
        penaltyIds: amendments.map((a) => a.penaltyId),
        changedEntryIds,
      },
    },
    transaction,
  );
  return { id: created.id, version: created.version };
}
