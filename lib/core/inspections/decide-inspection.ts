// The verdict of one inspection, rule by rule, against the class rules in force. Framework-free
// (relative imports, no server-only): the server decides with it, the dock screen uses it for a
// provisional verdict while offline, and unit tests call it directly.
//
// Decisive values and uncertainties:
//   nozzle  — each two-point reading, corrected to the 20 °C reference temperature (ISO 1:2022)
//             for the differential expansion of part and instrument when the temperature and material
//             are given (nozzle-thermal.ts); the largest counts against a maximum, the smallest
//             against a minimum (ISO 14405-1:2016, via evaluateConformity).
//             U from the instrument's budget (a/√3 and δ/√12 in quadrature, k = 2; JCGM 100:2008
//             4.3.7, F.2.2.1, 6.2.1), else the U typed on the form, else the class default; when
//             corrected, the temperature and expansion-coefficient terms join it in quadrature (5.1.2).
//   weight  — the MEAN of the weighings. A boat's mass is one quantity, unlike the local sizes of
//             a nozzle exit, so repeated weighings are repeat observations of it and their mean is
//             the best estimate (JCGM 100:2008, 4.2.1). Their spread is counted: U = 2·√((U_scale/2)²
//             + s²/n) with s the sample standard deviation (4.2.2, 4.2.3). Not weighed: inconclusive.
//   power   — the figure the scrutineer confirmed (declared, or from the evidence seen) against the
//             band with the class's power uncertainty; without evidence seen, conformity is not shown.
//   safety  — each item the class requires must be ticked as present; an unticked one does not conform.
//   seals   — each register seal checked on the boat's components: intact conforms; broken or missing
//             does not conform (decideSeals below says why).
// The overall result is the worst: does_not_conform > inconclusive > conforms.
// A targeted re-inspection (a protest's re-check of the nozzle, say) decides only the checks it
// was ordered to make: the others are left out, not called inconclusive (`scope`).
// Each value says what kind it is: measured at the dock, confirmed against evidence seen, or
// only declared by the entrant (`valueKind`).

import { evaluateConformity, formatMm, type DecisionRule, type Verdict } from '../engine/conformity';
import { computeUncertaintyBudget } from '../engine/measurement';
import type { LengthBudget, ReadingUncertaintyTerm } from '../engine/measurement-thermal';
import {
  correctReadingMm,
  describeThermal,
  nozzleBudget,
  resolveNozzleThermal,
  type NozzleThermal,
} from './nozzle-thermal';
import { EngineInputError } from '../engine/engine-input-error';
import {
  burdenForInspection,
  resolveOutcome,
  verdictProvenByProtester,
  worstOutcome,
  type BurdenOfProof,
  type Outcome,
} from '../engine/conformity-burden';
import { SAFETY_ITEMS, type SafetyItem } from '../constants';
import { formatFigure } from '../entries/check-declaration';
import type { ClassRules } from '../inputs/class-rules';
import type { InspectionKind, RecordInspectionInput } from '../inputs/inspections';
import type { SealCheckState } from '../inputs/seals';
import type { ItemUnit } from '../engine/measured-item';
import {
  decideGaugeChecks,
  decideMeasuredItems,
  twoPointGoverns,
  type ItemDecision,
  type ItemInstrument,
} from './decide-measured-items';

import { CHECK_AREAS, CHECK_AREA_LABELS, describeScope, type CheckArea } from './check-areas';

// Kept here too for the modules that import them with the decision.
export { CHECK_AREAS, CHECK_AREA_LABELS, describeScope, type CheckArea };

/**
 * The checks a protest asked for, as decision areas. Seals decide nothing here; "something else"
 * (or nothing named) cannot be narrowed, so the re-inspection decides everything (null).
 */
export function scopeFromRequestedChecks(requested: readonly string[] | null | undefined): CheckArea[] | null {
  if (!requested || requested.length === 0 || requested.includes('other')) return null;
  const map: Record<string, CheckArea> = {
    nozzle_diameter: 'nozzle',
    weight: 'weight',
    engine_power: 'power',
    safety_items: 'safety',
  };
  const areas = CHECK_AREAS.filter((a) => requested.some((r) => map[r] === a));
  return areas.length ? areas : null;
}

