// The verdict lines of a class's own measured items (`item:<key>`) and of go/no-go gauge checks
// (`gauge:nozzle`). decide-inspection.ts calls these and applies the burden of proof to every line.
// Framework-free; it imports nothing from decide-inspection.ts (that file imports this one).
//
// Items: the value and U come from lib/core/engine/measured-item.ts (the largest or smallest reading
// for a size in mm, the mean for one quantity such as a mass, the formula's value for engine
// capacity), decided with evaluateConformity under the item's decision rule, else the class's
// (ISO 14253-1:2017; ILAC-G8:09/2019). An item the class lists but the record does not measure is
// inconclusive ("not measured"), as an unweighed boat is.
// Gauges: a go/no-go gauge is an attribute check with no reading, so it has no U to guard with: it
// passes or fails. Which check governs the nozzle limits is the class's rule (two-point readings,
// the gauge, or both; ISO 14405-1:2016 distinguishes the two-point size from the inscribed size a
// plug gauge tests), and the gauge's line says where the two disagree.
import { evaluateConformity, type DecisionRule, type Verdict } from '../engine/conformity';
import { EngineInputError } from '../engine/engine-input-error';
import {
  ITEM_UNIT_FACTS,
  estimateDirectItem,
  estimateEngineCapacity,
  type ItemEstimate,
  type ItemUnit,
} from '../engine/measured-item';
import type { ClassRules } from '../inputs/class-rules';
import type { GaugeCheckInput, MeasuredItemInput } from '../inputs/inspections';
import type { MeasuredItemRule } from '../inputs/measured-item-rules';
import { CHECK_METHOD_WORDS, ownValue } from '../inputs/measured-item-terms';

/** An instrument named for an item, with its U already worked out (decide-inspection's instrumentUncertainty). */
export type ItemInstrument = {
  id: string;
  name: string;
  quantity: 'length' | 'mass';
  expandedUncertainty: number;
  basis: string;
};

/** A verdict line, the same fields as decide-inspection's RuleResult (kept apart to avoid an import cycle). */
export type ItemRuleLine = {
  rule: `item:${string}` | 'gauge:nozzle';
  label: string;
  decisiveValue: number | null;
  unit: ItemUnit | null;
  limit: number | null;
  acceptanceLimit: number | null;
  rejectionLimit: number | null;
  expandedUncertainty: number | null;
  verdict: Verdict;
  explanation: string;
  measured: boolean;
  valueKind: 'measured' | null;
};

/** What the stored record keeps of each measured item. */
export type ItemDecision = {
  key: string;
  label: string;
  unit: ItemUnit;
  value: number;
  expandedUncertainty: number;
  uncertaintyBasis: string;
};

const fmt = (x: number, unit: ItemUnit, extra = 0) => `${x.toFixed(ITEM_UNIT_FACTS[unit].digits + extra)} ${unit}`;

function explainItem(o: {
  what: string;
  value: number;
  unit: ItemUnit;
  side: 'max' | 'min';
  limit: number;
  u: number;
  rule: DecisionRule;
  verdict: Verdict;
}): string {
  const f = (x: number) => fmt(x, o.unit);
  const limit = `the ${o.side === 'max' ? 'maximum' : 'minimum'} ${f(o.limit)}`;
  const beyond = o.side === 'max' ? 'is above' : 'is below';
  const notBeyond = o.side === 'max' ? 'is not above' : 'is not below';
  const value = `${o.what} ${f(o.value)}`;
  const u = fmt(o.u, o.unit, 1);
  if (o.rule === 'simple')
    return `${value} ${o.verdict === 'conforms' ? notBeyond : beyond} ${limit} (simple acceptance): ${o.verdict === 'conforms' ? 'conforms' : 'does not conform'}.`;
  if (o.rule === 'guarded') {
    const acc = f(o.side === 'max' ? o.limit - o.u : o.limit + o.u);
    return `${value} ${o.verdict === 'conforms' ? notBeyond : beyond} the acceptance limit ${acc} (${limit} ${o.side === 'max' ? 'less' : 'plus'} U ${u}, guarded acceptance): ${o.verdict === 'conforms' ? 'conforms' : 'does not conform'}.`;
  }
  if (o.verdict === 'conforms')
    return `${value} is inside ${limit} by at least U ${u}: conformity proven (ISO 14253-1).`;
  if (o.verdict === 'does_not_conform')
    return `${value} ${beyond} ${limit} by more than U ${u}: non-conformity proven (ISO 14253-1).`;
  return `${value} is within U ${u} of ${limit}: neither conformity nor non-conformity proven (ISO 14253-1). Measure again with a better instrument (a smaller U) to decide.`;
}

