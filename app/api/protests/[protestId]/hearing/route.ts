// POST /api/protests/:protestId/hearing: the stewards set the hearing's time (meeting's time zone) and place; parties are e-mailed.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { scheduleHearing } from '@/lib/server/protests/schedule-hearing';

export const POST = actorHandler<{ protestId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await scheduleHearing(actor, params.protestId, await readJson(req)) });
});