export type ValueKind = 'measured' | 'confirmed' | 'declared';

export type RuleKey =
  | 'nozzle_max'
  | 'nozzle_min'
  | 'weight_min'
  | 'power_band'
  | `safety:${SafetyItem}`
  | `seal:${string}`
  | `gear:${string}`
  | `item:${string}`
  | 'gauge:nozzle';

/** A seal of the register checked at this inspection, with the component it is on in words. */
export type SealFinding = { number: string; state: SealCheckState; component: string };

export type RuleResult = {
  rule: RuleKey;
  label: string;
  /** The value the verdict was decided on (null for safety items and for what was not measured). */
  decisiveValue: number | null;
  /** mm, kg, kW for the nozzle, weight and power; a class's measured item in its own unit (cm³, dB(A)…). */
  unit: ItemUnit | null;
  /** The specification limit that governs (for the power band, the side that decided). */
  limit: number | null;
  acceptanceLimit: number | null;
  /** ISO 14253-1 only: beyond it non-conformity is proven. */
  rejectionLimit: number | null;
  expandedUncertainty: number | null;
  /** The nozzle's uncertainty budget, term by term (absent on other rules and on older records). */
  budget?: LengthBudget;
  verdict: Verdict;
  explanation: string;
  measured: boolean;
  /** measured at the dock, confirmed against evidence seen, or declared only (null: nothing to weigh, or a safety tick). */
  valueKind?: ValueKind | null;
  /** Who had to prove (ISO 14253-1:2017) and the verdict resolved for them; absent in records from before it. */
  burdenOfProof?: BurdenOfProof;
  outcome?: Outcome;
};

export type InstrumentFigures = {
  id: string;
  name: string;
  quantity: 'length' | 'mass';
  errorLimit: number | null;
  resolution: number | null;
  expandedUncertainty: number | null;
  /** The instrument's material on file, when it has one (else the form's, else steel is assumed). */
  material?: string | null;
  /** Where expandedUncertainty comes from when a calibration certificate gives it ("certificate C-1 of …, U … (k = 2)"). */
  uncertaintySource?: string | null;
};

export type InspectionDecision = {
  rules: RuleResult[];
  overall: Verdict;
  /** Who had to prove at this inspection, and the overall verdict resolved for them. */
  burdenOfProof: BurdenOfProof;
  overallOutcome: Outcome;
  nozzle: {
    correctedReadingsMm: number[];
    temperatureCorrected: boolean;
    expandedUncertaintyMm: number;
    uncertaintyBasis: string;
    /** What the correction used (null: not corrected). */
    thermal: NozzleThermal | null;
    /** The budget of the decisive reading (the maximum's when both sides are limited). */
    budget: LengthBudget;
  };
  weight: { meanKg: number; expandedUncertaintyKg: number; uncertaintyBasis: string } | null;
  /** The class's own measured items as decided (value, U and its basis), in the rules' order. */
  items: ItemDecision[];
  /** The checks decided (null: all of them). */
  scope: CheckArea[] | null;
};

/** The nozzle as decided; the newer temperature fields are optional (older callers and queued drafts). */
type NozzleDecideInput = Omit<
  RecordInspectionInput['nozzle'],
  'partTemperatureC' | 'instrumentTemperatureC' | 'instrumentAtPartTemperature' | 'instrumentMaterial'
> &
  Partial<
    Pick<
      RecordInspectionInput['nozzle'],
      'partTemperatureC' | 'instrumentTemperatureC' | 'instrumentAtPartTemperature' | 'instrumentMaterial'
    >
  >;

