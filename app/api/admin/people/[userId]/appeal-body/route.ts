// PUT|DELETE /api/admin/people/:userId/appeal-body: the site administrator appoints a person to the appeal body, or ends it.
import { actorHandler } from '@/lib/server/http/handler';
import { appointAppealBodyMember, endAppealBodyMembership } from '@/lib/server/admin/set-appeal-body';

type P = { userId: string };

export const PUT = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await appointAppealBodyMember(actor, params.userId) });
});

export const DELETE = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await endAppealBodyMembership(actor, params.userId) });
});
