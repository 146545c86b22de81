import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { enqueueMail } from '@/lib/server/mail/outbox';
import { appUrl } from '@/lib/server/config/env';
import { FileTechnicalReportInput } from '../../core/inputs/penalties';

export type TechnicalReportView = {
  id: string;
  entryId: string;
  raceNumber: number;
  boatName: string;
  ruleReference: string;
  facts: string;
  inspectionId: string | null;
  filedByName: string;
  createdAt: string;
  penaltyIds: string[];
};

const field = (f: string, message: string) =>
  new AppError('invalid_input', 400, `${f}: ${message}`, [{ field: f, message }]);

/** Reports to the stewards at a meeting, for the technical delegates who file them and the stewards. */
export async function listTechnicalReports(actor: Actor | null, eventId: string): Promise<TechnicalReportView[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!can(actor, 'technical_report.file', { eventId }) && !can(actor, 'penalty.apply', { eventId }))
    throw new AppError('forbidden', 403, 'You are not allowed to do this.');
  const rows = await getDb().sequelize.query<TechnicalReportView & { createdAt: Date }>(
    `select t.id, t.entry_id as "entryId", e.race_number as "raceNumber", b.name as "boatName",
            t.rule_reference as "ruleReference", t.facts, t.inspection_id as "inspectionId",
            coalesce(u.name, u.email) as "filedByName", t.created_at as "createdAt",
            coalesce((select json_agg(p.id order by p.decided_at) from penalties p where p.technical_report_id = t.id), '[]') as "penaltyIds"
       from technical_reports t join entries e on e.id = t.entry_id join boats b on b.id = e.boat_id
       join users u on u.id = t.filed_by_id
      where t.event_id = :eventId order by t.created_at desc`,
    { replacements: { eventId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString() }));
}

/**
 * A technical delegate's report to the stewards without a protest (a scrutineer or the chief scrutineer
 * of the meeting): the entry, the rule and what was found, optionally an inspection of that entry. It is
 * no decision: the stewards decide on it, with a penalty or none. A delegate does not report a boat they
 * entered or own. The meeting's stewards are told by e-mail.
 */
export async function fileTechnicalReport(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
): Promise<TechnicalReportView> {
  assertCan(actor, 'technical_report.file', { eventId });
  const input = FileTechnicalReportInput.parse(await readInput());
  const { sequelize } = getDb();
  const id = await sequelize.transaction(async (transaction) => {
    const [entry] = await sequelize.query<{ id: string; entrantId: string; ownerId: string; raceNumber: number }>(
      `select e.id, e.entrant_id as "entrantId", b.owner_id as "ownerId", e.race_number as "raceNumber"
         from entries e join boats b on b.id = e.boat_id where e.id = :entryId and e.event_id = :eventId`,
      { replacements: { entryId: input.entryId, eventId }, type: QueryTypes.SELECT, transaction },
    );
    if (!entry) throw field('entryId', 'Choose an entry of this meeting.');
    if (entry.entrantId === actor.id || entry.ownerId === actor.id)
      throw new AppError('conflict_of_interest', 403, 'You entered or own this boat: another delegate must report it.');
    if (input.inspectionId) {
      const [ok] = await sequelize.query(`select 1 from inspections where id = :id and entry_id = :entryId`, {
        replacements: { id: input.inspectionId, entryId: entry.id },
        type: QueryTypes.SELECT,
        transaction,
      });
      if (!ok) throw field('inspectionId', 'Choose an inspection of this entry.');
    }
    const [row] = await sequelize.query<{ id: string }>(
      `insert into technical_reports (event_id, entry_id, filed_by_id, rule_reference, facts, inspection_id)
       values (:eventId, :entryId, :actorId, :ruleReference, :facts, :inspectionId) returning id`,
      {
        replacements: { ...input, eventId, entryId: entry.id, actorId: actor.id },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAuditEvent(
      {
        eventId,
        actorId: actor.id,
        subjectType: 'technical_report',
        subjectId: row.id,
        action: 'technical_report.filed',
        details: { entryId: entry.id, ruleReference: input.ruleReference, inspectionId: input.inspectionId },
      },
      transaction,
    );
    const stewards = await sequelize.query<{ email: string }>(
      `select distinct u.email from event_staff s join users u on u.id = s.user_id
        where s.event_id = :eventId and s.role = 'steward' and u.suspended_at is null`,
      { replacements: { eventId }, type: QueryTypes.SELECT, transaction },
    );
    await enqueueMail(
      stewards.map((s) => ({
        kind: 'technical_report',
        to: s.email,
        subject: `Technical report to the stewards: #${entry.raceNumber}`,
        text: [
          `A technical delegate has reported race number ${entry.raceNumber} to the stewards under ${input.ruleReference}.`,
          '',
          input.facts,
          '',
          `Decide on it: ${appUrl()}/stewards/${eventId}/penalties`,
        ].join('\n'),
      })),
      transaction,
    );
    return row.id;
  });
  return (await listTechnicalReports(actor, eventId)).find((r) => r.id === id)!;
}

/** What the technical delegate's report screen shows: the meeting's confirmed entries and the reports so far. */
export async function getReportDesk(
  actor: Actor | null,
  eventId: string,
): Promise<{ entries: { id: string; label: string }[]; reports: TechnicalReportView[] }> {
  assertCan(actor, 'technical_report.file', { eventId });
  const [entries, reports] = await Promise.all([
    getDb().sequelize.query<{ id: string; label: string }>(
      `select e.id, '#' || e.race_number || ' ' || b.name || ' (' || c.code || ')' as label
         from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
        where e.event_id = :eventId and e.status = 'entered' order by e.race_number`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    listTechnicalReports(actor, eventId),
  ]);
  return { entries, reports };
}
