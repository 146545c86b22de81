// GET|POST /api/events/:eventId/penalties: the meeting's penalties (anyone signed in, as its results); the stewards impose one.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listPenalties } from '@/lib/server/penalties/list-penalties';
import { applyPenalty } from '@/lib/server/penalties/apply-penalty';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listPenalties(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json(
    { data: await applyPenalty(actor, parseId(params.eventId, 'event'), () => readJson(req)) },
    { status: 201 },
  );
});
