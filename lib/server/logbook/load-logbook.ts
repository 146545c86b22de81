import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { rolesCan, type Role } from '@/lib/core/auth/permissions';
import type { LogbookRecord } from '@/lib/core/logbook/logbook-record';
import { currentInspectionCte } from '@/lib/server/inspections/inspection-view';
import { queryProtestSummaries } from '@/lib/server/protests/protest-view';
import { openLogbook, type LogbookAccess } from './open-logbook';
import {
  iso,
  isoOrNull,
  readComponents,
  readDeclarations,
  readMeetings,
  readNotes,
  readSealEvents,
  type Q,
} from './read-boat-history';

// Everything a boat's logbook shows, across every meeting, cut to what this viewer may see. A few
// queries per boat, each by the boat's id (a boat has a handful of entries, not thousands).

export type Logbook = {
  record: LogbookRecord;
  isOwner: boolean;
  /** Meetings where this person may add a note, for the form's choice. */
  noteMeetings: { id: string; name: string }[];
  /** The zone that dates what belongs to no meeting: the boat's latest meeting's, else UTC. */
  fallbackZone: string;
};

async function readInspections(q: Q, boatId: string): Promise<LogbookRecord['inspections']> {
  const entryIds = (await q<{ id: string }>('select id from entries where boat_id = :boatId', { boatId })).map(
    (e) => e.id,
  );
  // The one definition of an entry's current record (currentInspectionCte), asked per entry.
  const current = new Set(
    (
      await Promise.all(
        entryIds.map((entryId) =>
          q<{ id: string }>(`with ${currentInspectionCte('entry')} select id from current_inspection`, { entryId }),
        ),
      )
    )
      .flat()
      .map((r) => r.id),
  );
  const rows = await q<{
    id: string;
    eventId: string;
    kind: string;
    capturedAt: Date;
    recordedBy: string;
    ruleVersion: number;
    declarationVersion: number | null;
    overallResult: string;
    results: unknown;
    supersedesId: string | null;
    correctionReason: string | null;
    notes: string;
  }>(
    `select i.id, i.event_id as "eventId", i.kind, i.captured_at as "capturedAt", coalesce(u.name, u.email) as "recordedBy",
            v.version as "ruleVersion", dv.version as "declarationVersion", i.overall_result as "overallResult", i.results,
            i.supersedes_id as "supersedesId", i.correction_reason as "correctionReason", i.notes
       from inspections i
       join class_rule_versions v on v.id = i.rule_version_id
       join users u on u.id = i.recorded_by_id
       left join boat_declaration_versions dv on dv.id = i.declaration_version_id
      where i.boat_id = :boatId`,
    { boatId },
  );
  return rows.map((r) => ({ ...r, capturedAt: iso(r.capturedAt), isCurrent: current.has(r.id) }));
}

async function readReinspections(q: Q, boatId: string) {
  const rows = await q<{
    id: string;
    eventId: string;
    reason: string;
    requestedBy: string;
    createdAt: Date;
    doneAt: Date | null;
    protestId: string | null;
  }>(
    `select r.id, r.event_id as "eventId", r.reason, coalesce(u.name, u.email) as "requestedBy",
            r.created_at as "createdAt", r.done_at as "doneAt", r.protest_id as "protestId"
       from reinspections r join entries e on e.id = r.entry_id join users u on u.id = r.requested_by_id
      where e.boat_id = :boatId`,
    { boatId },
  );
  return rows.map((r) => ({ ...r, createdAt: iso(r.createdAt), doneAt: isoOrNull(r.doneAt) }));
}

async function readIncidents(q: Q, boatId: string): Promise<NonNullable<LogbookRecord['incidents']>> {
  const rows = await q<{
    id: string;
    eventId: string;
    occurredAt: Date;
    description: string;
    damage: boolean;
    reinspectionId: string | null;
    supersedesId: string | null;
    correctionReason: string | null;
    isCurrent: boolean;
    recordedBy: string;
  }>(
    `select i.id, i.event_id as "eventId", i.occurred_at as "occurredAt", i.description, i.damage,
            i.reinspection_id as "reinspectionId", i.supersedes_id as "supersedesId", i.correction_reason as "correctionReason",
            not exists (select 1 from incidents x where x.supersedes_id = i.id) as "isCurrent", coalesce(u.name, u.email) as "recordedBy"
       from incidents i join entries e on e.id = i.entry_id join users u on u.id = i.recorded_by_id
      where e.boat_id = :boatId`,
    { boatId },
  );
  return rows.map((r) => ({ ...r, occurredAt: iso(r.occurredAt) }));
}

