import 'server-only';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { formatMoney } from '@/lib/core/inputs/entries';
import { LodgeAppealInput } from '../../core/inputs/penalties';
import { formatInZone } from '../../core/protests/protest-window';
import { readAppeal } from './appeal-view';
import { notifyAppeal } from './notify-appeal';
import { getAppeal, type AppealDetail } from './get-appeal';

const field = (status: number, code: string, f: string, message: string) =>
  new AppError(code, status, `${f}: ${message}`, [{ field: f, message }]);

/**
 * Notice of appeal against a stewards' penalty, to the governing body's appeal body. Only a party may give it:
 * the penalised boat's entrant or owner, or the protester whose protest led to it. It must come within the
 * meeting's appeal notice after the decision (a late one is refused with the deadline); the governing body's
 * rules set the real period. A penalty already annulled or replaced, or set by the appeal body itself, cannot be
 * appealed here. With a fee the appeal waits for the verified payment webhook; without one it is lodged at once.
 * Someone who is no party learns nothing about the penalty beyond what is posted (404 for a missing one).
 */
export async function lodgeAppeal(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
  now = new Date(),
): Promise<AppealDetail> {
  assertCan(actor, 'appeal.lodge', { eventId });
  const input = LodgeAppealInput.parse(await readInput());
  const { sequelize } = getDb();
  const [p] = await sequelize.query<{
    id: string;
    appealId: string | null;
    entrantId: string;
    ownerId: string;
    protesterId: string | null;
    deadline: Date;
    feeMinor: number;
    currency: string;
    timeZone: string;
    state: 'in_force' | 'ended';
  }>(
    `select p.id, p.appeal_id as "appealId", e.entrant_id as "entrantId", b.owner_id as "ownerId",
            pr.lodged_by_id as "protesterId",
            p.decided_at + make_interval(mins => ev.appeal_notice_minutes) as deadline,
            ev.appeal_fee_minor as "feeMinor", ev.currency, ev.time_zone as "timeZone",
            case when exists (select 1 from appeals x where x.penalty_id = p.id and x.status in ('annulled', 'amended'))
                 then 'ended' else 'in_force' end as state
       from penalties p join entries e on e.id = p.entry_id join boats b on b.id = e.boat_id
       join events ev on ev.id = p.event_id left join protests pr on pr.id = p.protest_id
      where p.id = :id and p.event_id = :eventId`,
    { replacements: { id: input.penaltyId, eventId }, type: QueryTypes.SELECT },
  );
  if (!p) throw field(404, 'not_found', 'penaltyId', 'No such penalty at this meeting.');
  if (![p.entrantId, p.ownerId, p.protesterId].includes(actor.id))
    throw new AppError(
      'not_a_party',
      403,
      "Only the penalised boat's entrant or owner, or the protester whose protest led to it, may appeal.",
    );
  if (p.appealId)
    throw field(409, 'final', 'penaltyId', 'The appeal body set this penalty: its decision is not appealed here.');
  if (p.state !== 'in_force') throw field(409, 'conflict', 'penaltyId', 'An appeal has already ended this penalty.');
  const deadline = new Date(p.deadline);
  if (now > deadline) {
    const label = formatInZone(deadline, p.timeZone);
    throw field(409, 'out_of_time', 'penaltyId', `Too late: notice of appeal was due by ${label}.`);
  }
  const isFree = p.feeMinor === 0;
  let appealId: string;
  try {
    appealId = await sequelize.transaction(async (transaction) => {
      const [row] = await sequelize.query<{ id: string }>(
        `insert into appeals (event_id, penalty_id, lodged_by_id, grounds, status, fee_minor, currency, notice_deadline)
         values (:eventId, :penaltyId, :actorId, :grounds, :status, :feeMinor, :currency, :deadline) returning id`,
        {
          replacements: {
            eventId,
            penaltyId: p.id,
            actorId: actor.id,
            grounds: input.grounds,
            status: isFree ? 'lodged' : 'awaiting_fee',
            feeMinor: p.feeMinor,
            currency: p.currency,
            deadline,
          },
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      await recordAuditEvent(
        {
          eventId,
          actorId: actor.id,
          subjectType: 'appeal',
          subjectId: row.id,
          action: isFree ? 'appeal.lodged' : 'appeal.submitted',
          details: { penaltyId: p.id, noticeDeadline: deadline.toISOString(), feeMinor: p.feeMinor },
        },
        transaction,
      );
      const a = (await readAppeal(row.id, { transaction }))!;
      if (isFree)
        await notifyAppeal(
          a,
          'Appeal lodged',
          ['Notice of appeal has been lodged with the appeal body. The results concerned show "under appeal".'],
          transaction,
        );
      else
        await notifyAppeal(
          a,
          'Appeal awaiting its fee',
          [`Your appeal is saved. It is lodged once the fee of ${formatMoney(p.feeMinor, p.currency)} is paid.`],
          transaction,
          { appellantOnly: true },
        );
      return row.id;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw field(409, 'duplicate_appeal', 'penaltyId', 'You have already appealed this penalty.');
    throw err;
  }
  return getAppeal(actor, appealId);
}
