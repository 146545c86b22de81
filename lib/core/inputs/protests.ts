// One zod schema per protest input, shared by the forms and the route handlers.
import { z } from 'zod';
import { REQUESTED_CHECKS } from '../protests/protest-states';

const CHECK_KEYS = Object.keys(REQUESTED_CHECKS) as [
  keyof typeof REQUESTED_CHECKS,
  ...(keyof typeof REQUESTED_CHECKS)[],
];
const text = (min: number, max: number, tooShort: string) =>
  z.string({ error: tooShort }).trim().min(min, tooShort).max(max, `Keep this under ${max} characters.`);

export const LodgeProtestInput = z
  .strictObject({
    againstEntryId: z.uuid({ error: 'Choose the entry you protest.' }).optional(),
    againstResultId: z.uuid({ error: 'Choose the results version you protest.' }).optional(),
    ruleReference: text(1, 120, 'Name the rule you say is broken (for example "SS 2.1 nozzle maximum").'),
    grounds: text(
      10,
      4000,
      'Write the grounds: what you saw or measured and why it breaks the rule (at least 10 characters).',
    ),
    requestedChecks: z
      .array(z.enum(CHECK_KEYS, { error: 'Choose checks from the list.' }))
      .max(CHECK_KEYS.length)
      .default([]),
  })
  .refine((v) => Boolean(v.againstEntryId) !== Boolean(v.againstResultId), {
    path: ['againstEntryId'],
    error: 'Choose one entry (or one results version) to protest.',
  });
export type LodgeProtestInput = z.infer<typeof LodgeProtestInput>;

export const AcceptProtestInput = z.strictObject({ note: z.string().trim().max(2000).default('') });

export const RejectProtestInput = z.strictObject({
  code: z.enum(['out_of_time', 'no_fee', 'wrong_form'], { error: 'Choose why the protest is invalid.' }),
  reasons: text(5, 4000, 'Give the reasons for the rejection.'),
});

export const OrderReinspectionInput = z.strictObject({
  reason: text(3, 1000, 'Say what the scrutineers should check.'),
});

export const ScheduleHearingInput = z.strictObject({
  // A datetime-local value, read in the meeting's time zone.
  hearingAt: z
    .string({ error: 'Choose the hearing date and time.' })
    .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'Choose the hearing date and time.'),
  place: text(2, 200, 'Say where the hearing is held.'),
});

export const DecideProtestInput = z
  .strictObject({
    outcome: z.enum(['upheld', 'dismissed', 'withdrawn'], { error: 'Choose the decision.' }),
    reasons: text(10, 8000, 'Write the reasons for the decision (at least 10 characters).'),
    penalty: z.string().trim().max(1000, 'Keep the penalty under 1000 characters.').default(''),
    panelIds: z.array(z.uuid()).max(10).default([]), // other stewards of the meeting who sat
  })
  .refine((v) => v.outcome === 'upheld' || v.penalty === '', {
    path: ['penalty'],
    error: 'A penalty goes only with an upheld protest.',
  });
export type DecideProtestInput = z.infer<typeof DecideProtestInput>;

export const EvidenceNoteInput = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('note'), note: text(3, 4000, 'Write the note (a witness statement, say).') }),
  z.strictObject({
    kind: z.literal('inspection_link'),
    inspectionId: z.uuid({ error: 'Choose an inspection record.' }),
  }),
]);
