import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import {
  describeDeclarationChanges,
  listComponentChanges,
  listDeclarationChanges,
  type DeclarationFields,
} from '@/lib/core/boats/declaration-changes';
import { listDeclaredComponents } from '@/lib/server/components/list-declared-components';

export type DeclarationVersionView = {
  version: number;
  createdAt: string;
  createdBy: string;
  /** What changed from the version before ("power 250 → 9000 kW"); the first version says so. */
  changes: string;
};

type Row = DeclarationFields & { id: string; version: number; createdAt: Date; createdBy: string };

/** A boat's declaration versions, newest first. Callers check ownership (or office) first. */
export async function listDeclarationVersions(boatId: string): Promise<DeclarationVersionView[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select d.id, d.version, d.created_at as "createdAt", coalesce(u.name, u.email) as "createdBy",
            d.hull_description as "hullDescription", d.pump_description as "pumpDescription",
            d.impeller_description as "impellerDescription", d.declared_nozzle_mm as "declaredNozzleMm",
            d.declared_nozzle_tolerance_mm as "declaredNozzleToleranceMm", d.engine_description as "engineDescription",
            d.declared_power_kw as "declaredPowerKw", d.power_evidence as "powerEvidence", d.displacement_l as "displacementL",
            d.declared_weight_kg as "declaredWeightKg", d.declared_performance as "declaredPerformance"
       from boat_declaration_versions d join users u on u.id = d.created_by_id
      where d.boat_id = :boatId
      order by d.version`,
    { replacements: { boatId }, type: QueryTypes.SELECT },
  );
  const declared = await listDeclaredComponents(rows.map((r) => r.id));
  const componentsOf = (r: Row) => declared.get(r.id) ?? [];
  return rows
    .map((r, i) => ({
      version: r.version,
      createdAt: new Date(r.createdAt).toISOString(),
      createdBy: r.createdBy,
      changes:
        i === 0
          ? 'first declaration'
          : describeDeclarationChanges([
              ...listDeclarationChanges(rows[i - 1], r),
              ...listComponentChanges(componentsOf(rows[i - 1]), componentsOf(r)),
            ]) || 'no change',
    }))
    .reverse();
}
