// GET /api/events/:eventId/gear-checks?entryId=: a boat's people and gear with today's dock confirmations (the meeting's board officials).
// POST /api/events/:eventId/gear-checks: a scrutineer of the meeting records what they saw of a boat's gear today.
import { withPermission, readJson } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { getEntryCrew } from '@/lib/server/crew/get-entry-crew';
import { recordGearChecks } from '@/lib/server/gear/record-gear-checks';

export const GET = withPermission<{ eventId: string }>('inspection.board', async (req, { actor, params }) => {
  const entryId = req.nextUrl.searchParams.get('entryId');
  if (!entryId)
    throw new AppError('invalid_input', 400, 'Name the boat’s entry.', [{ field: 'entryId', message: 'Required.' }]);
  return Response.json({ data: await getEntryCrew(actor, entryId, { eventId: params.eventId.toLowerCase() }) });
});

export const POST = withPermission<{ eventId: string }>('inspection.record', async (req, { actor, params }) => {
  return Response.json(
    { data: await recordGearChecks(actor, params.eventId, () => readJson(req, 32 * 1024)) },
    { status: 201 },
  );
});
