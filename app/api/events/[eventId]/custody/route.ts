// GET|POST /api/events/:eventId/custody: the parts the officials hold at the meeting; take a part into custody.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listCustody, takeIntoCustody } from '@/lib/server/custody/manage-custody';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listCustody(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await takeIntoCustody(actor, parseId(params.eventId, 'event'), await readJson(req)) },
    { status: 201 },
  );
});
