// POST /api/protests/:protestId/checkout: open (or reopen) the payment page for the protester's fee.
import { actorHandler } from '@/lib/server/http/handler';
import { startProtestPayment } from '@/lib/server/payments/start-protest-payment';

export const POST = actorHandler<{ protestId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await startProtestPayment(actor, params.protestId) });
});
