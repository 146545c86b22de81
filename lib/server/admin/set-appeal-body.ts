import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';

export type AppealBodyMembership = { userId: string; isAppealBody: boolean };

/** Which of these people (or everyone, with no list) sit on the appeal body. */
export async function appealBodyMemberIds(userIds?: string[]): Promise<Set<string>> {
  const rows = await getDb().sequelize.query<{ user_id: string }>(
    userIds
      ? 'select user_id from appeal_body_members where user_id in (:ids)'
      : 'select user_id from appeal_body_members',
    { replacements: { ids: userIds?.length ? userIds : [null] }, type: QueryTypes.SELECT },
  );
  return new Set(rows.map((r) => r.user_id));
}

/**
 * The site administrator appoints a person to the governing body's appeal body (a role above any single
 * meeting), or ends the appointment. Roles are read per request, so either takes effect at once. Like any staff
 * role, it needs an address the person has proven (they would be told of hearings there).
 */
export async function appointAppealBodyMember(actor: Actor | null, userId: string): Promise<AppealBodyMembership> {
  assertCan(actor, 'admin.manage_users');
  const id = parseId(userId, 'person');
  const user = await getDb().models.User.findByPk(id);
  if (!user) throw new AppError('not_found', 404, 'No such person.');
  if (!user.emailVerified || user.suspendedAt)
    throw new AppError(
      'address_not_proven',
      409,
      `${user.name ?? user.email} has not proven their address (or is suspended): they cannot join the appeal body yet.`,
    );
  await getDb().sequelize.query(
    `insert into appeal_body_members (user_id, appointed_by_id) values (:id, :by) on conflict (user_id) do nothing`,
    { replacements: { id, by: actor.id }, type: QueryTypes.INSERT },
  );
  return { userId: id, isAppealBody: true };
}

export async function endAppealBodyMembership(actor: Actor | null, userId: string): Promise<AppealBodyMembership> {
  assertCan(actor, 'admin.manage_users');
  const id = parseId(userId, 'person');
  const [rows] = (await getDb().sequelize.query(`delete from appeal_body_members where user_id = :id returning id`, {
    replacements: { id },
  })) as [unknown[], unknown];
  if (!rows.length) throw new AppError('not_found', 404, 'This person is not on the appeal body.');
  return { userId: id, isAppealBody: false };
}
