import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { enqueueMail } from '@/lib/server/mail/outbox';
import { appUrl } from '@/lib/server/config/env';
import { describeConflict, findProtestConflicts } from '@/lib/server/interests/find-protest-conflicts';
import { ApplyPenaltyInput } from '../../core/inputs/penalties';
import { formatInZone } from '../../core/protests/protest-window';
import { GOVERNING_BODY_CAUTION } from '../../core/penalties/penalty-kinds';
import { amendClassResults } from './amend-results';
import { readPenalties, type PenaltyView } from './penalty-view';
import { checkpointQuietly } from '@/lib/server/chain/chain-service';

const field = (f: string, message: string, status = 400, code = 'invalid_input') =>
  new AppError(code, status, `${f}: ${message}`, [{ field: f, message }]);

type EntryRow = {
  id: string;
  classId: string;
  entrantId: string;
  ownerId: string;
  raceNumber: number;
  boatName: string;
  email: string;
  name: string | null;
  eventName: string;
  timeZone: string;
  appealNoticeMinutes: number;
};

/** The entry with what the penalty's e-mail and checks need, at this meeting only. */
export async function readPenalisedEntry(
  entryId: string,
  eventId: string,
  transaction: import('sequelize').Transaction,
): Promise<EntryRow | undefined> {
  const [row] = await getDb().sequelize.query<EntryRow>(
    `select e.id, e.class_id as "classId", e.entrant_id as "entrantId", b.owner_id as "ownerId", e.race_number as "raceNumber",
            b.name as "boatName", u.email, u.name, ev.name as "eventName", ev.time_zone as "timeZone",
            ev.appeal_notice_minutes as "appealNoticeMinutes"
       from entries e join boats b on b.id = e.boat_id join users u on u.id = e.entrant_id join events ev on ev.id = e.event_id
      where e.id = :entryId and e.event_id = :eventId`,
    { replacements: { entryId, eventId }, type: QueryTypes.SELECT, transaction },
  );
  return row;
}

