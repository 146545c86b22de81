// zod 4 schemas for the calculation API bodies, shared by forms and route handlers.
// Parsed output feeds lib/core/engine's computeJetPerformance / computeCrossover / decideConformity /
// computeParity directly. Numbers must be JSON numbers (strings are rejected, and zod 4's
// z.number() also rejects NaN and Infinity). Objects are strict: an unknown key (a typo such as
// "pumpEfficency") is an error rather than a silently applied default.
// Upper bounds on power, diameter and lengths are sanity limits, not physics.

import { z } from 'zod';
import { BURDENS_OF_PROOF } from '../engine/conformity-burden';
import type {
  ConformityBody,
  CrossoverInput,
  JetPerformanceInput,
  MatchedPerformanceInput,
  ParityBody,
} from '../engine/calculation-api';
import { MATCHED_MAX_CURVE_POINTS } from '../engine/jet-matched';

const num = (what: string) => z.number({ error: `${what} must be a number` });

const powerKw = num('powerKw (kW)')
  .positive({ error: 'powerKw must be greater than 0' })
  .max(10_000, { error: 'powerKw must be at most 10000 kW' });
const nozzleDiameterMm = num('Nozzle diameter (mm)')
  .positive({ error: 'Nozzle diameter must be greater than 0 mm' })
  .max(1000, { error: 'Nozzle diameter must be at most 1000 mm' });
const speedMs = num('Speed (m/s)')
  .min(0, { error: 'Speed must not be negative' })
  .max(100, { error: 'Speed must be at most 100 m/s' });

export const waterSchema = z
  .strictObject({
    kind: z.enum(['fresh', 'sea'], { error: "water.kind must be 'fresh' or 'sea'" }),
    temperatureC: num('Water temperature (C)')
      .min(0, { error: 'Water temperature must be at least 0 C' })
      .max(40, { error: 'Water temperature must be at most 40 C' }),
    basis: z.enum(['ittc', 'eos80'], { error: "water.basis must be 'ittc' or 'eos80'" }).default('ittc'),
  })
  .refine((w) => w.basis !== 'ittc' || (w.temperatureC >= 10 && w.temperatureC <= 25), {
    path: ['temperatureC'],
    error: "The ITTC table covers 10–25 C: set basis 'eos80' for 0–40 C, or give densityKgM3",
  });

/** Shared jet model fields. Defaults: fresh water at 15 C (ITTC), efficiency 1, losses 0, wake 0. */
const jetModelFields = {
  water: waterSchema.default({ kind: 'fresh', temperatureC: 15, basis: 'ittc' }),
  /** Wins over water when given. */
  densityKgM3: num('densityKgM3 (kg/m^3)')
    .min(900, { error: 'densityKgM3 must be between 900 and 1100 kg/m^3' })
    .max(1100, { error: 'densityKgM3 must be between 900 and 1100 kg/m^3' })
    .optional(),
  pumpEfficiency: num('pumpEfficiency')
    .gt(0, { error: 'pumpEfficiency must be above 0' })
    .max(1, { error: 'pumpEfficiency must be at most 1' })
    .default(1),
  nozzleLossCoefficient: num('nozzleLossCoefficient')
    .min(0, { error: 'nozzleLossCoefficient must be at least 0' })
    .lt(1, { error: 'nozzleLossCoefficient must be below 1' })
    .default(0),
  inletLossCoefficient: num('inletLossCoefficient')
    .min(0, { error: 'inletLossCoefficient must be at least 0' })
    .lt(1, { error: 'inletLossCoefficient must be below 1' })
    .default(0),
  wakeFraction: num('wakeFraction')
    .min(0, { error: 'wakeFraction must be at least 0' })
    .lt(1, { error: 'wakeFraction must be below 1' })
    .default(0),
};

/** POST /api/v1/jet-performance */
export const jetPerformanceInputSchema = z.strictObject({
  powerKw,
  nozzleDiameterMm,
  speedsMs: z
    .array(speedMs, { error: 'speedsMs must be an array of speeds in m/s' })
    .min(1, { error: 'Give at least one speed' })
    .max(1000, { error: 'Give at most 1000 speeds' }),
  ...jetModelFields,
});

/** POST /api/v1/jet-performance/matched: the engine's power curve and the pump's characteristic. */
const rpm = (what: string) =>
  num(`${what} (rpm)`)
    .positive({ error: `${what} must be greater than 0 rpm` })
    .max(100_000, { error: `${what} must be at most 100000 rpm` });
