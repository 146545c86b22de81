// GET /api/series/:seriesId: the series, its classes, their rounds and rule versions (public).
import { publicHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { getSeries } from '@/lib/server/series/get-series';

export const GET = publicHandler<{ seriesId: string }>(async (_req, { params }) => {
  return Response.json({ data: await getSeries(parseId(params.seriesId, 'series')) });
});
