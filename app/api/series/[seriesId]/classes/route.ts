// POST /api/series/:seriesId/classes: the series secretary adds a class with its points table and dropped rounds.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { createSeriesClass } from '@/lib/server/series/manage-series';

export const POST = actorHandler<{ seriesId: string }>(async (req, { actor, params }) => {
  const data = await createSeriesClass(actor, parseId(params.seriesId, 'series'), () => readJson(req));
  return Response.json({ data }, { status: 201 });
});
