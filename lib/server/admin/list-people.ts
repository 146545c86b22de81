import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { toPersonView, type PersonView } from './person-view';
import { appealBodyMemberIds } from './set-appeal-body';

/** Everyone with an account, for the site administrator, with who sits on the appeal body. */
export async function listPeople(actor: Actor | null): Promise<PersonView[]> {
  assertCan(actor, 'admin.manage_users');
  const users = await getDb().models.User.findAll({
    order: [['createdAt', 'ASC']],
    attributes: ['id', 'name', 'email', 'isAdmin', 'createdAt', 'suspendedAt', 'suspendedReason'],
  });
  const appealBody = await appealBodyMemberIds();
  return users.map((u) => toPersonView(u, appealBody.has(u.id)));
}
