import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { SuspendPersonInput } from '@/lib/core/inputs/admin';
import { endAllSessions } from '@/lib/server/auth/sessions';
import { toPersonView, type PersonView } from './person-view';
import { appealBodyMemberIds } from './set-appeal-body';

async function findPerson(id: string) {
  const user = await getDb().models.User.findByPk(id);
  if (!user) throw new AppError('not_found', 404, 'No such person.');
  return user;
}

/**
 * The site administrator suspends an account: the person cannot sign in (by password, link or
 * invitation), and a session already open stops working on its next request, because roles are
 * read from the database per request and its session version is raised (lib/server/auth/actor.ts). Their
 * records stay as they are.
 */
export async function suspendPerson(actor: Actor | null, userId: string, raw: unknown): Promise<PersonView> {
  assertCan(actor, 'admin.manage_users');
  const id = parseId(userId, 'person');
  const { reason } = SuspendPersonInput.parse(raw);
  if (id === actor.id)
    throw new AppError('own_account', 409, 'You cannot suspend your own account: ask another administrator.');
  const user = await findPerson(id);
  if (user.suspendedAt)
    throw new AppError('already_suspended', 409, `${user.name ?? user.email} is already suspended.`);
  await user.update({ suspendedAt: new Date(), suspendedReason: reason, suspendedById: actor.id });
  // Sessions end for good: lifting the suspension later does not bring them back.
  await endAllSessions(user.id);
  return toPersonView(user, (await appealBodyMemberIds([user.id])).has(user.id));
}

/** Lifts a suspension: the person can sign in again (sessions ended by the suspension stay ended). */
export async function reinstatePerson(actor: Actor | null, userId: string): Promise<PersonView> {
  assertCan(actor, 'admin.manage_users');
  const user = await findPerson(parseId(userId, 'person'));
  if (!user.suspendedAt) throw new AppError('not_suspended', 409, `${user.name ?? user.email} is not suspended.`);
  await user.update({ suspendedAt: null, suspendedReason: null, suspendedById: null });
  return toPersonView(user, (await appealBodyMemberIds([user.id])).has(user.id));
}
