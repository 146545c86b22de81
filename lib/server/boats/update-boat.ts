import 'server-only';
import { after } from 'next/server';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { UpdateBoatInput } from '@/lib/core/inputs/boats';
import {
  describeDeclarationChanges,
  listDeclarationChanges,
  pickDeclaration,
  type DeclarationFields,
} from '@/lib/core/boats/declaration-changes';
import { currentInspectionCte } from '@/lib/server/inspections/inspection-view';
import { mailChiefScrutineers, type FlaggedEntry } from './mail-declaration-change';
import { findOwnBoat, toBoatView, type BoatView } from './boat-view';

/**
 * Changes the actor's own boat; only the fields sent change. A change to the declaration is a new
 * version (append-only, with who and when). An entry already inspected against an earlier version
 * is marked "re-inspection required" with what changed, its earlier verdict stops being current
 * (currentInspectionCte skips a record of a superseded version), and the meeting's chief
 * scrutineers get an e-mail after the answer. The owner check comes before the body is read.
 */
export async function updateBoat(
  actor: Actor | null,
  boatId: string,
  readInput: () => Promise<unknown>,
): Promise<BoatView> {
  assertCan(actor, 'boat.manage_own');
  const owned = await findOwnBoat(actor, boatId);
  const changes = UpdateBoatInput.parse(await readInput());
  const { models, sequelize } = getDb();
  const { boat, flagged } = await sequelize.transaction(async (transaction) => {
    // The boat's row lock orders edits of one boat, so version numbers never collide.
    const boat = (await models.Boat.findOne({
      where: { id: owned.id, ownerId: actor.id },
      lock: transaction.LOCK.UPDATE,
      transaction,
    }))!;
    const before = pickDeclaration(boat as unknown as DeclarationFields);
    await boat.update(changes, { transaction });
    const latest = pickDeclaration(boat as unknown as DeclarationFields);
    if (listDeclarationChanges(before, latest).length === 0) return { boat, flagged: [] as FlaggedEntry[] };
    const last = (await models.BoatDeclarationVersion.max('version', {
      where: { boatId: boat.id },
      transaction,
    })) as number | null;
    const version = await models.BoatDeclarationVersion.create(
      {
        ...latest,
        powerEvidence: boat.powerEvidence,
        boatId: boat.id,
        version: (last ?? 0) + 1,
        createdById: actor.id,
      },
      { transaction },
    );
    return {
      boat,
      flagged: await flagInspectedEntries(actor.id, boat.id, version.id, version.version, latest, transaction),
    };
  });
  if (flagged.length) after(() => mailChiefScrutineers(boat.name, flagged));
  return toBoatView(boat);
}

type InspectedRow = Omit<FlaggedEntry, 'changes'> & {
  checkedVersion: number;
  checked: DeclarationFields;
  openTaskId: string | null;
};

/** Live entries of the boat inspected against an earlier version: one open task each, with what changed. */
async function flagInspectedEntries(
  ownerId: string,
  boatId: string,
  versionId: string,
  versionNumber: number,
  latest: DeclarationFields,
  transaction: Transaction,
): Promise<FlaggedEntry[]> {
  const { models, sequelize } = getDb();
  // The newest version any inspection of the entry checked: what changed is told against it.
  const rows = await sequelize.query<InspectedRow>(
    `select e.id as "entryId", e.event_id as "eventId", e.race_number as "raceNumber", ev.name as "eventName",
            dv.version as "checkedVersion",
            json_build_object('hullDescription', dv.hull_description, 'pumpDescription', dv.pump_description,
              'impellerDescription', dv.impeller_description, 'declaredNozzleMm', dv.declared_nozzle_mm,
              'declaredNozzleToleranceMm', dv.declared_nozzle_tolerance_mm, 'engineDescription', dv.engine_description,
              'declaredPowerKw', dv.declared_power_kw, 'powerEvidence', dv.power_evidence, 'displacementL', dv.displacement_l,
              'declaredWeightKg', dv.declared_weight_kg) as checked,
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
  const flagged: FlaggedEntry[] = [];
  for (const r of rows) {
    const changes = describeDeclarationChanges(listDeclarationChanges(r.checked, latest));
    if (!changes) continue; // changed back to what was inspected: the verdict still stops being current, nothing to tell
    const reason = `Re-inspection required: the declaration changed after inspection (version ${r.checkedVersion} → ${versionNumber}): ${changes}`;
    if (r.openTaskId)
      await models.Reinspection.update(
        { reason, declarationVersionId: versionId },
        { where: { id: r.openTaskId }, transaction },
      );
    else
      await models.Reinspection.create(
        { eventId: r.eventId, entryId: r.entryId, reason, requestedById: ownerId, declarationVersionId: versionId },
        { transaction },
      );
    flagged.push({ entryId: r.entryId, eventId: r.eventId, raceNumber: r.raceNumber, eventName: r.eventName, changes });
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
