// GET|POST /api/events/:eventId/classes: list the meeting's classes, or create one (optionally a copy).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { createClass, listEventClasses } from '@/lib/server/classes/manage-classes';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listEventClasses(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await createClass(actor, parseId(params.eventId, 'event'), await readJson(req)) },
    { status: 201 },
  );
});
