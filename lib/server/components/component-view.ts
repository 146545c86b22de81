import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import type { Actor } from '@/lib/server/auth/actor';
import type { ComponentEventAction, ComponentKind } from '@/models/boat-record';
import { listComponentSeals, type ComponentSealView } from './list-component-seals';

// Plain objects for screens and handlers, and the one "may this person handle this component" check.

export type ComponentEventView = {
  action: ComponentEventAction;
  boatId: string | null;
  boatName: string | null;
  details: Record<string, unknown>;
  recordedBy: string;
  createdAt: string;
};

export type ComponentView = {
  id: string;
  kind: ComponentKind;
  maker: string;
  model: string;
  serialNumber: string;
  trimCode: string;
  notes: string;
  /** Where it is now: a boat, or null (taken off, kept with its identity). */
  boatId: string | null;
  boatName: string | null;
  createdAt: string;
  /** Oldest first: registered, fitted, removed, edited. */
  history: ComponentEventView[];
  /** Seals on it now (the latest event of each is applied or found intact). */
  seals: ComponentSealView[];
};

type Row = Omit<ComponentView, 'history' | 'seals' | 'createdAt'> & { createdAt: Date };

const notFound = () => new AppError('not_found', 404, 'No such component among yours.');

/**
 * The ids of components the actor may handle: on one of their boats, or on no boat and registered by
 * them. Anyone else's component answers exactly like a missing one (404).
 */
export async function findControlledComponentId(
  actor: Actor,
  componentId: string,
  opts: { transaction?: Transaction; lock?: boolean } = {},
): Promise<{ id: string; boatId: string | null }> {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i.test(componentId)) throw notFound();
  const [row] = await getDb().sequelize.query<{ id: string; boatId: string | null }>(
    `select c.id, c.boat_id as "boatId" from boat_components c
      where c.id = :id
        and (exists (select 1 from boats b where b.id = c.boat_id and b.owner_id = :actorId)
             or (c.boat_id is null and c.created_by_id = :actorId))
      ${opts.lock ? 'for update of c' : ''}`,
    {
      replacements: { id: componentId.toLowerCase(), actorId: actor.id },
      type: QueryTypes.SELECT,
      transaction: opts.transaction,
    },
  );
  if (!row) throw notFound();
  return row;
}

/**
 * Components with their history and seals: by id, on a boat, or a person's components on no boat.
 * Callers check who may see them first (the owner here; the logbook for a meeting's officials).
 */
export async function loadComponentViews(
  where: { ids: string[] } | { boatId: string } | { looseOf: string },
): Promise<ComponentView[]> {
  const { sequelize } = getDb();
  const filter =
    'ids' in where
      ? 'c.id in (:ids)'
      : 'boatId' in where
        ? 'c.boat_id = :boatId'
        : 'c.boat_id is null and c.created_by_id = :looseOf';
  if ('ids' in where && where.ids.length === 0) return [];
  const rows = await sequelize.query<Row>(
    `select c.id, c.kind, c.maker, c.model, c.serial_number as "serialNumber", c.trim_code as "trimCode", c.notes,
            c.boat_id as "boatId", b.name as "boatName", c.created_at as "createdAt"
       from boat_components c left join boats b on b.id = c.boat_id
      where ${filter}
      order by array_position(array['engine', 'pump', 'impeller']::varchar[], c.kind), c.serial_number`,
    { replacements: where, type: QueryTypes.SELECT },
  );
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [events, seals] = await Promise.all([
    sequelize.query<Omit<ComponentEventView, 'createdAt'> & { componentId: string; createdAt: Date }>(
      `select e.component_id as "componentId", e.action, e.boat_id as "boatId", b.name as "boatName", e.details,
              coalesce(u.name, u.email) as "recordedBy", e.created_at as "createdAt"
         from component_events e join users u on u.id = e.recorded_by_id left join boats b on b.id = e.boat_id
        where e.component_id in (:ids)
        -- A move writes 'removed' and 'fitted' in one transaction, often at the same instant: the
        -- removal reads first.
        order by e.created_at, array_position(array['registered', 'removed', 'fitted', 'edited']::varchar[], e.action), e.id`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    ),
    listComponentSeals(ids),
  ]);
  return rows.map((r) => ({
    ...r,
    createdAt: new Date(r.createdAt).toISOString(),
    history: events
      .filter((e) => e.componentId === r.id)
      .map(({ componentId: _, ...e }) => ({ ...e, createdAt: new Date(e.createdAt).toISOString() })),
    seals: seals.filter((s) => s.componentId === r.id),
  }));
}
