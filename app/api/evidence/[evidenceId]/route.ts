// GET /api/evidence/:evidenceId: download an evidence file, hashed again on the way out (X-Boreline-Integrity: intact|altered).
import { actorHandler } from '@/lib/server/http/handler';
import { openEvidence } from '@/lib/server/protests/open-evidence';

export const GET = actorHandler<{ evidenceId: string }>(async (_req, { actor, params }) => {
  const e = await openEvidence(actor, params.evidenceId);
  const ascii = e.fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return new Response(new Uint8Array(e.bytes), {
    headers: {
      'content-type': e.contentType,
      'content-length': String(e.bytes.byteLength),
      'content-disposition': `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(e.fileName)}`,
      'x-boreline-integrity': e.integrity,
      'x-boreline-sha256-stored': e.sha256Stored,
      'x-boreline-sha256-now': e.sha256Now,
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
      'content-security-policy': "default-src 'none'; sandbox",
    },
  });
});
