import 'server-only';
import { after } from 'next/server';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { SignUpInput } from '@/lib/core/inputs/auth';
import { hashPassword } from '@/lib/server/auth/passwords';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { sendMail } from '@/lib/server/mail/send';
import { sendAddressProof } from './prove-address';
import { appUrl, serverEnv } from '@/lib/server/config/env';

// Self sign-up for entrants. The answer is the same whether or not the address already has an
// account (OWASP Authentication Cheat Sheet, "Authentication and Error Messages"): a new account is
// made with an unproven address and a confirmation link; the owner of an existing one is told by
// e-mail instead. The password is hashed in both cases, so the time taken tells nothing either.

export type SignUpAnswer = { email: string; next: 'confirm-address' };

export async function createAccount(raw: unknown, clientAddress: string): Promise<SignUpAnswer> {
  const perAddress = await recordAttempt(`signup:addr:${clientAddress}`, {
    limit: serverEnv().SIGN_UP_LIMIT_PER_HOUR,
    windowS: 3600,
  });
  if (!perAddress.allowed) {
    throw new AppError(
      'rate_limited',
      429,
      `Too many new accounts from this address: try again in ${Math.ceil(perAddress.retryAfterS / 60)} minutes.`,
      {
        retryAfterS: perAddress.retryAfterS,
      },
    );
  }
  const input = SignUpInput.parse(raw);
  const passwordHash = await hashPassword(input.password);
  const [created] = await getDb().sequelize.query<{ id: string }>(
    `insert into users (id, name, email, email_verified, password_hash, created_at, updated_at)
     values (gen_random_uuid(), :name, :email, null, :passwordHash, now(), now())
     on conflict (email) do nothing returning id`,
    { replacements: { name: input.name, email: input.email, passwordHash }, type: QueryTypes.SELECT },
  );
  // At most a few messages an hour to one address, whoever asks: no mailbox flooding.
  const perMailbox = await recordAttempt(`signup:mail:${input.email}`, { limit: 3, windowS: 3600 });
  if (perMailbox.allowed) {
    after(() =>
      (created
        ? sendAddressProof({ id: created.id, email: input.email, name: input.name })
        : tellOwner(input.email)
      ).catch((err) => console.error('[sign-up] mail not sent', err)),
    );
  }
  return { email: input.email, next: 'confirm-address' };
}

function tellOwner(email: string) {
  const base = appUrl();
  return sendMail({
    to: email,
    subject: 'Someone tried to create a Boreline account with your address',
    text: `Somebody (perhaps you) asked to create a Boreline account with this address, which already has one. Nothing was changed.\n\nTo sign in, use your password or ask for an e-mailed link: ${base}/sign-in\n\nIf it was not you, you need do nothing.`,
  });
}
