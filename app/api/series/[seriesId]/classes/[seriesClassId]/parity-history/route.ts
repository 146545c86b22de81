// GET /api/series/:seriesId/classes/:seriesClassId/parity-history: each round's parity figures side by side
// with the rule changes between rounds, for the series' officials.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { loadParityHistory } from '@/lib/server/series/parity-history';

type P = { seriesId: string; seriesClassId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  const data = await loadParityHistory(
    actor,
    parseId(params.seriesId, 'series'),
    parseId(params.seriesClassId, 'series class'),
  );
  return Response.json({ data }, { headers: { 'Cache-Control': 'private, no-store' } });
});
