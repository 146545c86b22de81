// What changed between two versions of a boat's declaration, in words a scrutineer reads on the
// board and in the e-mail ("power 250 → 9000 kW"). Pure: runs on the server, in tests and the browser.

import { canonicalPerformance, describePerformance, type StoredBoatPerformance } from './declared-performance';

/** The fields a declaration version holds (the boat's name and hull number are identity, not declaration). */
export type DeclarationFields = {
  hullDescription: string;
  pumpDescription: string;
  impellerDescription: string;
  declaredNozzleMm: number;
  declaredNozzleToleranceMm: number;
  engineDescription: string;
  declaredPowerKw: number;
  powerEvidence: string;
  displacementL: number | null;
  declaredWeightKg: number | null;
  /** Declared engine curve, pump characteristic and suction data (absent where a reader does not select it: none). */
  declaredPerformance?: StoredBoatPerformance | null;
};

export const DECLARATION_FIELDS = [
  'hullDescription',
  'pumpDescription',
  'impellerDescription',
  'declaredNozzleMm',
  'declaredNozzleToleranceMm',
  'engineDescription',
  'declaredPowerKw',
  'powerEvidence',
  'displacementL',
  'declaredWeightKg',
] as const satisfies readonly (keyof DeclarationFields)[];

const LABELS: Record<(typeof DECLARATION_FIELDS)[number], { label: string; unit?: string }> = {
  hullDescription: { label: 'hull' },
  pumpDescription: { label: 'pump' },
  impellerDescription: { label: 'impeller' },
  declaredNozzleMm: { label: 'nozzle', unit: 'mm' },
  declaredNozzleToleranceMm: { label: 'nozzle tolerance', unit: 'mm' },
  engineDescription: { label: 'engine' },
  declaredPowerKw: { label: 'power', unit: 'kW' },
  powerEvidence: { label: 'power evidence' },
  displacementL: { label: 'displacement', unit: 'L' },
  declaredWeightKg: { label: 'weight', unit: 'kg' },
};

export type DeclarationChange = {
  field: keyof DeclarationFields | 'components';
  label: string;
  from: string;
  to: string;
};

/** A component as a declaration version names it (its identity then; lib/server/components). */
export type DeclaredComponent = {
  componentId: string;
  kind: 'engine' | 'pump' | 'impeller';
  maker: string;
  model: string;
  serialNumber: string;
  trimCode: string;
};

const COMPONENT_FIELDS = [
  ['serialNumber', 'serial'],
  ['maker', 'maker'],
  ['model', 'model'],
  ['trimCode', 'trim code'],
] as const;
const KIND_ORDER = ['engine', 'pump', 'impeller'] as const;

const shown = (v: string | number | null, unit?: string): string => {
  if (v === null || v === '') return '(none)';
  if (typeof v === 'number') return unit ? `${v} ${unit}` : String(v);
  return v.length > 60 ? `“${v.slice(0, 57)}…”` : `“${v}”`;
};

/** Picks the declaration fields of a boat-shaped object (numbers kept as numbers, absent figures as null). */
export function pickDeclaration(b: DeclarationFields): DeclarationFields {
  return {
    hullDescription: b.hullDescription ?? '',
    pumpDescription: b.pumpDescription ?? '',
    impellerDescription: b.impellerDescription ?? '',
    declaredNozzleMm: Number(b.declaredNozzleMm),
    declaredNozzleToleranceMm: Number(b.declaredNozzleToleranceMm),
    engineDescription: b.engineDescription ?? '',
    declaredPowerKw: Number(b.declaredPowerKw),
    powerEvidence: b.powerEvidence,
    displacementL: b.displacementL == null ? null : Number(b.displacementL),
    declaredWeightKg: b.declaredWeightKg == null ? null : Number(b.declaredWeightKg),
    declaredPerformance: b.declaredPerformance ?? null,
  };
}

/** The fields that differ, in declaration order. */
export function listDeclarationChanges(before: DeclarationFields, after: DeclarationFields): DeclarationChange[] {
  const a = pickDeclaration(before);
  const b = pickDeclaration(after);
  const changes: DeclarationChange[] = DECLARATION_FIELDS.filter((f) => a[f] !== b[f]).map((f) => {
    const { label, unit } = LABELS[f];
    // A figure with a unit reads "power 250 → 9000 kW"; text reads "engine “A” → “B”".
    const from = unit && typeof a[f] === 'number' ? String(a[f]) : shown(a[f]);
    return { field: f, label, from, to: shown(b[f], unit) };
  });
  // The engine and pump curves compare as documents and read as a summary of each side.
  if (canonicalPerformance(a.declaredPerformance) !== canonicalPerformance(b.declaredPerformance))
    changes.push({
      field: 'declaredPerformance',
      label: 'engine and pump curves',
      from: describePerformance(a.declaredPerformance),
      to: describePerformance(b.declaredPerformance),
    });
  return changes;
}

/** One line: "power 250 → 9000 kW; engine “A” → “B”". */
export function describeDeclarationChanges(changes: DeclarationChange[]): string {
  return changes.map((c) => `${c.label} ${c.from} → ${c.to}`).join('; ');
}

/**
 * What changed in the components a declaration names, in words: "impeller serial “A-1” → “B-2”" when
 * one impeller replaced another, "impeller trim code “T3” → “T4”" for an edit, "pump serial (none) → “P-9”"
 * when one was fitted and "engine serial “E-1” → (none)" when one was taken off. The same component
 * pairs with itself; the rest pair by kind (a swap), in serial order; what is left was fitted or taken off.
 */
export function listComponentChanges(before: DeclaredComponent[], after: DeclaredComponent[]): DeclarationChange[] {
  const bySerial = (a: DeclaredComponent, b: DeclaredComponent) =>
    a.serialNumber.localeCompare(b.serialNumber) || a.componentId.localeCompare(b.componentId);
  const out: DeclarationChange[] = [];
  for (const kind of KIND_ORDER) {
    const was = before.filter((c) => c.kind === kind).sort(bySerial);
    const now = after.filter((c) => c.kind === kind).sort(bySerial);
    const pairs: [DeclaredComponent | null, DeclaredComponent | null][] = [];
    const left = now.filter((n) => !was.some((w) => w.componentId === n.componentId));
    for (const w of was) {
      const same = now.find((n) => n.componentId === w.componentId);
      pairs.push([w, same ?? null]);
    }
    // A component that left pairs with a newcomer of its kind: that is a swap.
    for (const p of pairs) if (!p[1] && left.length) p[1] = left.shift()!;
    for (const n of left) pairs.push([null, n]);
    for (const [a, b] of pairs) {
      if (!a || !b) {
        out.push({
          field: 'components',
          label: `${kind} serial`,
          from: a ? shown(a.serialNumber) : '(none)',
          to: b ? shown(b.serialNumber) : '(none)',
        });
        continue;
      }
      for (const [f, label] of COMPONENT_FIELDS)
        if (a[f] !== b[f])
          out.push({ field: 'components', label: `${kind} ${label}`, from: shown(a[f]), to: shown(b[f]) });
    }
  }
  return out;
}
