// The dock form's state (strings, as typed) and its conversion to the inspection input, both ways,
// so a queued record that needs a fix can be loaded back into the form. Plain TypeScript.
import type { Material } from '@/lib/core/engine/measurement';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import type { InspectionKind, PowerEvidenceKind, RecordInspectionDraft } from '@/lib/core/inputs/inspections';
import type { InspectionSealsDraft as SealsDraft, SealCheckState } from '@/lib/core/inputs/seals';
import type { SealFinding } from '@/lib/core/inspections/decide-inspection';
import type { BoardRow, InspectionBoard } from '@/lib/server/inspections/list-inspection-board';
import type { BoatCard } from '@/lib/server/inspections/load-boat-card';
import { figureValue } from '@/lib/core/format/figures';
import { FORMULA_INPUTS } from '@/lib/core/engine/measured-item';
import { ownValue } from '@/lib/core/inputs/measured-item-terms';

/** The boat being inspected, from the server's card or, offline, from the phone's copy of the board. */
export type DockTarget = {
  source: 'server' | 'server-cache' | 'phone-copy';
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  className: string;
  status: string;
  isPaid: boolean;
  declaredPowerKw: number;
  powerEvidence: string;
  /** The boat's declaration version shown on the card (or the phone's copy); the record carries it. */
  declarationVersion: number | null;
  rules: ClassRules | null;
  ruleVersion: number | null;
  card: BoatCard | null;
  isOwnBoat: boolean;
  /** The boat's other live entries here (several classes per boat): the dock switches between them. */
  otherEntries: OtherEntry[];
};

/** Another class the same boat is entered in at this meeting, with its inspection so far. */
export type OtherEntry = { entryId: string; classCode: string; className: string; inspectionResult: string | null };

const LIVE = ['awaiting_payment', 'entered'];

/** Offline: of the phone copy's rows for one race number or tag (one boat, maybe several classes), the one to open first. */
export function firstBoardRow(rows: BoardRow[]): BoardRow | undefined {
  const rank = (r: BoardRow) => (LIVE.includes(r.status) ? 0 : 2) + (r.state === 'waiting' ? 0 : 1);
  return [...rows].sort((a, b) => rank(a) - rank(b) || a.classCode.localeCompare(b.classCode))[0];
}

export function targetFromCard(card: BoatCard, fromCache: boolean): DockTarget {
  return {
    source: fromCache ? 'server-cache' : 'server',
    entryId: card.entry.id,
    raceNumber: card.entry.raceNumber,
    boatName: card.boat.name,
    classCode: card.raceClass.code,
    className: card.raceClass.name,
    status: card.entry.status,
    isPaid: card.entry.isPaid,
    declaredPowerKw: card.boat.declaredPowerKw,
    powerEvidence: card.boat.powerEvidence,
    declarationVersion: card.boat.declarationVersion ?? null,
    rules: card.ruleVersion?.rules ?? null,
    ruleVersion: card.ruleVersion?.version ?? null,
    card,
    isOwnBoat: card.isOwnBoat,
    otherEntries: (card.otherEntries ?? []).map((e) => ({
      entryId: e.entryId,
      classCode: e.classCode,
      className: e.className,
      inspectionResult: e.inspectionResult,
    })),
  };
}

export function targetFromBoardRow(row: BoardRow, board: InspectionBoard): DockTarget {
  const cls = board.classes.find((c) => c.id === row.classId);
  return {
    source: 'phone-copy',
    entryId: row.entryId,
    raceNumber: row.raceNumber,
    boatName: row.boatName,
    classCode: row.classCode,
    className: row.className,
    status: row.status,
    isPaid: row.isPaid,
    declaredPowerKw: row.declaredPowerKw,
    powerEvidence: row.powerEvidence,
    // A phone copy saved before the rows carried it has none: the server then pins as it always did.
    declarationVersion: row.declarationVersion ?? null,
    rules: cls?.ruleVersion?.rules ?? null,
    ruleVersion: cls?.ruleVersion?.version ?? null,
    card: null,
    isOwnBoat: false,
    otherEntries: board.rows
      .filter((r) => r.boatId === row.boatId && r.entryId !== row.entryId && LIVE.includes(r.status))
      .map((r) => ({
        entryId: r.entryId,
        classCode: r.classCode,
        className: r.className,
        inspectionResult: r.state === 'waiting' ? null : r.state,
      })),
  };
}

export type FormSeals = {
  checks: Record<string, '' | SealCheckState>;
  applied: { number: string; componentId: string; position: string }[];
  removed: Record<string, string>;
};
export const NO_SEALS: FormSeals = { checks: {}, applied: [], removed: {} };

export type UncertaintySource = 'instrument' | 'typed' | 'class';

