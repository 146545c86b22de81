// GET|POST /api/boats/:boatId/components: one of the person's own boats' components (with history and seals), or register one fitted to it.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { listBoatComponents } from '@/lib/server/components/list-my-components';
import { registerComponent } from '@/lib/server/components/register-component';

type P = { boatId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listBoatComponents(actor, params.boatId) });
});

// The body is read only after the owner check (registerComponent calls readInput then).
export const POST = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await registerComponent(actor, params.boatId, () => readJson(req)) }, { status: 201 });
});