const increasing =
  <T>(key: keyof T & string, what: string) =>
  (points: T[], ctx: z.RefinementCtx) => {
    for (let i = 1; i < points.length; i++) {
      if (!((points[i][key] as number) > (points[i - 1][key] as number)))
        ctx.addIssue({ code: 'custom', path: [i, key], message: `${what} must increase from point to point` });
    }
  };
const enginePoint = z.strictObject({
  rpm: rpm('rpm'),
  powerKw: num('powerKw (kW)')
    .min(0, { error: 'powerKw must not be negative' })
    .max(10_000, { error: 'powerKw must be at most 10000 kW' }),
});
const pumpPoint = z.strictObject({
  flowCoefficient: num('flowCoefficient')
    .positive({ error: 'flowCoefficient must be greater than 0' })
    .max(10, { error: 'flowCoefficient must be at most 10' }),
  headCoefficient: num('headCoefficient')
    .min(-100, { error: 'headCoefficient must be at least -100' })
    .max(100, { error: 'headCoefficient must be at most 100' }),
  efficiency: num('efficiency')
    .gt(0, { error: 'efficiency must be above 0' })
    .max(1, { error: 'efficiency must be at most 1' }),
});
const { pumpEfficiency: _fixedEfficiency, ...matchedModelFields } = jetModelFields;
export const matchedInputSchema = z.strictObject({
  engine: z.strictObject({
    curve: z
      .array(enginePoint, { error: 'engine.curve must be an array of { rpm, powerKw } points' })
      .min(2, { error: 'Give at least 2 engine curve points' })
      .max(MATCHED_MAX_CURVE_POINTS, { error: `Give at most ${MATCHED_MAX_CURVE_POINTS} engine curve points` })
      .superRefine(increasing<z.infer<typeof enginePoint>>('rpm', 'rpm')),
    limiterRpm: rpm('limiterRpm').optional(),
  }),
  pump: z.strictObject({
    impellerDiameterMm: num('impellerDiameterMm (mm)')
      .positive({ error: 'impellerDiameterMm must be greater than 0 mm' })
      .max(2000, { error: 'impellerDiameterMm must be at most 2000 mm' }),
    curve: z
      .array(pumpPoint, {
        error: 'pump.curve must be an array of { flowCoefficient, headCoefficient, efficiency } points',
      })
      .min(2, { error: 'Give at least 2 pump curve points' })
      .max(MATCHED_MAX_CURVE_POINTS, { error: `Give at most ${MATCHED_MAX_CURVE_POINTS} pump curve points` })
      .superRefine(increasing<z.infer<typeof pumpPoint>>('flowCoefficient', 'flowCoefficient')),
  }),
  nozzleDiameterMm,
  speedsMs: z
    .array(speedMs, { error: 'speedsMs must be an array of speeds in m/s' })
    .min(1, { error: 'Give at least one speed' })
    .max(1000, { error: 'Give at most 1000 speeds' }),
  ...matchedModelFields,
  /** Optional: flag points where the pump inlet cavitates (NPSH available below required). */
  cavitation: z
    .strictObject({
      inletDepthM: num('cavitation.inletDepthM (m)')
        .min(0, { error: 'inletDepthM must not be negative' })
        .max(5, { error: 'inletDepthM must be at most 5 m' }),
      waterTemperatureC: num('cavitation.waterTemperatureC (C)')
        .min(0, { error: 'waterTemperatureC must be at least 0 C' })
        .max(100, { error: 'waterTemperatureC must be at most 100 C' })
        .optional(),
      ambientPressurePa: num('cavitation.ambientPressurePa (Pa)')
        .min(50_000, { error: 'ambientPressurePa must be at least 50000 Pa' })
        .max(120_000, { error: 'ambientPressurePa must be at most 120000 Pa' })
        .optional(),
      suctionSpecificSpeed: num('cavitation.suctionSpecificSpeed')
        .min(0.5, { error: 'suctionSpecificSpeed (dimensionless) must be at least 0.5' })
        .max(20, { error: 'suctionSpecificSpeed (dimensionless) must be at most 20' })
        .optional(),
      requiredNpshAtRated: z
        .strictObject({
          npshM: num('npshM (m)').positive({ error: 'npshM must be greater than 0' }).max(500),
          rpm: rpm('rpm'),
          flowM3s: num('flowM3s (m^3/s)').positive({ error: 'flowM3s must be greater than 0' }).max(100),
        })
        .optional(),
    })
    .refine((c) => (c.suctionSpecificSpeed === undefined) !== (c.requiredNpshAtRated === undefined), {
      error: 'Give either suctionSpecificSpeed or requiredNpshAtRated (one of them)',
    })
    .optional(),
});

