// Provisional results as entered on the form or read from a CSV file, shared by the form and the
// route handler. Positions run 1..N without gaps or repeats; a race number appears once.
import { z } from 'zod';

export const RESULTS_CSV_MAX_BYTES = 256 * 1024;

export const ResultRowInput = z.object({
  position: z.number({ error: 'Enter the position as a whole number.' }).int('Enter the position as a whole number.').min(1, 'Positions start at 1.').max(999),
  raceNumber: z.number({ error: 'Enter the race number.' }).int('Enter the race number as a whole number.').min(1, 'Race numbers run from 1 to 9999.').max(9999, 'Race numbers run from 1 to 9999.'),
});

export const PublishResultsInput = z
  .strictObject({
    classId: z.uuid({ error: 'Choose the class.' }),
    rows: z.array(ResultRowInput).min(1, 'Enter at least one finisher.').max(500),
    note: z.string().trim().max(500).default(''),
  })
  .superRefine((v, ctx) => {
    const seenNumbers = new Map<number, number>();
    const seenPositions = new Map<number, number>();
    v.rows.forEach((r, i) => {
      if (seenNumbers.has(r.raceNumber)) ctx.addIssue({ code: 'custom', path: ['rows', i, 'raceNumber'], message: `Race number ${r.raceNumber} is already in row ${seenNumbers.get(r.raceNumber)! + 1}.` });
      else seenNumbers.set(r.raceNumber, i);
      if (seenPositions.has(r.position)) ctx.addIssue({ code: 'custom', path: ['rows', i, 'position'], message: `Position ${r.position} is already in row ${seenPositions.get(r.position)! + 1}.` });
      else seenPositions.set(r.position, i);
      if (r.position > v.rows.length) ctx.addIssue({ code: 'custom', path: ['rows', i, 'position'], message: `With ${v.rows.length} finishers, positions run from 1 to ${v.rows.length}.` });
    });
  });
export type PublishResultsInput = z.infer<typeof PublishResultsInput>;
