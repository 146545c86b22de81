// GET /api/events/:eventId/classes/:classId/clock: the class's predicted runs (fixed-power model) against its run times.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { gatherClockSection } from '@/lib/server/timing/gather-clock-section';

type P = { eventId: string; classId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await gatherClockSection(actor, eventId, parseId(params.classId, 'class')) });
});