export type DecideInput = {
  /** kind: a 'protest' inspection is decided with the class's protest burden of proof, any other with its inspection one. */
  input: Pick<RecordInspectionInput, 'weight' | 'safety'> &
    Partial<Pick<RecordInspectionInput, 'measuredItems' | 'gaugeChecks'>> & { kind?: InspectionKind } & {
      nozzle: NozzleDecideInput;
      power: Pick<RecordInspectionInput['power'], 'declaredKw' | 'evidenceSeen'> & { note?: string };
    };
  rules: ClassRules;
  nozzleInstrument?: InstrumentFigures | null;
  weightInstrument?: InstrumentFigures | null;
  /** The instrument named for each measured item, by the item's key (checked by the server: type allowed, in calibration). */
  itemInstruments?: Readonly<Record<string, InstrumentFigures | null>>;
  /** The gauge of the nozzle's gauge check when it is on the instruments list. */
  gaugeInstrument?: InstrumentFigures | null;
  /** A targeted re-inspection: decide only these checks (null or absent: all). */
  scope?: readonly CheckArea[] | null;
  /** The register's seals checked on this boat (the server names the components; the dock uses the card's copy). */
  sealFindings?: readonly SealFinding[];
  /** The entry's declared dated safety gear judged on the meeting day of the record (the server's; absent: none declared). */
  gear?: GearOnDay | null;
};

/** Dated safety gear on the day: how many items were declared, and what is not in order (expired, not presented…). */
export type GearOnDay = { day: string; items: number; findings: readonly { code: string; text: string }[] };

const RANK: Record<Verdict, number> = { conforms: 0, inconclusive: 1, does_not_conform: 2 };
export const worstVerdict = (verdicts: Verdict[]): Verdict =>
  verdicts.reduce<Verdict>((w, v) => (RANK[v] > RANK[w] ? v : w), 'conforms');

export const MEASURE_AGAIN = 'Measure again with a better instrument (a smaller U) to decide.';

/** U of an instrument: its certificate's U, or its budget from a and δ (JCGM 100:2008, k = 2). */
export function instrumentUncertainty(
  i: InstrumentFigures,
  unit: 'mm' | 'kg',
): { expandedUncertainty: number; basis: string } {
  if (i.expandedUncertainty != null)
    return {
      expandedUncertainty: i.expandedUncertainty,
      basis: `${i.name}: certificate U ${formatFigure(i.expandedUncertainty, 2)} ${unit}${i.uncertaintySource ? ` (${i.uncertaintySource})` : ''}`,
    };
  const b = computeUncertaintyBudget({ errorLimitMm: i.errorLimit ?? 0, resolutionMm: i.resolution ?? 0 });
  const parts = [
    i.errorLimit != null && `a ${formatFigure(i.errorLimit, 2)}`,
    i.resolution != null && `δ ${formatFigure(i.resolution, 2)}`,
  ]
    .filter(Boolean)
    .join(', ');
  return {
    expandedUncertainty: b.expandedUncertaintyMm,
    basis: `${i.name} (${parts} ${unit}): U = 2·√(a²/3 + δ²/12) = ${b.expandedUncertaintyMm.toFixed(4)} ${unit}`,
  };
}

/** An item instrument's U in its own unit (mm for a length instrument, kg for a scale). */
function toItemU(i: InstrumentFigures): { expandedUncertainty: number; basis: string } {
  return instrumentUncertainty(i, i.quantity === 'length' ? 'mm' : 'kg');
}

function withAsk(explanation: string, verdict: Verdict): string {
  return verdict === 'inconclusive' && !/measure again with a better instrument/i.test(explanation)
    ? `${explanation} ${MEASURE_AGAIN}`
    : explanation;
}

/** Wording for a limit on kg or kW (the engine's own wording speaks of mm readings). */
function explainLimit(o: {
  what: string;
  value: number;
  unit: string;
  side: 'max' | 'min';
  limit: number;
  u: number;
  rule: DecisionRule;
  verdict: Verdict;
}): string {
  const f = (x: number) => `${formatFigure(x, o.unit === 'kW' ? 0 : 1)} ${o.unit}`;
  const limit = `the ${o.side === 'max' ? 'maximum' : 'minimum'} ${f(o.limit)}`;
  const beyond = o.side === 'max' ? 'is above' : 'is below';
  const notBeyond = o.side === 'max' ? 'is not above' : 'is not below';
  const value = `${o.what} ${f(o.value)}`;
  if (o.rule === 'simple')
    return `${value} ${o.verdict === 'conforms' ? notBeyond : beyond} ${limit} (simple acceptance): ${o.verdict === 'conforms' ? 'conforms' : 'does not conform'}.`;
  if (o.rule === 'guarded') {
    const acc = f(o.side === 'max' ? o.limit - o.u : o.limit + o.u);
    return `${value} ${o.verdict === 'conforms' ? notBeyond : beyond} the acceptance limit ${acc} (${limit} ${o.side === 'max' ? 'less' : 'plus'} U ${f(o.u)}, guarded acceptance): ${o.verdict === 'conforms' ? 'conforms' : 'does not conform'}.`;
  }
  if (o.verdict === 'conforms')
    return `${value} is inside ${limit} by at least U ${f(o.u)}: conformity proven (ISO 14253-1).`;
  if (o.verdict === 'does_not_conform')
    return `${value} ${beyond} ${limit} by more than U ${f(o.u)}: non-conformity proven (ISO 14253-1).`;
  return `${value} is within U ${f(o.u)} of ${limit}: neither conformity nor non-conformity proven (ISO 14253-1).`;
}

