// The public calculation API's OpenAPI 3.1 document, generated from the same zod schemas the
// route handlers parse with (zod 4's z.toJSONSchema, JSON Schema draft 2020-12, which is the
// dialect of OpenAPI 3.1), so the document cannot drift from what the server accepts.
// Framework-free: the route at /api/v1/openapi.json only serves the result.
// Cross-field rules (refinements such as "maxMm or minMm") cannot be expressed in JSON Schema;
// they are stated in the operation descriptions instead.

import { z } from 'zod';
import type {
  ConformityData,
  CrossoverData,
  JetPerformanceData,
  MatchedPerformanceData,
} from '../engine/calculation-api';
import { BURDENS_OF_PROOF, OUTCOMES } from '../engine/conformity-burden';
import {
  conformityInputSchema,
  crossoverInputSchema,
  jetPerformanceInputSchema,
  matchedInputSchema,
} from '../inputs/calculation';

/** Largest request body the public routes read (413 above it). */
export const PUBLIC_API_MAX_BODY_BYTES = 64 * 1024;

// Success shapes: what each route puts under `data`.
export const jetPerformanceDataSchema = z.object({
  densityKgM3: z.number().describe('Water density used, kg/m^3'),
  points: z.array(
    z.object({
      speedMs: z.number().describe('Boat speed, m/s'),
      jetVelocityMs: z.number().describe('Jet velocity at the nozzle exit, m/s'),
      massFlowKgS: z.number().describe('Mass flow through the pump, kg/s'),
      thrustN: z.number().describe('Net thrust, N (negative when the jet no longer outruns the inflow)'),
      isThrustPositive: z.boolean(),
    }),
  ),
});

export const matchedDataSchema = z.object({
  densityKgM3: z.number().describe('Water density used, kg/m^3'),
  points: z.array(
    z.object({
      speedMs: z.number().describe('Boat speed, m/s'),
      rpm: z.number().describe('Operating rpm of engine and pump'),
      shaftPowerKw: z.number().describe('Power the pump absorbs at the operating point, kW'),
      flowM3s: z.number().describe('Volume flow, m^3/s'),
      flowCoefficient: z.number().describe('Operating flow coefficient phi = Q / (n D^3)'),
      pumpEfficiency: z.number().describe('Pump efficiency at the operating flow coefficient'),
      jetVelocityMs: z.number().describe('Jet velocity at the nozzle exit, m/s'),
      thrustN: z.number().describe('Net thrust, N'),
      availableNpshM: z.number().optional().describe('Only with cavitation: NPSH available at the inlet, m'),
      requiredNpshM: z.number().optional().describe('Only with cavitation: NPSH the pump requires, m'),
      cavitating: z
        .boolean()
        .optional()
        .describe('Only with cavitation: true when NPSH available < required; the thrust is then an upper bound'),
      limitedBy: z
        .enum(['engine', 'limiter'])
        .describe(
          "engine: the pump absorbs the engine curve's power; limiter: it never does below the top of the range (the curve's last rpm or the limiter)",
        ),
    }),
  ),
});

export const crossoverDataSchema = z.object({
  crossoverSpeedMs: z
    .number()
    .nullable()
    .describe('Lowest boat speed where the thrust curves cross, m/s; null if none below 100 m/s'),
});

export const conformityDataSchema = z.object({
  decisiveValueMm: z
    .number()
    .describe('The reading that decides: the largest against a maximum, the smallest against a minimum'),
  verdict: z.enum(['conforms', 'does_not_conform', 'inconclusive']),
  explanation: z.string(),
  acceptanceLimitsMm: z.object({ maxMm: z.number().nullable(), minMm: z.number().nullable() }),
  outcome: z
    .object({
      burdenOfProof: z.enum(BURDENS_OF_PROOF),
      outcome: z.enum(OUTCOMES),
      partStands: z.boolean().describe('true when the part is accepted or stands'),
      explanation: z.string(),
    })
    .optional()
    .describe(
      'Only when the body gave burdenOfProof: the verdict resolved for whoever must prove (ISO 14253-1:2017; ILAC-G8:09/2019)',
    ),
});

export const errorBodySchema = z.object({
  error: z.object({
    code: z
      .string()
      .describe('Stable machine-readable code, e.g. invalid_input, invalid_json, too_large, rate_limited'),
    message: z.string().describe('A safe message for people'),
    details: z
      .union([
        z.array(
          z.object({
            field: z.string().describe('Dotted path, e.g. water.temperatureC or readingsMm.0'),
            message: z.string(),
          }),
        ),
        z.object({ retryAfterS: z.int().min(1) }),
      ])
      .optional(),
  }),
});

