// GET /api/reports/:publicId/pdf: the published report as a PDF, rendered once and then served from storage.
import { publicHandler } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { IMMUTABLE_CACHE_CONTROL, notModified, strongEtag } from '@/lib/server/http/immutable-file';
import { ensureReportPdf, findReportPdfHead, readReportPdf } from '@/lib/server/reports/report-pdf-file';

export const GET = publicHandler<{ publicId: string }>(async (req, { params }) => {
  const head = await findReportPdfHead(params.publicId);
  if (!head) throw new AppError('not_found', 404, 'No published report at this address.');
  const pdf = head.pdf ?? (await ensureReportPdf(params.publicId, head.reportId));
  const etag = strongEtag(pdf.sha256);
  const unchanged = notModified(req, etag);
  if (unchanged) return unchanged;
  const bytes = await readReportPdf(pdf);
  return new Response(new Uint8Array(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="parity-${head.classCode}-v${head.number}.pdf"`,
      etag,
      'cache-control': IMMUTABLE_CACHE_CONTROL,
      'x-content-type-options': 'nosniff',
    },
  });
});
