// POST /api/entries/:entryId/withdraw: the entrant withdraws their own unpaid entry.
import { actorHandler } from '@/lib/server/http/handler';
import { withdrawEntry } from '@/lib/server/entries/withdraw-entry';

export const POST = actorHandler<{ entryId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await withdrawEntry(actor, params.entryId) });
});
