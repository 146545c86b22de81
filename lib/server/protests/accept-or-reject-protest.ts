import 'server-only';
import { addMinutes } from 'date-fns';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findProtestForSteward } from './find-protest-for-actor';
import { AcceptProtestInput, RejectProtestInput } from '../../core/inputs/protests';
import { REJECTION_LABELS } from '../../core/protests/protest-states';
import { formatInZone } from '../../core/protests/protest-window';
import { notifyParties } from './notify-parties';
import { getProtest, type ProtestDetail } from './get-protest';
import { namesOfOfficials } from './names-of-officials';

/**
 * The stewards' first look: accept a lodged protest for a hearing, or reject it as invalid (out of
 * time, fee not paid, not in the required form) with reasons. A rejection is a decision: it gets
 * an appeal deadline, and the fee, if paid, is kept (common practice, no single source).
 */
export async function acceptOrRejectProtest(
  actor: Actor | null,
  protestId: string,
  action: 'accept' | 'reject',
  raw: unknown,
): Promise<ProtestDetail> {
  const { sequelize } = getDb();
  const { timeZone, rule, input } = await sequelize.transaction(async (transaction) => {
    // Who may act comes first (404/403), then the input (400).
    const { protest } = await findProtestForSteward(actor, protestId, transaction);
    const input =
      action === 'accept'
        ? { ...AcceptProtestInput.parse(raw ?? {}), code: null, reasons: '' }
        : { note: '', ...RejectProtestInput.parse(raw) };
    const event = (await getDb().models.Event.findByPk(protest.eventId, { transaction }))!;
    if (action === 'accept') {
      if (protest.status !== 'lodged')
        throw new AppError(
          'conflict',
          409,
          protest.status === 'awaiting_fee'
            ? 'The fee is not paid yet: the protest is not lodged.'
            : 'Only a lodged protest can be accepted.',
        );
      await protest.update({ status: 'accepted' }, { transaction });
      await recordAuditEvent(
        {
          eventId: protest.eventId,
          actorId: actor!.id,
          subjectType: 'protest',
          subjectId: protest.id,
          action: 'protest.accepted',
          details: { note: input.note },
        },
        transaction,
      );
    } else {
      if (protest.status !== 'lodged' && protest.status !== 'awaiting_fee')
        throw new AppError('conflict', 409, 'Only a protest not yet accepted can be rejected as invalid.');
      const decidedAt = new Date();
      await protest.update(
        {
          status: 'rejected',
          rejectionCode: input.code,
          decisionReasons: input.reasons,
          decidedAt,
          decidedByIds: [actor!.id],
          decidedByNames: await namesOfOfficials([actor!.id], transaction),
          appealDeadline: addMinutes(decidedAt, event.appealNoticeMinutes),
        },
        { transaction },
      );
      await recordAuditEvent(
        {
          eventId: protest.eventId,
          actorId: actor!.id,
          subjectType: 'protest',
          subjectId: protest.id,
          action: 'protest.rejected',
          details: { code: input.code, reasons: input.reasons },
        },
        transaction,
      );
    }
    return { timeZone: event.timeZone, rule: protest.ruleReference, input };
  });
  const detail = await getProtest(actor, protestId, { verifyEvidence: false });
  if (action === 'accept') {
    await notifyParties(detail.id, 'Protest accepted for a hearing', [
      `The stewards have accepted the protest under ${rule}.`,
      'They will tell you the time and place of the hearing.',
    ]);
  } else {
    await notifyParties(detail.id, 'Protest rejected as invalid', [
      `The stewards have rejected the protest under ${rule} as invalid: ${REJECTION_LABELS[input.code!]}.`,
      `Reasons: ${input.reasons}`,
      `Notice of appeal is due by ${formatInZone(detail.appealDeadline!, timeZone)}.`,
    ]);
  }
  return detail;
}
