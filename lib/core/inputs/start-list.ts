import { z } from 'zod';

// The organiser's decision on one entry's start on one meeting day (the day is checked against the
// meeting's days by the server). The reason is required: the start line reads it.
export const StartDecisionInput = z.strictObject({
  entryId: z.uuid({ message: 'Choose an entry of this meeting.' }),
  day: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Give the meeting day as yyyy-mm-dd.' }),
  mayStart: z.boolean({ message: 'Say whether the boat may start (true) or is held (false).' }),
  reason: z
    .string({ message: 'Give the reason for this decision.' })
    .trim()
    .min(3, { message: 'Give the reason for this decision (at least 3 characters).' })
    .max(500, { message: 'Keep the reason under 500 characters.' }),
});
export type StartDecisionInput = z.infer<typeof StartDecisionInput>;
