// POST /api/v1/jet-performance/crossover: the boat speed where two nozzle diameters' thrust curves cross (public, rate-limited).
import { publicHandler, readJson } from '@/lib/server/http/handler';
import { enforceRateLimit } from '@/lib/server/http/rate-limit';
import { PUBLIC_API_MAX_BODY_BYTES } from '@/lib/core/api/openapi';
import { crossoverInputSchema } from '@/lib/core/inputs/calculation';
import { computeCrossover } from '@/lib/core/engine/calculation-api';

export const POST = publicHandler(async (req) => {
  await enforceRateLimit(req, 'public-api');
  const input = crossoverInputSchema.parse(await readJson(req, PUBLIC_API_MAX_BODY_BYTES));
  return Response.json({ data: computeCrossover(input) });
});
