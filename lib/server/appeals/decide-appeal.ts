import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { refundPayment } from '@/lib/server/payments/stripe';
import { checkpointQuietly } from '@/lib/server/chain/chain-service';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { formatMoney } from '@/lib/core/inputs/entries';
import { DecideAppealInput } from '../../core/inputs/penalties';
import { amendClassResults } from '../penalties/amend-results';
import { readCatalogueItemFor, readPenalisedEntry } from '../penalties/apply-penalty';
import { APPEAL_STATUS_LABELS, PENDING_APPEAL, readAppeal } from './appeal-view';
import { findAppealForAppealBody } from './find-appeal-for-actor';
import { notifyAppeal } from './notify-appeal';
import { getAppeal, type AppealDetail } from './get-appeal';

/**
 * The appeal body's decision on a lodged appeal: it confirms the stewards' penalty, amends it (a penalty from
 * the meeting's catalogue replaces it, set by the appeal body) or annuls it. The class's results are amended as
 * a new version from the organiser's latest one with the penalties then in force, so an annulment restores
 * them. The fee is refunded when the appeal succeeds (annulled or amended) or is superseded unheard, and kept when it is
 * confirmed (common practice, no single source; the governing body's rules decide). As for protests, the
 * refund is asked for inside the transaction with a key made from the appeal id, so a retry after a failure
 * reaches the provider as the same request and the fee is never refunded twice; a decided appeal cannot be
 * decided again (409). When another appeal's decision has already ended the penalty (annulled or amended it), the
 * only outcome left is 'superseded': the appeal is closed with its fee refunded and the results are not touched.
 */