// Compile-time proof that the documented success shapes are what the engine returns.
type Fits<T, U> = T extends U ? true : false;
export const responsesFitEngine: [
  Fits<JetPerformanceData, z.output<typeof jetPerformanceDataSchema>>,
  Fits<CrossoverData, z.output<typeof crossoverDataSchema>>,
  Fits<ConformityData, z.output<typeof conformityDataSchema>>,
  Fits<MatchedPerformanceData, z.output<typeof matchedDataSchema>>,
] = [true, true, true, true];

type JsonSchema = Record<string, unknown>;

/**
 * One component schema; `$schema` is dropped because OpenAPI 3.1 already fixes the dialect.
 * Request bodies keep additionalProperties: false (the server refuses unknown keys); responses
 * drop it, since a response may gain fields later without breaking clients.
 */
function toComponent(schema: z.ZodType, io: 'input' | 'output', description: string): JsonSchema {
  const { $schema: _dialect, ...json } = z.toJSONSchema(schema, {
    target: 'draft-2020-12',
    io,
    unrepresentable: 'any',
    override: (ctx) => {
      if (io === 'output' && ctx.jsonSchema.additionalProperties === false) delete ctx.jsonSchema.additionalProperties;
    },
  });
  return { description, ...json };
}

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const json = (schema: JsonSchema) => ({ 'application/json': { schema } });
const dataOf = (name: string) => json({ type: 'object', properties: { data: ref(name) }, required: ['data'] });
const errorResponse = (description: string) => ({ description, content: json(ref('ErrorBody')) });

const RATE_LIMITED = {
  description: 'Too many requests from this client in the current minute.',
  headers: {
    'Retry-After': { description: 'Seconds until the window resets', schema: { type: 'integer', minimum: 1 } },
  },
  content: json(ref('ErrorBody')),
};

const BODY_ERRORS = {
  '400': errorResponse(
    'Bad input: details name each field (a dotted path) with a message; or the body is not valid JSON.',
  ),
  '413': errorResponse(`The body is larger than ${PUBLIC_API_MAX_BODY_BYTES} bytes.`),
  '415': errorResponse('The body is not sent as application/json.'),
  '429': RATE_LIMITED,
};

function postOperation(
  operationId: string,
  summary: string,
  description: string,
  input: string,
  output: string,
  extraResponses: Record<string, unknown> = {},
) {
  return {
    post: {
      operationId,
      summary,
      description,
      tags: ['calculation'],
      requestBody: { required: true, content: json(ref(input)) },
      responses: { '200': { description: 'The result.', content: dataOf(output) }, ...BODY_ERRORS, ...extraResponses },
    },
  };
}

const MODEL_NOTE =
  'Momentum theory of a water jet at fixed shaft power (Allison 1993; Faltinsen 2005, section 2.11; loss form as in MIT 2.611). ' +
  'Defaults: fresh water at 15 °C (ITTC 7.5-02-01-03 table), pump efficiency 1, losses 0, wake fraction 0; densityKgM3 wins over water. ' +
  'The ITTC table covers 10–25 °C: outside that set water.basis "eos80" (0–40 °C) or give densityKgM3. Unknown keys are refused.';

