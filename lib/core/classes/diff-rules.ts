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
  'nozzle.checkMethod': 'Nozzle limits checked by',
  'nozzle.gaugeNoGoMm': 'No-go plug gauge (mm)',
  'nozzle.gaugeGoMm': 'Go plug gauge (mm)',
};

/** "measuredItems.ballast.minimum" → "Measured item ballast: minimum". */
export const ruleLabel = (path: string) => {
  const item = /^measuredItems\.([a-z0-9_]+)\.(.+)$/.exec(path);
  return item ? `Measured item ${item[1]}: ${item[2]}` : (LABELS[path] ?? path);
};

/** A list of keyed objects (measured items): compared item by item and field by field, by key. */
const isKeyedList = (v: unknown): v is { key: string }[] =>
  Array.isArray(v) && v.length > 0 && v.every((x) => x && typeof x === 'object' && typeof x.key === 'string');

function flatten(value: unknown, prefix = '', out: Record<string, unknown> = {}) {
  if (isKeyedList(value)) {
    for (const { key, ...rest } of value) flatten(rest, `${prefix}.${key}`, out);
  } else if (prefix === 'measuredItems' && Array.isArray(value)) {
    // No items: nothing to compare (rules stored before items have none either).
  } else if (value && typeof value === 'object' && !Array.isArray(value)) {
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
