import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findProtestForSteward } from './find-protest-for-actor';
import { ScheduleHearingInput } from '../../core/inputs/protests';
import { DECIDABLE_STATUSES } from '../../core/protests/protest-states';
import { formatInZone, instantFromWallClock } from '../../core/protests/protest-window';
import { notifyParties } from './notify-parties';
import { getProtest, type ProtestDetail } from './get-protest';

/** Sets (or moves) the hearing's time, read in the meeting's time zone, and place; both parties are e-mailed. */
export async function scheduleHearing(
  actor: Actor | null,
  protestId: string,
  raw: unknown,
  now = new Date(),
): Promise<ProtestDetail> {
  const { sequelize, models } = getDb();
  const { label, place } = await sequelize.transaction(async (transaction) => {
    const { protest } = await findProtestForSteward(actor, protestId, transaction);
    const input = ScheduleHearingInput.parse(raw);
    if (!DECIDABLE_STATUSES.includes(protest.status))
      throw new AppError('conflict', 409, 'Accept the protest before scheduling its hearing.');
    const event = (await models.Event.findByPk(protest.eventId, { transaction }))!;
    const hearingAt = instantFromWallClock(input.hearingAt, event.timeZone);
    if (!hearingAt) throw fieldError('hearingAt', 'Choose the hearing date and time.');
    if (hearingAt.getTime() < now.getTime() - 60_000)
      throw fieldError('hearingAt', 'Choose a time that has not passed.');
    const moved = protest.status === 'hearing_scheduled';
    await protest.update({ status: 'hearing_scheduled', hearingAt, hearingPlace: input.place }, { transaction });
    await recordAuditEvent(
      {
        eventId: protest.eventId,
        actorId: actor!.id,
        subjectType: 'protest',
        subjectId: protest.id,
        action: moved ? 'protest.hearing_moved' : 'protest.hearing_scheduled',
        details: { hearingAt: hearingAt.toISOString(), place: input.place },
      },
      transaction,
    );
    return { label: formatInZone(hearingAt, event.timeZone), place: input.place };
  });
  const detail = await getProtest(actor, protestId, { verifyEvidence: false });
  await notifyParties(detail.id, 'Protest hearing', [
    `The stewards will hear the protest on ${label}, at ${place}.`,
    'Bring your evidence and witnesses; you may add evidence on the protest page until the decision.',
  ]);
  return detail;
}
