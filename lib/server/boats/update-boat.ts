import 'server-only';
import { after } from 'next/server';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { UpdateBoatInput } from '@/lib/core/inputs/boats';
import { listDeclarationChanges, pickDeclaration, type DeclarationFields } from '@/lib/core/boats/declaration-changes';
import { flagInspectedEntries } from './flag-declaration-change';
import { mailChiefScrutineers, type FlaggedEntry } from './mail-declaration-change';
import { findOwnBoat, toBoatView, type BoatView } from './boat-view';
import { declareBoatComponents } from '@/lib/server/components/declare-components';
import type { BoatDeclaration } from '@/lib/core/inputs/boats';
import type { StoredBoatPerformance } from '@/lib/core/boats/declared-performance';

export type BoatChanges = Partial<BoatDeclaration> & { declaredPerformance?: StoredBoatPerformance | null };

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
  /** What the body changes (the declared engine and pump data have their own: declare-performance.ts). */
  parseChanges: (raw: unknown) => Promise<BoatChanges> = async (raw) => UpdateBoatInput.parse(raw),
): Promise<BoatView> {
  assertCan(actor, 'boat.manage_own');
  const owned = await findOwnBoat(actor, boatId);
  const changes = await parseChanges(await readInput());
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
    // The new version names the components on the boat now (a component change writes its own version).
    await declareBoatComponents(version.id, boat.id, transaction);
    return {
      boat,
      flagged: await flagInspectedEntries(
        actor.id,
        { ...latest, id: version.id, version: version.version },
        transaction,
      ),
    };
  });
  if (flagged.length) after(() => mailChiefScrutineers(boat.name, flagged));
  return toBoatView(boat);
}
