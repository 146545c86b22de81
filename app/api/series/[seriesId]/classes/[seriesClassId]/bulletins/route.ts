// GET|POST /api/series/:seriesId/classes/:seriesClassId/bulletins: the class's technical bulletins (public);
// the series secretary publishes one, e-mailed to every entrant of the class.
import { actorHandler, publicHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listBulletins, publishBulletin } from '@/lib/server/series/bulletins';

type P = { seriesId: string; seriesClassId: string };

export const GET = publicHandler<P>(async (_req, { params }) => {
  const data = await listBulletins(parseId(params.seriesId, 'series'), parseId(params.seriesClassId, 'series class'));
  return Response.json({ data });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const data = await publishBulletin(
    actor,
    parseId(params.seriesId, 'series'),
    parseId(params.seriesClassId, 'series class'),
    () => readJson(req),
  );
  return Response.json({ data }, { status: 201 });
});
