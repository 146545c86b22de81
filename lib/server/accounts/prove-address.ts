import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { sendMail, linkMail } from '@/lib/server/mail/send';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { verifyPassword } from '@/lib/server/auth/passwords';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { appUrl } from '@/lib/server/config/env';

// A new account's address is unproven until its owner follows a one-time link sent to it and gives
// the password chosen at sign-up: the link shows the mailbox, the password shows it is the same
// person who signed up. Until then no staff role, invitation or fee is tied to the account.

const PROOF_HOURS = 48;
const RESENDS_PER_HOUR = 3;
const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/** Makes a one-time link for the account's current address and mails it. */
export async function sendAddressProof(user: { id: string; email: string; name: string | null }) {
  const token = randomBytes(32).toString('base64url');
  await getDb().sequelize.query(
    `insert into address_proofs (user_id, email, token_hash, expires_at) values (:userId, :email, :tokenHash, now() + make_interval(hours => :hours))`,
    { replacements: { userId: user.id, email: user.email, tokenHash: hashToken(token), hours: PROOF_HOURS } },
  );
  const base = appUrl();
  await sendMail(
    linkMail({
      to: user.email,
      subject: 'Confirm your e-mail address for Boreline',
      intro: `${user.name ?? 'Hello'}: an entrant account was created on Boreline with this address. Confirm that the address is yours to enter classes, pay fees and take on staff roles.`,
      linkLabel: 'Confirm my address',
      url: `${base}/confirm-address/${token}`,
      outro: `The link works once and expires in ${PROOF_HOURS} hours. If you did not create this account, ignore this message: nothing is tied to your address until it is confirmed, and signing in with an e-mailed link makes the account yours.`,
    }),
  );
}

/** What the confirmation page shows for a token (nothing for an unknown one). */
export async function findAddressProof(token: string) {
  if (!token || token.length > 100) return null;
  const [row] = await getDb().sequelize.query<{ email: string; isUsable: boolean }>(
    `select p.email, (p.used_at is null and p.expires_at > now() and u.email = p.email and u.email_verified is null) as "isUsable"
       from address_proofs p join users u on u.id = p.user_id where p.token_hash = :hash`,
    { replacements: { hash: hashToken(token) }, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

/**
 * Uses a proof once: the token must be live and the password the account's own. Returns the person
 * (to sign them in) or null. Wrong passwords are counted per token, so a leaked link cannot be used
 * to guess the password.
 */
export async function proveAddress(token: string, password: string) {
  if (!token || token.length > 100 || !password) return null;
  const tokenHash = hashToken(token);
  const attempts = await recordAttempt(`proof:${tokenHash}`, { limit: 10, windowS: PROOF_HOURS * 3600 });
  if (!attempts.allowed) return null;
  const { sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{
      proofId: string;
      id: string;
      email: string;
      name: string | null;
      passwordHash: string | null;
    }>(
      `select p.id as "proofId", u.id, u.email, u.name, u.password_hash as "passwordHash"
         from address_proofs p join users u on u.id = p.user_id
        where p.token_hash = :tokenHash and p.used_at is null and p.expires_at > now() and u.email = p.email and u.suspended_at is null
        for update of p, u`,
      { replacements: { tokenHash }, type: QueryTypes.SELECT, transaction },
    );
    if (!row || !(await verifyPassword(password, row.passwordHash)).isMatch) return null;
    await sequelize.query(`update address_proofs set used_at = now() where id = :id`, {
      replacements: { id: row.proofId },
      transaction,
    });
    await sequelize.query(`update users set email_verified = coalesce(email_verified, now()) where id = :id`, {
      replacements: { id: row.id },
      transaction,
    });
    return { id: row.id, email: row.email, name: row.name };
  });
}

/** The signed-in person asks for a new link (a few an hour). */
export async function resendAddressProof(actor: Actor | null) {
  assertCan(actor, 'account.view');
  if (actor.isAddressProven) throw new AppError('already_proven', 409, 'Your address is already confirmed.');
  const throttle = await recordAttempt(`proof-resend:${actor.id}`, { limit: RESENDS_PER_HOUR, windowS: 3600 });
  if (!throttle.allowed)
    throw new AppError(
      'too_many_requests',
      429,
      `We have sent several links in the last hour: wait ${Math.ceil(throttle.retryAfterS / 60)} minutes, and check your spam folder.`,
    );
  await sendAddressProof({ id: actor.id, email: actor.email, name: actor.name });
  return { email: actor.email };
}

/** Fees and staff roles need a proven address. */
export function assertAddressProven(actor: Actor) {
  if (!actor.isAddressProven) {
    throw new AppError(
      'address_unproven',
      403,
      'Confirm your e-mail address first: follow the link we sent you (My account sends a new one).',
    );
  }
}
