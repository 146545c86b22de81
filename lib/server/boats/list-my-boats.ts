import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { toBoatView, type BoatView } from './boat-view';

/** The actor's boats, by name. */
export async function listMyBoats(actor: Actor | null): Promise<BoatView[]> {
  assertCan(actor, 'boat.manage_own');
  const boats = await getDb().models.Boat.findAll({
    where: { ownerId: actor.id },
    order: [
      ['name', 'ASC'],
      ['createdAt', 'ASC'],
    ],
  });
  return boats.map(toBoatView);
}
