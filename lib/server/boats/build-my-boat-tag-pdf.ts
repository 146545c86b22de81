import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { buildSingleTagPdf } from '@/lib/core/tags/tag-sheet';
import { getMyBoat } from './get-my-boat';

/** One printable tag for the owner's boat: the current token, with the next live entry's number and class. */
export async function buildMyBoatTagPdf(
  actor: Actor | null,
  boatId: string,
): Promise<{ pdf: Uint8Array; fileName: string }> {
  assertCan(actor, 'boat.manage_own');
  const { boat, tag, entries } = await getMyBoat(actor, boatId);
  const next = entries[0];
  const pdf = await buildSingleTagPdf({
    tagUrl: tag.url,
    raceNumber: next ? String(next.raceNumber) : '',
    boatName: boat.name,
    className: next ? `${next.classCode} ${next.className}` : '',
  });
  const slug =
    boat.name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'boat';
  return { pdf, fileName: `${slug}-tag.pdf` };
}