function decideNozzle(
  d: DecideInput,
  isDecided = true,
): { results: RuleResult[]; nozzle: InspectionDecision['nozzle'] } {
  const { nozzle } = d.input;
  const { rules } = d;
  if (isDecided && nozzle.readings.length < rules.nozzle.minReadings) {
    throw new EngineInputError(
      'nozzle.readings',
      `The class rules ask for at least ${rules.nozzle.minReadings} readings around the exit; ${nozzle.readings.length} given.`,
    );
  }
  const thermal = resolveNozzleThermal(nozzle, d.nozzleInstrument?.material);
  const temperatureCorrected = thermal != null;
  const correctedReadingsMm = nozzle.readings.map((r) =>
    thermal ? correctReadingMm(r.diameterMm, thermal) : r.diameterMm,
  );
  const partTemperatureC = nozzle.partTemperatureC ?? nozzle.temperatureC;
  let u: { expandedUncertainty: number; basis: string };
  if (d.nozzleInstrument) {
    if (d.nozzleInstrument.quantity !== 'length')
      throw new EngineInputError(
        'nozzle.instrumentId',
        `${d.nozzleInstrument.name} weighs; choose an instrument that measures length.`,
      );
    u = instrumentUncertainty(d.nozzleInstrument, 'mm');
  } else if (nozzle.expandedUncertaintyMm != null) {
    u = {
      expandedUncertainty: nozzle.expandedUncertaintyMm,
      basis: `U ${formatMm(nozzle.expandedUncertaintyMm)} mm as entered`,
    };
  } else {
    u = {
      expandedUncertainty: rules.nozzle.defaultUncertaintyMm,
      basis: `the class default U ${formatMm(rules.nozzle.defaultUncertaintyMm)} mm (no instrument chosen)`,
    };
  }
  const note = thermal
    ? describeThermal(thermal)
    : partTemperatureC != null
      ? ' Not corrected for temperature: the nozzle material was not given.'
      : '';
  const readingTerms = readingTermsOf(d.nozzleInstrument ?? null, u.expandedUncertainty, u.basis);
  const raw = nozzle.readings.map((r) => r.diameterMm);
  const results: RuleResult[] = [];
  const budgets: LengthBudget[] = [];
  for (const side of ['max', 'min'] as const) {
    const limit = side === 'max' ? rules.nozzle.maxMm : rules.nozzle.minMm;
    if (limit == null) continue;
    // The budget of the reading that decides this side (the correction is monotonic in the reading).
    const budget = nozzleBudget(readingTerms, side === 'max' ? Math.max(...raw) : Math.min(...raw), thermal);
    budgets.push(budget);
    // Without a correction the instrument's U stands as before; with one, U = 2·u_c of the whole budget.
    const sideU = thermal ? budget.expandedUncertaintyMm : u.expandedUncertainty;
    const basis = thermal
      ? `${u.basis}, with the temperature and expansion-coefficient terms (JCGM 100:2008, 5.1.2): U = 2·u_c = ${sideU.toFixed(4)} mm`
      : u.basis;
    const r = evaluateConformity({
      readingsMm: correctedReadingsMm,
      ...(side === 'max' ? { maxMm: limit } : { minMm: limit }),
      expandedUncertaintyMm: sideU,
      rule: rules.decisionRule,
    });
    const check = r.checks[0];
    results.push({
      rule: side === 'max' ? 'nozzle_max' : 'nozzle_min',
      label: side === 'max' ? 'Nozzle exit diameter, maximum' : 'Nozzle exit diameter, minimum',
      decisiveValue: check.decisiveValueMm,
      unit: 'mm',
      limit,
      acceptanceLimit: check.acceptanceLimitMm,
      rejectionLimit: check.rejectionLimitMm,
      expandedUncertainty: sideU,
      budget,
      verdict: check.verdict,
      explanation: withAsk(`${check.explanation}${note} Uncertainty: ${basis}.`, check.verdict),
      measured: true,
      valueKind: 'measured',
    });
  }
  const budget = budgets[0] ?? nozzleBudget(readingTerms, Math.max(...raw), thermal);
  const expandedUncertaintyMm = thermal ? budget.expandedUncertaintyMm : u.expandedUncertainty;
  return {
    results,
    nozzle: {
      correctedReadingsMm,
      temperatureCorrected,
      expandedUncertaintyMm,
      uncertaintyBasis: thermal
        ? `${u.basis}, with the temperature and expansion-coefficient terms (JCGM 100:2008, 5.1.2): U = 2·u_c = ${expandedUncertaintyMm.toFixed(4)} mm`
        : u.basis,
      thermal,
      budget,
    },
  };
}

