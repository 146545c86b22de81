// POST /api/events/:eventId/entries/:entryId/cancel: the organiser cancels an entry (refunding a paid fee).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { cancelEntry } from '@/lib/server/entries/cancel-entry';

export const POST = actorHandler<{ eventId: string; entryId: string }>(async (req, { actor, params }) => {
  const result = await cancelEntry(
    actor,
    parseId(params.eventId, 'event'),
    parseId(params.entryId, 'entry'),
    await readJson(req),
  );
  return Response.json({ data: result });
});
