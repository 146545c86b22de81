// GET|POST /api/boats: the signed-in person's boats, or register a new one with its declaration.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { listMyBoats } from '@/lib/server/boats/list-my-boats';
import { createBoat } from '@/lib/server/boats/create-boat';

export const GET = actorHandler(async (_req, { actor }) => {
  return Response.json({ data: await listMyBoats(actor) });
});

export const POST = actorHandler(async (req, { actor }) => {
  return Response.json({ data: await createBoat(actor, await readJson(req)) }, { status: 201 });
});
