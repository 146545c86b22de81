import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Verdict } from '@/lib/core/engine/conformity';
import type { RuleResult } from '../../core/inspections/decide-inspection';
import type { StoredMeasurements } from '../../core/inspections/inspection-record';

// One inspection record as screens and the API see it (plain object), and the one query that
// reads records with who recorded them, under which rule version, and what superseded them.

export type InspectionView = {
  id: string;
  eventId: string;
  entryId: string;
  boatId: string;
  classId: string;
  ruleVersionId: string;
  ruleVersion: number;
  kind: string;
  recordedBy: { id: string; name: string };
  device: string;
  idempotencyKey: string;
  capturedAt: string;
  receivedAt: string;
  supersedesId: string | null;
  supersededById: string | null;
  correctionReason: string | null;
  reinspectionId: string | null;
  /** The stored record's measurements (one shape: lib/core/inspections/inspection-record.ts). */
  measurements: StoredMeasurements;
  rules: RuleResult[];
  overallResult: Verdict;
  notes: string;
  photoCount: number;
};

type Row = Omit<InspectionView, 'recordedBy' | 'rules' | 'capturedAt' | 'receivedAt' | 'photoCount'> & {
  recordedById: string;
  recordedByName: string | null;
  recordedByEmail: string;
  results: { rules?: RuleResult[] };
  capturedAt: Date;
  receivedAt: Date;
  photoCount: string | number;
};

/**
 * Records matching a condition on `i` (the inspections table), newest capture first. The
 * condition is written by callers in this folder only, with values passed as replacements.
 */
export async function loadInspectionViews(
  condition: string,
  replacements: Record<string, unknown>,
  transaction?: Transaction,
): Promise<InspectionView[]> {
  const rows = await getDb().sequelize.query<Row>(
    `select i.id, i.event_id as "eventId", i.entry_id as "entryId", i.boat_id as "boatId", i.class_id as "classId",
            i.rule_version_id as "ruleVersionId", v.version as "ruleVersion", i.kind, i.recorded_by_id as "recordedById",
            u.name as "recordedByName", u.email as "recordedByEmail", i.device, i.idempotency_key as "idempotencyKey",
            i.captured_at as "capturedAt", i.received_at as "receivedAt", i.supersedes_id as "supersedesId",
            (select s.id from inspections s where s.entry_id = i.entry_id and s.supersedes_id = i.id order by s.captured_at desc limit 1) as "supersededById",
            i.correction_reason as "correctionReason", i.reinspection_id as "reinspectionId", i.measurements, i.results,
            i.overall_result as "overallResult", i.notes,
            (select count(*) from inspection_photos p where p.inspection_id = i.id) as "photoCount"
       from inspections i
       join class_rule_versions v on v.id = i.rule_version_id
       join users u on u.id = i.recorded_by_id
      where ${condition}
      order by i.captured_at desc, i.received_at desc`,
    { replacements, type: QueryTypes.SELECT, transaction },
  );
  return rows.map(({ recordedById, recordedByName, recordedByEmail, results, photoCount, ...r }) => ({
    ...r,
    recordedBy: { id: recordedById, name: recordedByName ?? recordedByEmail },
    rules: results?.rules ?? [],
    capturedAt: new Date(r.capturedAt).toISOString(),
    receivedAt: new Date(r.receivedAt).toISOString(),
    photoCount: Number(photoCount),
  }));
}

/**
 * The current record of each entry in scope, as a CTE named `current_inspection(id, entry_id)`.
 * A correction takes the place of the record it supersedes, at that record's capture time, and a
 * superseded record no longer counts; among what is left the latest capture wins (device clocks,
 * so a record that waited offline does not overtake one made after it). A record of a declaration
 * version the owner has since replaced no longer counts either: the boat must be inspected again.
 */
export function currentInspectionCte(scope: 'entry' | 'event', { acrossVersions = false } = {}): string {
  const where = scope === 'entry' ? 'entry_id = :entryId' : 'event_id = :eventId';
  // acrossVersions: the latest record whatever declaration version it checked (the parity report keeps
  // the inspected figures, flagged, while the entry waits for its re-inspection); the verdict stops
  // being current for everything else.
  const replaced = acrossVersions
    ? ''
    : `and not exists (select 1 from boat_declaration_versions dv
                           join boat_declaration_versions dn on dn.boat_id = dv.boat_id and dn.version > dv.version
                          where dv.id = c.declaration_version_id)`;
  // The chain carries the columns the choice needs, so the choice never joins inspections again (that
  // join read the whole table once the entry had a long history: it ran for every record sent).
  return `recursive chain as (
      select id, entry_id, captured_at as root_at, captured_at, received_at, declaration_version_id
        from inspections where ${where} and supersedes_id is null
      union all
      select i.id, i.entry_id, c.root_at, i.captured_at, i.received_at, i.declaration_version_id
        from inspections i join chain c on i.entry_id = c.entry_id and i.supersedes_id = c.id
    ), current_inspection as (
      select distinct on (c.entry_id) c.id, c.entry_id
        from chain c
       where not exists (select 1 from inspections s where s.entry_id = c.entry_id and s.supersedes_id = c.id)
         ${replaced}
       order by c.entry_id, c.root_at desc, c.captured_at desc, c.received_at desc
    )`;
}
