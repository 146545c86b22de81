// One zod schema per declared-interest input, shared by the register form and the route handlers.
import { z } from 'zod';

export const INTEREST_KIND_LABELS = {
  boat: 'A boat at this meeting',
  entrant: 'An entrant (a person) at this meeting',
  team: 'A team, club or sponsor (name it)',
} as const;
export type InterestKind = keyof typeof INTEREST_KIND_LABELS;
export const INTEREST_KIND_SHORT: Record<InterestKind, string> = { boat: 'Boat', entrant: 'Entrant', team: 'Team' };

const text = (min: number, max: number, tooShort: string) =>
  z.string({ error: tooShort }).trim().min(min, tooShort).max(max, `Keep this under ${max} characters.`);
const statement = text(5, 1000, 'Say in a sentence what the interest is (for example "I crew for this boat").');

export const DeclareInterestInput = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('boat'), boatId: z.uuid({ error: 'Choose the boat.' }), statement }),
    z.strictObject({ kind: z.literal('entrant'), entrantId: z.uuid({ error: 'Choose the entrant.' }), statement }),
    z.strictObject({ kind: z.literal('team'), teamName: text(2, 120, 'Name the team, club or sponsor.'), statement }),
  ],
  { error: 'Choose what the interest is in: a boat, an entrant or a team.' },
);
export type DeclareInterestInput = z.infer<typeof DeclareInterestInput>;

export const WithdrawInterestInput = z.strictObject({
  reason: text(3, 500, 'Say why the interest no longer applies (for example "declared by mistake").'),
});
