// POST /api/series: an organiser (or the site administrator) starts a series and becomes its secretary.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { createSeries } from '@/lib/server/series/create-series';

export const POST = actorHandler(async (req, { actor }) => {
  return Response.json({ data: await createSeries(actor, () => readJson(req)) }, { status: 201 });
});
