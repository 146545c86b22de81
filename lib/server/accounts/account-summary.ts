import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';

/** What the account page shows about the person's own sign-in (never the hash itself). */
export async function getAccountSummary(actor: Actor | null) {
  assertCan(actor, 'account.view');
  const [row] = await getDb().sequelize.query<{ hasPassword: boolean; addressProvenAt: Date | null }>(
    `select password_hash is not null as "hasPassword", email_verified as "addressProvenAt" from users where id = :id`,
    { replacements: { id: actor.id }, type: QueryTypes.SELECT },
  );
  return {
    hasPassword: !!row?.hasPassword,
    addressProvenAt: row?.addressProvenAt ? new Date(row.addressProvenAt).toISOString() : null,
  };
}
