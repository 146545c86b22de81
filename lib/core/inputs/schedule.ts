import { z } from 'zod';
import { isSingleLine } from './text-safety';

// Scrutineering slots: the chief scrutineer opens them; entrants (or the chief scrutineer) book an entry
// into one; the dock checks boats in. Times are datetime-local values in the meeting's time zone (the
// server reads them there and refuses a time outside the meeting's days).
export const SLOT_CAPACITY_MAX = 50;

const wallClock = (what: string) =>
  z
    .string({ error: `Enter the ${what} as a date and time.` })
    .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, `Enter the ${what} as a date and time (yyyy-mm-ddThh:mm).`);

export const OpenSlotInput = z.strictObject({
  classId: z.uuid({ error: 'Choose the class.' }).transform((v) => v.toLowerCase()),
  bay: z
    .string({ error: 'Name the bay.' })
    .trim()
    .min(1, 'Name the bay.')
    .max(40, 'Keep the bay name under 40 characters.')
    .refine(isSingleLine, 'Keep the bay name on one line.'),
  startsAt: wallClock('start'),
  durationMinutes: z
    .number({ error: 'Enter the length in minutes.' })
    .int('Enter the length as whole minutes.')
    .min(5, 'A slot lasts at least 5 minutes.')
    .max(240, 'A slot lasts at most 240 minutes.'),
  capacity: z
    .number({ error: 'Enter how many boats the slot takes.' })
    .int('Enter a whole number of boats.')
    .min(1, 'A slot takes at least one boat.')
    .max(SLOT_CAPACITY_MAX, `A slot takes at most ${SLOT_CAPACITY_MAX} boats.`),
  graceMinutes: z
    .number({ error: 'Enter the grace period in minutes.' })
    .int('Enter the grace period as whole minutes.')
    .min(0, 'The grace period cannot be negative.')
    .max(120, 'Keep the grace period to 120 minutes or less.')
    .default(10),
});
export type OpenSlotInput = z.infer<typeof OpenSlotInput>;

export const BookSlotInput = z.strictObject({
  slotId: z.uuid({ error: 'Choose a slot.' }).transform((v) => v.toLowerCase()),
});
export type BookSlotInput = z.infer<typeof BookSlotInput>;

export const RecordArrivalInput = z.strictObject({
  /** Made on the phone when the boat was checked in: a retry of the same key stores nothing new. */
  key: z.uuid({ error: 'The check-in has no key.' }).transform((v) => v.toLowerCase()),
  entryId: z.uuid({ error: 'Choose the entry.' }).transform((v) => v.toLowerCase()),
  /** When the phone saw the boat arrive (it may be sent later, after a lost connection). */
  arrivedAt: z.iso.datetime({ offset: true, error: 'Give the arrival time as an ISO 8601 instant.' }),
  bay: z
    .string()
    .trim()
    .max(40, 'Keep the bay name under 40 characters.')
    .refine(isSingleLine, 'Keep the bay name on one line.')
    .default(''),
});
export type RecordArrivalInput = z.infer<typeof RecordArrivalInput>;
