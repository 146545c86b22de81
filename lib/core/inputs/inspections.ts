import { z } from 'zod';
import { SAFETY_ITEM_KEYS, type SafetyItem } from '../constants';
import { MATERIAL_OPTIONS, type Material } from '../engine/measurement';
import { InspectionSealsInput } from './seals';
import { INSTRUMENT_TYPES } from './instrument-types';
import { ITEM_KEY_PATTERN, MAX_ITEM_READINGS, MAX_MEASURED_ITEMS } from './measured-item-terms';
import { INSPECTION_KINDS, POWER_EVIDENCE_KINDS, checkCapturedAt } from './inspection-terms';
import { READING_FIELDS, type ReadingField } from '../engine/measured-item';

// Inspection input, shared by the dock form (also offline, before queuing) and the server.
// Figures arrive as JSON numbers in mm, degrees, °C, kg and kW; a string for a number is refused.
// What depends on the class (how many readings, which safety items) is checked against the rule
// version in force by lib/core/inspections/decide-inspection.ts, which names the same fields.

export {
  INSPECTION_KINDS,
  INSPECTION_KIND_LABELS,
  INSPECTION_PHOTO_MAX_BYTES,
  INSPECTION_PHOTOS_PER_UPLOAD,
  MAX_AGE_MS,
  MAX_FUTURE_MS,
  POWER_EVIDENCE_KINDS,
  POWER_EVIDENCE_KIND_WORDS,
  checkCapturedAt,
  type InspectionKind,
  type PowerEvidenceKind,
} from './inspection-terms';

const num = (what: string, unit: string) =>
  z.number({
    error: (iss) =>
      iss.input === undefined || iss.input === null
        ? `Enter ${what} (${unit}).`
        : `Enter ${what} as a number (${unit}).`,
  });
const optionalNum = (what: string, unit: string) =>
  z
    .number({ error: `Enter ${what} as a number (${unit}), or leave it empty.` })
    .nullable()
    .optional()
    .transform((v) => v ?? null);
const temperature = (what: string) =>
  optionalNum(what, '°C').pipe(
    z
      .number()
      .min(-30, 'Temperatures run from -30 to 70 °C.')
      .max(70, 'Temperatures run from -30 to 70 °C.')
      .nullable(),
  );
const uuid = (what: string) => z.uuid({ error: `Choose ${what}.` });
const optionalUuid = (what: string) =>
  uuid(what)
    .nullable()
    .optional()
    .transform((v) => v ?? null);
const text = (what: string, max: number) =>
  z
    .string({ error: `Enter ${what} as text.` })
    .trim()
    .max(max, `Keep ${what} under ${max} characters.`);

const MATERIALS = MATERIAL_OPTIONS.map((m) => m.value) as [Material, ...Material[]];

export const NozzleReading = z.object({
  // Exclusive bounds: a diameter of 0 or below, or a metre and more, is a typing slip, not a nozzle.
  diameterMm: num('the diameter', 'mm')
    .gt(0, 'A diameter must be above 0 mm.')
    .lt(1000, 'A diameter must be below 1000 mm.'),
  angleDeg: num('the angle', '°').min(0, 'Angles run from 0 to 359°.').max(359, 'Angles run from 0 to 359°.'),
});

/** One reading of a class's measured item: { value } read directly, or { boreMm, strokeMm } for engine capacity. */
export const ItemReadingInput = z
  .partialRecord(
    z.enum(READING_FIELDS as unknown as [ReadingField, ...ReadingField[]], {
      error: 'A reading has only the fields value, boreMm or strokeMm.',
    }),
    num('the reading', 'the item’s unit')
      .gt(0, 'A reading must be above 0.')
      .lt(1_000_000, 'A reading must be below 1000000.'),
  )
  .refine((r) => Object.keys(r).length > 0, 'Enter the reading.');

/** The readings of one measured item of the class (which items and how many readings: the class rules). */
export const MeasuredItemInput = z.object({
  key: z.string({ error: 'Name the item by its key.' }).regex(ITEM_KEY_PATTERN, 'This is not an item key.'),
  instrumentId: optionalUuid('an instrument'),
  readings: z
    .array(ItemReadingInput, { error: 'List the item’s readings.' })
    .min(1, 'Enter at least one reading.')
    .max(MAX_ITEM_READINGS * 2, `Enter at most ${MAX_ITEM_READINGS * 2} readings.`),
});
export type MeasuredItemInput = z.infer<typeof MeasuredItemInput>;

