// GET /api/boats/:boatId/logbook/pdf: the boat's logbook as a PDF to print and sign, for its owner and the officials who may read it (404 for anyone else).
import { actorHandler } from '@/lib/server/http/handler';
import { buildMyLogbookPdf } from '@/lib/server/logbook/build-logbook-pdf';

export const GET = actorHandler<{ boatId: string }>(async (_req, { actor, params }) => {
  const { pdf, fileName } = await buildMyLogbookPdf(actor, params.boatId);
  return new Response(Buffer.from(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="${fileName}"`,
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
    },
  });
});
