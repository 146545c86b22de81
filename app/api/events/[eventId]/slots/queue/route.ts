// GET /api/events/:eventId/slots/queue: the dock's queue for a meeting day (?day=yyyy-mm-dd; default today in the meeting's zone).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { readDockQueue } from '@/lib/server/schedule/dock-queue';

type P = { eventId: string };

export const GET = withPermission<P>('inspection.board', async (req, { actor, params }) => {
  const queue = await readDockQueue(actor, parseId(params.eventId, 'event'), req.nextUrl.searchParams.get('day'));
  return Response.json({ data: queue }, { headers: { 'Cache-Control': 'no-store' } });
});
