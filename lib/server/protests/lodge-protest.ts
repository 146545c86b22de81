import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { formatMoney } from '@/lib/core/inputs/entries';
import { loadResultsVersions } from '@/lib/server/results/load-results-versions';
import { LodgeProtestInput } from '../../core/inputs/protests';
import {
  formatInZone,
  isWithinWindow,
  protestDeadline,
  relevantVersionForEntry,
} from '../../core/protests/protest-window';
import { notifyParties } from './notify-parties';
import { getProtest, type ProtestDetail } from './get-protest';

const fieldError = (status: number, code: string, field: string, message: string) =>
  new AppError(code, status, message, [{ field, message }]);

/** "SS 2.1 Nozzle max" and "ss 2.1  nozzle MAX" are one matter. */
export const normaliseRule = (rule: string) =>
  rule
    .toLowerCase()
    .replace(/[^a-z0-9.]+/g, ' ')
    .trim();

/**
 * Lodges a protest by an entrant with a confirmed entry at the meeting (only competitors protest:
 * common practice, no single source), against another entry of the same meeting or against the
 * current results version of a class. It must come within the window opened by the results
 * version that last changed what is protested; a late one is refused with the deadline shown.
 * With a fee the protest waits for the verified payment webhook; without one it is lodged at once.
 */
export async function lodgeProtest(
  actor: Actor | null,
  eventId: string,
  raw: unknown,
  now = new Date(),
): Promise<ProtestDetail> {
  assertCan(actor, 'protest.lodge', { eventId });
  const input = LodgeProtestInput.parse(raw);
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const own = await models.Entry.count({ where: { eventId, entrantId: actor.id, status: 'entered' } });
  if (own === 0)
    throw new AppError(
      'not_a_competitor',
      403,
      'Only entrants with a confirmed entry at this meeting can lodge a protest here.',
    );

  let matterKey: string;
  let version: { id: string; publishedAt: Date } | null;
  if (input.againstEntryId) {
    const target = await models.Entry.findByPk(input.againstEntryId.toLowerCase());
    if (!target) throw fieldError(400, 'invalid_input', 'againstEntryId', 'No such entry.');
    if (target.eventId !== eventId)
      throw fieldError(
        400,
        'invalid_input',
        'againstEntryId',
        'This entry belongs to another meeting: lodge the protest at that meeting.',
      );
    if (target.entrantId === actor.id)
      throw fieldError(400, 'invalid_input', 'againstEntryId', 'You cannot protest your own entry.');
    version = relevantVersionForEntry(await loadResultsVersions(eventId, { classId: target.classId }), target.id);
    matterKey = `entry:${target.id}:${normaliseRule(input.ruleReference)}`;
  } else {
    const result = await models.ProvisionalResults.findByPk(input.againstResultId!.toLowerCase());
    if (!result || result.eventId !== eventId)
      throw fieldError(400, 'invalid_input', 'againstResultId', 'Choose a results version of this meeting.');
    const latest = await models.ProvisionalResults.max<number, typeof result>('version', {
      where: { classId: result.classId },
    });
    if (latest !== result.version)
      throw fieldError(
        409,
        'superseded',
        'againstResultId',
        `Version ${result.version} has been replaced by version ${latest}: protest the current version.`,
      );
    version = result;
    matterKey = `result:${result.id}:${normaliseRule(input.ruleReference)}`;
  }
  if (!version)
    throw fieldError(
      409,
      'window_not_open',
      'againstEntryId',
      'Results for this class are not published yet: the protest window opens when they are.',
    );
  const deadline = protestDeadline(version.publishedAt, event.protestWindowMinutes);
  if (!isWithinWindow(deadline, now)) {
    const label = formatInZone(deadline, event.timeZone);
    throw new AppError('out_of_time', 409, `The protest window closed at ${label}.`, [
      { field: 'againstEntryId', message: `Too late: the protest window closed at ${label}.` },
    ]);
  }

  const isFree = event.protestFeeMinor === 0;
  let protestId: string;
  try {
    protestId = await sequelize.transaction(async (transaction) => {
      const p = await models.Protest.create(
        {
          eventId,
          lodgedById: actor.id,
          againstEntryId: input.againstEntryId?.toLowerCase() ?? null,
          againstResultId: input.againstResultId?.toLowerCase() ?? null,
          resultsVersionId: version.id,
          matterKey,
          ruleReference: input.ruleReference,
          grounds: input.grounds,
          requestedChecks: input.requestedChecks,
          status: isFree ? 'lodged' : 'awaiting_fee',
          feeMinor: event.protestFeeMinor,
          currency: event.currency,
          windowDeadline: deadline,
        },
        { transaction },
      );
      await recordAuditEvent(
        {
          eventId,
          actorId: actor.id,
          subjectType: 'protest',
          subjectId: p.id,
          action: isFree ? 'protest.lodged' : 'protest.submitted',
          details: {
            matterKey,
            ruleReference: input.ruleReference,
            resultsVersionId: version.id,
            windowDeadline: deadline.toISOString(),
            feeMinor: event.protestFeeMinor,
          },
        },
        transaction,
      );
      return p.id;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw fieldError(
        409,
        'duplicate_matter',
        'ruleReference',
        'You have already protested this matter under this rule: add evidence to that protest instead.',
      );
    }
    throw err;
  }
  if (isFree) {
    await notifyParties(
      protestId,
      'Protest lodged',
      [
        `A protest has been lodged under ${input.ruleReference}.`,
        'The stewards will decide whether to accept it for a hearing.',
      ],
      { includeStewards: true },
    );
  } else {
    await notifyParties(
      protestId,
      'Protest awaiting its fee',
      [
        `Your protest under ${input.ruleReference} is saved.`,
        `It is lodged once the fee of ${formatMoney(event.protestFeeMinor, event.currency)} is paid.`,
      ],
      { includeProtested: false },
    );
  }
  return getProtest(actor, protestId);
}
