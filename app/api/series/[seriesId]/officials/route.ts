// GET /api/series/:seriesId/officials: the series' officials and open invitations (its secretary only).
// POST /api/series/:seriesId/officials: the secretary invites a person by e-mail to be a secretary or steward of
// the series; the answer is the same whether or not the address has an account.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { appointSeriesOfficial } from '@/lib/server/series/manage-series';
import { listSeriesOfficials } from '@/lib/server/series/list-series-officials';

export const GET = actorHandler<{ seriesId: string }>(async (_req, { actor, params }) => {
  const data = await listSeriesOfficials(actor, parseId(params.seriesId, 'series'));
  return Response.json({ data });
});

export const POST = actorHandler<{ seriesId: string }>(async (req, { actor, params }) => {
  const data = await appointSeriesOfficial(actor, parseId(params.seriesId, 'series'), () => readJson(req));
  return Response.json({ data }, { status: 201 });
});