export async function decideAppeal(
  actor: Actor | null,
  appealId: string,
  readInput: () => Promise<unknown>,
): Promise<AppealDetail> {
  const { sequelize } = getDb();
  const decided = await sequelize.transaction(async (transaction) => {
    const { appeal } = await findAppealForAppealBody(actor, appealId, transaction);
    const input = DecideAppealInput.parse(await readInput());
    if (!PENDING_APPEAL.includes(appeal.status))
      throw new AppError(
        'conflict',
        409,
        `This appeal is ${APPEAL_STATUS_LABELS[appeal.status].toLowerCase()}: it cannot be decided now.`,
      );
    // Another appeal against the same penalty may have ended it already: that decision stands.
    const [ended] = await sequelize.query(
      `select 1 from appeals where penalty_id = :penaltyId and id <> :id and status in ('annulled', 'amended')`,
      { replacements: { penaltyId: appeal.penaltyId, id: appeal.id }, type: QueryTypes.SELECT, transaction },
    );
    if (ended && input.outcome !== 'superseded')
      throw new AppError(
        'superseded',
        409,
        "Another appeal's decision has already ended this penalty: close this appeal as superseded (its fee is refunded).",
      );
    if (!ended && input.outcome === 'superseded')
      throw new AppError('not_superseded', 409, 'No other appeal has ended this penalty: confirm, amend or annul it.');
    const entry = (await readPenalisedEntry(appeal.entryId, appeal.eventId, transaction))!;
    const item =
      input.outcome === 'amended'
        ? await readCatalogueItemFor(input.catalogueItemId!, appeal.eventId, entry.id, input.runLabel, transaction)
        : null;
    if (!item && input.runLabel)
      throw new AppError('invalid_input', 400, 'runLabel: only an amended decision names a run.', [
        { field: 'runLabel', message: 'Only an amended decision names a run.' },
      ]);
    const decidedAt = new Date();
    await sequelize.query(
      `update appeals set status = :status, decision_reasons = :reasons, decided_at = :decidedAt, decided_by_id = :actorId,
              updated_at = now()
        where id = :id`,
      {
        replacements: { status: input.outcome, reasons: input.reasons, decidedAt, actorId: actor!.id, id: appeal.id },
        transaction,
      },
    );
    let replacingId: string | null = null;
    if (item) {
      const [row] = await sequelize.query<{ id: string }>(
        `insert into penalties (event_id, entry_id, catalogue_item_id, code, kind, amount, label, run_label,
                                appeal_id, replaces_penalty_id, reason, decided_by_id, decided_at)
         values (:eventId, :entryId, :itemId, :code, :kind, :amount, :label, :runLabel, :appealId, :replaces, :reason, :actorId, :decidedAt)
         returning id`,
        {
          replacements: {
            eventId: appeal.eventId,
            entryId: entry.id,
            itemId: item.id,
            code: item.code,
            kind: item.kind,
            amount: item.amount,
            label: item.label,
            runLabel: input.runLabel,
            appealId: appeal.id,
            replaces: appeal.penaltyId,
            reason: input.reasons,
            actorId: actor!.id,
            decidedAt,
          },
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      replacingId = row.id;
    }
    // Closing a superseded appeal leaves the results as the other decision made them.
    const amended =
      input.outcome === 'superseded'
        ? null
        : await amendClassResults(
            {
              eventId: appeal.eventId,
              classId: appeal.classId,
              actorId: actor!.id,
              source: 'appeal',
              note: `Appeal body: penalty ${appeal.penaltyCode} on #${appeal.raceNumber} ${input.outcome}`,
            },
            transaction,
          );
    // The refund is the last step that can fail (after the results amendment, which may refuse): when the
    // provider does not confirm it, nothing of the decision is stored.
    const succeeds = input.outcome !== 'confirmed';
    let refund: { id: string } | null = null;
    if (succeeds && appeal.paymentIntentId && !appeal.refundId) {
      refund = await refundPayment({
        paymentIntentId: appeal.paymentIntentId,
        idempotencyKey: `appeal-fee-refund-${appeal.id}`,
        metadata: { kind: 'appeal', appealId: appeal.id },
      }).catch((err) => {
        if (err instanceof AppError) throw err;
        console.error('[boreline] appeal fee refund failed; decision not recorded', appeal.id, err);
        throw new AppError(
          'refund_failed',
          502,
          'The payment provider did not confirm the refund, so the decision was not recorded. Try again.',
        );
      });
    }
    if (refund)
      await sequelize.query(`update appeals set refund_id = :refundId, refunded_at = :decidedAt where id = :id`, {
        replacements: { refundId: refund.id, decidedAt, id: appeal.id },
        transaction,
      });
    await recordAuditEvent(
      {
        eventId: appeal.eventId,
        actorId: actor!.id,
        subjectType: 'appeal',
        subjectId: appeal.id,
        action: `appeal.${input.outcome}`,
        details: {
          penaltyId: appeal.penaltyId,
          reasons: input.reasons,
          replacingPenaltyId: replacingId,
          refundId: refund?.id ?? null,
        },
      },
      transaction,
    );
    const fee = appeal.feeMinor > 0 ? formatMoney(appeal.feeMinor, appeal.currency) : null;
    const fresh = (await readAppeal(appeal.id, { transaction }))!;
    await notifyAppeal(
      fresh,
      input.outcome === 'superseded'
        ? 'Appeal closed: the penalty was already ended'
        : `Appeal decided: ${input.outcome}`,
      [
        input.outcome === 'superseded'
          ? "The appeal body has closed the appeal: another appeal's decision had already ended the penalty it was against."
          : `The appeal body has decided the appeal: ${APPEAL_STATUS_LABELS[input.outcome].toUpperCase()}.`,
        `Reasons: ${input.reasons}`,
        ...(item
          ? [`Penalty now in force: ${item.code} ${item.label}${input.runLabel ? ` (run ${input.runLabel})` : ''}`]
          : []),
        amended
          ? `The results are amended as version ${amended.version}.`
          : 'The results do not change (or are not published yet).',
        ...(fee
          ? [
              refund
                ? `The appeal fee of ${fee} is refunded to the card that paid it.`
                : `The appeal fee of ${fee} is kept.`,
            ]
          : []),
      ],
      transaction,
    );
    return { id: appeal.id, eventId: appeal.eventId, outcome: input.outcome };
  });
  // The appeal body's decision (and any results it amended) is covered by a signed checkpoint before it answers.
  await checkpointQuietly(decided.eventId, `appeal decided (${decided.outcome})`);
  return getAppeal(actor, decided.id);
}
