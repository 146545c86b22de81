// GET /api/appeals/:appealId: one appeal, for its parties, the meeting's stewards and organiser, and the appeal body.
import { actorHandler } from '@/lib/server/http/handler';
import { getAppeal } from '@/lib/server/appeals/get-appeal';

export const GET = actorHandler<{ appealId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await getAppeal(actor, params.appealId) });
});
