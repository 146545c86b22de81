// POST /api/v1/jet-performance/matched: the jet matched to its engine and pump curves (public, rate-limited).
import { publicHandler, readJson } from '@/lib/server/http/handler';
import { enforceRateLimit } from '@/lib/server/http/rate-limit';
import { PUBLIC_API_MAX_BODY_BYTES } from '@/lib/core/api/openapi';
import { matchedInputSchema } from '@/lib/core/inputs/calculation';
import { computeMatchedPerformance } from '@/lib/core/engine/calculation-api';

export const POST = publicHandler(async (req) => {
  await enforceRateLimit(req, 'public-api');
  const input = matchedInputSchema.parse(await readJson(req, PUBLIC_API_MAX_BODY_BYTES));
  return Response.json({ data: computeMatchedPerformance(input) });
});
