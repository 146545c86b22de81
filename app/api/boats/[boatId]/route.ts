// GET|PATCH /api/boats/:boatId: one of the person's own boats (404 for anyone else's), read or edited (an edit of the declaration is a new version).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { getMyBoat } from '@/lib/server/boats/get-my-boat';
import { updateBoat } from '@/lib/server/boats/update-boat';

type P = { boatId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await getMyBoat(actor, params.boatId) });
});

// The body is read only after the owner check (updateBoat calls readInput then).
export const PATCH = actorHandler<P>(async (req, { actor, params }) => {
  return Response.json({ data: await updateBoat(actor, params.boatId, () => readJson(req)) });
});
