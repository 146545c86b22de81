// POST /api/components/:componentId/move: move one of the person's components to another of their boats, or take it off ({ boatId: null }).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { moveComponent } from '@/lib/server/components/move-component';

// The body is read only after the check that the component is the person's.
export const POST = actorHandler<{ componentId: string }>(async (req, { actor, params }) => {
  return Response.json({ data: await moveComponent(actor, params.componentId, () => readJson(req)) });
});
