import 'server-only';
import { after } from 'next/server';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { EditComponentInput } from '@/lib/core/inputs/components';
import { mailChiefScrutineers } from '@/lib/server/boats/mail-declaration-change';
import type { FlaggedEntry } from '@/lib/server/boats/mail-declaration-change';
import { findControlledComponentId, loadComponentViews, type ComponentView } from './component-view';
import { writeComponentDeclarationVersion } from './declare-components';
import { lockOwnBoats } from './lock-boats';
import { serialClash } from './register-component';

/** The fields a declaration shows: changing one of them on a fitted component is a new version. */
const DECLARED = ['maker', 'model', 'trimCode'] as const;
const EDITABLE = [...DECLARED, 'notes'] as const;

/**
 * Edits a component's maker, model, trim code or notes (kind and serial are its identity and never
 * change). Writes an 'edited' event with each changed field's before and after; when a declared
 * field changed on a component fitted to a boat, the boat gets its next declaration version (and an
 * inspected entry is flagged). Who may: the owner of the boat it is on, or its registrant while it
 * is on no boat, checked before the body is read and again under the component's row lock.
 */
export async function editComponent(
  actor: Actor | null,
  componentId: string,
  readInput: () => Promise<unknown>,
): Promise<ComponentView> {
  assertCan(actor, 'boat.manage_own');
  const { id } = await findControlledComponentId(actor, componentId);
  const input = EditComponentInput.parse(await readInput());
  const { models, sequelize } = getDb();
  let flagged: FlaggedEntry[] = [];
  let boatName = '';
  let current: { kind: 'engine' | 'pump' | 'impeller'; serialNumber: string; maker: string } | null = null;
  try {
    await sequelize.transaction(async (transaction) => {
      // Component first, then its boat: the order every component writer keeps.
      const { boatId } = await findControlledComponentId(actor, id, { transaction, lock: true });
      const boats = await lockOwnBoats(actor.id, [boatId], transaction);
      const component = (await models.BoatComponent.findByPk(id, { transaction }))!;
      current = { kind: component.kind, serialNumber: component.serialNumber, maker: input.maker ?? component.maker };
      const before: Record<string, string> = {};
      const afterValues: Record<string, string> = {};
      for (const f of EDITABLE) {
        const v = input[f];
        if (v === undefined || v === component[f]) continue;
        before[f] = component[f];
        afterValues[f] = v;
      }
      if (Object.keys(afterValues).length === 0) return; // nothing differs: no event, no version
      await component.update(afterValues, { transaction });
      await models.ComponentEvent.create(
        { componentId: id, action: 'edited', boatId, details: { before, after: afterValues }, recordedById: actor.id },
        { transaction },
      );
      if (boatId && DECLARED.some((f) => f in afterValues)) {
        boatName = boats.get(boatId) ?? '';
        flagged = await writeComponentDeclarationVersion(actor.id, boatId, transaction);
      }
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError && current) {
      const c = current as { kind: 'engine' | 'pump' | 'impeller'; serialNumber: string; maker: string };
      throw serialClash(c.kind, c.maker, c.serialNumber, 'maker');
    }
    throw err;
  }
  const shown = flagged;
  if (shown.length) after(() => mailChiefScrutineers(boatName, shown));
  return (await loadComponentViews({ ids: [id] }))[0];
}
