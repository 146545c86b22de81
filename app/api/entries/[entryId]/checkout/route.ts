// POST /api/entries/:entryId/checkout: open (or reopen) the payment page for the person's unpaid entry.
import { actorHandler } from '@/lib/server/http/handler';
import { startEntryPayment } from '@/lib/server/payments/start-entry-payment';

export const POST = actorHandler<{ entryId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await startEntryPayment(actor, params.entryId) });
});
