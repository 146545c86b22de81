// POST /api/events/:eventId/start-list/decisions: the organiser lets a held boat start, or holds a clear one, on a meeting day, with the reason.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { assertCan } from '@/lib/server/auth/actor';
import { recordStartDecision } from '@/lib/server/start-list/start-list';

type P = { eventId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'start_list.decide', { eventId }); // before reading a body at all
  const decision = await recordStartDecision(actor, eventId, await readJson(req, 4 * 1024));
  return Response.json({ data: decision }, { status: 201 });
});
