import { z } from 'zod';
import type { LogNoteCategory } from '../../../models/boat-record';

// An official's dated note in a boat's logbook (damage, a repair, anything else worth keeping).
// Notes are never edited or removed, so what is refused here is refused before anything is kept.

// The column's enumeration (models/boat-record.ts); a type import only, so lib/core stays free of models' values.
export const LOG_NOTE_CATEGORIES = ['damage', 'repair', 'observation'] as const satisfies readonly LogNoteCategory[];

export const LOG_NOTE_CATEGORY_LABELS: Record<LogNoteCategory, string> = {
  damage: 'Damage',
  repair: 'Repair',
  observation: 'Observation',
};

export const LOG_NOTE_MAX_CHARS = 4000;

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A real calendar day written YYYY-MM-DD (2027-02-30 is refused, not rolled over). */
export function isCalendarDate(s: string): boolean {
  const m = ISO_DATE.exec(s);
  if (!m) return false;
  const d = new Date(Date.UTC(+m[1], +m[2] - 1, +m[3]));
  return d.getUTCFullYear() === +m[1] && d.getUTCMonth() === +m[2] - 1 && d.getUTCDate() === +m[3];
}

/**
 * The day a note's matter happened may be today anywhere on Earth (UTC+14 is a day ahead of UTC),
 * never later; nor before 1950, which is a typing slip for a boat's record.
 */
export function isPlausibleNoteDate(s: string, now = new Date()): boolean {
  if (!isCalendarDate(s)) return false;
  const latest = new Date(now.getTime() + 14 * 3_600_000).toISOString().slice(0, 10);
  return s >= '1950-01-01' && s <= latest;
}

export const AddLogNoteInput = z.strictObject({
  eventId: z.uuid({ error: 'Choose the meeting the note belongs to.' }).transform((v) => v.toLowerCase()),
  category: z.enum(LOG_NOTE_CATEGORIES, { error: 'Choose damage, repair or observation.' }),
  notedOn: z
    .string({ error: 'Enter the day it happened (YYYY-MM-DD).' })
    .trim()
    .refine(isCalendarDate, 'Enter the day it happened as a real date (YYYY-MM-DD).')
    .refine((s) => isPlausibleNoteDate(s), 'The day it happened cannot be in the future.'),
  body: z
    .string({ error: 'Write the note.' })
    .trim()
    .min(1, 'Write the note.')
    .max(LOG_NOTE_MAX_CHARS, `Keep the note to ${LOG_NOTE_MAX_CHARS} characters.`),
});
export type AddLogNoteInput = z.infer<typeof AddLogNoteInput>;
