import 'server-only';
import { checkpointQuietly } from '@/lib/server/chain/chain-service';
import { Op } from 'sequelize';
import { addMinutes } from 'date-fns';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { refundPayment } from '@/lib/server/payments/stripe';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { formatMoney } from '@/lib/core/inputs/entries';
import { findProtestForSteward } from './find-protest-for-actor';
import { DecideProtestInput } from '../../core/inputs/protests';
import { DECIDABLE_STATUSES, PROTEST_STATUS_LABELS, type ProtestStatus } from '../../core/protests/protest-states';
import { formatInZone } from '../../core/protests/protest-window';
import { notifyParties } from './notify-parties';
import { getProtest, type ProtestDetail } from './get-protest';
import { namesOfOfficials } from './names-of-officials';
import { findProtestConflicts } from '@/lib/server/interests/find-protest-conflicts';
import { appUrl } from '@/lib/server/config/env';

/**
 * The stewards' decision: upheld, dismissed or withdrawn, with reasons and, when upheld, any
 * penalty. Upheld refunds the fee (kept when dismissed or withdrawn: common practice, no single
 * source). The refund is asked for inside the transaction with a key made from the protest id, so
 * a retry after a failure reaches the provider as the same request and the fee is never refunded
 * twice; a decided protest cannot be decided again (409). Notice of appeal is due the meeting's
 * appeal notice after the decision.
 */
export async function decideProtest(actor: Actor | null, protestId: string, raw: unknown): Promise<ProtestDetail> {
  const { sequelize, models } = getDb();
  const { input, ...outcome } = await sequelize.transaction(async (transaction) => {
    // Who may decide comes first (404/403), then the input (400).
    const { protest } = await findProtestForSteward(actor, protestId, transaction);
    const input = DecideProtestInput.parse(raw);
    const mayWithdraw = input.outcome === 'withdrawn' && protest.status === 'lodged';
    if (!DECIDABLE_STATUSES.includes(protest.status) && !mayWithdraw) {
      throw new AppError(
        'conflict',
        409,
        `This protest is ${PROTEST_STATUS_LABELS[protest.status as ProtestStatus].toLowerCase()}: it cannot be decided now.`,
      );
    }
    const panel = [...new Set(input.panelIds.map((x) => x.toLowerCase()))].filter((x) => x !== actor!.id);
    if (panel.length) {
      const stewards = await models.EventStaff.count({
        where: { eventId: protest.eventId, role: 'steward', userId: { [Op.in]: panel } },
        transaction,
      });
      if (stewards !== panel.length)
        throw new AppError('invalid_input', 400, 'panelIds: name only stewards of this meeting.', [
          { field: 'panelIds', message: 'Name only stewards of this meeting.' },
        ]);
      // A steward with an interest cannot sit on the panel either (the deciding steward was checked above).
      const conflicted = await findProtestConflicts(protest.id, panel, transaction);
      if (conflicted.length) {
        const names = await namesOfOfficials(
          conflicted.map((c) => c.officialId),
          transaction,
        );
        const message = `${names.join(', ')} ${names.length === 1 ? 'has' : 'have'} an interest in this protest and cannot sit on the panel.`;
        throw new AppError('invalid_input', 400, `panelIds: ${message}`, [{ field: 'panelIds', message }]);
      }
    }
    const decidedByIds = [actor!.id, ...panel];
    const decidedByNames = await namesOfOfficials(decidedByIds, transaction);
    let refund: { id: string } | null = null;
    if (input.outcome === 'upheld' && protest.paymentIntentId && !protest.refundId) {
      refund = await refundPayment({
        paymentIntentId: protest.paymentIntentId,
        idempotencyKey: `protest-fee-refund-${protest.id}`,
        metadata: { kind: 'protest', protestId: protest.id },
      }).catch((err) => {
        if (err instanceof AppError) throw err;
        console.error('[boreline] protest fee refund failed; decision not recorded', protest.id, err);
        throw new AppError(
          'refund_failed',
          502,
          'The payment provider did not confirm the refund, so the decision was not recorded. Try again.',
        );
      });
    }
    const event = (await models.Event.findByPk(protest.eventId, { attributes: ['appealNoticeMinutes'], transaction }))!;
    const decidedAt = new Date();
    await protest.update(
      {
        status: input.outcome,
        decisionReasons: input.reasons,
        penalty: input.penalty || null,
        decidedAt,
        decidedByIds,
        decidedByNames,
        appealDeadline: addMinutes(decidedAt, event.appealNoticeMinutes),
        ...(refund && { refundId: refund.id, refundedAt: decidedAt }),
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        eventId: protest.eventId,
        actorId: actor!.id,
        subjectType: 'protest',
        subjectId: protest.id,
        action: `protest.${input.outcome}`,
        details: {
          reasons: input.reasons,
          penalty: input.penalty || null,
          decidedByIds,
          decidedByNames,
          refundId: refund?.id ?? null,
        },
      },
      transaction,
    );
    return { input, refunded: Boolean(refund), feeMinor: protest.feeMinor, currency: protest.currency };
  });
  const detail = await getProtest(actor, protestId, { verifyEvidence: false });
  await checkpointQuietly(detail.eventId, `protest decided (${input.outcome})`);
  const fee = outcome.feeMinor > 0 ? formatMoney(outcome.feeMinor, outcome.currency) : null;
  await notifyParties(detail.id, `Protest ${input.outcome}`, [
    `The stewards have decided the protest under ${detail.ruleReference} against ${detail.targetLabel}: ${detail.statusLabel.toUpperCase()}.`,
    `Reasons: ${input.reasons}`,
    ...(input.penalty ? [`Penalty: ${input.penalty}`] : []),
    ...(fee
      ? [
          outcome.refunded
            ? `The protest fee of ${fee} is refunded to the card that paid it.`
            : `The protest fee of ${fee} is kept.`,
        ]
      : []),
    `Notice of appeal is due by ${formatInZone(detail.appealDeadline!, detail.timeZone)}.`,
    `The written decision (PDF): ${appUrl()}/api/protests/${detail.id}/decision.pdf`,
  ]);
  return detail;
}
