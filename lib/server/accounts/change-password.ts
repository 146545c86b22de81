import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { hashPassword, verifyPassword } from '@/lib/server/auth/passwords';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { endAllSessions } from '@/lib/server/auth/sessions';
import { ChangePasswordInput } from '@/lib/core/inputs/auth';

/**
 * Sets a new password for the signed-in person. The current password is asked for when there is
 * one (a borrowed session alone cannot take the account over), and every session ends, this one
 * included: the form signs the person in again with the new password.
 */
export async function changePassword(actor: Actor | null, raw: unknown) {
  assertCan(actor, 'account.view');
  const { currentPassword, password } = ChangePasswordInput.parse(raw);
  const { sequelize } = getDb();
  const [row] = await sequelize.query<{ passwordHash: string | null }>(
    `select password_hash as "passwordHash" from users where id = :id`,
    {
      replacements: { id: actor.id },
      type: QueryTypes.SELECT,
    },
  );
  if (row?.passwordHash) {
    const throttle = await recordAttempt(`password-change:${actor.id}`, { limit: 10, windowS: 15 * 60 });
    if (!throttle.allowed)
      throw new AppError('rate_limited', 429, 'Too many attempts: wait 15 minutes.', {
        retryAfterS: throttle.retryAfterS,
      });
    if (!(await verifyPassword(currentPassword, row.passwordHash)).isMatch) {
      throw new AppError('wrong_password', 400, 'That is not your current password.', [
        { field: 'currentPassword', message: 'That is not your current password.' },
      ]);
    }
  }
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(`update users set password_hash = :hash, updated_at = now() where id = :id`, {
      replacements: { id: actor.id, hash: await hashPassword(password) },
      transaction,
    });
    await endAllSessions(actor.id, transaction);
  });
}

/** "Sign out everywhere": every session of the person ends, on every device. */
export async function signOutEverywhere(actor: Actor | null) {
  assertCan(actor, 'account.view');
  await endAllSessions(actor.id);
}
