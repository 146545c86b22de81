import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { CreateBoatInput } from '@/lib/core/inputs/boats';
import { toBoatView, type BoatView } from './boat-view';

/** Registers a boat for the actor with its declared specification (figures stored in mm and kW). */
export async function createBoat(actor: Actor | null, raw: unknown): Promise<BoatView> {
  assertCan(actor, 'boat.manage_own');
  const input = CreateBoatInput.parse(raw);
  const boat = await getDb().models.Boat.create({ ...input, ownerId: actor.id });
  return toBoatView(boat);
}
