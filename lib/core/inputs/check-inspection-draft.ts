// The dock's offline check of an inspection record, without zod (zod was about 28 KB of the dock's
// first-load JavaScript). It gives what RecordInspectionInput (./inspections.ts, the server's schema)
// gives for the same draft: accept or refuse, the same field paths and messages, and the same parsed
// record. It follows zod 4's order: a field's own checks run after its type is right, an object's
// cross-field checks run only when nothing inside it had the wrong type, and a transform runs only on a
// value with no problem. tests/unit/core/inputs/check-inspection-draft.test.ts runs both over one
// table of drafts; change the two together.
import { SAFETY_ITEM_KEYS } from '../constants';
import { MATERIAL_OPTIONS } from '../engine/measurement';
import { READING_FIELDS } from '../engine/measured-item';
import { INSPECTION_KINDS, POWER_EVIDENCE_KINDS, checkCapturedAt } from './inspection-terms';
import { ITEM_KEY_PATTERN, MAX_ITEM_READINGS, MAX_MEASURED_ITEMS } from './measured-item-terms';
import { SEAL_CHECK_STATES, SEAL_NUMBER_PATTERN } from './seal-terms';
import type { RecordInspectionInput } from './inspections';

type Path = (string | number)[];
/** fatal: zod's non-continuable issue (a wrong type or value): the enclosing object's cross-field checks are skipped. */
type Issue = { path: Path; message: string; fatal: boolean };
export type DraftCheck =
  | { success: true; data: RecordInspectionInput }
  | { success: false; fieldErrors: Record<string, string>; issues: { field: string; message: string }[] };

