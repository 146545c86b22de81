// PUT /api/boats/:boatId/performance: the owner declares the boat's engine curve, pump characteristic and suction data (a new declaration version).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { declarePerformance } from '@/lib/server/boats/declare-performance';

type P = { boatId: string };

// The body is read only after the owner check (updateBoat calls readInput then).
export const PUT = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await declarePerformance(actor, params.boatId, () => readJson(req)) });
});
