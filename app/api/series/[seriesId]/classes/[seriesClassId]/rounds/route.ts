// POST /api/series/:seriesId/classes/:seriesClassId/rounds: the series secretary makes a meeting's class (of one of the series' organisations) a round.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { linkRound } from '@/lib/server/series/manage-series';

type P = { seriesId: string; seriesClassId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const data = await linkRound(
    actor,
    parseId(params.seriesId, 'series'),
    parseId(params.seriesClassId, 'series class'),
    () => readJson(req),
  );
  return Response.json({ data }, { status: 201 });
});
