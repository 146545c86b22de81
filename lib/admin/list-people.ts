import 'server-only';
import { getDb } from '@/lib/db';
import { assertCan, type Actor } from '@/lib/auth/actor';

/** Everyone with an account, for the site administrator. */
export async function listPeople(actor: Actor | null) {
  assertCan(actor, 'admin.manage_users');
  const users = await getDb().models.User.findAll({ order: [['createdAt', 'ASC']], attributes: ['id', 'name', 'email', 'isAdmin', 'createdAt'] });
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email, isAdmin: u.isAdmin, createdAt: u.createdAt.toISOString() }));
}
