import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { Op, QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { assertCan, type Actor } from './actor';
import { sendMail, linkMail } from '@/lib/server/mail/send';
import type { EventStaffRole } from '@/lib/core/constants';
import { InviteStaffInput, personName } from '@/lib/core/inputs/auth';
import type { AppointSeriesOfficialInput, SeriesOfficialRole } from '@/lib/core/inputs/series';
import { wipeUnprovenPassword } from './sessions';
import { recordAttempt } from './throttle';
import { appUrl, serverEnv } from '@/lib/server/config/env';

const INVITATION_DAYS = 14;
const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

const ROLE_WORDS: Record<EventStaffRole | SeriesOfficialRole, string> = {
  organiser: 'an organiser',
  chief_scrutineer: 'the chief scrutineer',
  scrutineer: 'a scrutineer',
  steward: 'a steward',
  series_secretary: 'a series secretary',
  series_steward: 'a series steward',
};

/** What an invitation leads to: a role at one meeting or a role in one series (exactly one). */
type Scope =
  | { eventId: string; seriesId?: never; role: EventStaffRole }
  | { seriesId: string; eventId?: never; role: SeriesOfficialRole };

/**
 * Stores the invitation (the token's SHA-256 only) and e-mails its link. Nothing here looks at whether the
 * address has an account: the row, the message and the answer are the same for every address.
 */
async function issueInvitation(actor: Actor, email: string, scope: Scope, mail: { subject: string; intro: string }) {
  // Each invitation is an e-mail sent at once in Boreline's name: at most INVITES_PER_HOUR from one official, and
  // INVITES_PER_ADDRESS_PER_HOUR to one address from anyone, so the app is no relay for a flood (the same for every
  // address: it says nothing about accounts).
  const { INVITES_PER_HOUR, INVITES_PER_ADDRESS_PER_HOUR } = serverEnv();
  for (const [key, limit] of [
    [`invite-by:${actor.id}`, INVITES_PER_HOUR],
    [`invite-to:${email.toLowerCase()}`, INVITES_PER_ADDRESS_PER_HOUR],
  ] as const) {
    const counted = await recordAttempt(key, { limit, windowS: 3600 });
    if (!counted.allowed)
      throw new AppError(
        'too_many_invitations',
        429,
        `Too many invitations were sent${key.startsWith('invite-to:') ? ' to this address' : ''} in the last hour: try again in ${Math.ceil(counted.retryAfterS / 60)} minutes.`,
      );
  }
  const { sequelize, models } = getDb();
  const token = randomBytes(32).toString('base64url');
  // A new invitation to the same address for the same role and place replaces one still waiting (a lost or
  // mistyped message is sent again): the earlier link stops working, so no spare link stays live for 14 days.
  await sequelize.query(
    `update staff_invitations set expires_at = now()
      where lower(email) = lower(:email) and role = :role and accepted_at is null and expires_at > now()
        and event_id is not distinct from :eventId and series_id is not distinct from :seriesId`,
    { replacements: { email, role: scope.role, eventId: scope.eventId ?? null, seriesId: scope.seriesId ?? null } },
  );
  const invitation = await models.StaffInvitation.create({
    eventId: scope.eventId ?? null,
    seriesId: scope.seriesId ?? null,
    email,
    role: scope.role,
    tokenHash: hashToken(token),
    invitedById: actor.id,
    expiresAt: new Date(Date.now() + INVITATION_DAYS * 86400_000),
  });
  await sendMail(
    linkMail({
      to: email,
      subject: mail.subject,
      intro: mail.intro,
      linkLabel: 'Accept the invitation and sign in',
      url: `${appUrl()}/invite/${token}`,
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

/** An organiser invites a person to the event's staff; the e-mailed link signs them in with the role. */
export async function inviteStaff(actor: Actor | null, eventId: string, raw: unknown) {
  assertCan(actor, 'event.staff_manage', { eventId });
  const input = InviteStaffInput.parse(raw);
  const event = await getDb().models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such event.');
  return issueInvitation(
    actor,
    input.email,
    { eventId, role: input.role },
    {
      subject: `You are invited to ${event.name} as ${ROLE_WORDS[input.role]}`,
      intro: `${actor.name ?? actor.email} has invited you to serve as ${ROLE_WORDS[input.role]} at ${event.name} (${event.venue}).`,
    },
  );
}

/**
 * A series' secretary invites a person to a series role (input already parsed by the caller). The person holds
 * the role only once they follow the link from that mailbox; an address without an account gets one then.
 */
export async function inviteSeriesOfficial(actor: Actor | null, seriesId: string, input: AppointSeriesOfficialInput) {
  assertCan(actor, 'series.manage', { seriesId });
  const [series] = await getDb().sequelize.query<{ name: string; season: number }>(
    `select name, season from series where id = :seriesId`,
    { replacements: { seriesId }, type: QueryTypes.SELECT },
  );
  if (!series) throw new AppError('not_found', 404, 'No such series.');
  const words = ROLE_WORDS[input.role];
  return issueInvitation(
    actor,
    input.email,
    { seriesId, role: input.role },
    {
      subject: `You are invited to ${series.name} (${series.season}) as ${words}`,
      intro:
        `${actor.name ?? actor.email} has invited you to serve as ${words} of ${series.name}, season ` +
        `${series.season}. You hold the role once you accept from this mailbox; if this address has no Boreline ` +
        'account yet, accepting makes one.',
    },
  );
}

/** Looks an invitation up by its token without using it (for the acceptance page). */
export async function findInvitation(token: string) {
  if (!token) return null;
  const { StaffInvitation, User } = getDb().models;
  const inv = await StaffInvitation.findOne({ where: { tokenHash: hashToken(token) } });
  if (!inv) return null;
  const [place] = await getDb().sequelize.query<{ name: string; detail: string }>(
    inv.eventId
      ? `select name, venue as detail from events where id = :id`
      : `select name, 'season ' || season as detail from series where id = :id`,
    { replacements: { id: inv.eventId ?? inv.seriesId }, type: QueryTypes.SELECT },
  );
  if (!place) return null;
  const user = await User.findOne({ where: { email: inv.email }, attributes: ['name', 'emailVerified'] });
  return {
    email: inv.email,
    role: inv.role,
    scope: inv.eventId ? ('event' as const) : ('series' as const),
    placeName: place.name,
    placeDetail: place.detail,
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
    if (inv.eventId) {
      const role = inv.role as EventStaffRole;
      await models.EventStaff.findOrCreate({
        where: { eventId: inv.eventId, userId: user.id, role },
        defaults: { eventId: inv.eventId, userId: user.id, role },
        transaction,
      });
    } else {
      // Appointed by whoever sent the invitation; holding the role already is no error (the link is used up).
      await sequelize.query(
        `insert into series_officials (series_id, user_id, role, appointed_by_id)
         values (:seriesId, :userId, :role, :invitedById) on conflict (series_id, user_id, role) do nothing`,
        {
          replacements: { seriesId: inv.seriesId, userId: user.id, role: inv.role, invitedById: inv.invitedById },
          transaction,
        },
      );
    }
    await inv.update({ acceptedAt: new Date() }, { transaction });
    // Other links to the same role and place for this address (sent twice) are spent with this one.
    await sequelize.query(
      `update staff_invitations set expires_at = now()
        where id <> :id and lower(email) = lower(:email) and role = :role and accepted_at is null and expires_at > now()
          and event_id is not distinct from :eventId and series_id is not distinct from :seriesId`,
      {
        replacements: { id: inv.id, email: inv.email, role: inv.role, eventId: inv.eventId, seriesId: inv.seriesId },
        transaction,
      },
    );
    return { id: user.id, email: user.email, name: user.name };
  });
}
