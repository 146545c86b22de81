// GET /api/series/:seriesId/classes/:seriesClassId/standings: standings after each round (public, as results).
import { publicHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { loadStandings } from '@/lib/server/series/standings';

type P = { seriesId: string; seriesClassId: string };

export const GET = publicHandler<P>(async (_req, { params }) => {
  const data = await loadStandings(parseId(params.seriesId, 'series'), parseId(params.seriesClassId, 'series class'));
  return Response.json({ data });
});
