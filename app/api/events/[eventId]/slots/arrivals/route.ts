// POST /api/events/:eventId/slots/arrivals: check a boat in at the dock (booked or walk-in); the phone's key makes a retry harmless.
import { withPermission, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { recordArrival } from '@/lib/server/schedule/record-arrival';

type P = { eventId: string };

export const POST = withPermission<P>('inspection.record', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await recordArrival(actor, eventId, await readJson(req)) }, { status: 201 });
});
