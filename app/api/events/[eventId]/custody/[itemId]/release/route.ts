// POST /api/events/:eventId/custody/:itemId/release: hand a held part back (to whom, with a note), once.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { releaseFromCustody } from '@/lib/server/custody/manage-custody';

type P = { eventId: string; itemId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({
    data: await releaseFromCustody(actor, parseId(params.eventId, 'event'), params.itemId, await readJson(req)),
  });
});
