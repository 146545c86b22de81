// PUT /api/events/:eventId/crew-requirements: the organiser sets the licence grades a class (or the whole meeting) accepts.
import { withPermission, readJson } from '@/lib/server/http/handler';
import { setCrewRequirements } from '@/lib/server/crew/set-crew-requirements';

export const PUT = withPermission<{ eventId: string }>('class.edit', async (req, { actor, params }) => {
  return Response.json({ data: await setCrewRequirements(actor, params.eventId, () => readJson(req, 16 * 1024)) });
});
