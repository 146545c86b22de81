// GET|POST /api/events/:eventId/protests: the meeting's protests (all for stewards and organiser, else the caller's own); lodge one.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listEventProtests } from '@/lib/server/protests/list-event-protests';
import { lodgeProtest } from '@/lib/server/protests/lodge-protest';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listEventProtests(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await lodgeProtest(actor, parseId(params.eventId, 'event'), await readJson(req)) },
    { status: 201 },
  );
});
