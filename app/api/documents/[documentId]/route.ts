// GET /api/documents/:documentId: download a boat document (its owner, or officials of a meeting the boat is entered at).
import { actorHandler } from '@/lib/server/http/handler';
import { getDocumentForDownload } from '@/lib/server/boats/get-document-for-download';

export const GET = actorHandler<{ documentId: string }>(async (_req, { actor, params }) => {
  const doc = await getDocumentForDownload(actor, params.documentId);
  // The stored name is already sanitised; quotes and line breaks are still kept out of the header.
  const ascii = doc.fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return new Response(Buffer.from(doc.bytes), {
    headers: {
      'content-type': doc.contentType,
      'content-length': String(doc.bytes.byteLength),
      'content-disposition': `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(doc.fileName)}`,
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
      'content-security-policy': "default-src 'none'; sandbox",
    },
  });
});
