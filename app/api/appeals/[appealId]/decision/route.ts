// POST /api/appeals/:appealId/decision: the appeal body confirms, amends or annuls the stewards' penalty (results amended; fee refunded or kept).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { decideAppeal } from '@/lib/server/appeals/decide-appeal';

export const POST = actorHandler<{ appealId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await decideAppeal(actor, params.appealId, () => readJson(req)) });
});
