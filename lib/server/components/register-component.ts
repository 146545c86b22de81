import 'server-only';
import { after } from 'next/server';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { COMPONENT_KIND_LABELS, RegisterComponentInput } from '@/lib/core/inputs/components';
import { findOwnBoat } from '@/lib/server/boats/boat-view';
import { mailChiefScrutineers } from '@/lib/server/boats/mail-declaration-change';
import { loadComponentViews, type ComponentView } from './component-view';
import { writeComponentDeclarationVersion } from './declare-components';
import { lockOwnBoats } from './lock-boats';

/**
 * A serial number the actor already registered for this kind and maker: one part has one record among
 * a person's components. Only the actor's own components can clash (the unique index is per owner), so
 * the refusal never tells anything about another person's parts.
 */
export function serialClash(
  kind: keyof typeof COMPONENT_KIND_LABELS,
  maker: string,
  serialNumber: string,
  field: 'serialNumber' | 'maker' = 'serialNumber',
) {
  const label = COMPONENT_KIND_LABELS[kind].toLowerCase();
  const what = `${/^[aeiou]/.test(label) ? 'An' : 'A'} ${label}${maker ? ` by ${maker}` : ''}`;
  const message = `${what} with serial number ${serialNumber} is already among your components. One part has one record: fit it from your components on no boat (or move it from the boat it is on); if the serial or maker is mistyped, correct it.`;
  return new AppError('serial_taken', 409, message, [{ field, message }]);
}

/**
 * Registers an engine, pump or impeller fitted to one of the actor's boats: a record of its own with
 * a 'registered' event, and the boat's next declaration version naming it (re-inspection flagged
 * where the boat was already inspected). The owner check comes before the body is read.
 */
export async function registerComponent(
  actor: Actor | null,
  boatId: string,
  readInput: () => Promise<unknown>,
): Promise<ComponentView> {
  assertCan(actor, 'boat.manage_own');
  const boat = await findOwnBoat(actor, boatId);
  const input = RegisterComponentInput.parse(await readInput());
  const { models, sequelize } = getDb();
  let id: string;
  let flagged;
  try {
    ({ id, flagged } = await sequelize.transaction(async (transaction) => {
      if (!(await lockOwnBoats(actor.id, [boat.id], transaction)).size)
        throw new AppError('not_found', 404, 'No such boat among yours.');
      const component = await models.BoatComponent.create(
        { ...input, boatId: boat.id, createdById: actor.id },
        { transaction },
      );
      await models.ComponentEvent.create(
        { componentId: component.id, action: 'registered', boatId: boat.id, recordedById: actor.id },
        { transaction },
      );
      return { id: component.id, flagged: await writeComponentDeclarationVersion(actor.id, boat.id, transaction) };
    }));
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw serialClash(input.kind, input.maker, input.serialNumber);
    throw err;
  }
  if (flagged.length) after(() => mailChiefScrutineers(boat.name, flagged));
  return (await loadComponentViews({ ids: [id] }))[0];
}