// The patterns zod 4.6 uses for z.uuid() and z.iso.datetime({ offset: true }) (zod/v4/core/regexes.js).
const UUID =
  /^([0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[1-8][0-9a-fA-F]{3}-[89abAB][0-9a-fA-F]{3}-[0-9a-fA-F]{12}|00000000-0000-0000-0000-000000000000|ffffffff-ffff-ffff-ffff-ffffffffffff)$/;
const DATE = `(?:(?:\\d\\d[2468][048]|\\d\\d[13579][26]|\\d\\d0[48]|[02468][048]00|[13579][26]00)-02-29|\\d{4}-(?:(?:0[13578]|1[02])-(?:0[1-9]|[12]\\d|3[01])|(?:0[469]|11)-(?:0[1-9]|[12]\\d|30)|(?:02)-(?:0[1-9]|1\\d|2[0-8])))`;
const DATETIME_OFFSET = new RegExp(
  `^${DATE}T(?:(?:[01]\\d|2[0-3]):[0-5]\\d:[0-5]\\d(?:\\.\\d+)?(?:Z|([+-](?:[01]\\d|2[0-3]):[0-5]\\d)))$`,
);
const MATERIALS: readonly string[] = MATERIAL_OPTIONS.map((m) => m.value);

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  isObject(v) && (Object.getPrototypeOf(v) === Object.prototype || Object.getPrototypeOf(v) === null);
/** zod's English wording for a value of the wrong type where the schema has no message of its own. */
function typeName(v: unknown): string {
  if (typeof v === 'number') return Number.isNaN(v) ? 'NaN' : Number.isFinite(v) ? 'number' : String(v);
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'array';
  if (typeof v === 'object' && Object.getPrototypeOf(v) !== Object.prototype && v.constructor)
    return v.constructor.name;
  return typeof v;
}
const expected = (what: string, v: unknown) => `Invalid input: expected ${what}, received ${typeName(v)}`;

class Checker {
  issues: Issue[] = [];
  fail(path: Path, message: string, fatal = true) {
    this.issues.push({ path, message, fatal });
  }
  /** Any issue since `from`: a transform does not run. */
  anySince = (from: number) => this.issues.length > from;
  /** A fatal issue since `from`: an object's cross-field checks do not run. */
  fatalSince = (from: number) => this.issues.slice(from).some((i) => i.fatal);

  number(v: unknown, path: Path, typeMessage: string, checks: [(n: number) => boolean, string][]): unknown {
    if (typeof v !== 'number' || !Number.isFinite(v)) return (this.fail(path, typeMessage), v);
    for (const [ok, message] of checks) if (!ok(v)) this.fail(path, message, false);
    return v;
  }
  /** Entering a figure: its own message when missing, another when not a number. */
  figure(v: unknown, path: Path, what: string, unit: string, checks: [(n: number) => boolean, string][]) {
    const typeMessage = v == null ? `Enter ${what} (${unit}).` : `Enter ${what} as a number (${unit}).`;
    return this.number(v, path, typeMessage, checks);
  }
  /** optionalNum(...).pipe(z.number()...nullable()): empty is null, else the checks. */
  optionalFigure(v: unknown, path: Path, what: string, unit: string, checks: [(n: number) => boolean, string][]) {
    if (v == null) return null;
    if (typeof v !== 'number' || !Number.isFinite(v))
      return (this.fail(path, `Enter ${what} as a number (${unit}), or leave it empty.`), v);
    return this.number(v, path, '', checks);
  }
  /**
   * zod's length checks are asked of anything with a length, even a value of the wrong type (a list
   * where text was expected), unless an earlier issue stopped the value outright.
   */
  lengths(v: unknown, path: Path, checks: ([number, string] | undefined)[], kinds: ('min' | 'max')[]) {
    const length = (v as { length?: unknown } | null | undefined)?.length;
    if (typeof length !== 'number') return;
    checks.forEach((check, i) => {
      if (check && (kinds[i] === 'min' ? length < check[0] : length > check[0])) this.fail(path, check[1], false);
    });
  }
  text(v: unknown, path: Path, what: string, max: number, min?: [number, string]): unknown {
    const tooLong: [number, string] = [max, `Keep ${what} under ${max} characters.`];
    if (typeof v !== 'string') {
      this.fail(path, `Enter ${what} as text.`);
      this.lengths(v, path, [tooLong, min], ['max', 'min']);
      return v;
    }
    const s = v.trim();
    this.lengths(s, path, [tooLong, min], ['max', 'min']);
    return s;
  }
  uuid(v: unknown, path: Path, message: string): unknown {
    if (typeof v !== 'string') return (this.fail(path, message), v);
    if (!UUID.test(v)) this.fail(path, message, false);
    return v;
  }
  /** uuid(what).nullable().optional().transform((v) => v ?? null) */
  optionalUuid(v: unknown, path: Path, what: string): unknown {
    if (v == null) return null;
    return this.uuid(v, path, `Choose ${what}.`);
  }
  boolean(v: unknown, path: Path, message: string): unknown {
    if (typeof v !== 'boolean') this.fail(path, message);
    return v;
  }
  oneOf(v: unknown, path: Path, values: readonly string[], message: string): unknown {
    if (typeof v !== 'string' || !values.includes(v)) this.fail(path, message);
    return v;
  }
  /** z.enum(...).nullable().optional().transform((v) => v ?? null) */
  optionalOneOf(v: unknown, path: Path, values: readonly string[], message: string): unknown {
    return v == null ? null : this.oneOf(v, path, values, message);
  }
  /** z.array(element, { error }) with its length checks (the minimum is asked even when an element is wrong). */
  array<T>(
    v: unknown,
    path: Path,
    typeMessage: string | null,
    element: (x: unknown, path: Path) => T,
    lengths: { min?: [number, string]; max: [number, string] },
  ): T[] | unknown {
    if (!Array.isArray(v)) {
      this.fail(path, typeMessage ?? expected('array', v));
      this.lengths(v, path, [lengths.min, lengths.max], ['min', 'max']);
      return v;
    }
    // zod refuses a list past its maximum before looking at any element (and stops there).
    if (v.length > lengths.max[0]) return (this.fail(path, lengths.max[1]), v);
    const out: T[] = [];
    for (let i = 0; i < v.length; i++) out.push(element(v[i], [...path, i])); // holes too (map skips them)
    if (lengths.min && v.length < lengths.min[0]) this.fail(path, lengths.min[1], false);
    return out;
  }
}

const gt = (limit: number, message: string): [(n: number) => boolean, string] => [(n) => n > limit, message];
const lt = (limit: number, message: string): [(n: number) => boolean, string] => [(n) => n < limit, message];
const atLeast = (limit: number, message: string): [(n: number) => boolean, string] => [(n) => n >= limit, message];
const atMost = (limit: number, message: string): [(n: number) => boolean, string] => [(n) => n <= limit, message];
const TEMPERATURE = [
  atLeast(-30, 'Temperatures run from -30 to 70 °C.'),
  atMost(70, 'Temperatures run from -30 to 70 °C.'),
];

function nozzleReading(c: Checker, v: unknown, path: Path) {
  if (!isObject(v)) return (c.fail(path, expected('object', v)), v);
  return {
    diameterMm: c.figure(v.diameterMm, [...path, 'diameterMm'], 'the diameter', 'mm', [
      gt(0, 'A diameter must be above 0 mm.'),
      lt(1000, 'A diameter must be below 1000 mm.'),
    ]),
    angleDeg: c.figure(v.angleDeg, [...path, 'angleDeg'], 'the angle', '°', [
      atLeast(0, 'Angles run from 0 to 359°.'),
      atMost(359, 'Angles run from 0 to 359°.'),
    ]),
  };
}

function nozzle(c: Checker, v: unknown, path: Path) {
  if (!isObject(v)) return (c.fail(path, expected('object', v)), v);
  const from = c.issues.length;
  const at = (k: string) => [...path, k];
  const n = {
    readings: c.array(v.readings, at('readings'), 'List the nozzle readings.', (x, p) => nozzleReading(c, x, p), {
      min: [1, 'Enter at least one reading.'],
      max: [24, 'Enter at most 24 readings.'],
    }),
    instrumentId: c.optionalUuid(v.instrumentId, at('instrumentId'), 'an instrument'),
    expandedUncertaintyMm: c.optionalFigure(
      v.expandedUncertaintyMm,
      at('expandedUncertaintyMm'),
      'the expanded uncertainty U',
      'mm',
      [
        gt(0, 'U must be above zero: every reading carries at least its resolution.'),
        atMost(5, 'An uncertainty above 5 mm is not credible.'),
      ],
    ),
    temperatureC: c.optionalFigure(v.temperatureC, at('temperatureC'), 'the nozzle temperature', '°C', TEMPERATURE),
    partTemperatureC: c.optionalFigure(
      v.partTemperatureC,
      at('partTemperatureC'),
      'the nozzle temperature',
      '°C',
      TEMPERATURE,
    ),
    instrumentTemperatureC: c.optionalFigure(
      v.instrumentTemperatureC,
      at('instrumentTemperatureC'),
      'the instrument temperature',
      '°C',
      TEMPERATURE,
    ),
    instrumentAtPartTemperature:
      v.instrumentAtPartTemperature === undefined
        ? false
        : c.boolean(
            v.instrumentAtPartTemperature,
            at('instrumentAtPartTemperature'),
            'Say whether the instrument is at the nozzle’s temperature.',
          ),
    material: c.optionalOneOf(v.material, at('material'), MATERIALS, 'Choose the nozzle material.'),
    instrumentMaterial: c.optionalOneOf(
      v.instrumentMaterial,
      at('instrumentMaterial'),
      MATERIALS,
      'Choose the instrument’s material.',
    ),
  };
  if (!c.fatalSince(from)) {
    if (n.temperatureC != null && n.partTemperatureC != null && n.temperatureC !== n.partTemperatureC)
      c.fail(
        at('partTemperatureC'),
        'Give the nozzle temperature once (partTemperatureC, or the older temperatureC).',
        false,
      );
    if (n.instrumentAtPartTemperature && n.instrumentTemperatureC != null)
      c.fail(
        at('instrumentTemperatureC'),
        'Give the instrument’s temperature, or say it is the same as the nozzle’s, not both.',
        false,
      );
    if (n.instrumentAtPartTemperature && n.temperatureC == null && n.partTemperatureC == null)
      c.fail(at('partTemperatureC'), 'Enter the nozzle temperature (°C): the instrument is said to be at it.', false);
  }
  if (c.anySince(from)) return n;
  const part = n.partTemperatureC ?? n.temperatureC;
  return { ...n, temperatureC: part, partTemperatureC: part };
}

function weight(c: Checker, v: unknown, path: Path) {
  if (v == null) return null;
  if (!isObject(v)) return (c.fail(path, expected('object', v)), v);
  const from = c.issues.length;
  const w = {
    readingsKg: c.array(
      v.readingsKg,
      [...path, 'readingsKg'],
      null,
      (x, p) =>
        c.figure(x, p, 'the weighing', 'kg', [
          gt(0, 'A weighing must be above 0 kg.'),
          lt(20000, 'A weighing must be below 20000 kg.'),
        ]),
      { max: [6, 'Enter at most 6 weighings.'] },
    ) as unknown[],
    instrumentId: c.optionalUuid(v.instrumentId, [...path, 'instrumentId'], 'a scale'),
  };
  if (c.anySince(from)) return w;
  return w.readingsKg.length ? w : null;
}

function power(c: Checker, v: unknown, path: Path) {
  if (!isObject(v)) return (c.fail(path, expected('object', v)), v);
  const at = (k: string) => [...path, k];
  return {
    declaredKw: c.figure(v.declaredKw, at('declaredKw'), 'the power', 'kW', [
      gt(0, 'Power must be above 0 kW.'),
      lt(10000, 'Power must be below 10000 kW.'),
    ]),
    evidenceSeen: c.boolean(v.evidenceSeen, at('evidenceSeen'), 'Say whether the power evidence was seen.'),
    note: v.note === undefined ? '' : c.text(v.note, at('note'), 'the power note', 500),
    evidenceKind: c.optionalOneOf(
      v.evidenceKind,
      at('evidenceKind'),
      POWER_EVIDENCE_KINDS,
      'Choose the kind of evidence seen for the power.',
    ),
    dynoDocumentId: c.optionalUuid(v.dynoDocumentId, at('dynoDocumentId'), 'the dyno sheet document'),
  };
}

/** A seal number: trimmed, checked, then in capitals (only when it passed). */
function sealNumber(c: Checker, v: unknown, path: Path): unknown {
  if (typeof v !== 'string') {
    c.fail(path, 'Enter the seal number.');
    c.lengths(v, path, [[1, 'Enter the seal number.']], ['min']);
    return v;
  }
  const s = v.trim();
  const from = c.issues.length;
  if (s.length < 1) c.fail(path, 'Enter the seal number.', false);
  if (!SEAL_NUMBER_PATTERN.test(s)) c.fail(path, 'A seal number has 1 to 40 letters, digits or dashes.', false);
  return c.anySince(from) ? s : s.toUpperCase();
}

const NO_SEAL_ACTIONS = { checks: [], applied: [], removed: [] };

function seals(c: Checker, raw: unknown, path: Path) {
  // An empty list is what a record queued before the register carries: no seal actions.
  const v = Array.isArray(raw) && raw.length === 0 ? undefined : raw;
  if (v === undefined) return NO_SEAL_ACTIONS;
  if (!isObject(v))
    return (c.fail(path, 'Record seals as the register asks: checks, applied and removed (not free text).'), v);
  const from = c.issues.length;
  const at = (k: string) => [...path, k];
  const list = <T>(x: unknown, key: string, max: [number, string], item: (o: Record<string, unknown>, p: Path) => T) =>
    x === undefined
      ? []
      : c.array(x, at(key), null, (o, p) => (isObject(o) ? item(o, p) : (c.fail(p, expected('object', o)), o)), {
          max,
        });
  const s = {
    checks: list(v.checks, 'checks', [40, 'Check at most 40 seals in one record.'], (o, p) => ({
      number: sealNumber(c, o.number, [...p, 'number']),
      state: c.oneOf(o.state, [...p, 'state'], SEAL_CHECK_STATES, 'Say whether the seal is intact, broken or missing.'),
    })),
    applied: list(v.applied, 'applied', [20, 'Apply at most 20 seals in one record.'], (o, p) => ({
      number: sealNumber(c, o.number, [...p, 'number']),
      componentId: c.uuid(o.componentId, [...p, 'componentId'], 'Choose the component the seal goes on.'),
      position: c.text(o.position, [...p, 'position'], 'where the seal is', 120, [
        1,
        'Say where on the component the seal is.',
      ]),
    })),
    removed: list(v.removed, 'removed', [20, 'Remove at most 20 seals in one record.'], (o, p) => ({
      number: sealNumber(c, o.number, [...p, 'number']),
      reason: c.text(o.reason, [...p, 'reason'], 'the reason', 500, [3, 'Say why the seal is removed.']),
    })),
  } as { checks: { number: string }[]; applied: { number: string }[]; removed: { number: string }[] };
  if (!c.fatalSince(from)) {
    const seen = new Set<string>();
    for (const name of ['checks', 'applied', 'removed'] as const)
      s[name].forEach((x, i) => {
        if (seen.has(`${name}:${x.number}`))
          c.fail([...path, name, i, 'number'], `Seal ${x.number} is listed twice.`, false);
        seen.add(`${name}:${x.number}`);
      });
    s.applied.forEach((a, i) => {
      if (seen.has(`checks:${a.number}`) || seen.has(`removed:${a.number}`))
        c.fail(
          [...path, 'applied', i, 'number'],
          `Seal ${a.number} cannot be applied and checked or removed in the same record.`,
          false,
        );
    });
  }
  return s;
}

/** A partial record keyed by a fixed set: unknown keys are named together, as zod names them. */
function keyedRecord(
  c: Checker,
  v: unknown,
  path: Path,
  keys: readonly string[],
  value: (x: unknown, p: Path) => unknown,
) {
  if (!isPlainObject(v)) return (c.fail(path, expected('record', v)), v);
  const out: Record<string, unknown> = {};
  const unknown: string[] = [];
  for (const k of Object.keys(v)) {
    if (k === '__proto__') continue;
    if (!keys.includes(k)) unknown.push(k);
    else out[k] = value(v[k], [...path, k]);
  }
  if (unknown.length)
    c.fail(path, `Unrecognized key${unknown.length > 1 ? 's' : ''}: ${unknown.map((k) => `"${k}"`).join(', ')}`, false);
  return out;
}

function measuredItem(c: Checker, v: unknown, path: Path) {
  if (!isObject(v)) return (c.fail(path, expected('object', v)), v);
  const at = (k: string) => [...path, k];
  const key = v.key;
  if (typeof key !== 'string') c.fail(at('key'), 'Name the item by its key.');
  else if (!ITEM_KEY_PATTERN.test(key)) c.fail(at('key'), 'This is not an item key.', false);
  const instrumentId = c.optionalUuid(v.instrumentId, at('instrumentId'), 'an instrument');
  const readings = c.array(
    v.readings,
    at('readings'),
    'List the item’s readings.',
    (x, p) => {
      const from = c.issues.length;
      const r = keyedRecord(c, x, p, READING_FIELDS, (n, q) =>
        c.figure(n, q, 'the reading', 'the item’s unit', [
          gt(0, 'A reading must be above 0.'),
          lt(1_000_000, 'A reading must be below 1000000.'),
        ]),
      );
      if (!c.fatalSince(from) && isObject(r) && Object.keys(r).length === 0) c.fail(p, 'Enter the reading.', false);
      return r;
    },
    {
      min: [1, 'Enter at least one reading.'],
      max: [MAX_ITEM_READINGS * 2, `Enter at most ${MAX_ITEM_READINGS * 2} readings.`],
    },
  );
  return { key, instrumentId, readings };
}

function gaugeCheck(c: Checker, v: unknown, path: Path) {
  if (!isObject(v)) return (c.fail(path, expected('object', v)), v);
  const from = c.issues.length;
  const at = (k: string) => [...path, k];
  const g = {
    rule: c.oneOf(v.rule, at('rule'), ['nozzle'], 'Gauge checks are made on the nozzle exit.'),
    gauge: v.gauge === undefined ? '' : c.text(v.gauge, at('gauge'), 'the gauge’s identity', 120),
    instrumentId: c.optionalUuid(v.instrumentId, at('instrumentId'), 'the gauge'),
    passed: c.boolean(v.passed, at('passed'), 'Say whether the gauge check passed.'),
  };
  if (!c.fatalSince(from) && !g.instrumentId && !g.gauge)
    c.fail(at('gauge'), 'Say which gauge was used (its marking or serial).', false);
  return g;
}

/**
 * Checks a draft as RecordInspectionInput.safeParse does. `fieldErrors` holds the first message for each
 * dotted path (as the form shows them); `data` is the parsed record (defaults and trims applied).
 */
export function checkInspectionDraft(draft: unknown, now = Date.now()): DraftCheck {
  const c = new Checker();
  if (!isObject(draft)) {
    c.fail([], expected('object', draft));
    return refused(c);
  }
  const v = draft;
  const out = {
    idempotencyKey: c.uuid(v.idempotencyKey, ['idempotencyKey'], 'The record key must be a UUID made on the device.'),
    entryId: c.uuid(v.entryId, ['entryId'], 'Choose the boat’s entry.'),
    declarationVersion: declarationVersion(c, v.declarationVersion),
    kind:
      v.kind === undefined ? 'pre_race' : c.oneOf(v.kind, ['kind'], INSPECTION_KINDS, 'Choose the kind of inspection.'),
    capturedAt: capturedAt(c, v.capturedAt),
    device: v.device === undefined ? '' : c.text(v.device, ['device'], 'the device name', 80),
    nozzle: nozzle(c, v.nozzle, ['nozzle']),
    weight: weight(c, v.weight, ['weight']),
    power: power(c, v.power, ['power']),
    seals: seals(c, v.seals, ['seals']),
    safety:
      v.safety === undefined
        ? {}
        : keyedRecord(c, v.safety, ['safety'], SAFETY_ITEM_KEYS, (x, p) =>
            c.boolean(x, p, 'Tick or untick each safety item.'),
          ),
    measuredItems:
      v.measuredItems === undefined
        ? []
        : c.array(v.measuredItems, ['measuredItems'], 'List the measured items.', (x, p) => measuredItem(c, x, p), {
            max: [MAX_MEASURED_ITEMS, `Enter at most ${MAX_MEASURED_ITEMS} measured items.`],
          }),
    gaugeChecks:
      v.gaugeChecks === undefined
        ? []
        : c.array(v.gaugeChecks, ['gaugeChecks'], 'List the gauge checks.', (x, p) => gaugeCheck(c, x, p), {
            max: [4, 'Enter at most 4 gauge checks.'],
          }),
    notes: v.notes === undefined ? '' : c.text(v.notes, ['notes'], 'the notes', 2000),
    supersedesId: c.optionalUuid(v.supersedesId, ['supersedesId'], 'the record to correct'),
    correctionReason: correctionReason(c, v.correctionReason),
    reinspectionId: c.optionalUuid(v.reinspectionId, ['reinspectionId'], 'the re-inspection task'),
  };
  if (!c.fatalSince(0)) crossChecks(c, out as unknown as RecordInspectionInput, now);
  if (c.issues.length) return refused(c);
  return { success: true, data: out as unknown as RecordInspectionInput };
}

/** A whole number from 1, or nothing (records queued before the dock sent it). */
function declarationVersion(c: Checker, v: unknown) {
  const message = 'Give the declaration version as a whole number.';
  if (v == null) return null;
  // zod's .int() stops there (its issue does not continue), so .min(1) is not asked.
  if (typeof v !== 'number' || !Number.isInteger(v)) return (c.fail(['declarationVersion'], message), v);
  if (v < 1) c.fail(['declarationVersion'], message, false);
  return v;
}

function capturedAt(c: Checker, v: unknown) {
  const message = 'Give the time of the inspection as an ISO date and time.';
  if (typeof v !== 'string') return (c.fail(['capturedAt'], message), v);
  if (!DATETIME_OFFSET.test(v)) c.fail(['capturedAt'], message, false);
  return v;
}

function correctionReason(c: Checker, v: unknown) {
  if (v == null) return null;
  const from = c.issues.length;
  const s = c.text(v, ['correctionReason'], 'the reason for the correction', 1000);
  return c.anySince(from) ? s : s || null;
}

/** The record's own superRefine: what no single field can say. */
function crossChecks(c: Checker, v: RecordInspectionInput, now: number) {
  if (v.nozzle.instrumentId && v.nozzle.expandedUncertaintyMm != null)
    c.fail(['nozzle', 'expandedUncertaintyMm'], 'Choose an instrument or type U, not both.', false);
  const kind = v.power.evidenceKind;
  if (kind && (kind !== 'declaration_only') !== v.power.evidenceSeen)
    c.fail(
      ['power', 'evidenceKind'],
      kind === 'declaration_only'
        ? 'Declaration only means no evidence was seen.'
        : 'A dyno sheet or maker’s rating means the evidence was seen.',
      false,
    );
  if (v.power.dynoDocumentId && kind !== 'dyno_sheet')
    c.fail(['power', 'dynoDocumentId'], 'A document is named only for a dyno sheet.', false);
  const keys = new Set<string>();
  v.measuredItems.forEach((m, i) => {
    if (keys.has(m.key)) c.fail(['measuredItems', i, 'key'], `The item ${m.key} is given twice.`, false);
    keys.add(m.key);
  });
  const gauged = new Set<string>();
  v.gaugeChecks.forEach((g, i) => {
    if (gauged.has(g.rule)) c.fail(['gaugeChecks', i, 'rule'], 'Give one gauge check per limit.', false);
    gauged.add(g.rule);
  });
  const when = checkCapturedAt(v.capturedAt, now);
  if (when) c.fail(['capturedAt'], when, false);
  if (v.supersedesId && !v.correctionReason)
    c.fail(['correctionReason'], 'Say why the earlier record is being corrected.', false);
}

function refused(c: Checker): DraftCheck {
  const fieldErrors: Record<string, string> = {};
  const issues = c.issues.map((i) => ({ field: i.path.map(String).join('.'), message: i.message }));
  for (const i of issues) fieldErrors[i.field] ??= i.message;
  return { success: false, fieldErrors, issues };
}