function estimate(rule: MeasuredItemRule, m: MeasuredItemInput, index: number, inst: ItemInstrument | null) {
  const field = (i: number, name: string) => `measuredItems.${index}.readings.${i}.${name}`;
  if (m.readings.length < rule.readings)
    throw new EngineInputError(
      `measuredItems.${index}.readings`,
      `The class rules ask for ${rule.readings} reading${rule.readings === 1 ? '' : 's'} of ${rule.label}; ${m.readings.length} given.`,
    );
  if (rule.formula.kind === 'engine_capacity') {
    m.readings.forEach((r, i) => {
      for (const name of ['boreMm', 'strokeMm'] as const)
        if (r[name] == null)
          throw new EngineInputError(field(i, name), `Enter the ${name === 'boreMm' ? 'bore' : 'stroke'} (mm).`);
      if (r.value != null)
        throw new EngineInputError(field(i, 'value'), `${rule.label} is worked out from bore and stroke.`);
    });
    const lengthU = inst && inst.quantity === 'length' ? inst.expandedUncertainty / 2 : null;
    return estimateEngineCapacity({
      cylinders: rule.formula.cylinders,
      boresMm: m.readings.map((r) => r.boreMm!),
      strokesMm: m.readings.map((r) => r.strokeMm!),
      instrumentStandardUMm: lengthU,
      defaultExpandedUCm3: rule.defaultUncertainty,
      instrumentBasis:
        lengthU != null
          ? `${inst!.basis} for each bore and stroke reading`
          : inst
            ? `${inst.name} gives no length uncertainty; the class default U ${rule.defaultUncertainty} cm³ stands`
            : null,
    });
  }
  m.readings.forEach((r, i) => {
    if (r.value == null) throw new EngineInputError(field(i, 'value'), `Enter the reading (${rule.unit}).`);
    if (r.boreMm != null || r.strokeMm != null)
      throw new EngineInputError(field(i, 'value'), `${rule.label} is read directly: give value only.`);
  });
  // The instrument's own U applies only where its quantity is the item's (a length instrument for mm, a scale for kg).
  const applies =
    inst && ((inst.quantity === 'length' && rule.unit === 'mm') || (inst.quantity === 'mass' && rule.unit === 'kg'));
  return estimateDirectItem({
    unit: rule.unit,
    values: m.readings.map((r) => r.value!),
    instrumentStandardU: applies ? inst!.expandedUncertainty / 2 : null,
    defaultExpandedU: rule.defaultUncertainty,
    instrumentBasis: applies
      ? inst!.basis
      : inst
        ? `${inst.name} gives no uncertainty in ${rule.unit}; the class default U ${rule.defaultUncertainty} ${rule.unit} stands`
        : null,
  });
}

function labelOf(rule: MeasuredItemRule): string {
  return rule.note ? `${rule.label} (${rule.note})` : rule.label;
}

/**
 * One line per measured item of the class. Throws EngineInputError naming the field for an item the
 * class does not have, too few readings, or a reading of the wrong shape (the server answers 400).
 */
export function decideMeasuredItems(
  rules: Pick<ClassRules, 'measuredItems' | 'decisionRule'>,
  measured: readonly MeasuredItemInput[] | undefined,
  instruments: Readonly<Record<string, ItemInstrument | null>> = {},
): { lines: ItemRuleLine[]; items: ItemDecision[] } {
  const defined = rules.measuredItems ?? [];
  const given = measured ?? [];
  given.forEach((m, i) => {
    if (!defined.some((d) => d.key === m.key))
      throw new EngineInputError(
        `measuredItems.${i}.key`,
        `The class rules in force have no measured item “${m.key}”: it cannot be recorded for this boat.`,
      );
  });
  const lines: ItemRuleLine[] = [];
  const items: ItemDecision[] = [];
  for (const rule of defined) {
    const index = given.findIndex((m) => m.key === rule.key);
    const label = labelOf(rule);
    const decisionRule = rule.decisionRule ?? rules.decisionRule;
    const limits = [
      ['max', rule.maximum],
      ['min', rule.minimum],
    ].filter((l): l is ['max' | 'min', number] => l[1] != null);
    if (index < 0) {
      lines.push({
        rule: `item:${rule.key}`,
        label,
        decisiveValue: null,
        unit: rule.unit,
        limit: limits[0]?.[1] ?? null,
        acceptanceLimit: null,
        rejectionLimit: null,
        expandedUncertainty: null,
        verdict: 'inconclusive',
        explanation: `Not measured: the class rules limit ${rule.label}. Measure it to decide.`,
        measured: false,
        valueKind: null,
      });
      continue;
    }
    const m = given[index];
    const est: ItemEstimate = estimate(rule, m, index, ownValue(instruments, rule.key) ?? null);
    const result = evaluateConformity({
      readingsMm: est.decisiveValues,
      ...(rule.maximum != null ? { maxMm: rule.maximum } : {}),
      ...(rule.minimum != null ? { minMm: rule.minimum } : {}),
      expandedUncertaintyMm: est.expandedUncertainty,
      rule: decisionRule,
    });
    const governing =
      result.checks.find((c) => c.verdict === result.verdict && c.side === 'max') ??
      result.checks.find((c) => c.verdict === result.verdict)!;
    const extreme = ITEM_UNIT_FACTS[rule.unit].decisive === 'extreme' && rule.formula.kind === 'direct';
    const n = m.readings.length;
    const what = extreme
      ? `${governing.side === 'max' ? 'Largest' : 'Smallest'} reading`
      : rule.formula.kind === 'engine_capacity'
        ? 'Engine capacity'
        : n > 1
          ? `Mean of ${n} readings`
          : 'Reading';
    const explanation = `${explainItem({ what, value: governing.decisiveValueMm, unit: rule.unit, side: governing.side, limit: governing.limitMm, u: est.expandedUncertainty, rule: decisionRule, verdict: governing.verdict })} Uncertainty: ${est.basis}.`;
    lines.push({
      rule: `item:${rule.key}`,
      label,
      decisiveValue: governing.decisiveValueMm,
      unit: rule.unit,
      limit: governing.limitMm,
      acceptanceLimit: governing.acceptanceLimitMm,
      rejectionLimit: governing.rejectionLimitMm,
      expandedUncertainty: est.expandedUncertainty,
      verdict: result.verdict,
      explanation,
      measured: true,
      valueKind: 'measured',
    });
    items.push({
      key: rule.key,
      label: rule.label,
      unit: rule.unit,
      value: est.value,
      expandedUncertainty: est.expandedUncertainty,
      uncertaintyBasis: est.basis,
    });
  }
  return { lines, items };
}

