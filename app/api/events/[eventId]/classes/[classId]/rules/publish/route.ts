// POST /api/events/:eventId/classes/:classId/rules/publish: freeze the draft as a numbered version.
import { actorHandler, readOptionalJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { publishRules } from '@/lib/server/classes/rule-versions';

type P = { eventId: string; classId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const body = await readOptionalJson(req);
  const version = await publishRules(actor, parseId(params.eventId, 'event'), parseId(params.classId, 'class'), body);
  return Response.json({ data: version }, { status: 201 });
});
