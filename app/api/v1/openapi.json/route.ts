// GET /api/v1/openapi.json: the public API's OpenAPI 3.1 document, generated from the zod schemas (public, rate-limited).
import { publicHandler } from '@/lib/server/http/handler';
import { enforceRateLimit } from '@/lib/server/http/rate-limit';
import { buildOpenApiDocument } from '@/lib/core/api/openapi';
import pkg from '@/package.json';

// Counted per request, so never prerendered at build time (the counter lives in the database).
export const dynamic = 'force-dynamic';

// Built once per server process: the schemas cannot change while it runs.
let document: ReturnType<typeof buildOpenApiDocument> | undefined;

export const GET = publicHandler(async (req) => {
  await enforceRateLimit(req, 'public-api');
  document ??= buildOpenApiDocument(pkg.version);
  return Response.json(document, { headers: { 'Cache-Control': 'public, max-age=300' } });
});
