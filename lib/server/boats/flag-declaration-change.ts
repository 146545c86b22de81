import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import {
  describeDeclarationChanges,
  listComponentChanges,
  listDeclarationChanges,
  type DeclarationFields,
} from '@/lib/core/boats/declaration-changes';
import { currentInspectionCte } from '@/lib/server/inspections/inspection-view';
import { listDeclaredComponents } from '@/lib/server/components/list-declared-components';
import type { FlaggedEntry } from './mail-declaration-change';

// Marks "re-inspection required" on every live entry of a boat whose newest inspected declaration
// version is older than `latest`: one open task per entry (its reason says what changed since the
// inspected version), and the entry's quick-read result follows the current record, which the newer
// version made stale. Called by the owner's edit, and by recording when a record arrives for a
// version already replaced (it waited offline, or crossed an edit). Runs inside the caller's transaction.

type InspectedRow = Omit<FlaggedEntry, 'changes' | 'opened'> & {
  checkedVersion: number;
  checkedVersionId: string;
  checked: DeclarationFields;
  openTaskId: string | null;
};

export async function flagInspectedEntries(
  requestedById: string,
  latest: DeclarationFields & { id: string; version: number },
  transaction: Transaction,
): Promise<FlaggedEntry[]> {
  const { models, sequelize } = getDb();
  const versionId = latest.id;
  const versionNumber = latest.version;
  const boatId = (await models.BoatDeclarationVersion.findByPk(versionId, { attributes: ['boatId'], transaction }))!
    .boatId;
  // The newest version any inspection of the entry checked: what changed is told against it.
  const rows = await sequelize.query<InspectedRow>(
    `select e.id as "entryId", e.event_id as "eventId", e.race_number as "raceNumber", ev.name as "eventName",
            dv.version as "checkedVersion", dv.id as "checkedVersionId",
            json_build_object('hullDescription', dv.hull_description, 'pumpDescription', dv.pump_description,
              'impellerDescription', dv.impeller_description, 'declaredNozzleMm', dv.declared_nozzle_mm,
              'declaredNozzleToleranceMm', dv.declared_nozzle_tolerance_mm, 'engineDescription', dv.engine_description,
              'declaredPowerKw', dv.declared_power_kw, 'powerEvidence', dv.power_evidence, 'displacementL', dv.displacement_l,
              'declaredWeightKg', dv.declared_weight_kg, 'declaredPerformance', dv.declared_performance) as checked,
            (select r.id from reinspections r where r.entry_id = e.id and r.done_at is null and r.declaration_version_id is not null
              order by r.created_at desc limit 1) as "openTaskId"
       from entries e
       join events ev on ev.id = e.event_id
       join lateral (select d.* from inspections i join boat_declaration_versions d on d.id = i.declaration_version_id
                      where i.entry_id = e.id order by d.version desc limit 1) dv on true
      where e.boat_id = :boatId and e.status in ('awaiting_payment', 'entered') and dv.version < :versionNumber
        for update of e`,
    { replacements: { boatId, versionNumber }, type: QueryTypes.SELECT, transaction },
  );
  // The components each version named (with their identity then), so "impeller serial A → B" is told too.
  const declared = await listDeclaredComponents(
    [versionId, ...new Set(rows.map((r) => r.checkedVersionId))],
    transaction,
  );
  const flagged: FlaggedEntry[] = [];
  for (const r of rows) {
    const changes = describeDeclarationChanges([
      ...listDeclarationChanges(r.checked, latest),
      ...listComponentChanges(declared.get(r.checkedVersionId) ?? [], declared.get(versionId) ?? []),
    ]);
    if (!changes) continue; // changed back to what was inspected: the verdict still stops being current, nothing to tell
    const reason = `Re-inspection required: the declaration changed after inspection (version ${r.checkedVersion} → ${versionNumber}): ${changes}`;
    if (r.openTaskId)
      await models.Reinspection.update(
        { reason, declarationVersionId: versionId },
        { where: { id: r.openTaskId }, transaction },
      );
    else
      await models.Reinspection.create(
        { eventId: r.eventId, entryId: r.entryId, reason, requestedById, declarationVersionId: versionId },
        { transaction },
      );
    flagged.push({
      entryId: r.entryId,
      eventId: r.eventId,
      raceNumber: r.raceNumber,
      eventName: r.eventName,
      changes,
      opened: !r.openTaskId,
    });
  }
  // The entry's quick-read result follows the current record, which the new version just made stale.
  for (const r of rows)
    await sequelize.query(
      `with ${currentInspectionCte('entry')}
       update entries set inspection_result = (select i.overall_result from inspections i join current_inspection c on c.id = i.id), updated_at = now()
        where id = :entryId`,
      { replacements: { entryId: r.entryId }, transaction },
    );
  return flagged;
}
