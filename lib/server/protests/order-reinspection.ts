import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findProtestForSteward } from './find-protest-for-actor';
import { OrderReinspectionInput } from '../../core/inputs/protests';
import { DECIDABLE_STATUSES } from '../../core/protests/protest-states';
import { notifyParties } from './notify-parties';
import { getProtest, type ProtestDetail } from './get-protest';

/**
 * The stewards send the protested boat back to the scrutineers: a re-inspection task that names
 * the protest. The scrutineers record it like any other; the recorded inspection marks the task
 * done and is linked to the protest through it. One open task per protest at a time.
 */
export async function orderReinspection(actor: Actor | null, protestId: string, raw: unknown): Promise<ProtestDetail> {
  const { models, sequelize } = getDb();
  const input = await sequelize.transaction(async (transaction) => {
    const { protest } = await findProtestForSteward(actor, protestId, transaction);
    assertCan(actor, 'inspection.assign_reinspection', { eventId: protest.eventId });
    const input = OrderReinspectionInput.parse(raw);
    if (!protest.againstEntryId)
      throw new AppError(
        'conflict',
        409,
        'This protest is against a results version, not a boat: there is nothing to re-inspect.',
      );
    if (!DECIDABLE_STATUSES.includes(protest.status))
      throw new AppError('conflict', 409, 'Accept the protest before ordering a re-inspection.');
    const open = await models.Reinspection.count({ where: { protestId: protest.id, doneAt: null }, transaction });
    if (open > 0)
      throw new AppError('conflict', 409, 'A re-inspection for this protest is already waiting for the scrutineers.');
    const task = await models.Reinspection.create(
      {
        eventId: protest.eventId,
        entryId: protest.againstEntryId,
        reason: `Protest under ${protest.ruleReference}: ${input.reason}`,
        requestedById: actor!.id,
        protestId: protest.id,
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        eventId: protest.eventId,
        actorId: actor!.id,
        subjectType: 'protest',
        subjectId: protest.id,
        action: 'protest.reinspection_ordered',
        details: { reinspectionId: task.id, reason: input.reason },
      },
      transaction,
    );
    return input;
  });
  const detail = await getProtest(actor, protestId, { verifyEvidence: false });
  await notifyParties(detail.id, 'Re-inspection ordered', [
    `The stewards have ordered a re-inspection of ${detail.targetLabel}: ${input.reason}`,
    'The scrutineers will call the boat.',
  ]);
  return detail;
}
