// POST /api/events/:eventId/classes/:classId/rules/publish: freeze the draft as a numbered version.
import { actorHandler, readJson } from '@/lib/http/handler';
import { parseId } from '@/lib/http/ids';
import { publishRules } from '@/lib/classes/rule-versions';

type P = { eventId: string; classId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const body = req.headers.get('content-length') === '0' ? {} : await readJson(req);
  const version = await publishRules(actor, parseId(params.eventId, 'event'), parseId(params.classId, 'class'), body);
  return Response.json({ data: version }, { status: 201 });
});
