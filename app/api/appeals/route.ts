// GET /api/appeals: the appeals the caller may read (every meeting's for the appeal body; otherwise their own and those on their boats).
import { actorHandler } from '@/lib/server/http/handler';
import { listAppeals } from '@/lib/server/appeals/list-appeals';

export const GET = actorHandler(async (_req, { actor }) => {
  return Response.json({ data: await listAppeals(actor) });
});
