// GET|POST /api/events/:eventId/pump-catalogue: the meeting's impeller models and trims with their curves (anyone signed in reads); its organiser adds one.
import { actorHandler, readJson, withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listPumpCatalogue } from '@/lib/server/boats/list-pump-catalogue';
import { addPumpCatalogueEntry } from '@/lib/server/boats/add-pump-catalogue-entry';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listPumpCatalogue(actor, parseId(params.eventId, 'event')) });
});

// Permission before the body is read (addPumpCatalogueEntry checks it again).
export const POST = withPermission<P>('class.edit', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await addPumpCatalogueEntry(actor, eventId, () => readJson(req)) }, { status: 201 });
});
