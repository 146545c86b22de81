// GET /api/protests/:protestId/decision.pdf: the written decision as a PDF, for the parties and the meeting's officials.
import { actorHandler } from '@/lib/server/http/handler';
import { buildDecisionPdf } from '@/lib/server/protests/build-decision-pdf';

export const GET = actorHandler<{ protestId: string }>(async (_req, { actor, params }) => {
  const pdf = await buildDecisionPdf(actor, params.protestId);
  return new Response(Buffer.from(pdf.bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `inline; filename="${pdf.fileName}"`,
      'cache-control': 'private, no-store',
    },
  });
});
