// PUT /api/entries/:entryId/masses: the entrant (or the meeting's organiser) declares the entry's crew and fuel masses for the predicted runs.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { declareEntryMasses } from '@/lib/server/timing/declared-masses';

type P = { entryId: string };

/** A body of two numbers: anything past 1 KB is refused before it is read whole (413). */
const MAX_BODY_BYTES = 1024;

// The body is read only after the entrant-or-organiser check (declareEntryMasses calls readInput then).
export const PUT = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await declareEntryMasses(actor, params.entryId, () => readJson(req, MAX_BODY_BYTES)) });
});
