// Provisional results as entered on the form or read from a CSV file, shared by the form and the
// route handler. Positions run 1..N without gaps or repeats; a race number appears once.
import { z } from 'zod';

export const RESULTS_CSV_MAX_BYTES = 256 * 1024;

export const ResultRowInput = z.object({
  position: z
    .number({ error: 'Enter the position as a whole number.' })
    .int('Enter the position as a whole number.')
    .min(1, 'Positions start at 1.')
    .max(999),
  raceNumber: z
    .number({ error: 'Enter the race number.' })
    .int('Enter the race number as a whole number.')
    .min(1, 'Race numbers run from 1 to 9999.')
    .max(9999, 'Race numbers run from 1 to 9999.'),
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
      if (seenNumbers.has(r.raceNumber))
        ctx.addIssue({
          code: 'custom',
          path: ['rows', i, 'raceNumber'],
          message: `Race number ${r.raceNumber} is already in row ${seenNumbers.get(r.raceNumber)! + 1}.`,
        });
      else seenNumbers.set(r.raceNumber, i);
      if (seenPositions.has(r.position))
        ctx.addIssue({
          code: 'custom',
          path: ['rows', i, 'position'],
          message: `Position ${r.position} is already in row ${seenPositions.get(r.position)! + 1}.`,
        });
      else seenPositions.set(r.position, i);
      if (r.position > v.rows.length)
        ctx.addIssue({
          code: 'custom',
          path: ['rows', i, 'position'],
          message: `With ${v.rows.length} finishers, positions run from 1 to ${v.rows.length}.`,
        });
    });
  });
export type PublishResultsInput = z.infer<typeof PublishResultsInput>;

/** One row of the results form as typed: position null means "the row's place" (not edited). */
export type ResultsFormRow = { key: number; position: string | null; raceNumber: string };

import { numberOrNull } from './form-values';

/**
 * The rows the form sends: a row without a race number is left out (a pre-filled position alone is not
 * a finisher), so two finishers in a three-row form publish. `screenIndex[i]` is the screen row of sent row i.
 */
export function rowsToSend(rows: ResultsFormRow[]): {
  send: { position: number | null; raceNumber: number | null }[];
  screenIndex: number[];
} {
  const send: { position: number | null; raceNumber: number | null }[] = [];
  const screenIndex: number[] = [];
  rows.forEach((r, i) => {
    if (r.raceNumber.trim() === '') return;
    send.push({
      position: r.position === null ? i + 1 : numberOrNull(r.position),
      raceNumber: numberOrNull(r.raceNumber),
    });
    screenIndex.push(i);
  });
  return { send, screenIndex };
}
