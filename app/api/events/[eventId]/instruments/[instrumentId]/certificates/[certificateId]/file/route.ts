// GET /api/events/:eventId/instruments/:instrumentId/certificates/:certificateId/file: download a calibration certificate's file (the meeting's officials).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { getCertificateFile } from '@/lib/server/inspections/get-certificate-file';

type P = { eventId: string; instrumentId: string; certificateId: string };

export const GET = withPermission<P>('inspection.board', async (_req, { actor, params }) => {
  const file = await getCertificateFile(
    actor,
    parseId(params.eventId, 'event'),
    parseId(params.instrumentId, 'instrument'),
    parseId(params.certificateId, 'certificate'),
  );
  return new Response(new Uint8Array(file.bytes), {
    headers: {
      'content-type': file.contentType,
      'content-length': String(file.bytes.byteLength),
      'content-disposition': `attachment; filename="${file.fileName}"`,
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
      'content-security-policy': "default-src 'none'; sandbox",
    },
  });
});
