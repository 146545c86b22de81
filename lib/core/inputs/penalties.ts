// One zod schema per penalty and appeal input, shared by the forms and the route handlers.
import { z } from 'zod';
import { PENALTY_KINDS, PENALTY_AMOUNT_UNITS } from '../penalties/penalty-kinds';

const text = (min: number, max: number, tooShort: string) =>
  z.string({ error: tooShort }).trim().min(min, tooShort).max(max, `Keep this under ${max} characters.`);
const oneLine = (v: string) => !/[\r\n]/.test(v);

export const AddCatalogueItemInput = z
  .strictObject({
    code: z
      .string({ error: 'Give the penalty a short code (for example "T5").' })
      .trim()
      .regex(/^[A-Za-z0-9][A-Za-z0-9.-]{0,15}$/, 'Use up to 16 letters, digits, dots or hyphens (for example "T5").'),
    kind: z.enum(PENALTY_KINDS, { error: 'Choose the kind of penalty.' }),
    amount: z
      .number({ error: 'Enter the amount as a whole number.' })
      .int('Enter the amount as a whole number.')
      .min(1, 'The amount must be at least 1.')
      .max(10_000_000)
      .nullable()
      .default(null),
    label: text(3, 200, 'Describe the penalty in a few words (at least 3 characters).').refine(oneLine, 'One line.'),
    ruleReference: z
      .string()
      .trim()
      .max(120, 'Keep this under 120 characters.')
      .refine(oneLine, 'One line.')
      .default(''),
  })
  .superRefine((v, ctx) => {
    const unit = PENALTY_AMOUNT_UNITS[v.kind];
    if (unit && v.amount === null)
      ctx.addIssue({ code: 'custom', path: ['amount'], message: `Enter the amount (${unit}).` });
    if (!unit && v.amount !== null)
      ctx.addIssue({
        code: 'custom',
        path: ['amount'],
        message: 'This kind of penalty has no amount: leave it empty.',
      });
  });
export type AddCatalogueItemInput = z.infer<typeof AddCatalogueItemInput>;

export const FileTechnicalReportInput = z.strictObject({
  entryId: z.uuid({ error: 'Choose the entry you report.' }),
  ruleReference: text(1, 120, 'Name the rule concerned (for example "SS 2.1 nozzle maximum").').refine(
    oneLine,
    'One line.',
  ),
  facts: text(3, 4000, 'Write what was found (at least 3 characters).'),
  inspectionId: z.uuid({ error: 'Choose an inspection of this entry.' }).nullable().default(null),
});
export type FileTechnicalReportInput = z.infer<typeof FileTechnicalReportInput>;

export const ApplyPenaltyInput = z
  .strictObject({
    entryId: z.uuid({ error: 'Choose the entry.' }),
    catalogueItemId: z.uuid({ error: 'Choose a penalty from the catalogue.' }),
    protestId: z.uuid({ error: 'Choose an upheld protest.' }).nullable().default(null),
    technicalReportId: z.uuid({ error: 'Choose a technical report.' }).nullable().default(null),
    runLabel: z.string().trim().min(1).max(40).nullable().default(null),
    reason: text(3, 2000, 'Write the reason for the penalty (at least 3 characters).'),
  })
  .refine((v) => (v.protestId === null) !== (v.technicalReportId === null), {
    path: ['protestId'],
    error: 'Name the decision this penalty comes from: one upheld protest or one technical report.',
  });
export type ApplyPenaltyInput = z.infer<typeof ApplyPenaltyInput>;

export const LodgeAppealInput = z.strictObject({
  penaltyId: z.uuid({ error: 'Choose the penalty you appeal.' }),
  grounds: text(10, 4000, 'Write the grounds of the appeal (at least 10 characters).'),
});
export type LodgeAppealInput = z.infer<typeof LodgeAppealInput>;

export const ScheduleAppealHearingInput = z.strictObject({
  // An instant with its offset (the appeal body sits above any one meeting's time zone).
  hearingAt: z.iso.datetime({ offset: true, error: 'Give the hearing time with its offset (ISO 8601).' }),
  place: text(2, 200, 'Say where the hearing is held.').refine(oneLine, 'One line.'),
});

export const DecideAppealInput = z
  .strictObject({
    // superseded: another appeal's decision already ended the penalty; this one is closed without a hearing.
    outcome: z.enum(['confirmed', 'amended', 'annulled', 'superseded'], { error: 'Choose the decision.' }),
    reasons: text(10, 8000, 'Write the reasons for the decision (at least 10 characters).'),
    // When amended: the penalty that replaces the stewards' one.
    catalogueItemId: z.uuid({ error: 'Choose the replacing penalty from the catalogue.' }).nullable().default(null),
    runLabel: z.string().trim().min(1).max(40).nullable().default(null),
  })
  .refine((v) => (v.outcome === 'amended') === (v.catalogueItemId !== null), {
    path: ['catalogueItemId'],
    error: 'Choose the replacing penalty when (and only when) the decision is amended.',
  });
export type DecideAppealInput = z.infer<typeof DecideAppealInput>;
