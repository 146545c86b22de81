// POST|GET /api/events/:eventId/reinspections: ask for entries to be inspected again; list the tasks (?open=1 for open only).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { assertCan } from '@/lib/server/auth/actor';
import { requestReinspection } from '@/lib/server/inspections/request-reinspection';
import { listReinspections } from '@/lib/server/inspections/list-reinspections';

type P = { eventId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'inspection.assign_reinspection', { eventId }); // before reading a body at all
  return Response.json({ data: await requestReinspection(actor, eventId, await readJson(req)) }, { status: 201 });
});

export const GET = actorHandler<P>(async (req, { actor, params }) => {
  const openOnly = req.nextUrl.searchParams.get('open') === '1';
  return Response.json({ data: await listReinspections(actor, parseId(params.eventId, 'event'), { openOnly }) });
});
