import 'server-only';
import { after } from 'next/server';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { MoveComponentInput } from '@/lib/core/inputs/components';
import { findOwnBoat } from '@/lib/server/boats/boat-view';
import { mailChiefScrutineers, type FlaggedEntry } from '@/lib/server/boats/mail-declaration-change';
import { findControlledComponentId, loadComponentViews, type ComponentView } from './component-view';
import { writeComponentDeclarationVersion } from './declare-components';
import { lockOwnBoats } from './lock-boats';

const boatNotYours = () =>
  new AppError('not_found', 404, 'boatId: No such boat among yours.', [
    { field: 'boatId', message: 'Choose one of your own boats.' },
  ]);

/**
 * Moves a component onto another of the actor's boats, or takes it off (boat null: it keeps its
 * identity, history and seals). Who may: the owner of the boat it is on, or its registrant while it
 * is on no boat; the target is always one of the actor's own boats. Writes 'removed' (old boat) and
 * 'fitted' (new boat) events and the next declaration version of each boat touched, all in one
 * transaction under the component's row lock and the boats' locks. `fromBoatId`, when sent, is where
 * the mover saw it: a component that has moved since is refused (409), so of two moves made from the
 * same view only the first succeeds.
 */
export async function moveComponent(
  actor: Actor | null,
  componentId: string,
  readInput: () => Promise<unknown>,
): Promise<ComponentView> {
  assertCan(actor, 'boat.manage_own');
  const { id } = await findControlledComponentId(actor, componentId);
  const input = MoveComponentInput.parse(await readInput());
  const to = input.boatId?.toLowerCase() ?? null;
  if (to) await findOwnBoat(actor, to).catch(() => Promise.reject(boatNotYours()));
  const { models, sequelize } = getDb();
  const touched = await sequelize.transaction(async (transaction) => {
    const { boatId: from } = await findControlledComponentId(actor, id, { transaction, lock: true });
    if (input.fromBoatId !== undefined && (input.fromBoatId?.toLowerCase() ?? null) !== from)
      throw new AppError(
        'component_moved',
        409,
        'This component has moved since the page was loaded: reload the page to see where it is now.',
      );
    if (from === to)
      throw new AppError(
        'invalid_input',
        400,
        `boatId: ${to ? 'It is already on that boat.' : 'It is already on no boat.'}`,
        [{ field: 'boatId', message: to ? 'It is already on that boat.' : 'It is already on no boat.' }],
      );
    const boats = await lockOwnBoats(actor.id, [from, to], transaction);
    if (to && !boats.has(to)) throw boatNotYours();
    await models.BoatComponent.update({ boatId: to }, { where: { id }, transaction });
    const out: { boatName: string; flagged: FlaggedEntry[] }[] = [];
    if (from)
      await models.ComponentEvent.create(
        { componentId: id, action: 'removed', boatId: from, details: { toBoatId: to }, recordedById: actor.id },
        { transaction },
      );
    if (to)
      await models.ComponentEvent.create(
        { componentId: id, action: 'fitted', boatId: to, details: { fromBoatId: from }, recordedById: actor.id },
        { transaction },
      );
    for (const b of [from, to])
      if (b)
        out.push({
          boatName: boats.get(b)!,
          flagged: await writeComponentDeclarationVersion(actor.id, b, transaction),
        });
    return out;
  });
  for (const t of touched) if (t.flagged.length) after(() => mailChiefScrutineers(t.boatName, t.flagged));
  return (await loadComponentViews({ ids: [id] }))[0];
}