/** A task ordered for a protest the viewer may not see keeps its reason to itself (the reason may name the protest). */
function hideUnseenProtestReasons(
  tasks: Awaited<ReturnType<typeof readReinspections>>,
  protests: LogbookRecord['protests'],
): LogbookRecord['reinspections'] {
  const seen = new Set(protests.map((p) => p.id));
  return tasks.map(({ protestId, ...t }) =>
    protestId && !seen.has(protestId) ? { ...t, reason: 'ordered by the stewards' } : t,
  );
}

async function readCustody(q: Q, boatId: string): Promise<LogbookRecord['custody']> {
  const rows = await q<{
    id: string;
    eventId: string;
    description: string;
    sealNumber: string | null;
    takenBy: string;
    takenAt: Date;
    releasedTo: string | null;
    releasedBy: string | null;
    releasedAt: Date | null;
    note: string | null;
  }>(
    `select ci.id, ci.event_id as "eventId", ci.description, ci.seal_number as "sealNumber",
            coalesce(tu.name, tu.email) as "takenBy", ci.taken_at as "takenAt",
            cr.released_to as "releasedTo", coalesce(ru.name, ru.email) as "releasedBy", cr.released_at as "releasedAt", cr.note
       from custody_items ci join entries e on e.id = ci.entry_id join users tu on tu.id = ci.taken_by_id
       left join custody_releases cr on cr.item_id = ci.id left join users ru on ru.id = cr.released_by_id
      where e.boat_id = :boatId`,
    { boatId },
  );
  return rows.map((r) => ({
    id: r.id,
    eventId: r.eventId,
    description: r.description,
    sealNumber: r.sealNumber,
    takenBy: r.takenBy,
    takenAt: iso(r.takenAt),
    release: r.releasedAt
      ? {
          releasedTo: r.releasedTo ?? '',
          releasedBy: r.releasedBy ?? '',
          releasedAt: iso(r.releasedAt),
          note: r.note ?? '',
        }
      : null,
  }));
}

/**
 * Protests against this boat's entries, only those the viewer may see today: the lodger, the
 * protested entrant once the fee is paid (lib/server/protests/list-my-protests.ts), and the
 * meeting's officials with protest.view_all. Grounds and evidence stay on the protest's own page.
 */
async function readProtests(actor: Actor, boatId: string): Promise<LogbookRecord['protests']> {
  const officialOf = Object.entries(actor.eventRoles)
    .filter(([, roles]) => rolesCan(roles as Role[], 'protest.view_all'))
    .map(([eventId]) => eventId);
  const rows = await queryProtestSummaries(
    `e.boat_id = :boatId and (p.lodged_by_id = :uid or (e.entrant_id = :uid and p.status <> 'awaiting_fee')
       or p.event_id = any(array[:officialOf]::uuid[]))`,
    { boatId, uid: actor.id, officialOf: officialOf.length ? officialOf : [null] },
  );
  return rows.map((p) => ({
    id: p.id,
    eventId: p.eventId,
    raceNumber: p.raceNumber,
    statusLabel: p.statusLabel,
    ruleReference: p.ruleReference,
    lodgedAt: p.lodgedAt,
    decidedAt: p.decidedAt,
    decisionReasons: p.decisionReasons,
    penalty: p.penalty,
    decidedByNames: p.decidedByNames,
  }));
}

/** The logbook of a boat for this viewer (openLogbook decides who: 401, or 404 as for a missing boat). */
export async function loadLogbook(actor: Actor | null, rawBoatId: string): Promise<Logbook> {
  const access: LogbookAccess = await openLogbook(actor, rawBoatId);
  const { sequelize } = getDb();
  const q: Q = <T extends object>(sql: string, replacements?: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const boatId = access.boat.id;
  const [
    meetings,
    declarations,
    { components, componentEvents },
    sealEvents,
    inspections,
    reinspections,
    custody,
    protests,
    notes,
    incidents,
  ] = await Promise.all([
    readMeetings(q, boatId),
    readDeclarations(q, boatId),
    readComponents(q, boatId),
    readSealEvents(q, boatId),
    readInspections(q, boatId),
    readReinspections(q, boatId),
    readCustody(q, boatId),
    readProtests(access.actor, boatId),
    readNotes(q, boatId),
    readIncidents(q, boatId),
  ]);
  const latest = meetings[meetings.length - 1];
  return {
    record: {
      boat: access.boat,
      meetings,
      declarations,
      components,
      componentEvents,
      sealEvents,
      inspections,
      reinspections: hideUnseenProtestReasons(reinspections, protests),
      custody,
      protests,
      notes,
      incidents,
    },
    isOwner: access.isOwner,
    noteMeetings: meetings.filter((m) => access.noteEventIds.includes(m.id)).map((m) => ({ id: m.id, name: m.name })),
    fallbackZone: latest?.timeZone ?? 'UTC',
  };
}
