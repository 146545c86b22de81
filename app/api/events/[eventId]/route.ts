// GET|PATCH /api/events/:eventId: the meeting's details, read or edited by its organiser.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { getEventForOrganiser, updateEvent } from '@/lib/server/events/save-event';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await getEventForOrganiser(actor, parseId(params.eventId, 'event')) });
});

export const PATCH = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await updateEvent(actor, parseId(params.eventId, 'event'), await readJson(req)) });
});
