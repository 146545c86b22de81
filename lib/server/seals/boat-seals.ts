import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { SealAction } from '@/models/boat-record';
import { describeComponent } from '@/lib/core/seals/seal-words';

/** A seal on one of the boat's components now: its latest event was applied or found intact. */
export type BoatSeal = {
  sealId: string;
  number: string;
  lastAction: SealAction;
  lastEventId: string;
  lastAt: string;
  position: string;
  componentId: string;
  /** The component in words (“engine Marlo MX-6, serial 7731”). */
  component: string;
};

// A seal's latest event decides where it is: the components of the boat now (boat_components.boat_id),
// so a component moved to another boat takes its seals with it. Events are ordered by their time, then id.
const BOAT_SEALS_SQL = `
  select s.id as "sealId", s.number, l.action as "lastAction", l.id as "lastEventId", l.created_at as "lastAt",
         l.position, c.id as "componentId", c.kind, c.maker, c.model, c.serial_number as "serialNumber"
    from boat_components c
    join lateral (select distinct e.seal_id from seal_events e where e.component_id = c.id) x on true
    join lateral (select e.id, e.action, e.position, e.created_at, e.component_id from seal_events e
                   where e.seal_id = x.seal_id order by e.created_at desc, e.id desc limit 1) l on l.component_id = c.id
    join seals s on s.id = x.seal_id
   where c.boat_id = :boatId and l.action in ('applied', 'intact')
   order by s.number`;

type Row = Omit<BoatSeal, 'component' | 'lastAt'> & {
  lastAt: Date;
  kind: string;
  maker: string;
  model: string;
  serialNumber: string;
};

/** The seals on the boat's components now (the dock lists them to be checked). */
export async function loadBoatSeals(boatId: string, transaction?: Transaction): Promise<BoatSeal[]> {
  const rows = await getDb().sequelize.query<Row>(BOAT_SEALS_SQL, {
    replacements: { boatId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return rows.map((r) => ({
    sealId: r.sealId,
    number: r.number,
    lastAction: r.lastAction,
    lastEventId: r.lastEventId,
    lastAt: new Date(r.lastAt).toISOString(),
    position: r.position,
    componentId: r.componentId,
    component: describeComponent(r),
  }));
}

/** The boat's components now, for the dock's “apply a seal” choice. */
export async function loadBoatComponentChoices(boatId: string): Promise<{ id: string; label: string }[]> {
  const rows = await getDb().models.BoatComponent.findAll({
    where: { boatId },
    order: [
      ['kind', 'ASC'],
      ['serialNumber', 'ASC'],
    ],
  });
  return rows.map((c) => ({ id: c.id, label: describeComponent(c) }));
}
