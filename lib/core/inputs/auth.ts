import { z } from 'zod';
import { EVENT_STAFF_ROLES } from '@/lib/core/constants';

// One schema per input, shared by the form and the server.
export const email = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }));

/**
 * A person's name as others see it (greetings, staff lists, records, e-mails): 1–120 characters,
 * trimmed. Control characters (line breaks could forge lines in an e-mail) and the bidirectional
 * overrides and isolates of Unicode Standard Annex #9 (which can make shown text read backwards,
 * CVE-2021-42574) are refused; joiners used in written names (U+200C, U+200D) are kept.
 */
export const personName = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, 'Enter your name.')
  .max(120, 'Keep the name under 120 characters.')
  .refine(
    (v) => !/[\p{Cc}\u202A-\u202E\u2066-\u2069\u2028\u2029]/u.test(v),
    'Use letters, spaces and punctuation only in the name.',
  );

export const SignUpInput = z.object({
  name: personName,
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

/** My account: the name others see. */
export const ChangeNameInput = z.object({ name: personName });

/** Accepting a staff invitation: the name is asked for only when the account has none yet. */
export const AcceptInvitationInput = z.object({
  token: z.string().min(1).max(200),
  name: personName.optional(),
});
