import 'server-only';
import bcrypt from 'bcryptjs';
import { getDb } from '@/lib/db';
import { assertCan, type Actor } from '@/lib/auth/actor';
import { ChangePasswordInput } from '@/lib/validations/auth';

/** Sets a new password for the signed-in person (people invited by e-mail start without one). */
export async function changePassword(actor: Actor | null, raw: unknown) {
  assertCan(actor, 'account.view');
  const { password } = ChangePasswordInput.parse(raw);
  await getDb().models.User.update({ passwordHash: await bcrypt.hash(password, 10) }, { where: { id: actor.id } });
}
