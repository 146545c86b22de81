// POST /api/events/:eventId/classes/:classId/report/publish: freeze the draft as the next numbered version.
import { actorHandler, readOptionalJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { after } from 'next/server';
import { publishReport } from '@/lib/server/reports/manage-reports';
import { ensureReportPdf } from '@/lib/server/reports/report-pdf-file';

type P = { eventId: string; classId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const body = await readOptionalJson(req);
  const report = await publishReport(actor, parseId(params.eventId, 'event'), parseId(params.classId, 'class'), body);
  // Render and store the version's PDF once, after the answer; the first download then reads storage.
  after(() =>
    ensureReportPdf(report.publicId, report.id).catch((err) =>
      console.error('[boreline] report PDF not stored after publishing', err),
    ),
  );
  return Response.json({ data: { id: report.id, publicId: report.publicId, number: report.number } }, { status: 201 });
});
