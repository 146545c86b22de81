import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { ClassRules } from '@/lib/core/inputs/class-rules';

// A published class rule version is frozen (the class_rule_versions_frozen trigger refuses every change
// and deletion), so its rules never change once read: each process keeps the ones it has read, by the
// version's id, and a record sent from the dock costs no rules query and no rules JSON after the first.
// Drafts are never kept (they change). Bounded: the oldest entry goes first. Frozen in memory, so code
// that tried to change a kept copy would fail loudly rather than change the next record's rules.
const MAX_KEPT = 500;
const globalForRules = globalThis as unknown as { __borelinePublishedRules?: Map<string, ClassRules> };

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value)) deepFreeze(v);
  }
  return value;
}

/** The rules of a published version, or null when there is no published version with this id. */
export async function publishedRules(versionId: string): Promise<ClassRules | null> {
  const kept = (globalForRules.__borelinePublishedRules ??= new Map());
  const known = kept.get(versionId);
  if (known) return known;
  const [row] = await getDb().sequelize.query<{ rules: ClassRules }>(
    `select rules from class_rule_versions where id = :versionId and status = 'published'`,
    { replacements: { versionId }, type: QueryTypes.SELECT },
  );
  if (!row) return null;
  if (kept.size >= MAX_KEPT) kept.delete(kept.keys().next().value!);
  kept.set(versionId, deepFreeze(row.rules));
  return row.rules;
}
