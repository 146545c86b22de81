// GET /api/protests/:protestId: one protest with its evidence (hash-checked), for its parties and the meeting's officials only.
import { actorHandler } from '@/lib/server/http/handler';
import { getProtest } from '@/lib/server/protests/get-protest';

export const GET = actorHandler<{ protestId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await getProtest(actor, params.protestId) });
});