/** A go/no-go gauge check of a size limit (the nozzle exit): which gauge, and whether the part passed. */
export const GaugeCheckInput = z
  .object({
    rule: z.enum(['nozzle'], { error: 'Gauge checks are made on the nozzle exit.' }),
    /** The gauge's identity as marked on it (size, serial), when it is not on the instruments list. */
    gauge: text('the gauge’s identity', 120).default(''),
    instrumentId: optionalUuid('the gauge'),
    passed: z.boolean({ error: 'Say whether the gauge check passed.' }),
  })
  .superRefine((g, ctx) => {
    if (!g.instrumentId && !g.gauge)
      ctx.addIssue({ code: 'custom', path: ['gauge'], message: 'Say which gauge was used (its marking or serial).' });
  });
export type GaugeCheckInput = z.infer<typeof GaugeCheckInput>;

export const RecordInspectionInput = z
  .object({
    idempotencyKey: z.uuid({ error: 'The record key must be a UUID made on the device.' }),
    entryId: uuid('the boat’s entry'),
    /** The boat's declaration version the dock showed: the record checks that one (older clients send none). */
    declarationVersion: z
      .number({ error: 'Give the declaration version as a whole number.' })
      .int('Give the declaration version as a whole number.')
      .min(1, 'Give the declaration version as a whole number.')
      .nullable()
      .optional()
      .transform((v) => v ?? null),
    kind: z.enum(INSPECTION_KINDS, { error: 'Choose the kind of inspection.' }).default('pre_race'),
    capturedAt: z.iso.datetime({ offset: true, error: 'Give the time of the inspection as an ISO date and time.' }),
    device: text('the device name', 80).default(''),
    nozzle: z
      .object({
        readings: z
          .array(NozzleReading, { error: 'List the nozzle readings.' })
          .min(1, 'Enter at least one reading.')
          .max(24, 'Enter at most 24 readings.'),
        instrumentId: optionalUuid('an instrument'),
        expandedUncertaintyMm: optionalNum('the expanded uncertainty U', 'mm').pipe(
          z
            .number()
            // No measurement has U = 0: the instrument's resolution alone contributes (JCGM 100:2008, F.2.2.1).
            .gt(0, 'U must be above zero: every reading carries at least its resolution.')
            .max(5, 'An uncertainty above 5 mm is not credible.')
            .nullable(),
        ),
        /** The part's temperature under its older name (records queued before the instrument's temperature was asked). */
        temperatureC: temperature('the nozzle temperature'),
        /** The part's (nozzle's) temperature when measured. */
        partTemperatureC: temperature('the nozzle temperature'),
        /** The instrument's temperature; absent: taken as 20 °C (the record says so). */
        instrumentTemperatureC: temperature('the instrument temperature'),
        /** One thermometer reading for both (the form's "same as the part"). */
        instrumentAtPartTemperature: z
          .boolean({ error: 'Say whether the instrument is at the nozzle’s temperature.' })
          .optional()
          .default(false),
        material: z
          .enum(MATERIALS, { error: 'Choose the nozzle material.' })
          .nullable()
          .optional()
          .transform((v) => v ?? null),
        /** The instrument's material when the instrument has none on file; absent: steel, said in the record. */
        instrumentMaterial: z
          .enum(MATERIALS, { error: 'Choose the instrument’s material.' })
          .nullable()
          .optional()
          .transform((v) => v ?? null),
      })
      .superRefine((n, ctx) => {
        if (n.temperatureC != null && n.partTemperatureC != null && n.temperatureC !== n.partTemperatureC)
          ctx.addIssue({
            code: 'custom',
            path: ['partTemperatureC'],
            message: 'Give the nozzle temperature once (partTemperatureC, or the older temperatureC).',
          });
        if (n.instrumentAtPartTemperature && n.instrumentTemperatureC != null)
          ctx.addIssue({
            code: 'custom',
            path: ['instrumentTemperatureC'],
            message: 'Give the instrument’s temperature, or say it is the same as the nozzle’s, not both.',
          });
        if (n.instrumentAtPartTemperature && n.temperatureC == null && n.partTemperatureC == null)
          ctx.addIssue({
            code: 'custom',
            path: ['partTemperatureC'],
            message: 'Enter the nozzle temperature (°C): the instrument is said to be at it.',
          });
      })
      // One name for the part's temperature from here on: temperatureC and partTemperatureC agree.
      .transform((n) => {
        const part = n.partTemperatureC ?? n.temperatureC;
        return { ...n, temperatureC: part, partTemperatureC: part };
      }),
    weight: z
      .object({
        readingsKg: z
          .array(
            num('the weighing', 'kg')
              .gt(0, 'A weighing must be above 0 kg.')
              .lt(20000, 'A weighing must be below 20000 kg.'),
          )
          .max(6, 'Enter at most 6 weighings.'),
        instrumentId: optionalUuid('a scale'),
      })
      .nullable()
      .optional()
      .transform((v) => (v && v.readingsKg.length ? v : null)),
    power: z.object({
      declaredKw: num('the power', 'kW').gt(0, 'Power must be above 0 kW.').lt(10000, 'Power must be below 10000 kW.'),
      evidenceSeen: z.boolean({ error: 'Say whether the power evidence was seen.' }),
      note: text('the power note', 500).default(''),
      /** What the evidence was (older clients send only evidenceSeen). */
      evidenceKind: z
        .enum(POWER_EVIDENCE_KINDS, { error: 'Choose the kind of evidence seen for the power.' })
        .nullable()
        .optional()
        .transform((v) => v ?? null),
      /** The boat's uploaded document that is the dyno sheet, when there is one. */
      dynoDocumentId: optionalUuid('the dyno sheet document'),
    }),
    // The seal register: seals checked, applied and removed at this inspection (lib/core/inputs/seals.ts).
    // An empty list is what a record queued on a phone before the register carries: no seal actions.
    seals: z.preprocess(
      (v) => (Array.isArray(v) && v.length === 0 ? undefined : v),
      InspectionSealsInput.default({ checks: [], applied: [], removed: [] }),
    ),
    safety: z
      .partialRecord(
        z.enum(SAFETY_ITEM_KEYS as [SafetyItem, ...SafetyItem[]]),
        z.boolean({ error: 'Tick or untick each safety item.' }),
      )
      .default({}),
    /** The class's own measured items (older clients send none). */
    measuredItems: z
      .array(MeasuredItemInput, { error: 'List the measured items.' })
      .max(MAX_MEASURED_ITEMS, `Enter at most ${MAX_MEASURED_ITEMS} measured items.`)
      .default([]),
    gaugeChecks: z
      .array(GaugeCheckInput, { error: 'List the gauge checks.' })
      .max(4, 'Enter at most 4 gauge checks.')
      .default([]),
    notes: text('the notes', 2000).default(''),
    supersedesId: optionalUuid('the record to correct'),
    correctionReason: text('the reason for the correction', 1000)
      .nullable()
      .optional()
      .transform((v) => v || null),
    reinspectionId: optionalUuid('the re-inspection task'),
  })
  .superRefine((v, ctx) => {
    if (v.nozzle.instrumentId && v.nozzle.expandedUncertaintyMm != null) {
      ctx.addIssue({
        code: 'custom',
        path: ['nozzle', 'expandedUncertaintyMm'],
        message: 'Choose an instrument or type U, not both.',
      });
    }
    const kind = v.power.evidenceKind;
    if (kind && (kind !== 'declaration_only') !== v.power.evidenceSeen) {
      ctx.addIssue({
        code: 'custom',
        path: ['power', 'evidenceKind'],
        message:
          kind === 'declaration_only'
            ? 'Declaration only means no evidence was seen.'
            : 'A dyno sheet or maker’s rating means the evidence was seen.',
      });
    }
    if (v.power.dynoDocumentId && kind !== 'dyno_sheet') {
      ctx.addIssue({
        code: 'custom',
        path: ['power', 'dynoDocumentId'],
        message: 'A document is named only for a dyno sheet.',
      });
    }
    const keys = new Set<string>();
    v.measuredItems.forEach((m, i) => {
      if (keys.has(m.key))
        ctx.addIssue({
          code: 'custom',
          path: ['measuredItems', i, 'key'],
          message: `The item ${m.key} is given twice.`,
        });
      keys.add(m.key);
    });
    const gauged = new Set<string>();
    v.gaugeChecks.forEach((g, i) => {
      if (gauged.has(g.rule))
        ctx.addIssue({ code: 'custom', path: ['gaugeChecks', i, 'rule'], message: 'Give one gauge check per limit.' });
      gauged.add(g.rule);
    });
    const when = checkCapturedAt(v.capturedAt);
    if (when) ctx.addIssue({ code: 'custom', path: ['capturedAt'], message: when });
    if (v.supersedesId && !v.correctionReason) {
      ctx.addIssue({
        code: 'custom',
        path: ['correctionReason'],
        message: 'Say why the earlier record is being corrected.',
      });
    }
  });
