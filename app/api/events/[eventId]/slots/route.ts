// GET|POST /api/events/:eventId/slots: the meeting's scrutineering slots with who is booked; open a slot (chief scrutineer).
import { actorHandler, readJson, withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { openSlot } from '@/lib/server/schedule/open-slot';
import { listSlots } from '@/lib/server/schedule/list-slots';

type P = { eventId: string };

// Permission first (withPermission), then the body.
export const POST = withPermission<P>('schedule.manage', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await openSlot(actor, eventId, await readJson(req)) }, { status: 201 });
});

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listSlots(actor, parseId(params.eventId, 'event')) });
});
