import { z } from 'zod';
import { convertLength, convertPower } from '@/lib/core/engine/units';
import { isSingleLine } from '@/lib/core/inputs/text-safety';

// A boat's declaration, shared by the boat form and the boats API. Figures arrive as JSON
// numbers with their unit and are stored in mm and kW. Strings are refused: the form converts
// with valueAsNumber and sends nothing for an empty field, which reads as "Enter …".

export const NOZZLE_UNITS = ['mm', 'in'] as const;
export const POWER_UNITS = ['kW', 'hp', 'PS'] as const;
export const POWER_EVIDENCE_VALUES = ['dyno_sheet', 'maker_rating', 'none'] as const;
export const DOCUMENT_KINDS = {
  dyno_sheet: 'Dyno sheet',
  pump_spec: 'Pump or nozzle specification',
  engine_spec: 'Engine specification',
  registration: 'Registration or measurement certificate',
  photo: 'Photo',
  other: 'Other',
} as const;
export type DocumentKind = keyof typeof DOCUMENT_KINDS;
export const DOCUMENT_KIND_VALUES = Object.keys(DOCUMENT_KINDS) as [DocumentKind, ...DocumentKind[]];

/** Maximum size of one boat document (bytes). */
export const BOAT_DOCUMENT_MAX_BYTES = 10 * 1024 * 1024;

/** A required number: "Enter …" when missing, "… as a number" when it is text or anything else. */
export const requiredNumber = (what: string) =>
  z.number({
    error: (iss) => (iss.input === undefined || iss.input === null ? `Enter ${what}.` : `Enter ${what} as a number.`),
  });
/** An optional number: missing or null means "not declared". */
const optionalNumber = (what: string) =>
  z
    .number({ error: `Enter ${what} as a number, or leave it empty.` })
    .nullable()
    .optional();

const text = (what: string, max: number) =>
  z
    .string({ error: `Enter ${what} as text.` })
    .trim()
    .max(max, `Keep ${what} under ${max} characters.`);

const BoatFields = z.strictObject({
  name: z
    .string({ error: 'Enter the boat’s name.' })
    .trim()
    .min(1, 'Enter the boat’s name.')
    .max(80, 'Keep the boat’s name under 80 characters.')
    .refine(isSingleLine, 'Type the boat’s name on one line.'),
  // As painted on the hull: letters and digits, with spaces, hyphens, dots or slashes between them.
  // It is an identifier, not a quantity: "-7" or "−7" is refused rather than read as a number.
  hullNumber: text('the hull or sail number', 20).refine(
    (v) => v === '' || /^[\p{L}\p{N}](?:[\p{L}\p{N} ./-]*[\p{L}\p{N}])?$/u.test(v),
    'Type the hull or sail number as it is painted on the hull: letters and digits (like 42 or NZ-42), no minus sign.',
  ),
  hullDescription: text('the hull description', 500),
  pumpDescription: text('the pump description', 500),
  impellerDescription: text('the impeller description', 500),
  nozzleDiameter: requiredNumber('the nozzle exit diameter').positive('The nozzle exit diameter must be above zero.'),
  nozzleUnit: z.enum(NOZZLE_UNITS, { error: 'Choose mm or in for the nozzle diameter.' }),
  nozzleToleranceMm: requiredNumber('the nozzle tolerance')
    .min(0, 'The tolerance cannot be negative.')
    .max(5, 'A tolerance above 5 mm is not credible.'),
  engineDescription: text('the engine description', 500),
  power: requiredNumber('the declared power').positive('The declared power must be above zero.'),
  powerUnit: z.enum(POWER_UNITS, { error: 'Choose kW, hp or PS for the power.' }),
  powerEvidence: z.enum(POWER_EVIDENCE_VALUES, { error: 'Choose what backs the power figure.' }),
  displacementL: optionalNumber('the engine displacement').refine(
    (v) => v == null || (v > 0 && v <= 50),
    'The displacement must be above 0 and at most 50 litres.',
  ),
  declaredWeightKg: optionalNumber('the declared weight').refine(
    (v) => v == null || (v > 0 && v <= 20000),
    'The weight must be above 0 and at most 20000 kg.',
  ),
});

type Fields = z.infer<typeof BoatFields>;

