// POST /api/protests/:protestId/accept: the stewards accept a lodged protest for a hearing.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { acceptOrRejectProtest } from '@/lib/server/protests/accept-or-reject-protest';

export const POST = actorHandler<{ protestId: string }>(async (req, { actor, params }) => {
  const body = req.headers.get('content-type') ? await readJson(req) : {}; // the note is optional
  return Response.json({ data: await acceptOrRejectProtest(actor, params.protestId, 'accept', body) });
});
