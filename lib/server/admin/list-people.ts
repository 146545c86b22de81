import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { toPersonView, type PersonView } from './person-view';

/** Everyone with an account, for the site administrator. */
export async function listPeople(actor: Actor | null): Promise<PersonView[]> {
  assertCan(actor, 'admin.manage_users');
  const users = await getDb().models.User.findAll({
    order: [['createdAt', 'ASC']],
    attributes: ['id', 'name', 'email', 'isAdmin', 'createdAt', 'suspendedAt', 'suspendedReason'],
  });
  return users.map(toPersonView);
}
