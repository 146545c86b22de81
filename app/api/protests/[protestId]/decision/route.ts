// POST /api/protests/:protestId/decision: the stewards decide (upheld refunds the fee once; dismissed and withdrawn keep it).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { decideProtest } from '@/lib/server/protests/decide-protest';

export const POST = actorHandler<{ protestId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await decideProtest(actor, params.protestId, await readJson(req)) });
});
