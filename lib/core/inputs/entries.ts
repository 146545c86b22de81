import { z } from 'zod';

// Entering a boat into a class at an event, shared by the entry form and POST /api/entries.

const uuid = (what: string) => z.uuid({ error: `Choose ${what}.` });

export const SubmitEntryInput = z.strictObject({
  boatId: uuid('a boat'),
  eventId: uuid('an event'),
  classId: uuid('a class'),
  /** The race number the entrant would like; taken only if free at the event. */
  requestedRaceNumber: z
    .number({ error: 'Enter the race number as a whole number, or leave it empty.' })
    .int('Enter the race number as a whole number.')
    .min(1, 'Race numbers run from 1 to 9999.')
    .max(9999, 'Race numbers run from 1 to 9999.')
    .nullable()
    .optional(),
});
export type SubmitEntryInput = z.infer<typeof SubmitEntryInput>;

/** How an entry's state reads to its entrant (inspection results come from inspection_result). */
export const ENTRY_STATUS_LABELS = {
  awaiting_payment: 'Awaiting payment',
  entered: 'Entered',
  withdrawn: 'Withdrawn',
  cancelled: 'Cancelled',
} as const;

export const INSPECTION_RESULT_LABELS = {
  conforms: 'Inspected: conforms',
  does_not_conform: 'Inspected: does not conform',
  inconclusive: 'Inspected: inconclusive',
} as const;

/** "45.00 NZD": every currency Boreline offers has two decimal places (ISO 4217). */
export function formatMoney(minor: number, currency: string): string {
  return `${(minor / 100).toFixed(2)} ${currency.toUpperCase()}`;
}
