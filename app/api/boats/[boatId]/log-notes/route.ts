// POST /api/boats/:boatId/log-notes: the chief scrutineer or a steward of a meeting the boat is entered in adds a dated note to its logbook (append-only).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { addLogNote } from '@/lib/server/logbook/add-log-note';

// The body is read only after the permission check (addLogNote calls readInput then).
export const POST = actorHandler<{ boatId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await addLogNote(actor, params.boatId, () => readJson(req)) }, { status: 201 });
});
