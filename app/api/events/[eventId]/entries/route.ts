// GET /api/events/:eventId/entries: every entry of the meeting, for its officials.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listEventEntries } from '@/lib/server/entries/list-event-entries';

export const GET = actorHandler<{ eventId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await listEventEntries(actor, parseId(params.eventId, 'event')) });
});
