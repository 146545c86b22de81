import 'server-only';
import { pickDeclaration, type DeclarationFields } from '@/lib/core/boats/declaration-changes';
import type { LogbookComponentRef, LogbookMeeting, LogbookRecord } from '@/lib/core/logbook/logbook-record';

// What a boat's logbook reads about the boat itself: the meetings it entered, its declaration
// versions, its components and their seals, and officials' notes (load-logbook.ts reads the rest).

export const iso = (d: unknown) => new Date(d as string).toISOString();
export const isoOrNull = (d: unknown) => (d ? iso(d) : null);

/** A SELECT with named replacements, bound to one Sequelize instance by the caller. */
export type Q = <T extends object>(sql: string, replacements?: Record<string, unknown>) => Promise<T[]>;

export async function readMeetings(q: Q, boatId: string): Promise<LogbookMeeting[]> {
  return q<LogbookMeeting>(
    `select ev.id, ev.name, ev.starts_on::text as "startsOn", ev.ends_on::text as "endsOn", ev.time_zone as "timeZone",
            json_agg(json_build_object('raceNumber', e.race_number, 'classCode', c.code, 'className', c.name, 'status', e.status)
                     order by e.created_at) as entries
       from entries e join events ev on ev.id = e.event_id join race_classes c on c.id = e.class_id
      where e.boat_id = :boatId
      group by ev.id
      order by ev.starts_on, ev.name`,
    { boatId },
  );
}

export async function readDeclarations(q: Q, boatId: string): Promise<LogbookRecord['declarations']> {
  const rows = await q<
    DeclarationFields & {
      id: string;
      version: number;
      createdAt: Date;
      createdBy: string;
      components: LogbookComponentRef[];
    }
  >(
    `select d.id, d.version, d.created_at as "createdAt", coalesce(u.name, u.email) as "createdBy",
            d.hull_description as "hullDescription", d.pump_description as "pumpDescription",
            d.impeller_description as "impellerDescription", d.declared_nozzle_mm as "declaredNozzleMm",
            d.declared_nozzle_tolerance_mm as "declaredNozzleToleranceMm", d.engine_description as "engineDescription",
            d.declared_power_kw as "declaredPowerKw", d.power_evidence as "powerEvidence", d.displacement_l as "displacementL",
            d.declared_weight_kg as "declaredWeightKg",
            coalesce((select json_agg(json_build_object('kind', bc.kind, 'maker', bc.maker, 'model', bc.model, 'serialNumber', bc.serial_number)
                                      order by bc.kind, bc.serial_number)
                        from declaration_version_components dvc join boat_components bc on bc.id = dvc.component_id
                       where dvc.declaration_version_id = d.id), '[]') as components
       from boat_declaration_versions d join users u on u.id = d.created_by_id
      where d.boat_id = :boatId
      order by d.version`,
    { boatId },
  );
  return rows.map((r) => ({
    id: r.id,
    version: r.version,
    createdAt: iso(r.createdAt),
    createdBy: r.createdBy,
    fields: pickDeclaration(r),
    components: r.components,
  }));
}

export async function readComponents(q: Q, boatId: string) {
  const [components, events] = await Promise.all([
    q<LogbookRecord['components'][number]>(
      `select id, kind, maker, model, serial_number as "serialNumber", trim_code as "trimCode", notes
         from boat_components where boat_id = :boatId order by kind, serial_number`,
      { boatId },
    ),
    // What happened on this boat, and the earlier history of what is on it now. Who recorded a step
    // on another boat's record is that boat's business: it is not named here.
    q<{ id: string; action: string; boatId: string | null; createdAt: Date; recordedBy: string } & LogbookComponentRef>(
      `select ce.id, ce.action, ce.boat_id as "boatId", ce.created_at as "createdAt", coalesce(u.name, u.email) as "recordedBy",
              bc.kind, bc.maker, bc.model, bc.serial_number as "serialNumber"
         from component_events ce join boat_components bc on bc.id = ce.component_id join users u on u.id = ce.recorded_by_id
        where ce.boat_id = :boatId or ce.component_id in (select id from boat_components where boat_id = :boatId)`,
      { boatId },
    ),
  ]);
  const componentEvents: LogbookRecord['componentEvents'] = events.map((e) => {
    const where = e.boatId === boatId ? 'this_boat' : e.boatId ? 'other_boat' : 'no_boat';
    return {
      id: e.id,
      component: { kind: e.kind, maker: e.maker, model: e.model, serialNumber: e.serialNumber },
      action: e.action,
      where,
      createdAt: iso(e.createdAt),
      recordedBy: where === 'other_boat' ? "another boat's record" : e.recordedBy,
    };
  });
  return { components, componentEvents };
}

export async function readSealEvents(q: Q, boatId: string): Promise<LogbookRecord['sealEvents']> {
  const rows = await q<{
    id: string;
    sealNumber: string;
    action: string;
    createdAt: Date;
    eventId: string | null;
    position: string;
    reason: string;
    recordedBy: string;
    inspectionId: string | null;
    componentId: string | null;
    component: LogbookComponentRef | null;
  }>(
    `select se.id, s.number as "sealNumber", se.action, se.created_at as "createdAt", se.event_id as "eventId",
            se.position, se.reason, coalesce(u.name, u.email) as "recordedBy", se.inspection_id as "inspectionId",
            se.component_id as "componentId",
            case when bc.id is null then null
                 else json_build_object('kind', bc.kind, 'maker', bc.maker, 'model', bc.model, 'serialNumber', bc.serial_number) end as component
       from seal_events se join seals s on s.id = se.seal_id join users u on u.id = se.recorded_by_id
       left join boat_components bc on bc.id = se.component_id
      where se.boat_id = :boatId or se.component_id in (select id from boat_components where boat_id = :boatId)`,
    { boatId },
  );
  return rows.map((r) => ({ ...r, createdAt: iso(r.createdAt) }));
}

export async function readNotes(q: Q, boatId: string): Promise<LogbookRecord['notes']> {
  const rows = await q<{
    id: string;
    eventId: string;
    category: string;
    notedOn: string;
    body: string;
    author: string;
    createdAt: Date;
  }>(
    `select n.id, n.event_id as "eventId", n.category, n.noted_on::text as "notedOn", n.body,
            coalesce(u.name, u.email) as author, n.created_at as "createdAt"
       from boat_log_notes n join users u on u.id = n.author_id
      where n.boat_id = :boatId`,
    { boatId },
  );
  return rows.map((r) => ({ ...r, createdAt: iso(r.createdAt) }));
}
