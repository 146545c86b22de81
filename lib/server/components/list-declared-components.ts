import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { DeclaredComponent } from '@/lib/core/boats/declaration-changes';

/** The components each version names, by version id (a version that names none maps to []). */
export async function listDeclaredComponents(
  versionIds: string[],
  transaction?: Transaction,
): Promise<Map<string, DeclaredComponent[]>> {
  const out = new Map<string, DeclaredComponent[]>(versionIds.map((id) => [id, []]));
  if (versionIds.length === 0) return out;
  const rows = await getDb().sequelize.query<DeclaredComponent & { versionId: string }>(
    `select declaration_version_id as "versionId", component_id as "componentId", kind, maker, model,
            serial_number as "serialNumber", trim_code as "trimCode"
       from declaration_version_components where declaration_version_id in (:versionIds)
      order by kind, serial_number`,
    { replacements: { versionIds }, type: QueryTypes.SELECT, transaction },
  );
  for (const { versionId, ...c } of rows) out.get(versionId)?.push(c);
  return out;
}
