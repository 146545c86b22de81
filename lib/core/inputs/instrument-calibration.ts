// What the chief scrutineer sends about an instrument's calibration: a certificate (its fields come
// as form fields beside the file) and a daily check against a reference.
import { z } from 'zod';

export const CERTIFICATE_MAX_BYTES = 8 * 1024 * 1024;
/** Bounds on a certificate's dates: calibrated from this day on, due at most this many years later. */
export const EARLIEST_CALIBRATION = '2000-01-01';
export const MAX_INTERVAL_YEARS = 10;

export { INSTRUMENT_TYPES, INSTRUMENT_TYPE_LABELS, type InstrumentType } from './instrument-types';

const text = (what: string, max: number) =>
  z
    .string({ error: `Enter ${what} as text.` })
    .trim()
    .min(1, `Enter ${what}.`)
    .max(max, `Keep ${what} under ${max} characters.`);

// Form fields arrive as strings; an empty one is "not given".
const formNumber = (what: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? null : Number(v.trim().replace(',', '.'))) : v),
    z
      .number({ error: `Enter ${what} as a number.` })
      .refine((n) => Number.isFinite(n), `Enter ${what} as a number.`)
      .nullable(),
  );

export const AddCertificateInput = z
  .object({
    number: text('the certificate number', 80),
    laboratory: text('the calibration laboratory', 160),
    calibratedOn: z.iso.date({ error: 'Give the calibration date as a date.' }),
    dueOn: z.iso.date({ error: 'Give the due date as a date.' }),
    expandedUncertainty: formNumber('the stated expanded uncertainty U').pipe(
      // A certificate never states U = 0: the reference and the resolution contribute (JCGM 100:2008, F.2.2.1).
      z.number().gt(0, 'U must be above zero.').max(100, 'Keep U at or below 100.').nullable(),
    ),
    coverageFactor: formNumber('the coverage factor k').pipe(
      z.number().min(1, 'k is at least 1.').max(5, 'k is at most 5.').nullable(),
    ),
  })
  .superRefine((v, ctx) => {
    // Plausible dates only (found by an outside test: year 0 was a 500, 1900–9999 an instrument usable
    // for ever). A calibration cannot lie ahead of today (a day's grace for the time zones), and a due
    // date more than ten years on is not a calibration interval (common practice, no source).
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    if (v.calibratedOn < EARLIEST_CALIBRATION)
      ctx.addIssue({
        code: 'custom',
        path: ['calibratedOn'],
        message: `Give a calibration date from ${EARLIEST_CALIBRATION} on.`,
      });
    else if (v.calibratedOn > tomorrow)
      ctx.addIssue({
        code: 'custom',
        path: ['calibratedOn'],
        message: 'The calibration date cannot be in the future.',
      });
    const latestDue = `${String(Number(v.calibratedOn.slice(0, 4)) + MAX_INTERVAL_YEARS).padStart(4, '0')}${v.calibratedOn.slice(4)}`;
    if (v.dueOn > latestDue)
      ctx.addIssue({
        code: 'custom',
        path: ['dueOn'],
        message: `A due date more than ${MAX_INTERVAL_YEARS} years after the calibration is not credible.`,
      });
    if (v.dueOn <= v.calibratedOn)
      ctx.addIssue({ code: 'custom', path: ['dueOn'], message: 'The due date comes after the calibration date.' });
    if (v.expandedUncertainty != null && v.coverageFactor == null)
      ctx.addIssue({ code: 'custom', path: ['coverageFactor'], message: 'Give the k the certificate states with U.' });
  });
export type AddCertificateInput = z.infer<typeof AddCertificateInput>;

export const RecordInstrumentCheckInput = z.object({
  reference: text('the reference used (gauge block, check weight)', 160),
  nominalValue: z
    .number({ error: 'Enter the reference’s nominal value as a number.' })
    .min(0, 'The nominal value cannot be negative.')
    .max(100000, 'Keep the nominal value at or below 100000.'),
  reading: z
    .number({ error: 'Enter the instrument’s reading as a number.' })
    .min(0, 'The reading cannot be negative.')
    .max(100000, 'Keep the reading at or below 100000.'),
  /** Optional where the instrument has an error limit: the server then decides, and refuses a contradiction. */
  passed: z.boolean({ error: 'Say whether the check passed.' }).optional(),
});
export type RecordInstrumentCheckInput = z.infer<typeof RecordInstrumentCheckInput>;
