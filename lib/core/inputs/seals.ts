import { z } from 'zod';
import { SEAL_BATCH_MAX, SEAL_CHECK_STATES, SEAL_NUMBER_PATTERN } from './seal-terms';

// The seal register's inputs, shared by the forms and the server: a batch of numbered seals issued
// to a meeting, and what a scrutineer does with seals while recording an inspection (check the seals
// already on the boat, apply new ones, remove one with a reason).

export {
  SEAL_BATCH_MAX,
  SEAL_CHECK_STATES,
  SEAL_CHECK_WORDS,
  SEAL_NUMBER_PATTERN,
  type SealCheckState,
} from './seal-terms';

const text = (what: string, max: number) =>
  z
    .string({ error: `Enter ${what} as text.` })
    .trim()
    .max(max, `Keep ${what} under ${max} characters.`);

/**
 * How seal numbers are compared: in capitals, the number at the end without its leading zeros, so
 * "zz-01", "ZZ-1" and "ZZ-001" are one seal (a scrutineer reading "ZZ-01" off the seal and typing
 * "ZZ-1" means that seal). Its SQL twin is `sealKeySql` in lib/server/seals/seal-key.ts.
 */
export const sealNumberKey = (number: string) => number.toUpperCase().replace(/0*([0-9]+)$/, '$1');

export const sealNumber = z
  .string({ error: 'Enter the seal number.' })
  .trim()
  .min(1, 'Enter the seal number.')
  .regex(SEAL_NUMBER_PATTERN, 'A seal number has 1 to 40 letters, digits or dashes.')
  .transform((s) => s.toUpperCase());

/** The numbers of a batch: prefix + each number, padded to the width of the last one (“KR-001” … “KR-250”). */
export function batchSealNumbers(prefix: string, firstNumber: number, lastNumber: number): string[] {
  const width = String(lastNumber).length;
  const out: string[] = [];
  for (let n = firstNumber; n <= lastNumber; n++) out.push(`${prefix}${String(n).padStart(width, '0')}`.toUpperCase());
  return out;
}

export const IssueSealBatchInput = z
  .strictObject({
    prefix: z
      .string({ error: 'Enter the prefix as text.' })
      .trim()
      .max(12, 'Keep the prefix to 12 characters.')
      .regex(/^[A-Za-z0-9-]*$/, 'A prefix has letters, digits or dashes only.')
      .default('')
      .transform((s) => s.toUpperCase()),
    firstNumber: z
      .number({ error: 'Enter the first number as a whole number.' })
      .int('Enter the first number as a whole number.')
      .min(0, 'Numbers start at 0.')
      .max(99_999_999, 'Keep numbers to 8 digits.'),
    lastNumber: z
      .number({ error: 'Enter the last number as a whole number.' })
      .int('Enter the last number as a whole number.')
      .min(0, 'Numbers start at 0.')
      .max(99_999_999, 'Keep numbers to 8 digits.'),
    note: text('the note', 500).default(''),
  })
  .superRefine((v, ctx) => {
    if (v.lastNumber < v.firstNumber)
      ctx.addIssue({ code: 'custom', path: ['lastNumber'], message: 'The last number must not be below the first.' });
    else if (v.lastNumber - v.firstNumber + 1 > SEAL_BATCH_MAX)
      ctx.addIssue({
        code: 'custom',
        path: ['lastNumber'],
        message: `A batch holds at most ${SEAL_BATCH_MAX} seals; issue another batch for more.`,
      });
    else if (`${v.prefix}${v.lastNumber}`.length > 40)
      ctx.addIssue({ code: 'custom', path: ['prefix'], message: 'Prefix and number together must fit 40 characters.' });
  });
export type IssueSealBatchInput = z.infer<typeof IssueSealBatchInput>;

export const ListSealsQuery = z.object({
  q: z
    .string()
    .trim()
    .max(40, 'Search with at most 40 characters.')
    .regex(/^[A-Za-z0-9-]*$/, 'Search by seal number: letters, digits or dashes.')
    .default(''),
});

/** What the scrutineer did with seals while recording one inspection. */
export const InspectionSealsInput = z
  .object(
    {
      checks: z
        .array(
          z.object({
            number: sealNumber,
            state: z.enum(SEAL_CHECK_STATES, { error: 'Say whether the seal is intact, broken or missing.' }),
          }),
        )
        .max(40, 'Check at most 40 seals in one record.')
        .default([]),
      applied: z
        .array(
          z.object({
            number: sealNumber,
            componentId: z.uuid({ error: 'Choose the component the seal goes on.' }),
            position: text('where the seal is', 120).min(1, 'Say where on the component the seal is.'),
          }),
        )
        .max(20, 'Apply at most 20 seals in one record.')
        .default([]),
      removed: z
        .array(
          z.object({
            number: sealNumber,
            reason: text('the reason', 500).min(3, 'Say why the seal is removed.'),
          }),
        )
        .max(20, 'Remove at most 20 seals in one record.')
        .default([]),
    },
    { error: 'Record seals as the register asks: checks, applied and removed (not free text).' },
  )
  .superRefine((v, ctx) => {
    const seen = new Map<string, string>();
    const dup = (list: 'checks' | 'applied' | 'removed', i: number, n: string) => {
      const where = seen.get(`${list}:${n}`);
      if (where) ctx.addIssue({ code: 'custom', path: [list, i, 'number'], message: `Seal ${n} is listed twice.` });
      seen.set(`${list}:${n}`, String(i));
    };
    v.checks.forEach((c, i) => dup('checks', i, c.number));
    v.applied.forEach((c, i) => dup('applied', i, c.number));
    v.removed.forEach((c, i) => dup('removed', i, c.number));
    v.applied.forEach((a, i) => {
      if (seen.has(`checks:${a.number}`) || seen.has(`removed:${a.number}`))
        ctx.addIssue({
          code: 'custom',
          path: ['applied', i, 'number'],
          message: `Seal ${a.number} cannot be applied and checked or removed in the same record.`,
        });
    });
  });
export type InspectionSealsInput = z.infer<typeof InspectionSealsInput>;
/** The seal actions as a form builds them (before parsing). */
export type InspectionSealsDraft = z.input<typeof InspectionSealsInput>;
