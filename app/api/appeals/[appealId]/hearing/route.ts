// POST /api/appeals/:appealId/hearing: the appeal body sets the hearing's time and place.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { scheduleAppealHearing } from '@/lib/server/appeals/schedule-appeal-hearing';

export const POST = actorHandler<{ appealId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await scheduleAppealHearing(actor, params.appealId, () => readJson(req)) });
});