/** The instrument's own budget rows as standard uncertainties of the reading (JCGM 100:2008, 4.3.7, F.2.2.1; U/k with k = 2). */
function readingTermsOf(
  i: InstrumentFigures | null,
  expandedUncertainty: number,
  basis: string,
): ReadingUncertaintyTerm[] {
  if (i && i.expandedUncertainty == null && (i.errorLimit != null || i.resolution != null)) {
    const terms: ReadingUncertaintyTerm[] = [];
    if (i.errorLimit != null)
      terms.push({
        quantity: `${i.name}: error limit a`,
        value: i.errorLimit,
        unit: 'mm',
        standardUncertainty: i.errorLimit / Math.sqrt(3),
        basis: 'rectangular: a/√3 (JCGM 100:2008, 4.3.7)',
      });
    if (i.resolution != null)
      terms.push({
        quantity: `${i.name}: resolution δ`,
        value: i.resolution,
        unit: 'mm',
        standardUncertainty: i.resolution / Math.sqrt(12),
        basis: 'rectangular: δ/√12 (JCGM 100:2008, F.2.2.1)',
      });
    return terms;
  }
  const what = i ? `${i.name}: certificate U` : basis.startsWith('U ') ? 'U as entered' : 'class default U';
  return [
    {
      quantity: what,
      value: expandedUncertainty,
      unit: 'mm',
      standardUncertainty: expandedUncertainty / 2,
      basis: 'U/k, k = 2 (JCGM 100:2008, 6.2.1)',
    },
  ];
}

function sideCheck(value: number, side: 'max' | 'min', limit: number, u: number, rule: DecisionRule) {
  return evaluateConformity({
    readingsMm: [value],
    ...(side === 'max' ? { maxMm: limit } : { minMm: limit }),
    expandedUncertaintyMm: u,
    rule,
  }).checks[0];
}