export type RecordInspectionInput = z.infer<typeof RecordInspectionInput>;
/** What the form builds before parsing (defaults not yet applied). */
export type RecordInspectionDraft = z.input<typeof RecordInspectionInput>;

export const RequestReinspectionInput = z.object({
  entryIds: z
    .array(uuid('an entry'), { error: 'Choose the entries to re-inspect.' })
    .min(1, 'Choose at least one entry.')
    .max(60, 'Choose at most 60 entries at once.'),
  reason: text('the reason', 500).min(3, 'Say why (for example “top three, heat 2”).'),
});
export type RequestReinspectionInput = z.infer<typeof RequestReinspectionInput>;

export const AddInstrumentInput = z
  .object({
    name: text('the instrument’s name', 120).min(2, 'Name the instrument (at least 2 characters).'),
    quantity: z.enum(['length', 'mass'], { error: 'Choose what it measures: length (mm) or mass (kg).' }),
    errorLimit: optionalNum('the error limit', 'mm or kg').pipe(
      z
        .number()
        .min(0, 'The error limit cannot be negative.')
        .max(100, 'Keep the error limit at or below 100.')
        .nullable(),
    ),
    resolution: optionalNum('the resolution', 'mm or kg').pipe(
      z
        .number()
        .min(0, 'The resolution cannot be negative.')
        .max(100, 'Keep the resolution at or below 100.')
        .nullable(),
    ),
    expandedUncertainty: optionalNum('the expanded uncertainty U', 'mm or kg').pipe(
      z.number().min(0, 'U cannot be negative.').max(100, 'Keep U at or below 100.').nullable(),
    ),
    // What identifies it (all optional: an instrument added before calibration records had none).
    instrumentType: z
      .enum(INSTRUMENT_TYPES, { error: 'Choose the kind of instrument from the list.' })
      .nullable()
      .optional()
      .transform((v) => v ?? null),
    serial: text('the serial number', 80)
      .nullable()
      .optional()
      .transform((v) => (v ? v : null)),
    rangeMin: optionalNum('the start of the measuring range', 'mm or kg'),
    rangeMax: optionalNum('the end of the measuring range', 'mm or kg'),
    material: text('the material', 40)
      .nullable()
      .optional()
      .transform((v) => (v ? v : null)),
  })
  .superRefine((v, ctx) => {
    if (v.errorLimit == null && v.resolution == null && v.expandedUncertainty == null) {
      ctx.addIssue({
        code: 'custom',
        path: ['errorLimit'],
        message: 'Give the error limit and resolution, or the certificate’s U.',
      });
    }
    if (v.rangeMin != null && v.rangeMax != null && v.rangeMax <= v.rangeMin)
      ctx.addIssue({ code: 'custom', path: ['rangeMax'], message: 'The range ends above where it starts.' });
  });
export type AddInstrumentInput = z.infer<typeof AddInstrumentInput>;

export const BOARD_RESULT_FILTERS = [
  'waiting',
  'conforms',
  'does_not_conform',
  'inconclusive',
  'reinspection',
] as const;
export type BoardResultFilter = (typeof BOARD_RESULT_FILTERS)[number];
