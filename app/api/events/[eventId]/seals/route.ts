// GET /api/events/:eventId/seals?q=: the meeting's seal register, each seal with its current state (q: part of a number).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listSeals } from '@/lib/server/seals/seal-register';

type P = { eventId: string };

export const GET = withPermission<P>('inspection.board', async (req, { actor, params }) => {
  const q = req.nextUrl.searchParams.get('q') ?? '';
  return Response.json({ data: await listSeals(actor, parseId(params.eventId, 'event'), { q }) });
});
