import 'server-only';
import { QueryTypes } from 'sequelize';
import { FROM_REPLICA, getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import type { PumpCatalogueEntry } from '@/models';
import type { StoredPumpCurvePoint } from '@/models/shapes/boat-performance';

export type PumpCatalogueView = {
  id: string;
  eventId: string;
  eventName: string;
  /** The club running the meeting: two meetings of one name are told apart by it. */
  organisationName: string;
  maker: string;
  model: string;
  trimCode: string;
  impellerDiameterMm: number;
  curve: StoredPumpCurvePoint[];
  createdAt: string;
};

export const toCatalogueView = (
  e: PumpCatalogueEntry,
  eventName: string,
  organisationName: string,
): PumpCatalogueView => ({
  id: e.id,
  eventId: e.eventId,
  eventName,
  organisationName,
  maker: e.maker,
  model: e.model,
  trimCode: e.trimCode,
  impellerDiameterMm: e.impellerDiameterMm,
  curve: e.curve,
  createdAt: new Date(e.createdAt).toISOString(),
});

/**
 * Impeller models and trims the meetings' organisers entered (a maker's published curves, open to
 * anyone signed in so an entrant can choose one), newest first; one meeting's when eventId is given.
 * A meeting still in draft is not public yet: its entries (and its name) show only to those who may
 * edit its classes.
 */
export async function listPumpCatalogue(actor: Actor | null, eventId?: string): Promise<PumpCatalogueView[]> {
  assertCan(actor, 'boat.manage_own');
  const organised = Object.keys(actor.eventRoles).filter((id) => can(actor, 'class.edit', { eventId: id }));
  const rows = await getDb().sequelize.query<Omit<PumpCatalogueView, 'createdAt'> & { createdAt: Date }>(
    `select p.id, p.event_id as "eventId", ev.name as "eventName", o.name as "organisationName", p.maker, p.model,
            p.trim_code as "trimCode", p.impeller_diameter_mm as "impellerDiameterMm", p.curve, p.created_at as "createdAt"
       from pump_catalogue_entries p join events ev on ev.id = p.event_id join organisations o on o.id = ev.organisation_id
      where (cast(:eventId as uuid) is null or p.event_id = cast(:eventId as uuid))
        and (ev.status <> 'draft' or p.event_id = any(cast(:organised as uuid[])))
      order by p.created_at desc
      limit 500`,
    {
      replacements: { eventId: eventId ?? null, organised: `{${organised.join(',')}}` },
      type: QueryTypes.SELECT,
      ...FROM_REPLICA,
    },
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString() }));
}
