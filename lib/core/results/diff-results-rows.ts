// Which entries a new results version changes against the previous one: a row that appeared, went
// away, moved position or changed status (disqualified, excluded). Their protest window restarts;
// everyone else's keeps its deadline.
// Framework-free so the rule can be unit tested.
export type Row = { position: number; raceNumber: number; entryId: string; status?: 'dsq' | 'excluded' };

export function diffResultsRows(previous: readonly Row[] | null, next: readonly Row[]): string[] {
  const place = (r: Row) => `${r.position}${r.status ? `:${r.status}` : ''}`;
  const before = new Map((previous ?? []).map((r) => [r.entryId, place(r)]));
  const after = new Map(next.map((r) => [r.entryId, place(r)]));
  const changed = new Set<string>();
  for (const [id, pos] of after) if (before.get(id) !== pos) changed.add(id);
  for (const id of before.keys()) if (!after.has(id)) changed.add(id);
  return [...changed].sort();
}
