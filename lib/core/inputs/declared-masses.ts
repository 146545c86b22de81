// The crew and fuel masses an entrant declares for one entry (the predicted run adds them to the weight measured
// at inspection; lib/core/timing/clock-section.ts). Both are sent every time; null means "not declared", and the
// stated assumption is used for it. The bounds are sanity limits, not class rules (common practice, no source),
// and the database holds the same ones (migrations/20261203010000-entry-declared-masses.js).
import { z } from 'zod';
import { CREW_KG_RANGE, FUEL_KG_RANGE, MASS_FIELDS, massWords } from './declared-masses-check';

export { CREW_KG_RANGE, FUEL_KG_RANGE };

const mass = (field: keyof typeof MASS_FIELDS) => {
  const words = massWords(field);
  const { range } = MASS_FIELDS[field];
  return z.number({ error: words.notNumber }).min(range.min, words.tooSmall).max(range.max, words.tooLarge).nullable();
};

export const DeclareMassesInput = z.strictObject({ crewKg: mass('crewKg'), fuelKg: mass('fuelKg') });
export type DeclareMassesInput = z.infer<typeof DeclareMassesInput>;
