// POST /api/series/:seriesId/classes/:seriesClassId/race-numbers: the series secretary gives a boat its season race number (unique in the class).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { assignRaceNumber } from '@/lib/server/series/manage-series';

type P = { seriesId: string; seriesClassId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const data = await assignRaceNumber(
    actor,
    parseId(params.seriesId, 'series'),
    parseId(params.seriesClassId, 'series class'),
    () => readJson(req),
  );
  return Response.json({ data }, { status: 201 });
});
