// GET|POST /api/events/:eventId/instruments: the meeting’s instruments in service with the U each brings; the organiser or chief scrutineer adds one.
import { actorHandler, readJson, withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listInstruments } from '@/lib/server/inspections/list-instruments';
import { addInstrument } from '@/lib/server/inspections/add-instrument';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listInstruments(actor, parseId(params.eventId, 'event')) });
});

// Permission before the body is read (addInstrument checks it again).
export const POST = withPermission<P>('instrument.manage', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await addInstrument(actor, eventId, await readJson(req)) }, { status: 201 });
});