/** What is stored (the boats table's columns). */
export type BoatDeclaration = {
  name: string;
  hullNumber: string;
  hullDescription: string;
  pumpDescription: string;
  impellerDescription: string;
  declaredNozzleMm: number;
  declaredNozzleToleranceMm: number;
  engineDescription: string;
  declaredPowerKw: number;
  powerEvidence: (typeof POWER_EVIDENCE_VALUES)[number];
  displacementL: number | null;
  declaredWeightKg: number | null;
};

// Limits apply after conversion (the database checks the same: 0 < mm < 1000, 0 < kW < 10000).
function checkRanges(v: Partial<Fields>, ctx: z.RefinementCtx) {
  if (v.nozzleDiameter !== undefined) {
    const mm = convertLength(v.nozzleDiameter, v.nozzleUnit ?? 'mm', 'mm');
    if (!(mm > 0))
      ctx.addIssue({
        code: 'custom',
        path: ['nozzleDiameter'],
        message: 'The nozzle exit diameter must be above zero.',
      });
    else if (!(mm < 1000))
      ctx.addIssue({
        code: 'custom',
        path: ['nozzleDiameter'],
        message: 'The nozzle exit diameter must be below 1000 mm (39.37 in).',
      });
  }
  if (v.power !== undefined) {
    const kw = convertPower(v.power, v.powerUnit ?? 'kW', 'kW');
    if (!(kw > 0)) ctx.addIssue({ code: 'custom', path: ['power'], message: 'The declared power must be above zero.' });
    else if (!(kw < 10000))
      ctx.addIssue({ code: 'custom', path: ['power'], message: 'The declared power must be below 10000 kW.' });
  }
}

function toStored(v: Partial<Fields>): Partial<BoatDeclaration> {
  const out: Partial<BoatDeclaration> = {};
  for (const k of [
    'name',
    'hullNumber',
    'hullDescription',
    'pumpDescription',
    'impellerDescription',
    'engineDescription',
    'powerEvidence',
  ] as const) {
    if (v[k] !== undefined) (out as Record<string, unknown>)[k] = v[k];
  }
  if (v.nozzleDiameter !== undefined)
    out.declaredNozzleMm = convertLength(v.nozzleDiameter, v.nozzleUnit ?? 'mm', 'mm');
  if (v.nozzleToleranceMm !== undefined) out.declaredNozzleToleranceMm = v.nozzleToleranceMm;
  if (v.power !== undefined) out.declaredPowerKw = convertPower(v.power, v.powerUnit ?? 'kW', 'kW');
  if (v.displacementL !== undefined) out.displacementL = v.displacementL ?? null;
  if (v.declaredWeightKg !== undefined) out.declaredWeightKg = v.declaredWeightKg ?? null;
  return out;
}

/** POST /api/boats: a new boat. Text fields may be left out; figures are required. */
export const CreateBoatInput = BoatFields.extend({
  hullNumber: BoatFields.shape.hullNumber.default(''),
  hullDescription: BoatFields.shape.hullDescription.default(''),
  pumpDescription: BoatFields.shape.pumpDescription.default(''),
  impellerDescription: BoatFields.shape.impellerDescription.default(''),
  engineDescription: BoatFields.shape.engineDescription.default(''),
  nozzleUnit: BoatFields.shape.nozzleUnit.default('mm'),
  nozzleToleranceMm: BoatFields.shape.nozzleToleranceMm.default(0.1),
  powerUnit: BoatFields.shape.powerUnit.default('kW'),
  powerEvidence: BoatFields.shape.powerEvidence.default('none'),
})
  .superRefine(checkRanges)
  .transform((v) => ({ displacementL: null, declaredWeightKg: null, ...toStored(v) }) as BoatDeclaration);
export type CreateBoatInput = z.input<typeof CreateBoatInput>;

/** PATCH /api/boats/:id: any subset; a figure without its unit is taken as mm or kW. */
export const UpdateBoatInput = BoatFields.partial()
  .superRefine((v, ctx) => {
    if (Object.keys(v).length === 0)
      ctx.addIssue({ code: 'custom', path: [], message: 'Send at least one field to change.' });
    checkRanges(v, ctx);
  })
  .transform(toStored);
export type UpdateBoatInput = z.input<typeof UpdateBoatInput>;

export const UploadDocumentFields = z.object({
  kind: z.enum(DOCUMENT_KIND_VALUES, { error: 'Choose what kind of document this is.' }),
});