/** The catalogue item, of this meeting only, and the run a run disqualification strikes out. */
export async function readCatalogueItemFor(
  catalogueItemId: string,
  eventId: string,
  entryId: string,
  runLabel: string | null,
  transaction: import('sequelize').Transaction,
) {
  const { sequelize } = getDb();
  const [item] = await sequelize.query<{
    id: string;
    code: string;
    kind: string;
    amount: number | null;
    label: string;
  }>(`select id, code, kind, amount, label from penalty_catalogue_items where id = :id and event_id = :eventId`, {
    replacements: { id: catalogueItemId, eventId },
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!item) throw field('catalogueItemId', "Choose a penalty from this meeting's catalogue.");
  if (item.kind === 'run_disqualification') {
    if (!runLabel) throw field('runLabel', 'Name the run the boat is disqualified from.');
    const [run] = await sequelize.query(
      `select 1 from run_times r where r.entry_id = :entryId and r.run_label = :runLabel
          and not exists (select 1 from run_times c where c.supersedes_id = r.id)`,
      { replacements: { entryId, runLabel }, type: QueryTypes.SELECT, transaction },
    );
    if (!run) throw field('runLabel', `This boat has no current run "${runLabel}".`);
  } else if (runLabel) throw field('runLabel', 'Only a disqualification from a run names a run.');
  return item;
}

/** The e-mail that tells the entrant of a penalty (queued with it, in its transaction). */
export function penaltyMail(
  entry: EntryRow,
  p: { code: string; label: string; runLabel: string | null; reason: string; decidedAt: Date },
  opts: { subject: string; intro: string; resultsVersion: number | null },
) {
  const deadline = new Date(p.decidedAt.getTime() + entry.appealNoticeMinutes * 60_000);
  return {
    kind: 'penalty',
    to: entry.email,
    subject: `${opts.subject}: #${entry.raceNumber} ${entry.boatName} at ${entry.eventName}`.slice(0, 200),
    text: [
      `Hello ${entry.name ?? entry.email},`,
      '',
      opts.intro,
      `Penalty: ${p.code} ${p.label}${p.runLabel ? ` (run ${p.runLabel})` : ''}`,
      `Reason: ${p.reason}`,
      opts.resultsVersion
        ? `The results are amended as version ${opts.resultsVersion}, with the reason beside the boat's row.`
        : 'The results do not change (or are not published yet).',
      `Notice of appeal to the governing body's appeal body is due by ${formatInZone(deadline, entry.timeZone)}: ${appUrl()}/appeals`,
      '',
      GOVERNING_BODY_CAUTION,
    ].join('\n'),
  };
}

/**
 * The stewards impose a penalty from the meeting's catalogue on one entry, from a decision: a protest they
 * upheld against that boat (or against its class's results), or a technical delegate's report on it. A
 * steward who entered or owns the boat, or who has an interest in the protest, may not. The results of the
 * boat's class are amended as a new version (amendClassResults) and the entrant is e-mailed, both in the
 * penalty's own transaction, so a refused amendment stores nothing.
 */
export async function applyPenalty(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
): Promise<PenaltyView> {
  assertCan(actor, 'penalty.apply', { eventId });
  const input = ApplyPenaltyInput.parse(await readInput());
  const { sequelize } = getDb();
  const id = await sequelize.transaction(async (transaction) => {
    const entry = await readPenalisedEntry(input.entryId, eventId, transaction);
    if (!entry) throw field('entryId', 'Choose an entry of this meeting.');
    if (entry.entrantId === actor.id || entry.ownerId === actor.id)
      throw new AppError(
        'conflict_of_interest',
        403,
        'You entered or own this boat: another steward of this meeting must decide.',
      );
    const item = await readCatalogueItemFor(input.catalogueItemId, eventId, entry.id, input.runLabel, transaction);
    if (input.protestId) {
      const [protest] = await sequelize.query<{
        status: string;
        againstEntryId: string | null;
        resultClassId: string | null;
      }>(
        `select p.status, p.against_entry_id as "againstEntryId", r.class_id as "resultClassId"
           from protests p left join provisional_results r on r.id = p.against_result_id
          where p.id = :id and p.event_id = :eventId`,
        { replacements: { id: input.protestId, eventId }, type: QueryTypes.SELECT, transaction },
      );
      if (!protest) throw field('protestId', 'Choose a protest of this meeting.');
      if (protest.status !== 'upheld')
        throw field(
          'protestId',
          'Only an upheld protest leads to a penalty: decide the protest first.',
          409,
          'conflict',
        );
      if (protest.againstEntryId ? protest.againstEntryId !== entry.id : protest.resultClassId !== entry.classId)
        throw field('protestId', 'This protest is not about this boat.');
      const [conflict] = await findProtestConflicts(input.protestId, [actor.id], transaction);
      if (conflict)
        throw new AppError(
          'conflict_of_interest',
          403,
          `You have an interest in this protest (${conflict.reasons.map((r) => describeConflict(r)).join('; ')}): another steward must decide.`,
        );
    } else {
      const [report] = await sequelize.query<{ entryId: string }>(
        `select entry_id as "entryId" from technical_reports where id = :id and event_id = :eventId`,
        { replacements: { id: input.technicalReportId, eventId }, type: QueryTypes.SELECT, transaction },
      );
      if (!report) throw field('technicalReportId', 'Choose a technical report of this meeting.');
      if (report.entryId !== entry.id) throw field('technicalReportId', 'This report is about another boat.');
    }
    const [row] = await sequelize.query<{ id: string; decidedAt: Date }>(
      `insert into penalties (event_id, entry_id, catalogue_item_id, code, kind, amount, label, run_label,
                              protest_id, technical_report_id, reason, decided_by_id)
       values (:eventId, :entryId, :itemId, :code, :kind, :amount, :label, :runLabel, :protestId, :reportId, :reason, :actorId)
       returning id, decided_at as "decidedAt"`,
      {
        replacements: {
          eventId,
          entryId: entry.id,
          itemId: item.id,
          code: item.code,
          kind: item.kind,
          amount: item.amount,
          label: item.label,
          runLabel: input.runLabel,
          protestId: input.protestId,
          reportId: input.technicalReportId,
          reason: input.reason,
          actorId: actor.id,
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAuditEvent(
      {
        eventId,
        actorId: actor.id,
        subjectType: 'penalty',
        subjectId: row.id,
        action: 'penalty.imposed',
        details: {
          entryId: entry.id,
          code: item.code,
          kind: item.kind,
          amount: item.amount,
          runLabel: input.runLabel,
          protestId: input.protestId,
          technicalReportId: input.technicalReportId,
          reason: input.reason,
        },
      },
      transaction,
    );
    const amended = await amendClassResults(
      {
        eventId,
        classId: entry.classId,
        actorId: actor.id,
        source: 'stewards',
        note: `Stewards' penalty ${item.code} on #${entry.raceNumber}`,
      },
      transaction,
    );
    await enqueueMail(
      penaltyMail(
        entry,
        { ...item, runLabel: input.runLabel, reason: input.reason, decidedAt: new Date(row.decidedAt) },
        {
          subject: 'Penalty',
          intro: `The stewards have imposed a penalty on race number ${entry.raceNumber} (${entry.boatName}).`,
          resultsVersion: amended?.version ?? null,
        },
      ),
      transaction,
    );
    return row.id;
  });
  // A decision that amends the results: the meeting's chain head is signed now, as at any publication.
  await checkpointQuietly(eventId, `stewards' penalty imposed`);
  return (await readPenalties({ penaltyId: id }))[0];
}
