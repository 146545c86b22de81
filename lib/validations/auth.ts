import { z } from 'zod';
import { EVENT_STAFF_ROLES } from '@/lib/constants';

// One schema per input, shared by the form and the server.
export const email = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }));

export const SignUpInput = z.object({
  name: z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(120, 'Keep the name under 120 characters.'),
  email,
  password: z
    .string({ error: 'Choose a password.' })
    .min(10, 'Use at least 10 characters for the password.')
    .max(200, 'Keep the password under 200 characters.'),
});
export type SignUpInput = z.infer<typeof SignUpInput>;

export const InviteStaffInput = z.object({
  email,
  role: z.enum(EVENT_STAFF_ROLES, { error: 'Choose a staff role.' }),
});
export type InviteStaffInput = z.infer<typeof InviteStaffInput>;

export const ChangePasswordInput = z.object({
  // Required when the account has a password (people invited by e-mail may have none yet).
  currentPassword: z.string().max(1000, 'That is not your current password.').optional().default(''),
  password: SignUpInput.shape.password,
});
