// GET /api/reports/:publicId/csv: the published report's per-boat figures as CSV.
import { publicHandler } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { findPublishedReport } from '@/lib/reports/manage-reports';
import { reportToCsv } from '@/lib/reports/report-csv';

export const GET = publicHandler<{ publicId: string }>(async (_req, { params }) => {
  const report = await findPublishedReport(params.publicId);
  if (!report) throw new AppError('not_found', 404, 'No published report at this address.');
  return new Response(reportToCsv(report), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="parity-${report.inputs.classCode}-v${report.number}.csv"`,
      'x-content-type-options': 'nosniff',
    },
  });
});
