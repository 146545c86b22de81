import { z } from 'zod';
import { SAFETY_ITEM_KEYS } from '@/lib/core/constants';
import { convertPower } from '@/lib/core/engine/units';
import { DECISION_RULES } from '@/lib/core/engine/conformity';
import { BURDENS_OF_PROOF, DEFAULT_BURDEN_OF_PROOF } from '@/lib/core/engine/conformity-burden';
import { CHECK_METHODS, MeasuredItemRules } from './measured-item-rules';
import { REPORT_MODELS } from '../reports/matched-figures';

// Class rules: fixed before measuring (ISO/IEC 17025:2017, 7.1.3), stored as a versioned document.
const positive = (what: string, max: number) =>
  z
    .number({ error: `Enter ${what} as a number.` })
    .positive(`${what} must be above zero.`)
    .max(max, `${what} must be at most ${max}.`);
const optionalPositive = (what: string, max: number) =>
  positive(what, max)
    .nullable()
    .optional()
    .transform((v) => v ?? null);

const ParityAssumptions = z.object({
  pumpEfficiency: z
    .number({ error: 'Enter the pump efficiency.' })
    .gt(0, 'Pump efficiency must be above 0.')
    .max(1, 'Pump efficiency cannot exceed 1.'),
  nozzleLossCoefficient: z
    .number({ error: 'Enter the nozzle loss coefficient.' })
    .min(0, 'Loss coefficients cannot be negative.')
    .lt(1, 'Loss coefficients must be below 1.'),
  inletLossCoefficient: z
    .number({ error: 'Enter the inlet loss coefficient.' })
    .min(0, 'Loss coefficients cannot be negative.')
    .lt(1, 'Loss coefficients must be below 1.'),
  wakeFraction: z
    .number({ error: 'Enter the wake fraction.' })
    .min(0, 'The wake fraction cannot be negative.')
    .lt(1, 'The wake fraction must be below 1.'),
  referenceSpeedsMs: z
    .array(
      z
        .number({ error: 'Type each reference speed as a number in m/s, for example 10, 20, 30.' })
        .min(0, 'Speeds cannot be negative.')
        .max(60, 'Keep reference speeds at or below 60 m/s.'),
      { error: 'List the reference speeds.' },
    )
    .min(1, 'Give at least one reference speed.')
    .max(8, 'Give at most 8 reference speeds.'),
  /**
   * The report's model: fixed power for every boat, or the matched model (engine curve × pump curve) for
   * each boat that declared both (lib/core/reports/matched-figures.ts). Absent in older rules: fixed power.
   */
  reportModel: z.enum(REPORT_MODELS, { error: 'Choose the report’s model.' }).optional(),
});

const share = (what: string) =>
  z
    .number({ error: `Enter the ${what} share as a number.` })
    .gt(0, `The ${what} share must be above 0.`)
    .max(1, `The ${what} share must be at most 1 (100 %).`);

/** The stored rules document (all figures in SI-based units: mm, kW, kg). */
export const ClassRules = z
  .object({
    nozzle: z.object({
      maxMm: optionalPositive('The maximum nozzle diameter', 1000),
      minMm: optionalPositive('The minimum nozzle diameter', 1000),
      minReadings: z
        .number()
        .int('Readings must be a whole number.')
        .min(1, 'Ask for at least one reading.')
        .max(12, 'Ask for at most 12 readings.'),
      defaultUncertaintyMm: z
        .number({ error: 'Enter the nozzle measurement uncertainty.' })
        .min(0, 'Uncertainty cannot be negative.')
        .max(5, 'An uncertainty above 5 mm is not credible.'),
      /** Which check governs the diameter limits (absent: two-point readings, as before gauges). */
      checkMethod: z.enum(CHECK_METHODS, { error: 'Choose how the nozzle limits are checked.' }).optional(),
      gaugeNoGoMm: positive('The no-go gauge size', 1000).nullable().optional(),
      gaugeGoMm: positive('The go gauge size', 1000).nullable().optional(),
    }),
    power: z.object({
      minKw: optionalPositive('The minimum power', 10000),
      maxKw: optionalPositive('The maximum power', 10000),
      defaultUncertaintyKw: z.number().min(0, 'Uncertainty cannot be negative.').max(500),
      /**
       * The class's own expanded power uncertainty (k = 2) per kind of evidence, as a share of the power;
       * absent: the common-practice shares (lib/core/reports/power-uncertainty.ts).
       */
      evidenceShares: z
        .strictObject({
          dyno_sheet: share('dyno sheet'),
          maker_rating: share('maker’s rating'),
          declaration_only: share('declaration only'),
        })
        // Better evidence never carries more doubt: a dyno sheet at most a maker's rating, that at most a
        // bare declaration (common practice, no source).
        .refine((s) => s.dyno_sheet <= s.maker_rating, {
          path: ['maker_rating'],
          message: 'A maker’s rating cannot be surer than a dyno sheet: give it a share at least the dyno sheet’s.',
        })
        .refine((s) => s.maker_rating <= s.declaration_only, {
          path: ['declaration_only'],
          message: 'A bare declaration cannot be surer than a maker’s rating: give it a share at least the rating’s.',
        })
        .optional(),
    }),
    weight: z.object({
      minKg: optionalPositive('The minimum weight', 20000),
      includesDriver: z.boolean(),
      defaultUncertaintyKg: z.number().min(0, 'Uncertainty cannot be negative.').max(100),
    }),
    decisionRule: z.enum(DECISION_RULES as ['simple', 'guarded', 'iso14253'], { error: 'Choose a decision rule.' }),
    safetyItems: z.array(z.enum(SAFETY_ITEM_KEYS as [string, ...string[]])).max(SAFETY_ITEM_KEYS.length),
    parity: ParityAssumptions,
    /**
     * Who must prove, per context (ISO 14253-1:2017; ILAC-G8:09/2019). Optional so that rules stored
     * before it stay valid: readers apply DEFAULT_BURDEN_OF_PROOF (resolveBurdenRules).
     */
    burdenOfProof: z
      .object({
        inspection: z.enum(BURDENS_OF_PROOF, { error: 'Choose who must prove at inspection.' }),
        protest: z.enum(BURDENS_OF_PROOF, { error: 'Choose who must prove in a protest.' }),
      })
      .optional(),
    /** The class's own measured items (optional: rules stored before them have none). */
    measuredItems: MeasuredItemRules,
  })
  .superRefine((r, ctx) => {
    const n = r.nozzle;
    if (n.checkMethod === 'gauge' || n.checkMethod === 'both') {
      if (n.maxMm != null && n.gaugeNoGoMm == null)
        ctx.addIssue({
          code: 'custom',
          path: ['nozzle', 'gaugeNoGoMm'],
          message: 'Give the no-go plug gauge’s size for the maximum.',
        });
      if (n.maxMm != null && n.gaugeNoGoMm != null && n.gaugeNoGoMm > n.maxMm)
        ctx.addIssue({
          code: 'custom',
          path: ['nozzle', 'gaugeNoGoMm'],
          message: 'The no-go gauge may not be larger than the maximum: an exit above the maximum could still stop it.',
        });
      if (n.minMm != null && n.gaugeGoMm == null)
        ctx.addIssue({
          code: 'custom',
          path: ['nozzle', 'gaugeGoMm'],
          message: 'Give the go plug gauge’s size for the minimum.',
        });
      if (n.minMm != null && n.gaugeGoMm != null && n.gaugeGoMm < n.minMm)
        ctx.addIssue({
          code: 'custom',
          path: ['nozzle', 'gaugeGoMm'],
          message: 'The go gauge may not be smaller than the minimum: an exit below the minimum could still admit it.',
        });
    }
    if (r.nozzle.maxMm != null && r.nozzle.minMm != null && r.nozzle.minMm > r.nozzle.maxMm)
      ctx.addIssue({
        code: 'custom',
        path: ['nozzle', 'minMm'],
        message: 'The minimum nozzle diameter is above the maximum.',
      });
    if (r.power.maxKw != null && r.power.minKw != null && r.power.minKw > r.power.maxKw)
      ctx.addIssue({ code: 'custom', path: ['power', 'minKw'], message: 'The minimum power is above the maximum.' });
    if (r.nozzle.maxMm == null && r.nozzle.minMm == null)
      ctx.addIssue({
        code: 'custom',
        path: ['nozzle', 'maxMm'],
        message: 'Set a maximum or a minimum nozzle diameter (or both).',
      });
  });