/** A class's measured item as typed: the instrument and each reading's fields (value, or bore and stroke). */
export type FormItem = { instrumentId: string; readings: Record<string, string>[] };
/** The nozzle's go/no-go gauge check ('' : not checked). */
export type FormGauge = { identity: string; instrumentId: string; result: '' | 'passed' | 'failed' };
export const NO_GAUGE: FormGauge = { identity: '', instrumentId: '', result: '' };

export type FormState = {
  kind: InspectionKind;
  readings: { diameter: string; angle: string }[];
  uncertaintySource: UncertaintySource;
  instrumentId: string;
  typedU: string;
  /** The nozzle's (part's) temperature. */
  temperature: string;
  material: '' | Material;
  /** One thermometer reading for both: the instrument is at the nozzle's temperature (the default). */
  instrumentSameAsPart: boolean;
  instrumentTemperature: string;
  /** '' : the instrument's own on file, else steel assumed. */
  instrumentMaterial: '' | Material;
  weighings: string[];
  scaleId: string;
  powerKw: string;
  evidenceSeen: boolean;
  /** The kind of power evidence seen ('' : not said; then evidenceSeen alone is sent). */
  evidenceKind: '' | PowerEvidenceKind;
  dynoDocumentId: string;
  powerNote: string;
  /** The register's seals: each listed seal's check by number, seals applied, seals removed (number → reason). */
  seals: FormSeals;
  safety: Record<string, boolean>;
  /** The class's measured items by key (absent in a form state from before them: none). */
  items?: Record<string, FormItem>;
  gauge?: FormGauge;
  notes: string;
  supersedesId: string | null;
  correctionReason: string;
  reinspectionId: string;
};

/**
 * Default angles spread evenly over half a turn, 180°/n apart for n readings: three at 0, 60 and
 * 120° (common practice, no source); a two-point diameter at θ also covers θ + 180°.
 */
const angleFor = (i: number, n: number) => String(Math.round((180 / n) * i));

/**
 * The readings with one added or the last removed. Angles still at the even spread (or blank) are
 * spread again for the new count; angles the scrutineer typed are kept, and an added reading then
 * goes halfway between the last angle and 180°.
 */
export function resizeReadings(readings: FormState['readings'], n: number): FormState['readings'] {
  const next =
    n > readings.length
      ? [...readings, ...Array.from({ length: n - readings.length }, () => ({ diameter: '', angle: '' }))]
      : readings.slice(0, n);
  const isEvenSpread = readings.every(
    (r, i) => r.angle.trim() === '' || r.angle.trim() === angleFor(i, readings.length),
  );
  if (isEvenSpread) return next.map((r, i) => ({ ...r, angle: angleFor(i, n) }));
  return next.map((r, i) => {
    if (i < readings.length || r.angle !== '') return r;
    const last = Number(next[i - 1]?.angle);
    return { ...r, angle: String(Math.round(Number.isFinite(last) ? (last + 180) / 2 : (180 / n) * i)) };
  });
}

export function initialFormState(
  target: DockTarget,
  lengthInstrumentId: string | null,
  scaleId: string | null,
): FormState {
  const n = Math.max(target.rules?.nozzle.minReadings ?? 3, 1);
  return {
    // A protest's re-inspection is a protest inspection (the protester's burden); another task, post-race.
    kind: target.card?.openReinspections[0]?.protestId
      ? 'protest'
      : target.card?.openReinspections.length
        ? 'post_race'
        : 'pre_race',
    readings: Array.from({ length: n }, (_, i) => ({ diameter: '', angle: angleFor(i, n) })),
    uncertaintySource: lengthInstrumentId ? 'instrument' : 'class',
    instrumentId: lengthInstrumentId ?? '',
    typedU: '',
    temperature: '',
    material: '',
    instrumentSameAsPart: true,
    instrumentTemperature: '',
    instrumentMaterial: '',
    weighings: ['', ''],
    scaleId: scaleId ?? '',
    // Pre-filled as shown on the card (0.1 kW); the stored declaration keeps its full precision.
    powerKw: figureValue(target.declaredPowerKw, 'powerKw'),
    evidenceSeen: false,
    evidenceKind: '',
    dynoDocumentId: '',
    powerNote: '',
    // Every seal on the boat's components is listed to be checked; none is marked until the scrutineer looks.
    seals: { ...NO_SEALS, checks: Object.fromEntries((target.card?.seals ?? []).map((s) => [s.number, ''])) },
    safety: {},
    items: blankItems(target.rules),
    gauge: NO_GAUGE,
    notes: '',
    supersedesId: null,
    correctionReason: '',
    reinspectionId: target.card?.openReinspections[0]?.id ?? '',
  };
}

