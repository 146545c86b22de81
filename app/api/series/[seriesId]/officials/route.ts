// POST /api/series/:seriesId/officials: the series secretary appoints a secretary or steward of the series.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { appointSeriesOfficial } from '@/lib/server/series/manage-series';

export const POST = actorHandler<{ seriesId: string }>(async (req, { actor, params }) => {
  const data = await appointSeriesOfficial(actor, parseId(params.seriesId, 'series'), () => readJson(req));
  return Response.json({ data }, { status: 201 });
});
