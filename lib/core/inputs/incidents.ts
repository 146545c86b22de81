import { z } from 'zod';

// An incident at a meeting, recorded by the organiser or the chief scrutineer. Append-only: a correction
// names the record it replaces and says why. Damage makes a re-inspection mandatory before the next run.
export const RecordIncidentInput = z
  .strictObject({
    entryId: z.uuid({ error: 'Choose the boat.' }).transform((v) => v.toLowerCase()),
    occurredAt: z.iso.datetime({ offset: true, error: 'Give the time of the incident.' }),
    description: z
      .string({ error: 'Say what happened.' })
      .trim()
      .min(3, 'Say what happened (at least 3 characters).')
      .max(4000, 'Keep the description under 4000 characters.'),
    damage: z.boolean({ error: 'Say whether the boat was damaged.' }),
    supersedesId: z
      .uuid({ error: 'Name the record this corrects.' })
      .nullable()
      .optional()
      .transform((v) => v?.toLowerCase() ?? null),
    correctionReason: z
      .string()
      .trim()
      .max(1000, 'Keep the reason under 1000 characters.')
      .nullable()
      .optional()
      .transform((v) => v || null),
  })
  .superRefine((v, ctx) => {
    if (v.supersedesId && !v.correctionReason)
      ctx.addIssue({ code: 'custom', path: ['correctionReason'], message: 'Say why the record is corrected.' });
    if (!v.supersedesId && v.correctionReason)
      ctx.addIssue({ code: 'custom', path: ['supersedesId'], message: 'Name the record this corrects.' });
  });
export type RecordIncidentInput = z.infer<typeof RecordIncidentInput>;
