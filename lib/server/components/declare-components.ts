import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { pickDeclaration, type DeclarationFields } from '@/lib/core/boats/declaration-changes';
import { flagInspectedEntries } from '@/lib/server/boats/flag-declaration-change';
import type { FlaggedEntry } from '@/lib/server/boats/mail-declaration-change';

// A declaration version names the components on the boat when it was made, each with its identity
// as it was then (maker, model, serial, trim code), so a later edit of a component never rewrites
// what an earlier version declared.

/** Names the components on the boat now in this (new) version. Runs inside the caller's transaction. */
export async function declareBoatComponents(versionId: string, boatId: string, transaction: Transaction) {
  await getDb().sequelize.query(
    `insert into declaration_version_components
            (declaration_version_id, component_id, kind, maker, model, serial_number, trim_code)
     select :versionId, c.id, c.kind, c.maker, c.model, c.serial_number, c.trim_code
       from boat_components c where c.boat_id = :boatId`,
    { replacements: { versionId, boatId }, transaction },
  );
}

/**
 * The boat's components changed (fitted, taken off, or an identity field edited): the next version
 * of its declaration copies the latest version's fields and names the components on it now, made by
 * the actor, as an owner's edit of the declaration is. An entry inspected against an earlier version
 * is flagged for re-inspection with what changed. The caller holds the boat's row lock (it orders
 * version numbers) and sends the chief scrutineers' mail after the answer.
 */
export async function writeComponentDeclarationVersion(
  actorId: string,
  boatId: string,
  transaction: Transaction,
): Promise<FlaggedEntry[]> {
  const { models } = getDb();
  const latest = (await models.BoatDeclarationVersion.findOne({
    where: { boatId },
    order: [['version', 'DESC']],
    transaction,
  }))!;
  const fields = pickDeclaration(latest as unknown as DeclarationFields);
  const version = await models.BoatDeclarationVersion.create(
    { ...fields, powerEvidence: latest.powerEvidence, boatId, version: latest.version + 1, createdById: actorId },
    { transaction },
  );
  await declareBoatComponents(version.id, boatId, transaction);
  return flagInspectedEntries(actorId, { ...fields, id: version.id, version: version.version }, transaction);
}
