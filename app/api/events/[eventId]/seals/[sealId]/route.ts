// GET /api/events/:eventId/seals/:sealId: one seal's whole history across meetings (404 for a seal this meeting has no part in).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { loadSealHistory } from '@/lib/server/seals/seal-register';

type P = { eventId: string; sealId: string };

export const GET = withPermission<P>('inspection.board', async (_req, { actor, params }) => {
  return Response.json({
    data: await loadSealHistory(actor, parseId(params.eventId, 'event'), parseId(params.sealId, 'seal')),
  });
});
