import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { assertCan, type Actor } from './actor';
import { sendMail, linkMail } from '@/lib/server/mail/send';
import type { EventStaffRole } from '@/lib/core/constants';
import { InviteStaffInput, personName } from '@/lib/core/inputs/auth';
import { wipeUnprovenPassword } from './sessions';
import { appUrl } from '@/lib/server/config/env';

const INVITATION_DAYS = 14;
const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

const ROLE_WORDS: Record<EventStaffRole, string> = {
  organiser: 'an organiser',
  chief_scrutineer: 'the chief scrutineer',
  scrutineer: 'a scrutineer',
  steward: 'a steward',
};

/** An organiser invites a person to the event's staff; the e-mailed link signs them in with the role. */
export async function inviteStaff(actor: Actor | null, eventId: string, raw: unknown) {
  assertCan(actor, 'event.staff_manage', { eventId });
  const input = InviteStaffInput.parse(raw);
  const { Event, StaffInvitation } = getDb().models;
  const event = await Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such event.');
  const token = randomBytes(32).toString('base64url');
  const invitation = await StaffInvitation.create({
    eventId,
    email: input.email,
    role: input.role,
    tokenHash: hashToken(token),
    invitedById: actor.id,
    expiresAt: new Date(Date.now() + INVITATION_DAYS * 86400_000),
  });
  const base = appUrl();
  await sendMail(
    linkMail({
      to: input.email,
      subject: `You are invited to ${event.name} as ${ROLE_WORDS[input.role]}`,
      intro: `${actor.name ?? actor.email} has invited you to serve as ${ROLE_WORDS[input.role]} at ${event.name} (${event.venue}).`,
      linkLabel: 'Accept the invitation and sign in',
      url: `${base}/invite/${token}`,
      outro: `The link expires in ${INVITATION_DAYS} days.`,
    }),
  );
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    expiresAt: invitation.expiresAt.toISOString(),
  };
}

/** Looks an invitation up by its token without using it (for the acceptance page). */
export async function findInvitation(token: string) {
  if (!token) return null;
  const { StaffInvitation, Event, User } = getDb().models;
  const inv = await StaffInvitation.findOne({ where: { tokenHash: hashToken(token) }, include: [Event] });
  if (!inv) return null;
  const event = (inv as unknown as { event: { name: string; venue: string } }).event;
  const user = await User.findOne({ where: { email: inv.email }, attributes: ['name', 'emailVerified'] });
  return {
    email: inv.email,
    role: inv.role,
    eventName: event.name,
    venue: event.venue,
    isUsable: !inv.acceptedAt && inv.expiresAt > new Date(),
    // Staff are seen by name in lists and records: a new account, one without a name, or one whose
    // address was never proven (its name was chosen by whoever signed up) is given one here.
    needsName: !user?.name?.trim() || !user.emailVerified,
  };
}

/**
 * Uses an invitation once: creates the person if new, grants the role, returns the user. A name
 * given on the acceptance page is set on an account that has none, or whose address was never
 * proven (its name was chosen by whoever signed up, perhaps not the mailbox's owner); a name the
 * owner chose is never overwritten. A name that fails validation refuses the acceptance
 * ('NameInvalid'), leaving the invitation unused.
 */
export async function acceptInvitation(token: string, rawName?: unknown) {
  if (!token) return null;
  const parsedName = rawName == null || rawName === '' ? null : personName.safeParse(rawName);
  if (parsedName && !parsedName.success) throw new Error('NameInvalid');
  const name = parsedName?.data ?? null;
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    const inv = await models.StaffInvitation.findOne({
      where: { tokenHash: hashToken(token), acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!inv) return null;
    const [user] = await models.User.findOrCreate({
      where: { email: inv.email },
      defaults: { email: inv.email, name: null, emailVerified: new Date() },
      transaction,
    });
    // A suspended account takes no new role: the invitation stays unused (the transaction rolls
    // back) and next-auth turns the error into the sign-in page's message.
    if (user.suspendedAt) throw new Error('AccountSuspended');
    const needsName = !user.name?.trim() || !user.emailVerified;
    // Following the invitation proves the mailbox. An account made earlier under this address but
    // never proven may belong to somebody else: its password and sessions end here.
    if (!user.emailVerified) {
      await wipeUnprovenPassword(user.email, transaction);
      await user.reload({ transaction });
      await user.update({ emailVerified: new Date() }, { transaction });
    }
    if (needsName && name) await user.update({ name }, { transaction });
    await models.EventStaff.findOrCreate({
      where: { eventId: inv.eventId, userId: user.id, role: inv.role },
      defaults: { eventId: inv.eventId, userId: user.id, role: inv.role },
      transaction,
    });
    await inv.update({ acceptedAt: new Date() }, { transaction });
    return { id: user.id, email: user.email, name: user.name };
  });
}
