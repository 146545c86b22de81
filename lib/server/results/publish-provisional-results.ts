import 'server-only';
import { checkpointQuietly } from '@/lib/server/chain/chain-service';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { PublishResultsInput } from '../../core/inputs/results';
import { diffResultsRows } from '../../core/results/diff-results-rows';
import { listProvisionalResults, type ClassResultsView } from './list-provisional-results';
import { amendClassResults } from '../penalties/amend-results';

const rowError = (i: number, message: string) => ({ field: `rows.${i}.raceNumber`, message });

/**
 * Publishes the next provisional results version of one class, from the form or a CSV upload.
 * Every race number must be a live entry of that class at this meeting. Versions are numbered and
 * never changed; the entries whose row differs from the previous version get a fresh protest
 * window, the others keep theirs. Nothing is stored when any row is refused. When penalties are in force
 * on boats of the class, the stewards' amended version follows at once (the new order with them applied).
 */
export async function publishProvisionalResults(
  actor: Actor | null,
  eventId: string,
  raw: unknown,
  source: 'form' | 'csv',
): Promise<ClassResultsView> {
  assertCan(actor, 'results.publish', { eventId });
  const input = PublishResultsInput.parse(raw);
  const { sequelize, models } = getDb();
  const cls = await models.RaceClass.findOne({ where: { id: input.classId, eventId } });
  if (!cls)
    throw new AppError('invalid_input', 400, 'classId: choose a class of this meeting.', [
      { field: 'classId', message: 'Choose a class of this meeting.' },
    ]);

  const entries = await models.Entry.findAll({
    where: { eventId, raceNumber: { [Op.in]: input.rows.map((r) => r.raceNumber) } },
    include: [{ model: models.RaceClass, attributes: ['code'] }],
  });
  // A boat in several classes keeps one number: the entry in this class (a confirmed one first) is the one meant.
  const rank = (e: (typeof entries)[number]) => (e.classId === cls.id ? 0 : 2) + (e.status === 'entered' ? 0 : 1);
  const byNumber = new Map<number, (typeof entries)[number]>();
  for (const e of [...entries].sort((a, b) => rank(a) - rank(b)))
    if (!byNumber.has(e.raceNumber)) byNumber.set(e.raceNumber, e);
  const issues: { field: string; message: string }[] = [];
  const rows = input.rows.map((r, i) => {
    const e = byNumber.get(r.raceNumber);
    if (!e) issues.push(rowError(i, `No entry has race number ${r.raceNumber} at this meeting.`));
    else if (e.classId !== cls.id)
      issues.push(
        rowError(
          i,
          `Race number ${r.raceNumber} is entered in ${(e as unknown as { raceClass: { code: string } }).raceClass.code}, not ${cls.code}.`,
        ),
      );
    else if (e.status !== 'entered')
      issues.push(rowError(i, `Race number ${r.raceNumber} is not a confirmed entry (${e.status.replace('_', ' ')}).`));
    return { position: r.position, raceNumber: r.raceNumber, entryId: e?.id ?? '' };
  });
  if (issues.length) {
    const message =
      source === 'csv'
        ? `file: ${issues.map((x) => `line ${Number(x.field.split('.')[1]) + 2}: ${x.message}`).join(' ')}`
        : issues.map((x) => `${x.field}: ${x.message}`).join('; ');
    throw new AppError(
      'invalid_input',
      400,
      message,
      source === 'csv' ? [{ field: 'file', message: message.slice(6) }, ...issues] : issues,
    );
  }
  rows.sort((a, b) => a.position - b.position);

  await sequelize.transaction(async (transaction) => {
    // Lock the class so two publications cannot both take the same version number.
    await models.RaceClass.findByPk(cls.id, { lock: transaction.LOCK.UPDATE, transaction });
    const previous = await models.ProvisionalResults.findOne({
      where: { classId: cls.id },
      order: [['version', 'DESC']],
      transaction,
    });
    const changedEntryIds = diffResultsRows(previous?.rows ?? null, rows);
    if (previous && changedEntryIds.length === 0) {
      throw new AppError(
        'no_change',
        409,
        `These results are the same as version ${previous.version}: nothing to publish.`,
      );
    }
    const created = await models.ProvisionalResults.create(
      {
        eventId,
        classId: cls.id,
        version: (previous?.version ?? 0) + 1,
        publishedById: actor.id,
        rows,
        changedEntryIds,
        source,
        note: input.note,
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        eventId,
        actorId: actor.id,
        subjectType: 'results',
        subjectId: created.id,
        action: 'results.published',
        details: {
          classId: cls.id,
          classCode: cls.code,
          version: created.version,
          source,
          finishers: rows.length,
          changedEntryIds,
        },
      },
      transaction,
    );
    await amendClassResults(
      {
        eventId,
        classId: cls.id,
        actorId: actor.id,
        source: 'stewards',
        note: `Penalties in force applied to the organiser's version ${created.version}`,
      },
      transaction,
    );
  });
  await checkpointQuietly(eventId, `provisional results of ${cls.code} published`);
  const all = await listProvisionalResults(actor, eventId);
  return all.find((c) => c.classId === cls.id)!;
}
