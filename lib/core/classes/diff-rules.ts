// What changed between two versions of a class's rules, as readable rows (framework-free).
export type RuleChange = { path: string; before: unknown; after: unknown };

const LABELS: Record<string, string> = {
  'nozzle.maxMm': 'Nozzle exit diameter, maximum (mm)',
  'nozzle.minMm': 'Nozzle exit diameter, minimum (mm)',
  'nozzle.minReadings': 'Nozzle readings required',
  'nozzle.defaultUncertaintyMm': 'Nozzle expanded uncertainty U (mm)',
  'power.minKw': 'Power, minimum (kW)',
  'power.maxKw': 'Power, maximum (kW)',
  'power.defaultUncertaintyKw': 'Power uncertainty (kW)',
  'weight.minKg': 'Minimum weight (kg)',
  'weight.includesDriver': 'Weight includes driver',
  'weight.defaultUncertaintyKg': 'Weighing uncertainty (kg)',
  decisionRule: 'Decision rule',
  safetyItems: 'Safety items',
  'parity.pumpEfficiency': 'Parity model: pump efficiency',
  'parity.nozzleLossCoefficient': 'Parity model: nozzle loss coefficient',
  'parity.inletLossCoefficient': 'Parity model: inlet loss coefficient',
  'parity.wakeFraction': 'Parity model: wake fraction',
  'parity.referenceSpeedsMs': 'Parity model: reference speeds (m/s)',
  'burdenOfProof.inspection': 'Burden of proof at inspection',
  'burdenOfProof.protest': 'Burden of proof in a protest',
};

export const ruleLabel = (path: string) => LABELS[path] ?? path;

function flatten(value: unknown, prefix = '', out: Record<string, unknown> = {}) {
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  } else {
    out[prefix] = value;
  }
  return out;
}

export function diffRules(before: unknown, after: unknown): RuleChange[] {
  const a = flatten(before ?? {});
  const b = flatten(after ?? {});
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  return keys
    .filter((k) => JSON.stringify(a[k] ?? null) !== JSON.stringify(b[k] ?? null))
    .map((k) => ({ path: k, before: a[k] ?? null, after: b[k] ?? null }));
}
