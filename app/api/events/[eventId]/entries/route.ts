// GET /api/events/:eventId/entries: every entry of the meeting, for its officials.
import { actorHandler } from '@/lib/http/handler';
import { parseId } from '@/lib/http/ids';
import { listEventEntries } from '@/lib/entries/list-event-entries';

export const GET = actorHandler<{ eventId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await listEventEntries(actor, parseId(params.eventId, 'event')) });
});
