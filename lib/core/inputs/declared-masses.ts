// The crew and fuel masses an entrant declares for one entry (the predicted run adds them to the weight measured
// at inspection; lib/core/timing/clock-section.ts). Both are sent every time; null means "not declared", and the
// stated assumption is used for it. The bounds are sanity limits, not class rules (common practice, no source),
// and the database holds the same ones (migrations/20261203010000-entry-declared-masses.js).
import { z } from 'zod';

export const CREW_KG_RANGE = { min: 30, max: 400 } as const;
export const FUEL_KG_RANGE = { min: 0, max: 200 } as const;

const mass = (label: string, range: { min: number; max: number }, hint: string) =>
  z
    .number({ error: `Enter the ${label} in kilograms, or leave it empty.` })
    .min(range.min, `The ${label} is at least ${range.min} kg${hint}.`)
    .max(range.max, `The ${label} is at most ${range.max} kg: check the unit (kilograms).`)
    .nullable();

export const DeclareMassesInput = z.strictObject({
  crewKg: mass('crew mass', CREW_KG_RANGE, ' (everyone aboard, in their gear)'),
  fuelKg: mass('fuel mass', FUEL_KG_RANGE, ''),
});
export type DeclareMassesInput = z.infer<typeof DeclareMassesInput>;
