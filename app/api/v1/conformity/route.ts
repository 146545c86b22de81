// POST /api/v1/conformity: decide measured readings against a limit under a decision rule (public, rate-limited).
import { publicHandler, readJson } from '@/lib/server/http/handler';
import { enforceRateLimit } from '@/lib/server/http/rate-limit';
import { PUBLIC_API_MAX_BODY_BYTES } from '@/lib/core/api/openapi';
import { conformityInputSchema } from '@/lib/core/inputs/calculation';
import { decideConformity } from '@/lib/core/engine/calculation-api';

export const POST = publicHandler(async (req) => {
  await enforceRateLimit(req, 'public-api');
  const input = conformityInputSchema.parse(await readJson(req, PUBLIC_API_MAX_BODY_BYTES));
  return Response.json({ data: decideConformity(input) });
});
