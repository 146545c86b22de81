import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { UpdateBoatInput } from '@/lib/core/inputs/boats';
import { findOwnBoat, toBoatView, type BoatView } from './boat-view';

/** Changes the actor's own boat's declaration; only the fields sent change. */
export async function updateBoat(actor: Actor | null, boatId: string, raw: unknown): Promise<BoatView> {
  assertCan(actor, 'boat.manage_own');
  const boat = await findOwnBoat(actor, boatId);
  const changes = UpdateBoatInput.parse(raw);
  await boat.update(changes);
  return toBoatView(boat);
}
