// POST /api/events/:eventId/crew-sign-ons: an official of the meeting signs people of a boat on for today (once a day each).
import { withPermission, readJson } from '@/lib/server/http/handler';
import { signOnCrew } from '@/lib/server/crew/sign-on-crew';

export const POST = withPermission<{ eventId: string }>('inspection.record', async (req, { actor, params }) => {
  return Response.json(
    { data: await signOnCrew(actor, params.eventId, () => readJson(req, 16 * 1024)) },
    { status: 201 },
  );
});
