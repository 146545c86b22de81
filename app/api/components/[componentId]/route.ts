// GET|PATCH /api/components/:componentId: one of the person's components (404 for anyone else's), read or edited (maker, model, trim code, notes).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { getMyComponent } from '@/lib/server/components/list-my-components';
import { editComponent } from '@/lib/server/components/edit-component';

type P = { componentId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await getMyComponent(actor, params.componentId) });
});

// The body is read only after the check that the component is the person's.
export const PATCH = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await editComponent(actor, params.componentId, () => readJson(req)) });
});
