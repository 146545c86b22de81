// Publishing a class's parity report: the organiser's note for its readers.
import { z } from 'zod';

export const PublishReportInput = z.object({
  note: z.string().trim().max(4000, 'Keep the note under 4000 characters.').default(''),
});
