// GET /api/events/:eventId/classes/:classId/report: the live draft parity report (organiser), plus published versions.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { computeDraftReport, listReportVersions } from '@/lib/server/reports/manage-reports';

type P = { eventId: string; classId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  const classId = parseId(params.classId, 'class');
  const [draft, versions] = await Promise.all([
    computeDraftReport(actor, eventId, classId),
    listReportVersions(actor, eventId, classId),
  ]);
  return Response.json({ data: { draft, versions } });
});
