import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { reissueTag, tagUrl } from '@/lib/server/tags/tokens';
import { findOwnBoat } from './boat-view';

/** The owner replaces a lost or damaged sticker: the old token is retired and stops working. */
export async function reissueBoatTag(actor: Actor | null, boatId: string): Promise<{ token: string; url: string }> {
  assertCan(actor, 'boat.manage_own');
  const boat = await findOwnBoat(actor, boatId);
  const token = await reissueTag(boat.id);
  return { token, url: tagUrl(token) };
}
