// POST /api/events/:eventId/instruments/:instrumentId/checks: the chief scrutineer records today's check against a reference (a failed one takes the instrument out of use for the day).
import { readJson, withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { recordInstrumentCheck } from '@/lib/server/inspections/record-instrument-check';

type P = { eventId: string; instrumentId: string };

export const POST = withPermission<P>('instrument.manage', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  const instrumentId = parseId(params.instrumentId, 'instrument');
  const check = await recordInstrumentCheck(actor, eventId, instrumentId, await readJson(req));
  return Response.json({ data: check }, { status: 201 });
});
