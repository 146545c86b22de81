// What a re-inspection can be ordered to check, and its words: apart from the decision itself
// (decide-inspection.ts), so the dock's first load names a scope without loading the conformity engine.

/** What a re-inspection can be ordered to check; null scope means everything. */
export const CHECK_AREAS = ['nozzle', 'weight', 'power', 'safety', 'items'] as const;
export type CheckArea = (typeof CHECK_AREAS)[number];
export const CHECK_AREA_LABELS: Record<CheckArea, string> = {
  nozzle: 'nozzle exit diameter',
  weight: 'minimum weight',
  power: 'engine power',
  safety: 'safety equipment',
  items: 'class’s own measured items',
};

/** "Re-inspection of the nozzle exit diameter only" — the words for a scope, or null for a full inspection. */
export function describeScope(scope: readonly CheckArea[] | null | undefined): string | null {
  if (!scope || scope.length === 0) return null;
  const names = scope.map((a) => CHECK_AREA_LABELS[a]);
  const list = names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
  return `This re-inspection was ordered to check the ${list} only; nothing else is decided by it (earlier records stand for the rest).`;
}
