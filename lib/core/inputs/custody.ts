import { z } from 'zod';

// Taking a part into custody at the dock, and releasing it.
export const TakeIntoCustodyInput = z.strictObject({
  raceNumber: z
    .number({ error: 'Enter the race number.' })
    .int('Enter the race number as a whole number.')
    .min(1, 'Race numbers run from 1 to 9999.')
    .max(9999, 'Race numbers run from 1 to 9999.'),
  description: z
    .string({ error: 'Describe the part.' })
    .trim()
    .min(3, 'Describe the part (at least 3 characters).')
    .max(500, 'Keep the description under 500 characters.'),
  sealNumber: z
    .string()
    .trim()
    .max(40, 'Keep the seal or bag number under 40 characters.')
    .nullable()
    .optional()
    .transform((v) => v || null),
  protestId: z
    .uuid({ error: 'Choose the protest.' })
    .nullable()
    .optional()
    .transform((v) => v?.toLowerCase() ?? null),
});
export type TakeIntoCustodyInput = z.infer<typeof TakeIntoCustodyInput>;

export const ReleaseFromCustodyInput = z.strictObject({
  releasedTo: z
    .string({ error: 'Say who receives the part.' })
    .trim()
    .min(2, 'Say who receives the part.')
    .max(200, 'Keep this under 200 characters.'),
  note: z.string().trim().max(1000, 'Keep the note under 1000 characters.').default(''),
});