/** Builds the document (pure; the route caches it). */
export function buildOpenApiDocument(version = '1.0.0') {
  return {
    openapi: '3.1.0',
    info: {
      title: 'Boreline public calculation API',
      version,
      description:
        'Water-jet thrust (at fixed power, or matched to engine and pump curves), thrust-curve crossover and measurement conformity decisions. No sign-in; limited per client address per minute. ' +
        'Every error answers { error: { code, message, details? } }. Figures come from an idealised model and support, never replace, ' +
        "the governing body's rules and the judgement of licensed officials.",
    },
    servers: [{ url: '/' }],
    paths: {
      '/api/v1/jet-performance': postOperation(
        'computeJetPerformance',
        'Jet velocity, mass flow and thrust at given boat speeds',
        MODEL_NOTE,
        'JetPerformanceInput',
        'JetPerformanceData',
      ),
      '/api/v1/jet-performance/crossover': postOperation(
        'computeCrossover',
        'Boat speed at which two nozzle diameters’ thrust curves cross',
        `${MODEL_NOTE} Lossless curves never cross (the larger nozzle always pushes harder): the answer is then null.`,
        'CrossoverInput',
        'CrossoverData',
      ),
      '/api/v1/jet-performance/matched': postOperation(
        'computeMatchedPerformance',
        'Operating point of a jet matched to its engine: rpm, power, flow, efficiency and thrust at given boat speeds',
        'The pump settles where the engine curve meets the power the pump absorbs (affinity laws: Q = phi n D^3, gH = psi n^2 D^2, ' +
          'P = rho g Q H / eta; Karassik, Pump Handbook; Brennen, Hydrodynamics of Pumps, 1994) against the system head ' +
          'gH = 1/2 (1 + K_n)(Q/A_n)^2 - 1/2 (1 - K_i) V_in^2 with V_in = (1 - w) V, and T = rho Q (Q/A_n - V_in). ' +
          'psi and eta are linear in phi between the pump points, engine power linear in rpm between its points. The operating rpm is the lowest ' +
          "of the engine curve's range (capped at limiterRpm) where the pump absorbs the engine's power; where it never does, the top of that range " +
          '(limitedBy "limiter"). Water and loss defaults as for /api/v1/jet-performance; the pump efficiency comes from the curve. ' +
          'No operating point on the curves given (outside the pump curve, or an engine held below its curve) is a 422 naming which curve. ' +
          'Optional cavitation { inletDepthM, suctionSpecificSpeed | requiredNpshAtRated, waterTemperatureC?, ambientPressurePa? } adds to each point ' +
          'NPSH available = (p_atm - p_v)/(rho g) + z + (1 - K_i) V_in^2/(2g) (vapour pressure by IAPWS-IF97) and required = (omega Q^1/2 / S)^(4/3) / g ' +
          '(dimensionless suction specific speed, Brennen 1994); a cavitating point’s thrust is an upper bound.',
        'MatchedInput',
        'MatchedData',
        {
          '422': errorResponse(
            'No operating point on the curves given: details name the curve (engine or pump) and the speed.',
          ),
        },
      ),
      '/api/v1/conformity': postOperation(
        'decideConformity',
        'Decide a measured size against a limit under a stated decision rule',
        'Rules per ILAC-G8:09/2019 and ISO 14253-1:2017: simple (no guard band), guarded (guard band U), iso14253 (inconclusive inside ±U of the limit). ' +
          'Give maxMm, minMm or both (minMm below maxMm). The limit itself is inclusive. ' +
          'Optional burdenOfProof (ISO 14253-1:2017; ILAC-G8:09/2019) says who must prove: "conformity" (the entrant, as at inspection before racing: ' +
          'an inconclusive result is not accepted) or "non_conformity" (the protester, as in a protest: an inconclusive result is non-conformity not proven). ' +
          'With it the answer adds outcome; without it the answer is unchanged.',
        'ConformityInput',
        'ConformityData',
      ),
    },
    components: {
      schemas: {
        JetPerformanceInput: toComponent(
          jetPerformanceInputSchema,
          'input',
          'Power, nozzle exit diameter, boat speeds and the jet model assumptions.',
        ),
        CrossoverInput: toComponent(
          crossoverInputSchema,
          'input',
          'Power, two nozzle exit diameters and the shared jet model assumptions.',
        ),
        ConformityInput: toComponent(
          conformityInputSchema,
          'input',
          'Two-point readings, the limit(s), the expanded uncertainty U (k = 2) and the rule.',
        ),
        JetPerformanceData: toComponent(
          jetPerformanceDataSchema,
          'output',
          'One point per requested speed, in the order given.',
        ),
        CrossoverData: toComponent(crossoverDataSchema, 'output', 'The crossover speed, or null.'),
        MatchedInput: toComponent(
          matchedInputSchema,
          'input',
          'Engine power curve (rpm increasing), pump characteristic (flow coefficient increasing), nozzle exit diameter, boat speeds and the loss model.',
        ),
        MatchedData: toComponent(
          matchedDataSchema,
          'output',
          'One operating point per requested speed, in the order given.',
        ),
        ConformityData: toComponent(
          conformityDataSchema,
          'output',
          'The verdict with its decisive value and a plain explanation.',
        ),
        ErrorBody: toComponent(errorBodySchema, 'output', 'The one error shape of every Boreline route.'),
      },
    },
  } as const;
}
