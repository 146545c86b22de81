// POST /api/events/:eventId/classes/:classId/rules/publish: freeze the draft as a numbered version.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { publishRules } from '@/lib/server/classes/rule-versions';

type P = { eventId: string; classId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const body = req.headers.get('content-length') === '0' ? {} : await readJson(req);
  const version = await publishRules(actor, parseId(params.eventId, 'event'), parseId(params.classId, 'class'), body);
  return Response.json({ data: version }, { status: 201 });
});
