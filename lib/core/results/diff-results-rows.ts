// Which entries a new results version changes against the previous one: a row that appeared, went
// away or moved position. Their protest window restarts; everyone else's keeps its deadline.
// Framework-free so the rule can be unit tested.
export type Row = { position: number; raceNumber: number; entryId: string };

export function diffResultsRows(previous: readonly Row[] | null, next: readonly Row[]): string[] {
  const before = new Map((previous ?? []).map((r) => [r.entryId, r.position]));
  const after = new Map(next.map((r) => [r.entryId, r.position]));
  const changed = new Set<string>();
  for (const [id, pos] of after) if (before.get(id) !== pos) changed.add(id);
  for (const id of before.keys()) if (!after.has(id)) changed.add(id);
  return [...changed].sort();
}
