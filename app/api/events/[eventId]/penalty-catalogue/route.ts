// GET|POST /api/events/:eventId/penalty-catalogue: the meeting's penalty catalogue (organiser and stewards); the organiser adds an item.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { addCatalogueItem, listPenaltyCatalogue } from '@/lib/server/penalties/penalty-catalogue';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listPenaltyCatalogue(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await addCatalogueItem(actor, parseId(params.eventId, 'event'), () => readJson(req)) },
    { status: 201 },
  );
});