function decideWeight(d: DecideInput): { result: RuleResult | null; weight: InspectionDecision['weight'] } {
  const { rules } = d;
  const minKg = rules.weight.minKg;
  if (minKg == null) return { result: null, weight: null };
  const basisWords = rules.weight.includesDriver ? 'with driver' : 'without driver';
  const label = `Weight (${basisWords}), minimum`;
  const w = d.input.weight;
  if (!w || w.readingsKg.length === 0) {
    const explanation = `Not weighed: the class minimum is ${formatFigure(minKg, 1)} kg (${basisWords}). Weigh the boat to decide.`;
    return {
      result: {
        rule: 'weight_min',
        label,
        decisiveValue: null,
        unit: 'kg',
        limit: minKg,
        acceptanceLimit: null,
        rejectionLimit: null,
        expandedUncertainty: null,
        verdict: 'inconclusive',
        explanation,
        measured: false,
        valueKind: null,
      },
      weight: null,
    };
  }
  let scale: { expandedUncertainty: number; basis: string };
  if (d.weightInstrument) {
    if (d.weightInstrument.quantity !== 'mass')
      throw new EngineInputError('weight.instrumentId', `${d.weightInstrument.name} measures length; choose a scale.`);
    scale = instrumentUncertainty(d.weightInstrument, 'kg');
  } else {
    scale = {
      expandedUncertainty: rules.weight.defaultUncertaintyKg,
      basis: `the class default U ${formatFigure(rules.weight.defaultUncertaintyKg, 1)} kg (no scale chosen)`,
    };
  }
  const n = w.readingsKg.length;
  const meanKg = w.readingsKg.reduce((a, b) => a + b, 0) / n;
  const s = n > 1 ? Math.sqrt(w.readingsKg.reduce((a, x) => a + (x - meanKg) ** 2, 0) / (n - 1)) : 0;
  // JCGM 100:2008: u = U/k for the scale (k = 2), s/√n for the mean of n weighings, in quadrature, then k = 2.
  const expandedUncertaintyKg = 2 * Math.hypot(scale.expandedUncertainty / 2, n > 1 ? s / Math.sqrt(n) : 0);
  const basis =
    n > 1
      ? `${scale.basis}, with the spread of ${n} weighings (s ${s.toFixed(2)} kg): U ${expandedUncertaintyKg.toFixed(2)} kg`
      : scale.basis;
  const check = sideCheck(meanKg, 'min', minKg, expandedUncertaintyKg, rules.decisionRule);
  const what = n > 1 ? `Mean of ${n} weighings` : 'Weighing';
  const explanation = `${explainLimit({ what, value: meanKg, unit: 'kg', side: 'min', limit: minKg, u: expandedUncertaintyKg, rule: rules.decisionRule, verdict: check.verdict })} Uncertainty: ${basis}.`;
  return {
    result: {
      rule: 'weight_min',
      label,
      decisiveValue: meanKg,
      unit: 'kg',
      limit: minKg,
      acceptanceLimit: check.acceptanceLimitMm,
      rejectionLimit: check.rejectionLimitMm,
      expandedUncertainty: expandedUncertaintyKg,
      verdict: check.verdict,
      explanation: withAsk(explanation, check.verdict),
      measured: true,
      valueKind: 'measured',
    },
    weight: { meanKg, expandedUncertaintyKg, uncertaintyBasis: basis },
  };
}

function decidePower(d: DecideInput): RuleResult | null {
  const { rules } = d;
  const { declaredKw, evidenceSeen } = d.input.power;
  const u = rules.power.defaultUncertaintyKw;
  const sides = (
    [
      ['min', rules.power.minKw],
      ['max', rules.power.maxKw],
    ] as const
  ).filter((s): s is readonly ['min' | 'max', number] => s[1] != null);
  if (sides.length === 0) return null;
  const checks = sides.map(([side, limit]) => ({
    side,
    limit,
    check: sideCheck(declaredKw, side, limit, u, rules.decisionRule),
  }));
  // The side that decides: the worst verdict (on a tie, the maximum, as evaluateConformity does).
  const governing = checks.reduce((g, c) =>
    RANK[c.check.verdict] > RANK[g.check.verdict] ||
    (RANK[c.check.verdict] === RANK[g.check.verdict] && c.side === 'max')
      ? c
      : g,
  );
  const band =
    sides.length === 2
      ? `band ${formatFigure(rules.power.minKw!)}–${formatFigure(rules.power.maxKw!)} kW`
      : `${sides[0][0] === 'max' ? 'maximum' : 'minimum'} ${formatFigure(sides[0][1])} kW`;
  let verdict = governing.check.verdict;
  let explanation = `${explainLimit({ what: 'Power', value: declaredKw, unit: 'kW', side: governing.side, limit: governing.limit, u, rule: rules.decisionRule, verdict })} Class ${band}, U ${formatFigure(u)} kW.`;
  if (!evidenceSeen && verdict !== 'does_not_conform') {
    verdict = 'inconclusive';
    explanation = `${explanation} No evidence was seen (dyno sheet or maker’s rating), so conformity is not shown: ask for the evidence or measure again with a better instrument (a dyno run).`;
  }
  // Power is not measured at the dock: the figure is confirmed against the evidence seen, or only declared.
  const valueKind: ValueKind = evidenceSeen ? 'confirmed' : 'declared';
  return {
    rule: 'power_band',
    label: 'Engine power',
    decisiveValue: declaredKw,
    unit: 'kW',
    limit: governing.limit,
    acceptanceLimit: governing.check.acceptanceLimitMm,
    rejectionLimit: governing.check.rejectionLimitMm,
    expandedUncertainty: u,
    verdict,
    explanation: withAsk(explanation, verdict),
    measured: true,
    valueKind,
  };
}

