// GET /api/events/open: meetings taking entries, with their classes and published rules, for the entry form.
import { actorHandler } from '@/lib/server/http/handler';
import { listOpenEvents } from '@/lib/server/entries/list-open-events';

export const dynamic = 'force-dynamic';

export const GET = actorHandler(async (_req, { actor }) => {
  return Response.json({ data: await listOpenEvents(actor) });
});
