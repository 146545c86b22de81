// GET /api/reports/:publicId/pdf: the published report as a PDF.
import { publicHandler } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { findPublishedReport } from '@/lib/reports/manage-reports';
import { buildReportPdf } from '@/lib/reports/report-pdf';
import { getDb } from '@/lib/db';

export const GET = publicHandler<{ publicId: string }>(async (_req, { params }) => {
  const report = await findPublishedReport(params.publicId);
  if (!report) throw new AppError('not_found', 404, 'No published report at this address.');
  const timeZone = (await getDb().models.Event.findByPk(report.eventId, { attributes: ['timeZone'] }))?.timeZone ?? 'UTC';
  const pdf = await buildReportPdf(report, timeZone);
  return new Response(Buffer.from(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="parity-${report.inputs.classCode}-v${report.number}.pdf"`,
      'cache-control': 'public, max-age=300',
      'x-content-type-options': 'nosniff',
    },
  });
});