export type ClassRules = z.infer<typeof ClassRules>;

/** What the rules form sends: power may be entered in kW, hp or PS; it is stored in kW. */
export const ClassRulesForm = z
  .object({
    powerUnit: z.enum(['kW', 'hp', 'PS']).default('kW'),
    rules: z.unknown(),
  })
  .transform((v, ctx) => {
    const raw = v.rules as
      { power?: { minKw?: number | null; maxKw?: number | null; defaultUncertaintyKw?: number } } | undefined;
    const toKw = (x: number | null | undefined) => (typeof x === 'number' ? convertPower(x, v.powerUnit, 'kW') : x);
    const rules =
      raw && typeof raw === 'object' && raw.power
        ? {
            ...raw,
            power: {
              ...raw.power,
              minKw: toKw(raw.power.minKw),
              maxKw: toKw(raw.power.maxKw),
              defaultUncertaintyKw: toKw(raw.power.defaultUncertaintyKw),
            },
          }
        : raw;
    const parsed = ClassRules.safeParse(rules);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) ctx.addIssue({ ...issue, path: ['rules', ...issue.path] } as never);
      return z.NEVER;
    }
    return parsed.data;
  });

/**
 * Sensible starting rules for a new class; the organiser edits them. Three readings and the
 * uncertainties are common practice (no source); the decision rule is ISO 14253-1:2017 conformity.
 */
export const DEFAULT_CLASS_RULES: ClassRules = {
  nozzle: { maxMm: null, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: null, maxKw: null, defaultUncertaintyKw: 5 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: ['kill_switch', 'helmet', 'life_jacket', 'harness', 'fire_extinguisher', 'tow_point'],
  // ISO 14253-1:2017: the entrant proves conformity at inspection, the protester non-conformity in a protest.
  burdenOfProof: { ...DEFAULT_BURDEN_OF_PROOF },
  // MIT 2.611 course notes use eta_p = 0.9 and K_i = 0.2; K_n = 0.02 is a typical nozzle loss [partly memory].
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10, 20, 30],
  },
};

export const CreateClassInput = z.object({
  name: z
    .string({ error: 'Name the class.' })
    .trim()
    .min(2, 'Name the class (at least 2 characters).')
    .max(80, 'Keep the class name under 80 characters.'),
  code: z
    .string({ error: 'Give the class a short code.' })
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9-]{1,12}$/, 'Use 1–12 letters, digits or dashes for the code.'),
  description: z.string().trim().max(2000, 'Keep the description under 2000 characters.').default(''),
  copyFromClassId: z.uuid({ error: 'Choose a class to copy from.' }).nullable().optional(),
});
export type CreateClassInput = z.infer<typeof CreateClassInput>;

export const PublishRulesInput = z.object({
  changeNote: z.string().trim().max(2000, 'Keep the note under 2000 characters.').default(''),
  effectiveFrom: z.iso
    .datetime({ offset: true, error: 'Give the effective time as a date and time.' })
    .nullable()
    .optional(),
});
