// The declared crew and fuel masses checked in the browser without zod (the entrant's form on My entries): the
// same bounds and the same words as the server's schema (declared-masses.ts, built from these), so the page does
// not load zod for two numbers. tests/unit/core/inputs/declared-masses.test.ts holds the two to the same answers.

export const CREW_KG_RANGE = { min: 30, max: 400 } as const;
export const FUEL_KG_RANGE = { min: 0, max: 200 } as const;

export const MASS_FIELDS = {
  crewKg: { label: 'crew mass', range: CREW_KG_RANGE, hint: ' (everyone aboard, in their gear)' },
  fuelKg: { label: 'fuel mass', range: FUEL_KG_RANGE, hint: '' },
} as const;

export function massWords(field: keyof typeof MASS_FIELDS) {
  const { label, range, hint } = MASS_FIELDS[field];
  return {
    notNumber: `Enter the ${label} in kilograms, or leave it empty.`,
    tooSmall: `The ${label} is at least ${range.min} kg${hint}.`,
    tooLarge: `The ${label} is at most ${range.max} kg: check the unit (kilograms).`,
  };
}

export type DeclaredMasses = { crewKg: number | null; fuelKg: number | null };
export type MassesCheck = { ok: true; data: DeclaredMasses } | { ok: false; fieldErrors: Record<string, string> };

/** The form's two values (a number, null for empty, NaN for a typed word) as the server's schema would take them. */
export function checkDeclaredMasses(values: DeclaredMasses): MassesCheck {
  const fieldErrors: Record<string, string> = {};
  for (const field of Object.keys(MASS_FIELDS) as (keyof typeof MASS_FIELDS)[]) {
    const v = values[field];
    if (v === null) continue;
    const words = massWords(field);
    const { range } = MASS_FIELDS[field];
    if (typeof v !== 'number' || !Number.isFinite(v)) fieldErrors[field] = words.notNumber;
    else if (v < range.min) fieldErrors[field] = words.tooSmall;
    else if (v > range.max) fieldErrors[field] = words.tooLarge;
  }
  return Object.keys(fieldErrors).length > 0
    ? { ok: false, fieldErrors }
    : { ok: true, data: { crewKg: values.crewKg, fuelKg: values.fuelKg } };
}
