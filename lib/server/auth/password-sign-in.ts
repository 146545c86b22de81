import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { hashPassword, spendPasswordCheck, verifyPassword } from './passwords';
import { isOverAnyLimit, recordAttempts, clearAttempts } from './throttle';
import { serverEnv } from '@/lib/server/config/env';

// Password sign-in with throttles that stop an attacker without locking the owner out (OWASP
// Authentication Cheat Sheet, "Protect Against Automated Attacks"): failures are counted per account
// *at one address*, per address across accounts, and per account everywhere with a much higher
// ceiling against a spread-out attack. An attacker's failures at one address do not stop the owner
// at another; the e-mailed link is never throttled by password failures.

const FIFTEEN_MIN = 15 * 60;
export function signInLimits(email: string, address: string) {
  return [
    { key: `signin-fail:pair:${email}|${address}`, limit: serverEnv().SIGN_IN_LIMIT_PER_15_MIN, windowS: FIFTEEN_MIN },
    { key: `signin-fail:addr:${address}`, limit: serverEnv().SIGN_IN_ADDRESS_LIMIT_PER_15_MIN, windowS: FIFTEEN_MIN },
    { key: `signin-fail:acct:${email}`, limit: serverEnv().SIGN_IN_ACCOUNT_LIMIT_PER_HOUR, windowS: 60 * 60 },
  ];
}

export class TooManyAttemptsError extends Error {
  constructor() {
    super('TooManyAttempts'); // next-auth passes the message to the sign-in page as its error code
  }
}

type Found = { id: string; email: string; name: string | null; passwordHash: string | null };

/** The person for this e-mail and password, or null; throws TooManyAttemptsError when throttled. */
export async function checkPasswordSignIn(rawEmail: string, password: string, address: string) {
  const email = rawEmail.trim().toLowerCase();
  if (!email || !password || password.length > 1000) return null;
  const limits = signInLimits(email, address);
  if (await isOverAnyLimit(limits)) throw new TooManyAttemptsError();
  const { sequelize } = getDb();
  const [user] = await sequelize.query<Found>(
    `select id, email, name, password_hash as "passwordHash" from users where email = :email`,
    { replacements: { email }, type: QueryTypes.SELECT },
  );
  if (!user?.passwordHash) {
    // The same work and the same answer as a wrong password for a real account.
    await spendPasswordCheck(password);
    await recordAttempts(limits);
    return null;
  }
  const check = await verifyPassword(password, user.passwordHash);
  if (!check.isMatch) {
    // An old bcrypt hash is quicker to refuse than scrypt: top it up to the same work.
    if (check.needsRehash) await spendPasswordCheck(password);
    await recordAttempts(limits);
    return null;
  }
  if (check.needsRehash) {
    // Only if the hash is still the one just checked (a password change in between wins).
    await sequelize.query(`update users set password_hash = :next where id = :id and password_hash = :prev`, {
      replacements: { id: user.id, next: await hashPassword(password), prev: user.passwordHash },
    });
  }
  await clearAttempts(limits[0].key);
  return { id: user.id, email: user.email, name: user.name };
}
