import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { AssignStaffInput } from '@/lib/core/inputs/events';
import { inviteStaff } from '@/lib/server/auth/invitations';
import { sendMail } from '@/lib/server/mail/send';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { appUrl } from '@/lib/server/config/env';

/**
 * Gives a person a staff role at the event: a registered user whose address is proven gets it at
 * once (and an e-mail); anyone else, an unproven account included, gets an invitation whose link,
 * followed from that mailbox, signs them in with the role. So nobody can pre-register an official's
 * address and catch the role.
 */
export async function assignStaff(actor: Actor | null, eventId: string, raw: unknown) {
  assertCan(actor, 'event.staff_manage', { eventId });
  const input = AssignStaffInput.parse(raw);
  const { models } = getDb();
  const event = await models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such event.');
  const user = await models.User.findOne({ where: { email: input.email } });
  if (!user?.emailVerified)
    return { outcome: 'invited' as const, invitation: await inviteStaff(actor, eventId, input) };
  const created = await getDb().sequelize.transaction(async (transaction) => {
    const [, isNew] = await models.EventStaff.findOrCreate({
      where: { eventId, userId: user.id, role: input.role },
      defaults: { eventId, userId: user.id, role: input.role },
      transaction,
    });
    if (isNew)
      await recordAuditEvent(
        {
          eventId,
          actorId: actor.id,
          subjectType: 'staff',
          subjectId: user.id,
          action: 'staff.added',
          details: { role: input.role, email: user.email },
        },
        transaction,
      );
    return isNew;
  });
  if (!created)
    throw new AppError('conflict', 409, 'This person already has that role at this meeting.', [
      { field: 'email', message: 'Already on the staff in that role.' },
    ]);
  const base = appUrl();
  await sendMail({
    to: user.email,
    subject: `You are on the staff of ${event.name}`,
    text: `${actor.name ?? actor.email} added you to ${event.name} (${event.venue}) as ${input.role.replace('_', ' ')}.\n\nSign in: ${base}/sign-in`,
  });
  return { outcome: 'assigned' as const, userId: user.id, role: input.role };
}
