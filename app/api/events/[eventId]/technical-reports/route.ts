// GET|POST /api/events/:eventId/technical-reports: reports to the stewards without a protest (delegates and stewards read; a scrutineer or the chief scrutineer files one).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { fileTechnicalReport, listTechnicalReports } from '@/lib/server/penalties/technical-reports';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listTechnicalReports(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await fileTechnicalReport(actor, parseId(params.eventId, 'event'), () => readJson(req)) },
    { status: 201 },
  );
});
