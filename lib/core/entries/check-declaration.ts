// A boat's declaration against a class's rules, before entering: a warning to the entrant, never
// a verdict (only inspection by officials decides). Framework-free: runs in the entry form too.
//
// Each limit is decided with the engine's ISO 14253-1:2017 rule (lib/core/engine/conformity.ts), taking
// as the uncertainty U: for the nozzle, the owner's declared tolerance; for power and weight, the
// uncertainty the class applies to those measurements. So "within" means the declared figure
// clears the limit by at least U, "outside" that it is beyond the limit by more than U, and
// "too close to call" that inspection could go either way.

import { evaluateConformity, type Verdict } from '../engine/conformity';
import type { ClassRules } from '../inputs/class-rules';

export type DeclarationStatus = 'within' | 'outside' | 'too_close';
export const DECLARATION_STATUS_WORDS: Record<DeclarationStatus, string> = {
  within: 'within',
  outside: 'outside',
  too_close: 'too close to call',
};

export type DeclaredFigures = {
  declaredNozzleMm: number;
  declaredNozzleToleranceMm: number;
  declaredPowerKw: number;
  declaredWeightKg: number | null;
};

export type DeclarationRow = {
  key: 'nozzle_max' | 'nozzle_min' | 'power_min' | 'power_max' | 'weight_min';
  label: string;
  unit: 'mm' | 'kW' | 'kg';
  declared: number;
  limit: number;
  uncertainty: number;
  status: DeclarationStatus;
  explanation: string;
};

export type DeclarationCheck = {
  rows: DeclarationRow[];
  /** Things the check could not look at (an undeclared weight, for instance). */
  notes: string[];
  /** The worst row (outside > too_close > within), or null when the class limits nothing declared. */
  worst: DeclarationStatus | null;
};

const FROM_VERDICT: Record<Verdict, DeclarationStatus> = {
  conforms: 'within',
  does_not_conform: 'outside',
  inconclusive: 'too_close',
};
const RANK: Record<DeclarationStatus, number> = { within: 0, too_close: 1, outside: 2 };

/** Shortest decimal form (min `digits`, at most 4) that shows the value exactly, so a boundary never looks rounded across. */
export function formatFigure(value: number, digits = 0): string {
  for (let d = digits; d < 4; d++) {
    const f = 10 ** d;
    if (Math.abs(Math.round(value * f) / f - value) < 1e-9) return value.toFixed(d);
  }
  return value.toFixed(4);
}

type Limit = {
  key: DeclarationRow['key'];
  label: string;
  unit: DeclarationRow['unit'];
  side: 'max' | 'min';
  declared: number;
  limit: number;
  uncertainty: number;
  uncertaintyName: string;
  digits: number;
};

function decide(l: Limit): DeclarationRow {
  const result = evaluateConformity({
    readingsMm: [l.declared],
    ...(l.side === 'max' ? { maxMm: l.limit } : { minMm: l.limit }),
    expandedUncertaintyMm: l.uncertainty,
    rule: 'iso14253',
  });
  const status = FROM_VERDICT[result.verdict];
  const f = (x: number) => `${formatFigure(x, l.digits)} ${l.unit}`;
  const what = `Declared ${f(l.declared)}`;
  const limit = `the ${l.side === 'max' ? 'maximum' : 'minimum'} ${f(l.limit)}`;
  const u = `${l.uncertaintyName} ${f(l.uncertainty)}`;
  const explanation =
    status === 'within'
      ? `${what} clears ${limit} by at least ${u}.`
      : status === 'outside'
        ? `${what} is ${l.side === 'max' ? 'above' : 'below'} ${limit} by more than ${u}: as declared, the boat would not conform.`
        : `${what} is within ${u} of ${limit}: too close to call; inspection will decide.`;
  return {
    key: l.key,
    label: l.label,
    unit: l.unit,
    declared: l.declared,
    limit: l.limit,
    uncertainty: l.uncertainty,
    status,
    explanation,
  };
}

/** Compares a declaration with the class rules, limit by limit. A warning, not a verdict. */
export function checkDeclaration(boat: DeclaredFigures, rules: ClassRules): DeclarationCheck {
  const limits: Limit[] = [];
  const nozzle = {
    unit: 'mm' as const,
    declared: boat.declaredNozzleMm,
    uncertainty: boat.declaredNozzleToleranceMm,
    uncertaintyName: 'your declared tolerance',
    digits: 2,
  };
  if (rules.nozzle.maxMm != null)
    limits.push({
      ...nozzle,
      key: 'nozzle_max',
      label: 'Nozzle exit diameter, maximum',
      side: 'max',
      limit: rules.nozzle.maxMm,
    });
  if (rules.nozzle.minMm != null)
    limits.push({
      ...nozzle,
      key: 'nozzle_min',
      label: 'Nozzle exit diameter, minimum',
      side: 'min',
      limit: rules.nozzle.minMm,
    });

  const power = {
    unit: 'kW' as const,
    declared: boat.declaredPowerKw,
    uncertainty: rules.power.defaultUncertaintyKw,
    uncertaintyName: 'the class’s power uncertainty',
    digits: 0,
  };
  if (rules.power.minKw != null)
    limits.push({ ...power, key: 'power_min', label: 'Engine power, minimum', side: 'min', limit: rules.power.minKw });
  if (rules.power.maxKw != null)
    limits.push({ ...power, key: 'power_max', label: 'Engine power, maximum', side: 'max', limit: rules.power.maxKw });

  const notes: string[] = [];
  if (rules.weight.minKg != null) {
    const basis = rules.weight.includesDriver ? 'with driver' : 'without driver';
    if (boat.declaredWeightKg != null) {
      limits.push({
        key: 'weight_min',
        label: `Weight (${basis}), minimum`,
        unit: 'kg',
        side: 'min',
        declared: boat.declaredWeightKg,
        limit: rules.weight.minKg,
        uncertainty: rules.weight.defaultUncertaintyKg,
        uncertaintyName: 'the class’s weighing uncertainty',
        digits: 0,
      });
    } else {
      notes.push(
        `No weight declared: the class minimum is ${formatFigure(rules.weight.minKg)} kg (${basis}); the boat is weighed at inspection.`,
      );
    }
  }

  const rows = limits.map(decide);
  const worst = rows.reduce<DeclarationStatus | null>(
    (w, r) => (w === null || RANK[r.status] > RANK[w] ? r.status : w),
    null,
  );
  return { rows, notes, worst };
}
