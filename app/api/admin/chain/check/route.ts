// POST /api/admin/chain/check: the site administrator re-verifies every record chain against the live rows now (no body); the answer names each break.
import { actorHandler } from '@/lib/server/http/handler';
import { runSelfCheck } from '@/lib/server/chain/chain-service';

export const POST = actorHandler(async (_req, { actor }) => {
  return Response.json({ data: await runSelfCheck(actor) });
});
