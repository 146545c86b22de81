// POST /api/events: a club organiser creates a race meeting.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { createEvent } from '@/lib/server/events/save-event';

export const POST = actorHandler(async (req, { actor }) => {
  return Response.json({ data: await createEvent(actor, await readJson(req)) }, { status: 201 });
});
