// POST /api/v1/jet-performance: jet velocity, mass flow and thrust at given boat speeds (public, rate-limited).
import { publicHandler, readJson } from '@/lib/server/http/handler';
import { enforceRateLimit } from '@/lib/server/http/rate-limit';
import { PUBLIC_API_MAX_BODY_BYTES } from '@/lib/core/api/openapi';
import { jetPerformanceInputSchema } from '@/lib/core/inputs/calculation';
import { computeJetPerformance } from '@/lib/core/engine/calculation-api';

export const POST = publicHandler(async (req) => {
  await enforceRateLimit(req, 'public-api');
  const input = jetPerformanceInputSchema.parse(await readJson(req, PUBLIC_API_MAX_BODY_BYTES));
  return Response.json({ data: computeJetPerformance(input) });
});
