// POST /api/appeals/:appealId/checkout: open (or reopen) the payment page for the appellant's fee.
import { actorHandler } from '@/lib/server/http/handler';
import { startAppealPayment } from '@/lib/server/payments/start-appeal-payment';

export const POST = actorHandler<{ appealId: string }>(async (_req, { actor, params }) => {
  return Response.json({ data: await startAppealPayment(actor, params.appealId) });
});
