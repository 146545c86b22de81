import 'server-only';
import { getDb } from '@/lib/server/db';

// Sessions are signed cookies (JWT), so ending one means refusing it: each carries the person's
// session version at sign-in, and lib/server/auth/actor.ts accepts it only while the version still matches.

/** Ends every open session of the person (sign-out, password change, suspension, "everywhere"). */
export async function endAllSessions(userId: string, transaction?: unknown) {
  await getDb().sequelize.query('update users set session_version = session_version + 1 where id = :userId', {
    replacements: { userId },
    ...(transaction ? { transaction: transaction as never } : {}),
  });
}

/**
 * The mailbox behind an unproven address has just shown itself (an e-mailed link or invitation was
 * followed): a password chosen at sign-up by somebody else must not keep working, nor any session
 * it opened, nor the name they gave (the owner is asked for theirs). A proven address, or an account
 * without a password, is left alone.
 */
export async function wipeUnprovenPassword(email: string, transaction?: unknown) {
  await getDb().sequelize.query(
    `update users set password_hash = null, name = null, session_version = session_version + 1
      where email = :email and email_verified is null and password_hash is not null`,
    { replacements: { email: email.toLowerCase() }, ...(transaction ? { transaction: transaction as never } : {}) },
  );
}