function decideSafety(d: DecideInput): RuleResult[] {
  return d.rules.safetyItems.map((item) => {
    const key = item as SafetyItem;
    const ok = d.input.safety?.[key] === true;
    return {
      rule: `safety:${key}` as RuleKey,
      label: SAFETY_ITEMS[key] ?? key,
      decisiveValue: null,
      unit: null,
      limit: null,
      acceptanceLimit: null,
      rejectionLimit: null,
      expandedUncertainty: null,
      verdict: ok ? 'conforms' : 'does_not_conform',
      explanation: ok
        ? `${SAFETY_ITEMS[key]}: checked as present and working.`
        : `${SAFETY_ITEMS[key]}: not ticked as present and working. The class requires it; the boat does not conform until it is fitted and checked.`,
      measured: ok,
      valueKind: null,
    } satisfies RuleResult;
  });
}

/**
 * One line per seal checked. A broken or missing scrutineering seal means the sealed component is no
 * longer in the state that was verified when the seal went on, so the boat does not conform until it
 * is re-verified and sealed again (common practice, no source). The governing body's rules and its
 * officials decide what follows; the verdict shows the finding with the usual caution. A seal
 * finding is always shown, even in a targeted re-inspection: it is something seen, not a check ordered.
 */
export function decideSeals(findings: readonly SealFinding[] | undefined): RuleResult[] {
  return (findings ?? []).map((f) => {
    const ok = f.state === 'intact';
    const explanation = ok
      ? `Seal ${f.number} on the ${f.component} was found intact.`
      : f.state === 'broken'
        ? `Seal ${f.number} on the ${f.component} was found broken: the component is no longer in the state verified when it was sealed, so it does not conform until it is checked again and re-sealed. The officials decide what follows.`
        : `Seal ${f.number} on the ${f.component} was found missing: the component is no longer shown to be in the state verified when it was sealed, so it does not conform until it is checked again and re-sealed. The officials decide what follows.`;
    return {
      rule: `seal:${f.number}` as RuleKey,
      label: `Seal ${f.number} (${f.component})`,
      decisiveValue: null,
      unit: null,
      limit: null,
      acceptanceLimit: null,
      rejectionLimit: null,
      expandedUncertainty: null,
      verdict: ok ? 'conforms' : 'does_not_conform',
      explanation,
      measured: true,
      valueKind: null,
    } satisfies RuleResult;
  });
}

/**
 * Declared safety gear with dates (helmet, harness, jacket, extinguisher, first-aid kit): an item past its expiry
 * or service date on the meeting day, or not presented or not as declared at the dock that day, is a finding that
 * does not conform; with none, one line says every declared item is in date. Using safety gear within its date is
 * common practice (no source); the local rulebook and the officials decide what follows.
 */
export function decideGear(gear: GearOnDay | null | undefined): RuleResult[] {
  if (!gear || gear.items === 0) return [];
  const line = (rule: RuleKey, label: string, ok: boolean, explanation: string): RuleResult => ({
    rule,
    label,
    decisiveValue: null,
    unit: null,
    limit: null,
    acceptanceLimit: null,
    rejectionLimit: null,
    expandedUncertainty: null,
    verdict: ok ? 'conforms' : 'does_not_conform',
    explanation,
    measured: false,
    valueKind: null,
  });
  if (gear.findings.length === 0)
    return [
      line(
        'gear:in_date',
        'Safety gear dates',
        true,
        `Every declared item of safety gear (${gear.items}) is within its expiry or service date on ${gear.day}.`,
      ),
    ];
  return gear.findings.map((f, i) =>
    line(
      `gear:${i + 1}`,
      f.code === 'gear_expired' ? 'Safety gear out of date' : 'Safety gear at the dock',
      false,
      `${f.text} It does not conform until it is replaced, serviced or shown as declared. The local rulebook and the officials decide what follows.`,
    ),
  );
}

