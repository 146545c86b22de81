// GET|POST /api/events/:eventId/instruments: the meeting’s instruments in service with the U each brings; the organiser or chief scrutineer adds one.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listInstruments } from '@/lib/server/inspections/list-instruments';
import { addInstrument } from '@/lib/server/inspections/add-instrument';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listInstruments(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await addInstrument(actor, parseId(params.eventId, 'event'), await readJson(req)) },
    { status: 201 },
  );
});
