// What changed between two versions of a boat's declaration, in words a scrutineer reads on the
// board and in the e-mail ("power 250 → 9000 kW"). Pure: runs on the server, in tests and the browser.

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

const LABELS: Record<keyof DeclarationFields, { label: string; unit?: string }> = {
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

export type DeclarationChange = { field: keyof DeclarationFields; label: string; from: string; to: string };

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
  };
}

/** The fields that differ, in declaration order. */
export function listDeclarationChanges(before: DeclarationFields, after: DeclarationFields): DeclarationChange[] {
  const a = pickDeclaration(before);
  const b = pickDeclaration(after);
  return DECLARATION_FIELDS.filter((f) => a[f] !== b[f]).map((f) => {
    const { label, unit } = LABELS[f];
    // A figure with a unit reads "power 250 → 9000 kW"; text reads "engine “A” → “B”".
    const from = unit && typeof a[f] === 'number' ? String(a[f]) : shown(a[f]);
    return { field: f, label, from, to: shown(b[f], unit) };
  });
}

/** One line: "power 250 → 9000 kW; engine “A” → “B”". */
export function describeDeclarationChanges(changes: DeclarationChange[]): string {
  return changes.map((c) => `${c.label} ${c.from} → ${c.to}`).join('; ');
}
