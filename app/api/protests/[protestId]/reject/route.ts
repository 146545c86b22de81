// POST /api/protests/:protestId/reject: the stewards reject a protest as invalid (out of time, no fee, wrong form) with reasons.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { acceptOrRejectProtest } from '@/lib/server/protests/accept-or-reject-protest';

export const POST = actorHandler<{ protestId: string }>(async (req, { actor, params }) => {
  const body = await readJson(req);
  return Response.json({ data: await acceptOrRejectProtest(actor, params.protestId, 'reject', body) });
});
