// POST /api/boats/:boatId/tag: the owner reissues the boat's QR tag; the old sticker stops working.
import { actorHandler } from '@/lib/server/http/handler';
import { reissueBoatTag } from '@/lib/server/boats/reissue-boat-tag';

export const POST = actorHandler<{ boatId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await reissueBoatTag(actor, params.boatId) }, { status: 201 });
});
