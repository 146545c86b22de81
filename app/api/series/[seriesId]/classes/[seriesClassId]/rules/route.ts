// POST /api/series/:seriesId/classes/:seriesClassId/rules: the series secretary publishes the class's next rules version (append-only, with its effective date).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { publishSeriesRules } from '@/lib/server/series/manage-series';

type P = { seriesId: string; seriesClassId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const data = await publishSeriesRules(
    actor,
    parseId(params.seriesId, 'series'),
    parseId(params.seriesClassId, 'series class'),
    () => readJson(req),
  );
  return Response.json({ data }, { status: 201 });
});
