// GET /api/entries/:entryId/crew: the entry's people and gear with what is not in order today (the entrant, or officials of its meeting).
// PUT /api/entries/:entryId/crew: the entrant replaces their entry's people and gear.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { getEntryCrew } from '@/lib/server/crew/get-entry-crew';
import { saveEntryCrew } from '@/lib/server/crew/save-entry-crew';

export const GET = actorHandler<{ entryId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await getEntryCrew(actor, params.entryId) });
});

// The body is read only after the ownership check (saveEntryCrew calls readInput then); 64 KB holds the largest crew.
export const PUT = actorHandler<{ entryId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await saveEntryCrew(actor, params.entryId, () => readJson(req, 64 * 1024)) });
});