/** POST /api/v1/jet-performance/crossover */
export const crossoverInputSchema = z.strictObject({
  powerKw,
  nozzleDiametersMm: z.tuple([nozzleDiameterMm, nozzleDiameterMm], {
    error: 'nozzleDiametersMm must be two nozzle diameters in mm',
  }),
  ...jetModelFields,
});

const lengthMm = (what: string) =>
  num(`${what} (mm)`)
    .positive({ error: `${what} must be greater than 0 mm` })
    .max(10_000, { error: `${what} must be at most 10000 mm` });

/** POST /api/v1/conformity */
export const conformityInputSchema = z
  .strictObject({
    readingsMm: z
      .array(lengthMm('Reading'), { error: 'readingsMm must be an array of readings in mm' })
      .min(1, { error: 'Give at least one reading' })
      .max(1000, { error: 'Give at most 1000 readings' }),
    maxMm: lengthMm('maxMm').optional(),
    minMm: lengthMm('minMm').optional(),
    expandedUncertaintyMm: num('expandedUncertaintyMm (mm)')
      .min(0, { error: 'expandedUncertaintyMm must not be negative' })
      .max(100, { error: 'expandedUncertaintyMm must be at most 100 mm' }),
    rule: z.enum(['simple', 'guarded', 'iso14253'], { error: "rule must be 'simple', 'guarded' or 'iso14253'" }),
    /** Who must prove (ISO 14253-1:2017; ILAC-G8:09/2019); when given, the answer carries `outcome`. */
    burdenOfProof: z
      .enum(BURDENS_OF_PROOF, { error: "burdenOfProof must be 'conformity' or 'non_conformity'" })
      .optional(),
  })
  .refine((b) => b.maxMm !== undefined || b.minMm !== undefined, {
    path: ['maxMm'],
    error: 'Give a maximum (maxMm), a minimum (minMm) or both',
  })
  .refine((b) => b.maxMm === undefined || b.minMm === undefined || b.minMm < b.maxMm, {
    path: ['minMm'],
    error: 'minMm must be below maxMm',
  });

const parityBoatSchema = z.strictObject({
  id: z.string({ error: 'Boat id must be a string' }).min(1, { error: 'Boat id must not be empty' }),
  label: z.string({ error: 'Boat label must be a string' }).max(200, { error: 'Boat label is too long' }),
  powerKw,
  nozzleDiameterMm,
  uPowerKw: num('uPowerKw (kW)').min(0, { error: 'uPowerKw must not be negative' }).optional(),
  uNozzleDiameterMm: num('uNozzleDiameterMm (mm)')
    .min(0, { error: 'uNozzleDiameterMm must not be negative' })
    .optional(),
});

/** Class parity report body (route not fixed yet). Boat ids must be unique. */
export const parityInputSchema = z
  .strictObject({
    boats: z
      .array(parityBoatSchema, { error: 'boats must be an array' })
      .min(1, { error: 'Give at least one boat' })
      .max(5000, { error: 'Give at most 5000 boats' }),
    referenceSpeedsMs: z.array(speedMs).max(20, { error: 'Give at most 20 reference speeds' }).default([10, 20, 30]),
    ...jetModelFields,
  })
  .refine((b) => new Set(b.boats.map((x) => x.id)).size === b.boats.length, {
    path: ['boats'],
    error: 'Boat ids must be unique',
  });

export type JetPerformanceRequest = z.output<typeof jetPerformanceInputSchema>;
export type CrossoverRequest = z.output<typeof crossoverInputSchema>;
export type ConformityRequest = z.output<typeof conformityInputSchema>;
export type ParityRequest = z.output<typeof parityInputSchema>;
export type MatchedRequest = z.output<typeof matchedInputSchema>;

// Compile-time proof that parsed bodies fit the engine functions' inputs.
type Fits<T, U> = T extends U ? true : false;
export const schemaFitsEngine: [
  Fits<JetPerformanceRequest, JetPerformanceInput>,
  Fits<CrossoverRequest, CrossoverInput>,
  Fits<ConformityRequest, ConformityBody>,
  Fits<ParityRequest, ParityBody>,
  Fits<MatchedRequest, MatchedPerformanceInput>,
] = [true, true, true, true, true];
