import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

/**
 * Takes the row locks of the actor's boats named, in id order (every writer of components locks
 * the component first, then its boats in this order, so two moves never wait on each other in a
 * circle), and returns their names by id. A boat that is not the actor's is simply not returned.
 */
export async function lockOwnBoats(
  actorId: string,
  boatIds: (string | null)[],
  transaction: Transaction,
): Promise<Map<string, string>> {
  const ids = [...new Set(boatIds.filter((b): b is string => Boolean(b)))].sort();
  if (ids.length === 0) return new Map();
  const rows = await getDb().sequelize.query<{ id: string; name: string }>(
    `select id, name from boats where id in (:ids) and owner_id = :actorId order by id for update`,
    { replacements: { ids, actorId }, type: QueryTypes.SELECT, transaction },
  );
  return new Map(rows.map((r) => [r.id, r.name]));
}
