import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { RunTimesFormInput, RunTimesImportFields, readRunTimesCsv } from '@/lib/core/inputs/run-times';
import { checkRunLines, type CheckedLine, type RunLineView } from './check-run-times';

export type RunImportOutcome = { stored: number; corrected: number; unchanged: number; lines: RunLineView[] };

/** The import's fields from a multipart form (numbers typed as text), checked by the one schema. */
export function readImportFields(form: FormData) {
  const course = String(form.get('courseLengthM') ?? '').trim();
  return RunTimesImportFields.parse({
    classId: String(form.get('classId') ?? ''),
    courseLengthM: course === '' ? undefined : Number(course),
  });
}

/** The lines a preview shows for a CSV file: nothing is stored. */
export async function previewRunTimesCsv(
  actor: Actor | null,
  eventId: string,
  fields: { classId: string; courseLengthM: number },
  text: string,
): Promise<RunLineView[]> {
  assertCan(actor, 'results.publish', { eventId });
  return (await checkRunLines(eventId, fields.classId, fields.courseLengthM, readRunTimesCsv(text))).views;
}

function refusal(source: 'csv' | 'form', views: RunLineView[]): AppError {
  const bad = views.filter((v) => v.status === 'error');
  if (source === 'csv') {
    const message = bad.map((v) => `line ${v.line}: ${v.message}`).join(' ');
    return new AppError('invalid_input', 400, `file: nothing was stored. ${message}`, [
      {
        field: 'file',
        message: `Nothing was stored: ${bad.length} line${bad.length === 1 ? '' : 's'} refused. ${message}`,
      },
      ...bad.map((v) => ({ field: `lines.${v.line}`, message: v.message })),
    ]);
  }
  return new AppError(
    'invalid_input',
    400,
    `${bad.map((v) => `rows.${v.line}: ${v.message.replace(/\.$/, '')}`).join('; ')}.`,
    bad.map((v) => ({ field: `rows.${v.line}.raceNumber`, message: v.message })),
  );
}

/**
 * Stores runs from a CSV file or the form, all or nothing: any refused line stores none. Lines already
 * stored with the same figures are skipped (a re-import stores nothing twice); lines with other figures are
 * corrections that supersede the stored run. The class row is locked so two imports do not race.
 */
async function storeRuns(
  actor: Actor,
  eventId: string,
  classId: string,
  courseLengthM: number,
  lines: CheckedLine[],
  source: 'csv' | 'form',
): Promise<RunImportOutcome> {
  const { sequelize, models } = getDb();
  try {
    return await sequelize.transaction(async (transaction) => {
      const cls = await models.RaceClass.findOne({
        where: { id: classId, eventId },
        lock: transaction.LOCK.UPDATE,
        transaction,
      });
      const { views, plan } = await checkRunLines(eventId, classId, courseLengthM, lines, transaction);
      if (views.some((v) => v.status === 'error')) throw refusal(source, views);
      if (plan.length)
        await models.RunTime.bulkCreate(
          plan.map(({ line, entryId, supersedes }) => ({
            eventId,
            classId,
            entryId,
            raceNumber: line.row!.raceNumber,
            runLabel: line.row!.runLabel,
            courseLengthM,
            elapsedS: line.row!.elapsedS,
            trapSpeedMs: line.row!.trapSpeedMs,
            gpsTopSpeedMs: line.row!.gpsTopSpeedMs,
            rpm: line.row!.rpm,
            conditions: line.row!.conditions,
            source,
            supersedesId: supersedes?.id ?? null,
            recordedById: actor.id,
          })),
          { transaction },
        );
      const corrected = plan.filter((p) => p.supersedes).length;
      const outcome = {
        stored: plan.length - corrected,
        corrected,
        unchanged: views.filter((v) => v.status === 'unchanged').length,
        lines: views,
      };
      if (plan.length)
        await recordAuditEvent(
          {
            eventId,
            actorId: actor.id,
            subjectType: 'results',
            subjectId: classId,
            action: 'results.run_times_recorded',
            details: {
              classId,
              classCode: cls?.code ?? '',
              source,
              stored: outcome.stored,
              corrected,
              unchanged: outcome.unchanged,
              courseLengthM,
            },
          },
          transaction,
        );
      return outcome;
    });
  } catch (err) {
    // The partial unique indexes are the last word when two imports of the same runs meet.
    if (err instanceof UniqueConstraintError)
      throw new AppError('conflict', 409, 'These runs were stored by someone else just now: preview the file again.');
    throw err;
  }
}

export async function importRunTimesCsv(
  actor: Actor | null,
  eventId: string,
  fields: { classId: string; courseLengthM: number },
  text: string,
): Promise<RunImportOutcome> {
  assertCan(actor, 'results.publish', { eventId });
  return storeRuns(actor, eventId, fields.classId, fields.courseLengthM, readRunTimesCsv(text), 'csv');
}

/** Runs typed on the form: rows are numbered from 0 in errors (rows.N.field), as the form shows them. */
export async function recordRunTimesForm(
  actor: Actor | null,
  eventId: string,
  raw: unknown,
): Promise<RunImportOutcome> {
  assertCan(actor, 'results.publish', { eventId });
  const input = RunTimesFormInput.parse(raw);
  const lines: CheckedLine[] = input.rows.map((row, i) => ({
    line: i,
    cells: { raceNumber: String(row.raceNumber), run: row.runLabel, elapsed: String(row.elapsedS) },
    row,
    problems: [],
  }));
  return storeRuns(actor, eventId, input.classId, input.courseLengthM, lines, 'form');
}
