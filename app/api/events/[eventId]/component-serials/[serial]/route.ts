// GET /api/events/:eventId/component-serials/:serial: the boats entered here that carry a component with this serial (the dock's lookup).
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { findBoatsBySerial } from '@/lib/server/components/find-boat-by-serial';

export const GET = actorHandler<{ eventId: string; serial: string }>(async (_req, { actor, params }) => {
  // Next has already percent-decoded the segment; it is only ever compared as text (never decoded again).
  return Response.json({ data: await findBoatsBySerial(actor, parseId(params.eventId, 'event'), params.serial) });
});
