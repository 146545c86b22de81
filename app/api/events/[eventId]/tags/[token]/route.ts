// GET /api/events/:eventId/tags/:token: the boat card for a scanned tag (404 unknown, 410 replaced, 404 not entered here).
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { wantedEntry } from '@/lib/server/inspections/choose-dock-entry';
import { findBoatByTag } from '@/lib/server/inspections/find-boat-by-tag';

export const GET = actorHandler<{ eventId: string; token: string }>(async (req, { actor, params }) => {
  // Next has already percent-decoded the segment once; decoding it again turned "%25E0%25A4" into a
  // URIError (a 500). Whatever arrives is only ever matched against the token pattern (404 otherwise).
  return Response.json({
    data: await findBoatByTag(actor, parseId(params.eventId, 'event'), params.token, wantedEntry(req)),
  });
});
