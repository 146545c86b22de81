import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { ScheduleAppealHearingInput } from '../../core/inputs/penalties';
import { formatInZone } from '../../core/protests/protest-window';
import { PENDING_APPEAL, readAppeal } from './appeal-view';
import { findAppealForAppealBody } from './find-appeal-for-actor';
import { notifyAppeal } from './notify-appeal';
import { getAppeal, type AppealDetail } from './get-appeal';

/** The appeal body sets (or moves) the hearing of a lodged appeal; the parties are told. */
export async function scheduleAppealHearing(
  actor: Actor | null,
  appealId: string,
  readInput: () => Promise<unknown>,
): Promise<AppealDetail> {
  const { sequelize } = getDb();
  const id = await sequelize.transaction(async (transaction) => {
    const { appeal } = await findAppealForAppealBody(actor, appealId, transaction);
    const input = ScheduleAppealHearingInput.parse(await readInput());
    if (!PENDING_APPEAL.includes(appeal.status))
      throw new AppError('conflict', 409, 'Only a lodged appeal that is not yet decided can be given a hearing.');
    const hearingAt = new Date(input.hearingAt);
    await sequelize.query(
      `update appeals set status = 'hearing_scheduled', hearing_at = :hearingAt, hearing_place = :place, updated_at = now()
        where id = :id`,
      { replacements: { hearingAt, place: input.place, id: appeal.id }, transaction },
    );
    await recordAuditEvent(
      {
        eventId: appeal.eventId,
        actorId: actor!.id,
        subjectType: 'appeal',
        subjectId: appeal.id,
        action: 'appeal.hearing_scheduled',
        details: { hearingAt: hearingAt.toISOString(), place: input.place },
      },
      transaction,
    );
    const fresh = (await readAppeal(appeal.id, { transaction }))!;
    await notifyAppeal(
      fresh,
      'Appeal hearing',
      [`The appeal body will hear the appeal at ${formatInZone(hearingAt, appeal.timeZone)}, ${input.place}.`],
      transaction,
    );
    return appeal.id;
  });
  return getAppeal(actor, id);
}
