// GET /api/reports/:publicId/csv: the published report's per-boat figures as CSV (strong ETag, 304 when unchanged).
import { createHash } from 'node:crypto';
import { publicHandler } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { notModified, strongEtag } from '@/lib/server/http/immutable-file';
import { findPublishedReport } from '@/lib/server/reports/manage-reports';
import { reportToCsv } from '@/lib/core/reports/report-csv';

const CSV_CACHE_CONTROL = 'public, max-age=3600';

export const GET = publicHandler<{ publicId: string }>(async (req, { params }) => {
  const report = await findPublishedReport(params.publicId);
  if (!report) throw new AppError('not_found', 404, 'No published report at this address.');
  // Cheap to make and the same for every request, so it is not stored. Unlike the stored PDF it is
  // made by the running code (a new column would change it), so caches revalidate hourly (a 304).
  const csv = reportToCsv(report);
  const etag = strongEtag(createHash('sha256').update(csv).digest('hex'));
  const unchanged = notModified(req, etag, CSV_CACHE_CONTROL);
  if (unchanged) return unchanged;
  return new Response(csv, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="parity-${report.inputs.classCode}-v${report.number}.csv"`,
      etag,
      'cache-control': CSV_CACHE_CONTROL,
      'x-content-type-options': 'nosniff',
    },
  });
});
