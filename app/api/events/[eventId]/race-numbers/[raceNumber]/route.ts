// GET /api/events/:eventId/race-numbers/:raceNumber: the boat card by typed race number (when a tag will not scan).
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { wantedEntry } from '@/lib/server/inspections/choose-dock-entry';
import { findEntryByRaceNumber } from '@/lib/server/inspections/find-entry-by-race-number';

export const GET = actorHandler<{ eventId: string; raceNumber: string }>(async (req, { actor, params }) => {
  return Response.json({
    data: await findEntryByRaceNumber(actor, parseId(params.eventId, 'event'), params.raceNumber, wantedEntry(req)),
  });
});