/** One empty reading row per reading the class asks for, with the formula's fields. */
export function blankItems(rules: ClassRules | null): Record<string, FormItem> {
  return Object.fromEntries(
    (rules?.measuredItems ?? []).map((m) => [
      m.key,
      {
        instrumentId: '',
        readings: Array.from({ length: m.readings }, () =>
          Object.fromEntries(FORMULA_INPUTS[m.formula.kind].map((x) => [x.name, ''])),
        ),
      },
    ]),
  );
}

const isTyped = (r: Record<string, string>) => Object.values(r).some((v) => v.trim() !== '');

/** The measured items the form will send, in the rules' order: an item with nothing typed is left out (not measured). */
export function itemsToSend(f: FormState, rules: ClassRules | null): { key: string; item: FormItem }[] {
  return (rules?.measuredItems ?? [])
    .map((m) => ({ key: m.key, item: ownValue(f.items, m.key) }))
    .filter((x): x is { key: string; item: FormItem } => !!x.item && x.item.readings.some(isTyped));
}

/** A typed number: empty is "not given" (the schema says so), a comma is a decimal point, text stays NaN. */
const toNumber = (s: string): number | undefined => (s.trim() === '' ? undefined : Number(s.trim().replace(',', '.')));
const toOptionalNumber = (s: string): number | null => (s.trim() === '' ? null : Number(s.trim().replace(',', '.')));

export function draftFromForm(
  f: FormState,
  target: DockTarget,
  meta: { idempotencyKey: string; capturedAt: string; device: string },
): RecordInspectionDraft {
  const weighings = f.weighings.filter((w) => w.trim() !== '');
  return {
    idempotencyKey: meta.idempotencyKey,
    entryId: target.entryId,
    declarationVersion: target.declarationVersion,
    kind: f.kind,
    capturedAt: meta.capturedAt,
    device: meta.device,
    nozzle: {
      readings: f.readings.map((r) => ({
        diameterMm: toNumber(r.diameter) as number,
        angleDeg: toNumber(r.angle) as number,
      })),
      instrumentId: f.uncertaintySource === 'instrument' ? f.instrumentId || null : null,
      expandedUncertaintyMm: f.uncertaintySource === 'typed' ? (toNumber(f.typedU) as number) : null,
      partTemperatureC: toOptionalNumber(f.temperature),
      // "Same as the nozzle" only says something once the nozzle's temperature is given.
      instrumentAtPartTemperature: f.instrumentSameAsPart && f.temperature.trim() !== '',
      instrumentTemperatureC: f.instrumentSameAsPart ? null : toOptionalNumber(f.instrumentTemperature),
      material: f.material || null,
      instrumentMaterial: f.instrumentMaterial || null,
    },
    weight: weighings.length
      ? { readingsKg: weighings.map((w) => toNumber(w) as number), instrumentId: f.scaleId || null }
      : null,
    power: {
      declaredKw: toNumber(f.powerKw) as number,
      evidenceSeen: f.evidenceKind ? f.evidenceKind !== 'declaration_only' : f.evidenceSeen,
      note: f.powerNote,
      evidenceKind: f.evidenceKind || null,
      dynoDocumentId: f.evidenceKind === 'dyno_sheet' ? f.dynoDocumentId || null : null,
    },
    seals: {
      checks: Object.entries(f.seals.checks)
        .filter((c): c is [string, SealCheckState] => c[1] !== '')
        .map(([number, state]) => ({ number, state })),
      applied: f.seals.applied.filter((a) => a.number.trim() || a.position.trim() || a.componentId),
      removed: Object.entries(f.seals.removed).map(([number, reason]) => ({ number, reason })),
    },
    safety: Object.fromEntries((target.rules?.safetyItems ?? []).map((k) => [k, f.safety[k] === true])),
    measuredItems: itemsToSend(f, target.rules).map(({ key, item }) => ({
      key,
      instrumentId: item.instrumentId || null,
      // A row left empty is not a reading; a typed field that is not a number stays NaN so the schema names it.
      readings: item.readings.filter(isTyped).map((r) =>
        Object.fromEntries(
          Object.entries(r)
            .filter(([, v]) => v.trim() !== '')
            .map(([k, v]) => [k, toNumber(v) as number]),
        ),
      ),
    })),
    gaugeChecks:
      f.gauge && f.gauge.result
        ? [
            {
              rule: 'nozzle' as const,
              gauge: f.gauge.identity,
              instrumentId: f.gauge.instrumentId || null,
              passed: f.gauge.result === 'passed',
            },
          ]
        : [],
    notes: f.notes,
    supersedesId: f.supersedesId,
    correctionReason: f.supersedesId ? f.correctionReason : null,
    reinspectionId: f.reinspectionId || null,
  };
}

