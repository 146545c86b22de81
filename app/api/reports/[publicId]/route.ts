// GET /api/reports/:publicId: a published parity report (public; drafts are never reachable here).
import { publicHandler } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { findPublishedReport } from '@/lib/server/reports/manage-reports';

export const GET = publicHandler<{ publicId: string }>(async (_req, { params }) => {
  const report = await findPublishedReport(params.publicId);
  if (!report) throw new AppError('not_found', 404, 'No published report at this address.');
  return Response.json({ data: report });
});
