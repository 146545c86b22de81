import { z } from 'zod';
import { matchedInputSchema } from './calculation';
import { ENGINE_CURVE_SHAPES } from '../engine/engine-curve-shapes';
import { isSingleLine } from './text-safety';

// A boat's declared engine curve, pump characteristic and suction data (issue 19, item 3). The curve
// pieces are the matched API's own (POST /api/v1/jet-performance/matched), so a curve the API refuses
// is refused here with the same message; the report then feeds them to the same engine.

const matched = matchedInputSchema.shape;
const num = (what: string) => z.number({ error: `${what} must be a number` });

const EnginePoints = matched.engine.extend({ kind: z.literal('points') });
const EngineRated = z.strictObject({
  kind: z.literal('rated'),
  ratedPowerKw: num('ratedPowerKw (kW)')
    .positive({ error: 'ratedPowerKw must be greater than 0' })
    .max(10_000, { error: 'ratedPowerKw must be at most 10000 kW' }),
  ratedRpm: num('ratedRpm (rpm)')
    .positive({ error: 'ratedRpm must be greater than 0 rpm' })
    .max(100_000, { error: 'ratedRpm must be at most 100000 rpm' }),
  shape: z.enum(ENGINE_CURVE_SHAPES, { error: `shape must be one of ${ENGINE_CURVE_SHAPES.join(', ')}` }),
  limiterRpm: matched.engine.shape.limiterRpm,
});
export const DeclaredEngineInput = z.discriminatedUnion('kind', [EnginePoints, EngineRated], {
  error: "engine.kind must be 'points' (a power curve) or 'rated' (rated power and rpm with a curve shape)",
});

const PumpPoints = matched.pump.extend({ kind: z.literal('points') });
const PumpFromCatalogue = z.strictObject({
  kind: z.literal('catalogue'),
  catalogueEntryId: z.uuid({ error: 'Choose an impeller from the catalogue.' }),
});
export const DeclaredPumpInput = z.discriminatedUnion('kind', [PumpPoints, PumpFromCatalogue], {
  error: "pump.kind must be 'points' (the maker's curve) or 'catalogue' (an impeller model and trim)",
});

export const DeclaredSuctionInput = matched.cavitation.unwrap();

/** PUT /api/boats/:boatId/performance: the whole declared set; null (or left out) clears a part. */
export const DeclarePerformanceInput = z.strictObject({
  engine: DeclaredEngineInput.nullable().default(null),
  pump: DeclaredPumpInput.nullable().default(null),
  suction: DeclaredSuctionInput.nullable().default(null),
});
export type DeclarePerformanceInput = z.output<typeof DeclarePerformanceInput>;

const label = (what: string, max: number) =>
  z
    .string({ error: `Enter the ${what} as text.` })
    .trim()
    .max(max, `Keep the ${what} under ${max} characters.`)
    .refine(isSingleLine, `Type the ${what} on one line.`);

/** POST /api/events/:eventId/pump-catalogue: a maker's impeller model and trim with its curve. */
export const PumpCatalogueEntryInput = matched.pump.extend({
  maker: label('maker', 80).pipe(z.string().min(1, 'Name the maker.')),
  model: label('model', 80).pipe(z.string().min(1, 'Name the impeller model.')),
  trimCode: label('trim', 40).default(''),
});
export type PumpCatalogueEntryInput = z.output<typeof PumpCatalogueEntryInput>;