/**
 * The rule line resolved for whoever must prove (the verdict is kept as decided). An inconclusive
 * line's explanation says what it means: under the entrant's burden the usual "measure again" (or
 * fix the part) stands; under the protester's, non-conformity is not proven and the part stands. A
 * protester carries the uncertainty whatever acceptance rule the class uses (ISO 14253-1:2017): under
 * that burden a guarded or simple line is resolved on the zone beyond the limit by more than U.
 */
function withOutcome(r: RuleResult, burden: BurdenOfProof): RuleResult {
  const proven = burden === 'non_conformity' ? verdictProvenByProtester(r) : r.verdict;
  const { outcome, explanation } = resolveOutcome(proven, burden);
  if (proven === r.verdict && r.verdict !== 'inconclusive') return { ...r, burdenOfProof: burden, outcome };
  const why =
    proven === r.verdict
      ? explanation
      : `${explanation} The protester must show the value beyond the limit by more than the expanded uncertainty (ISO 14253-1:2017), whatever the class's acceptance rule.`;
  return { ...r, burdenOfProof: burden, outcome, explanation: `${r.explanation} ${why}` };
}

/** Every rule's verdict and the overall result. Throws EngineInputError (field named) on input the class refuses. */
export function decideInspection(d: DecideInput): InspectionDecision {
  const burdenOfProof = burdenForInspection(d.rules, d.input.kind);
  const scope = d.scope && d.scope.length ? [...d.scope] : null;
  const decides = (area: CheckArea) => !scope || scope.includes(area);
  const { results: nozzleResults, nozzle } = decideNozzle(d, decides('nozzle'));
  const { result: weightResult, weight } = decideWeight(d);
  const power = decidePower(d);
  const itemInstruments: Record<string, ItemInstrument | null> = {};
  for (const [key, i] of Object.entries(d.itemInstruments ?? {}))
    itemInstruments[key] = i ? { id: i.id, name: i.name, quantity: i.quantity, ...toItemU(i) } : null;
  const { lines: itemLines, items } = decideMeasuredItems(d.rules, d.input.measuredItems, itemInstruments);
  const gaugeLines = decideGaugeChecks(
    d.rules,
    d.input.gaugeChecks,
    d.gaugeInstrument?.name ?? null,
    nozzle.correctedReadingsMm,
  );
  // The same maths for every check; a targeted re-inspection keeps only the checks it was ordered to make.
  // Under a class whose nozzle rule says the gauge governs, the two-point lines are recorded but do not decide.
  const rules = [
    ...(decides('nozzle') && twoPointGoverns(d.rules) ? nozzleResults : []),
    ...(decides('nozzle') ? (gaugeLines as RuleResult[]) : []),
    ...(weightResult && decides('weight') ? [weightResult] : []),
    ...(power && decides('power') ? [power] : []),
    ...(decides('safety') ? decideSafety(d) : []),
    ...(decides('items') ? (itemLines as RuleResult[]) : []),
    ...decideSeals(d.sealFindings),
    ...(decides('safety') ? decideGear(d.gear) : []),
  ].map((r) => withOutcome(r, burdenOfProof));
  const overall = worstVerdict(rules.map((r) => r.verdict));
  return {
    rules,
    overall,
    burdenOfProof,
    overallOutcome: rules.length
      ? worstOutcome(rules.map((r) => r.outcome ?? resolveOutcome(r.verdict, burdenOfProof).outcome))
      : resolveOutcome(overall, burdenOfProof).outcome,
    nozzle,
    weight: decides('weight') ? weight : null,
    items: decides('items') ? items : [],
    scope,
  };
}

/** Words for a verdict, the same everywhere (never colour alone). */
export const VERDICT_WORDS: Record<Verdict, string> = {
  conforms: 'Conforms',
  does_not_conform: 'Does not conform',
  inconclusive: 'Inconclusive',
};
