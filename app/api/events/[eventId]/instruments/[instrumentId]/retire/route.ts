// POST /api/events/:eventId/instruments/:instrumentId/retire: takes an instrument out of service (kept in the list as retired).
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { retireInstrument } from '@/lib/server/inspections/retire-instrument';

type P = { eventId: string; instrumentId: string };

export const POST = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({
    data: await retireInstrument(actor, parseId(params.eventId, 'event'), parseId(params.instrumentId, 'instrument')),
  });
});
