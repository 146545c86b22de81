// A class's own measured items and the nozzle's check method, as the organiser states them in the
// class rules (lib/core/inputs/class-rules.ts takes them in). Messages are for the rules editor.
import { z } from 'zod';
import { DECISION_RULES, type DecisionRule } from '../engine/conformity';
import { ITEM_UNITS, type ItemUnit } from '../engine/measured-item';
import { INSTRUMENT_TYPES, type InstrumentType } from './instrument-types';
import { ITEM_KEY_PATTERN, MAX_ITEM_READINGS, MAX_MEASURED_ITEMS } from './measured-item-terms';

export {
  CHECK_METHODS,
  CHECK_METHOD_WORDS,
  ITEM_KEY_PATTERN,
  MAX_ITEM_READINGS,
  MAX_MEASURED_ITEMS,
  ownValue,
  type CheckMethod,
} from './measured-item-terms';

const limit = (what: string) =>
  z
    .number({ error: `Enter the ${what} as a number, or leave it empty.` })
    .positive(`The ${what} must be above zero.`)
    .max(1_000_000, `The ${what} must be at most 1000000.`)
    .nullable()
    .optional()
    .transform((v) => v ?? null);

export const MeasuredItemRule = z
  .object({
    key: z
      .string({ error: 'Give each item a key.' })
      .regex(
        ITEM_KEY_PATTERN,
        'Give the item a key of 2–40 lower-case letters, digits or underscores, starting with a letter (for example engine_capacity).',
      ),
    label: z
      .string({ error: 'Name the item.' })
      .trim()
      .min(2, 'Name the item (at least 2 characters).')
      .max(80, 'Keep the item’s name under 80 characters.'),
    unit: z.enum(ITEM_UNITS as unknown as [ItemUnit, ...ItemUnit[]], {
      error: 'Choose the item’s unit from the list.',
    }),
    minimum: limit('minimum'),
    maximum: limit('maximum'),
    readings: z
      .number({ error: 'Enter how many readings as a whole number.' })
      .int('Readings must be a whole number.')
      .min(1, 'Ask for at least one reading.')
      .max(MAX_ITEM_READINGS, `Ask for at most ${MAX_ITEM_READINGS} readings.`),
    instrumentTypes: z
      .array(z.enum(INSTRUMENT_TYPES as unknown as [InstrumentType, ...InstrumentType[]]), {
        error: 'Choose which kinds of instrument may be used.',
      })
      .min(1, 'Choose at least one kind of instrument that may be used.')
      .max(INSTRUMENT_TYPES.length)
      .refine((a) => new Set(a).size === a.length, 'Name each kind of instrument once.'),
    decisionRule: z
      .enum(DECISION_RULES as [DecisionRule, ...DecisionRule[]], { error: 'Choose a decision rule.' })
      .nullable()
      .optional()
      .transform((v) => v ?? null),
    defaultUncertainty: z
      .number({ error: 'Enter the item’s default expanded uncertainty U as a number.' })
      .min(0, 'Uncertainty cannot be negative.')
      .max(100_000, 'Keep U at or below 100000.'),
    note: z
      .string({ error: 'Enter the note as text.' })
      .trim()
      .max(200, 'Keep the note under 200 characters.')
      .optional()
      .transform((v) => v ?? ''),
    formula: z.discriminatedUnion(
      'kind',
      [
        z.object({ kind: z.literal('direct') }),
        z.object({
          kind: z.literal('engine_capacity'),
          cylinders: z
            .number({ error: 'Enter the number of cylinders.' })
            .int('The number of cylinders is a whole number.')
            .min(1, 'An engine has at least one cylinder.')
            .max(24, 'Keep the number of cylinders at or below 24.'),
        }),
      ],
      { error: 'Choose how the value is obtained (read directly, or engine capacity from bore and stroke).' },
    ),
  })
  .superRefine((item, ctx) => {
    if (item.minimum == null && item.maximum == null)
      ctx.addIssue({ code: 'custom', path: ['maximum'], message: 'Set a maximum or a minimum (or both).' });
    if (item.minimum != null && item.maximum != null && !(item.minimum < item.maximum))
      ctx.addIssue({ code: 'custom', path: ['minimum'], message: 'The minimum must be below the maximum.' });
    if (item.formula.kind === 'engine_capacity' && item.unit !== 'cm³')
      ctx.addIssue({
        code: 'custom',
        path: ['unit'],
        message: 'Engine capacity from bore and stroke is given in cm³.',
      });
  });
export type MeasuredItemRule = z.infer<typeof MeasuredItemRule>;

export const MeasuredItemRules = z
  .array(MeasuredItemRule, { error: 'List the measured items.' })
  .max(MAX_MEASURED_ITEMS, `A class may have at most ${MAX_MEASURED_ITEMS} measured items.`)
  .superRefine((items, ctx) => {
    const seen = new Set<string>();
    items.forEach((item, i) => {
      if (seen.has(item.key))
        ctx.addIssue({ code: 'custom', path: [i, 'key'], message: `The key ${item.key} is used twice.` });
      seen.add(item.key);
    });
  })
  .optional();

export const CHECK_METHOD_EXPLANATION =
  'Why the two can disagree: a round plug gauge only tests the largest circle that fits inside the exit. Take a maximum diameter of 102 mm and a no-go plug gauge of 102 mm. An oval exit 101.8 mm across its narrow axis and 102.3 mm across its wide axis stops the plug (the narrow axis is under 102 mm), so it passes the gauge check; yet a two-point reading across the wide axis is 102.3 mm, above the maximum, so it fails the two-point rule. For a minimum the two usually agree, but a go plug gauge tests the whole exit at once, while two-point readings test only the directions measured and can miss a narrow one. Say in the rule which one governs. (ISO 14405-1:2016 distinguishes the two-point size from the maximum inscribed size.)';
