// PUT|DELETE /api/admin/people/:userId/suspension: the site administrator suspends an account (with a reason) or lifts the suspension.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { reinstatePerson, suspendPerson } from '@/lib/server/admin/set-suspension';

type P = { userId: string };

export const PUT = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await suspendPerson(actor, params.userId, await readJson(req)) });
});

export const DELETE = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await reinstatePerson(actor, params.userId) });
});
