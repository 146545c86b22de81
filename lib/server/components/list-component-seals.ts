import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';

export type ComponentSealView = {
  componentId: string;
  sealId: string;
  number: string;
  /** Where on the component it was applied. */
  position: string;
  appliedAt: string;
  appliedBy: string;
  /** The seal's latest event: applied, or found intact at a later inspection. */
  lastAction: 'applied' | 'intact';
  lastSeenAt: string;
};

/**
 * The seals on these components now: a seal belongs to the component its latest 'applied' event
 * names, and is on it while its latest event is 'applied' or 'intact' (broken, missing or removed
 * seals are history, told by the seal register). Callers check who may see the components. The
 * seals follow the component from boat to boat: nothing here looks at the boat.
 */
export async function listComponentSeals(componentIds: string[]): Promise<ComponentSealView[]> {
  if (componentIds.length === 0) return [];
  const rows = await getDb().sequelize.query<
    Omit<ComponentSealView, 'appliedAt' | 'lastSeenAt'> & { appliedAt: Date; lastSeenAt: Date }
  >(
    `select applied.component_id as "componentId", s.id as "sealId", s.number, applied.position,
            applied.created_at as "appliedAt", coalesce(u.name, u.email) as "appliedBy",
            last.action as "lastAction", last.created_at as "lastSeenAt"
       from seals s
       join lateral (select e.* from seal_events e where e.seal_id = s.id
                      order by e.created_at desc, e.id desc limit 1) last on true
       join lateral (select e.* from seal_events e where e.seal_id = s.id and e.action = 'applied'
                      order by e.created_at desc, e.id desc limit 1) applied on true
       join users u on u.id = applied.recorded_by_id
      where s.id in (select e.seal_id from seal_events e where e.component_id in (:componentIds))
        and applied.component_id in (:componentIds) and last.action in ('applied', 'intact')
      order by s.number`,
    { replacements: { componentIds }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    ...r,
    appliedAt: new Date(r.appliedAt).toISOString(),
    lastSeenAt: new Date(r.lastSeenAt).toISOString(),
  }));
}
