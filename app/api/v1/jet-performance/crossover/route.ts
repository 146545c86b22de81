// POST /api/v1/jet-performance/crossover: the boat speed where two nozzle diameters' thrust curves cross (public, rate-limited).
import { publicHandler, readJson } from '@/lib/http/handler';
import { enforceRateLimit } from '@/lib/http/rate-limit';
import { PUBLIC_API_MAX_BODY_BYTES } from '@/lib/api/openapi';
import { crossoverInputSchema } from '@/lib/validations/calculation';
import { computeCrossover } from '@/lib/engine/calculation-api';

export const POST = publicHandler(async (req) => {
  await enforceRateLimit(req, 'public-api');
  const input = crossoverInputSchema.parse(await readJson(req, PUBLIC_API_MAX_BODY_BYTES));
  return Response.json({ data: computeCrossover(input) });
});
