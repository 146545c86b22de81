// POST /api/events/:eventId/appeals: a party gives notice of appeal against a penalty of this meeting (fee through checkout).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { lodgeAppeal } from '@/lib/server/appeals/lodge-appeal';

export const POST = actorHandler<{ eventId: string }>(async (req, { actor, params }) => {
  return Response.json(
    { data: await lodgeAppeal(actor, parseId(params.eventId, 'event'), () => readJson(req)) },
    { status: 201 },
  );
});
