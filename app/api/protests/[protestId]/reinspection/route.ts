// POST /api/protests/:protestId/reinspection: the stewards order a re-inspection of the protested boat (a task for the scrutineers).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { orderReinspection } from '@/lib/server/protests/order-reinspection';

export const POST = actorHandler<{ protestId: string }>(async (req, { actor, params }) => {
  return Response.json(
    { data: await orderReinspection(actor, params.protestId, await readJson(req)) },
    { status: 201 },
  );
});
