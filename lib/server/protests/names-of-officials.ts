import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

/** The deciding officials' names as they are now, in the order given, kept on the decision so a later rename does not rewrite it. */
export async function namesOfOfficials(ids: string[], transaction?: Transaction): Promise<string[]> {
  if (ids.length === 0) return [];
  const rows = await getDb().sequelize.query<{ id: string; name: string }>(
    'select id::text as id, coalesce(name, email) as name from users where id in (:ids)',
    { replacements: { ids }, type: QueryTypes.SELECT, transaction },
  );
  const byId = new Map(rows.map((r) => [r.id, r.name]));
  return ids.map((id) => byId.get(id) ?? 'a former official');
}