const str = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : '');

/** A queued draft back into the form (for "Fix and send again", with the same record key). */
export function formFromDraft(d: RecordInspectionDraft, base: FormState): FormState {
  return {
    ...base,
    kind: d.kind ?? base.kind,
    readings: d.nozzle.readings.map((r) => ({ diameter: str(r.diameterMm), angle: str(r.angleDeg) })),
    uncertaintySource: d.nozzle.instrumentId
      ? 'instrument'
      : d.nozzle.expandedUncertaintyMm != null
        ? 'typed'
        : 'class',
    instrumentId: d.nozzle.instrumentId ?? base.instrumentId,
    typedU: str(d.nozzle.expandedUncertaintyMm),
    temperature: str(d.nozzle.partTemperatureC ?? d.nozzle.temperatureC),
    material: d.nozzle.material ?? '',
    // A draft queued before the instrument's temperature was asked said nothing of it: not "same".
    instrumentSameAsPart:
      d.nozzle.instrumentAtPartTemperature ??
      (d.nozzle.instrumentTemperatureC == null && d.nozzle.temperatureC == null),
    instrumentTemperature: str(d.nozzle.instrumentTemperatureC),
    instrumentMaterial: d.nozzle.instrumentMaterial ?? '',
    weighings: d.weight?.readingsKg.map(str) ?? base.weighings,
    scaleId: d.weight?.instrumentId ?? base.scaleId,
    powerKw: str(d.power.declaredKw),
    evidenceSeen: d.power.evidenceSeen,
    evidenceKind: d.power.evidenceKind ?? '',
    dynoDocumentId: d.power.dynoDocumentId ?? '',
    powerNote: d.power.note ?? '',
    seals: sealsFromDraft(d.seals as SealsDraft | unknown[] | undefined, base.seals),
    safety: Object.fromEntries(Object.entries(d.safety ?? {}).map(([k, v]) => [k, v === true])),
    items: itemsFromDraft(d.measuredItems, base.items ?? {}),
    gauge: gaugeFromDraft(d.gaugeChecks) ?? base.gauge ?? NO_GAUGE,
    notes: d.notes ?? '',
    supersedesId: d.supersedesId ?? null,
    correctionReason: d.correctionReason ?? '',
    reinspectionId: d.reinspectionId ?? '',
  };
}

/** A queued draft's items back into the form (a draft queued before items had none: the blank rows stay). */
function itemsFromDraft(
  items: RecordInspectionDraft['measuredItems'],
  base: Record<string, FormItem>,
): Record<string, FormItem> {
  const out = { ...base };
  for (const m of items ?? []) {
    const blank = ownValue(base, m.key)?.readings[0] ?? {};
    const rows = m.readings.map((r) => ({
      ...Object.fromEntries(Object.keys(blank).map((k) => [k, ''])),
      ...Object.fromEntries(Object.entries(r).map(([k, v]) => [k, str(v)])),
    }));
    const want = ownValue(base, m.key)?.readings.length ?? rows.length;
    while (rows.length < want) rows.push({ ...Object.fromEntries(Object.keys(blank).map((k) => [k, ''])) });
    out[m.key] = { instrumentId: m.instrumentId ?? '', readings: rows };
  }
  return out;
}

function gaugeFromDraft(checks: RecordInspectionDraft['gaugeChecks']): FormGauge | null {
  const g = checks?.find((c) => c.rule === 'nozzle');
  return g
    ? { identity: g.gauge ?? '', instrumentId: g.instrumentId ?? '', result: g.passed ? 'passed' : 'failed' }
    : null;
}

/** The seals checked on the form as findings for the phone's provisional verdict (components named from the card). */
export function sealFindingsFromForm(
  checks: { number: string; state: SealCheckState }[],
  target: DockTarget,
): SealFinding[] {
  const byNumber = new Map((target.card?.seals ?? []).map((s) => [s.number.toUpperCase(), s.component]));
  return checks.map((c) => ({ number: c.number, state: c.state, component: byNumber.get(c.number) ?? 'component' }));
}

/** The draft's seal actions back into the form; a draft queued before the register (free text) keeps the base. */
function sealsFromDraft(d: SealsDraft | unknown[] | undefined, base: FormSeals): FormSeals {
  if (!d || Array.isArray(d)) return base;
  const checks = { ...base.checks };
  for (const c of d.checks ?? []) checks[c.number] = c.state;
  return {
    checks,
    applied: (d.applied ?? []).map((a) => ({ ...a })),
    removed: Object.fromEntries((d.removed ?? []).map((r) => [r.number, r.reason])),
  };
}
