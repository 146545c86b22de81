// POST /api/events/:eventId/classes/:classId/follow-series: the organiser makes a round's class follow the series rules in force.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { followSeriesRules } from '@/lib/server/series/follow-series-rules';

type P = { eventId: string; classId: string };

export const POST = actorHandler<P>(async (_req, { actor, params }) => {
  const data = await followSeriesRules(actor, parseId(params.eventId, 'event'), parseId(params.classId, 'class'));
  return Response.json({ data }, { status: 201 });
});
