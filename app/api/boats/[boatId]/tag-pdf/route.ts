// GET /api/boats/:boatId/tag-pdf: the owner's printable PDF of the boat's current QR tag.
import { actorHandler } from '@/lib/server/http/handler';
import { buildMyBoatTagPdf } from '@/lib/server/boats/build-my-boat-tag-pdf';

export const GET = actorHandler<{ boatId: string }>(async (_req, { actor, params }) => {
  const { pdf, fileName } = await buildMyBoatTagPdf(actor, params.boatId);
  return new Response(Buffer.from(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="${fileName}"`,
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
    },
  });
});
