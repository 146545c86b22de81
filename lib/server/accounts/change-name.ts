import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { ChangeNameInput } from '@/lib/core/inputs/auth';

/** The signed-in person sets the name others see (greetings, staff lists, records). Own account only. */
export async function changeName(actor: Actor | null, raw: unknown): Promise<{ name: string }> {
  assertCan(actor, 'account.view');
  const { name } = ChangeNameInput.parse(raw);
  await getDb().models.User.update({ name }, { where: { id: actor.id } });
  return { name };
}
