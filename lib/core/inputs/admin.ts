import { z } from 'zod';

// Suspending an account: the reason is kept with it and shown to other administrators.
export const SuspendPersonInput = z.strictObject({
  reason: z
    .string({ error: 'Give the reason for the suspension.' })
    .trim()
    .min(3, 'Give the reason for the suspension (at least 3 characters).')
    .max(500, 'Keep the reason under 500 characters.'),
});