/** Whether the nozzle's two-point lines decide (not when the class says the gauge alone governs). */
export const twoPointGoverns = (rules: Pick<ClassRules, 'nozzle'>) => rules.nozzle.checkMethod !== 'gauge';
/** Whether a gauge check is part of the nozzle's verdict. */
export const gaugeGoverns = (rules: Pick<ClassRules, 'nozzle'>) =>
  rules.nozzle.checkMethod === 'gauge' || rules.nozzle.checkMethod === 'both';

/**
 * The nozzle's gauge line. A gauge check recorded under a class whose rule does not use the gauge is
 * refused (400): the record would claim a check the rules do not ask for. Not checked while the rule
 * needs it: inconclusive. `readingsMm`: the two-point readings as the verdict used them, to say when
 * the two methods disagree.
 */
export function decideGaugeChecks(
  rules: Pick<ClassRules, 'nozzle'>,
  checks: readonly GaugeCheckInput[] | undefined,
  gaugeName: string | null,
  readingsMm: readonly number[],
): ItemRuleLine[] {
  const given = checks ?? [];
  if (!gaugeGoverns(rules)) {
    if (given.length)
      throw new EngineInputError(
        'gaugeChecks.0.rule',
        'The class rules in force check the nozzle with two-point readings only: a gauge check is not part of them.',
      );
    return [];
  }
  const { maxMm, minMm, gaugeNoGoMm, gaugeGoMm } = rules.nozzle;
  const sizes = [
    maxMm != null && gaugeNoGoMm != null ? `no-go plug ${gaugeNoGoMm.toFixed(2)} mm must not enter` : null,
    minMm != null && gaugeGoMm != null ? `go plug ${gaugeGoMm.toFixed(2)} mm must enter` : null,
  ]
    .filter(Boolean)
    .join('; ');
  const method = CHECK_METHOD_WORDS[rules.nozzle.checkMethod ?? 'two_point'];
  const check = given.find((g) => g.rule === 'nozzle');
  const base = {
    rule: 'gauge:nozzle' as const,
    label: 'Nozzle exit, go/no-go gauge',
    decisiveValue: null,
    unit: null,
    limit: null,
    acceptanceLimit: null,
    rejectionLimit: null,
    expandedUncertainty: null,
  };
  if (!check)
    return [
      {
        ...base,
        verdict: 'inconclusive',
        explanation: `Not checked with the gauge (${sizes}). ${method} Check the exit with the gauge to decide.`,
        measured: false,
        valueKind: null,
      },
    ];
  const who = gaugeName ?? check.gauge;
  let explanation = `${who}: ${check.passed ? 'passed' : 'failed'} (${sizes}). ${method}`;
  // Where the two methods disagree, say so: an oval exit can stop the no-go plug across its narrow
  // axis while a two-point reading across its wide axis is above the maximum.
  if (check.passed && readingsMm.length) {
    const over = maxMm != null && Math.max(...readingsMm) > maxMm;
    const under = minMm != null && Math.min(...readingsMm) < minMm;
    if (over || under)
      explanation += ` The two-point readings disagree (${over ? `largest ${Math.max(...readingsMm).toFixed(2)} mm above the maximum` : `smallest ${Math.min(...readingsMm).toFixed(2)} mm below the minimum`}): the exit is not round.${rules.nozzle.checkMethod === 'gauge' ? ' Under this class’s rule the gauge governs.' : ''}`;
  }
  return [
    {
      ...base,
      verdict: check.passed ? 'conforms' : 'does_not_conform',
      explanation,
      measured: true,
      valueKind: 'measured',
    },
  ];
}
