import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { findOwnBoat } from '@/lib/server/boats/boat-view';
import { loadComponentViews, findControlledComponentId, type ComponentView } from './component-view';

export type BoatComponents = {
  /** On this boat now. */
  fitted: ComponentView[];
  /** The actor's components on no boat (taken off, kept with their identity): they can be fitted here. */
  loose: ComponentView[];
  /** The actor's other boats, where a component can be moved. */
  otherBoats: { id: string; name: string }[];
};

/** One of the actor's boats' components, with their history and seals (the boat page and its API). */
export async function listBoatComponents(actor: Actor | null, boatId: string): Promise<BoatComponents> {
  assertCan(actor, 'boat.manage_own');
  const boat = await findOwnBoat(actor, boatId);
  const [fitted, loose, boats] = await Promise.all([
    loadComponentViews({ boatId: boat.id }),
    loadComponentViews({ looseOf: actor.id }),
    getDb().models.Boat.findAll({ where: { ownerId: actor.id }, attributes: ['id', 'name'], order: [['name', 'ASC']] }),
  ]);
  return {
    fitted,
    loose,
    otherBoats: boats.filter((b) => b.id !== boat.id).map((b) => ({ id: b.id, name: b.name })),
  };
}

/** One component the actor may handle (on their boat, or on no boat and registered by them). */
export async function getMyComponent(actor: Actor | null, componentId: string): Promise<ComponentView> {
  assertCan(actor, 'boat.manage_own');
  const { id } = await findControlledComponentId(actor, componentId);
  return (await loadComponentViews({ ids: [id] }))[0];
}
