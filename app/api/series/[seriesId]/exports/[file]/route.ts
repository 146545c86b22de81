// GET /api/series/:seriesId/exports/:kind.(csv|pdf): standings, penalties or appeals for the governing body.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { exportSeries } from '@/lib/server/series/exports';

type P = { seriesId: string; file: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  const [kind = '', format = ''] = params.file.split('.', 2);
  const out = await exportSeries(actor, parseId(params.seriesId, 'series'), kind, format);
  return new Response(out.body as BodyInit, {
    headers: {
      'Content-Type': out.contentType,
      'Content-Disposition': `attachment; filename="${out.filename}"`,
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
});
