import 'server-only';
import { QueryTypes } from 'sequelize';
import { FROM_REPLICA, getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { findRulesInForce } from '@/lib/server/classes/rule-versions';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import { BOARD_RESULT_FILTERS, type BoardResultFilter } from '@/lib/core/inputs/inspections';
import { currentInspectionCte } from './inspection-view';
import { listReinspectionViews, type ReinspectionView } from './reinspection-view';

export type BoardState = 'waiting' | 'conforms' | 'does_not_conform' | 'inconclusive';

export type BoardRow = {
  entryId: string;
  raceNumber: number;
  status: string;
  isPaid: boolean;
  boatId: string;
  boatName: string;
  hullNumber: string;
  /** The boat's current tag token, so the dock can match a scan offline. */
  tagToken: string | null;
  classId: string;
  classCode: string;
  className: string;
  declaredNozzleMm: number;
  declaredPowerKw: number;
  powerEvidence: string;
  declaredWeightKg: number | null;
  /** The boat's newest declaration version: a record made from this row says it checked that one. */
  declarationVersion: number;
  state: BoardState;
  latest: {
    id: string;
    overallResult: string;
    kind: string;
    capturedAt: string;
    recordedBy: string;
    device: string;
  } | null;
  inspectionCount: number;
  openReinspectionCount: number;
  /** Set when the owner changed the declaration after an inspection: the open task's reason, with what changed. */
  declarationChange: string | null;
};

export type InspectionBoard = {
  eventId: string;
  eventName: string;
  generatedAt: string;
  rows: BoardRow[];
  counts: {
    total: number;
    waiting: number;
    conforms: number;
    doesNotConform: number;
    inconclusive: number;
    openReinspections: number;
  };
  classes: {
    id: string;
    code: string;
    name: string;
    ruleVersion: { id: string; version: number; rules: ClassRules } | null;
  }[];
  reinspections: ReinspectionView[];
};

type Row = Omit<BoardRow, 'latest' | 'state' | 'inspectionCount' | 'openReinspectionCount'> & {
  latestId: string | null;
  latestResult: string | null;
  latestKind: string | null;
  latestCapturedAt: Date | null;
  latestBy: string | null;
  latestDevice: string | null;
  inspectionCount: string;
  openReinspectionCount: string;
};

/**
 * Every live entry of the meeting (withdrawn and cancelled boats are not inspected) with its current
 * record, what is still waiting, and the open re-inspection tasks. Filters: class (id or code) and
 * result (waiting, conforms, does_not_conform, inconclusive, reinspection). Counts are for the class
 * filter only, so the board shows how much is left whatever result is being looked at.
 */
export async function listInspectionBoard(
  actor: Actor | null,
  eventId: string,
  filters: { classFilter?: string | null; result?: string | null } = {},
): Promise<InspectionBoard> {
  assertCan(actor, 'inspection.board', { eventId });
  const result = filters.result || null;
  if (result && !BOARD_RESULT_FILTERS.includes(result as BoardResultFilter)) {
    throw new AppError('invalid_input', 400, `result: choose one of ${BOARD_RESULT_FILTERS.join(', ')}.`, [
      { field: 'result', message: 'Choose a result to filter by.' },
    ]);
  }
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['id', 'name'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const classRows = await models.RaceClass.findAll({ where: { eventId }, order: [['code', 'ASC']] });
  const wanted = filters.classFilter?.trim() || null;
  const chosen = wanted
    ? classRows.find((c) => c.id === wanted.toLowerCase() || c.code === wanted.toUpperCase())
    : null;
  if (wanted && !chosen)
    throw new AppError('invalid_input', 400, 'class: no such class at this meeting.', [
      { field: 'class', message: 'No such class at this meeting.' },
    ]);

  const rows = await sequelize.query<Row>(
    `with ${currentInspectionCte('event')}
     select e.id as "entryId", e.race_number as "raceNumber", e.status, (e.paid_at is not null and e.refunded_at is null) as "isPaid",
            b.id as "boatId", b.name as "boatName", b.hull_number as "hullNumber", t.token as "tagToken",
            c.id as "classId", c.code as "classCode", c.name as "className",
            b.declared_nozzle_mm as "declaredNozzleMm", b.declared_power_kw as "declaredPowerKw", b.power_evidence as "powerEvidence",
            b.declared_weight_kg as "declaredWeightKg",
            (select max(d.version) from boat_declaration_versions d where d.boat_id = b.id) as "declarationVersion",
            i.id as "latestId", i.overall_result as "latestResult", i.kind as "latestKind", i.captured_at as "latestCapturedAt",
            coalesce(u.name, u.email) as "latestBy", i.device as "latestDevice",
            (select count(*) from inspections x where x.entry_id = e.id) as "inspectionCount",
            (select count(*) from reinspections r where r.entry_id = e.id and r.done_at is null) as "openReinspectionCount",
            (select r.reason from reinspections r where r.entry_id = e.id and r.done_at is null and r.declaration_version_id is not null
              order by r.created_at desc limit 1) as "declarationChange"
       from entries e
       join boats b on b.id = e.boat_id
       join race_classes c on c.id = e.class_id
       left join boat_tags t on t.boat_id = b.id and t.retired_at is null
       left join current_inspection ci on ci.entry_id = e.id
       left join inspections i on i.id = ci.id
       left join users u on u.id = i.recorded_by_id
      where e.event_id = :eventId and e.status in ('awaiting_payment', 'entered')
        and (cast(:classId as uuid) is null or e.class_id = cast(:classId as uuid))
      order by e.race_number`,
    { replacements: { eventId, classId: chosen?.id ?? null }, type: QueryTypes.SELECT, ...FROM_REPLICA },
  );
  const all: BoardRow[] = rows.map((r) => ({
    entryId: r.entryId,
    raceNumber: r.raceNumber,
    status: r.status,
    isPaid: r.isPaid,
    boatId: r.boatId,
    boatName: r.boatName,
    hullNumber: r.hullNumber,
    tagToken: r.tagToken,
    classId: r.classId,
    classCode: r.classCode,
    className: r.className,
    declaredNozzleMm: r.declaredNozzleMm,
    declaredPowerKw: r.declaredPowerKw,
    powerEvidence: r.powerEvidence,
    declaredWeightKg: r.declaredWeightKg,
    declarationVersion: Number(r.declarationVersion),
    state: (r.latestResult ?? 'waiting') as BoardState,
    latest: r.latestId
      ? {
          id: r.latestId,
          overallResult: r.latestResult!,
          kind: r.latestKind!,
          capturedAt: new Date(r.latestCapturedAt!).toISOString(),
          recordedBy: r.latestBy ?? '',
          device: r.latestDevice ?? '',
        }
      : null,
    inspectionCount: Number(r.inspectionCount),
    openReinspectionCount: Number(r.openReinspectionCount),
    declarationChange: r.declarationChange,
  }));
  const count = (s: BoardState) => all.filter((r) => r.state === s).length;
  const reinspections = (await listReinspectionViews({ eventId, openOnly: true })).filter(
    (t) => !chosen || all.some((r) => r.entryId === t.entryId),
  );
  const shown = !result
    ? all
    : result === 'reinspection'
      ? all.filter((r) => r.openReinspectionCount > 0)
      : all.filter((r) => r.state === result);
  const classes = await Promise.all(
    classRows.map(async (c) => {
      const v = await findRulesInForce(c.id, new Date());
      return {
        id: c.id,
        code: c.code,
        name: c.name,
        ruleVersion: v ? { id: v.id, version: v.version, rules: v.rules } : null,
      };
    }),
  );
  return {
    eventId,
    eventName: event.name,
    generatedAt: new Date().toISOString(),
    rows: shown,
    counts: {
      total: all.length,
      waiting: count('waiting'),
      conforms: count('conforms'),
      doesNotConform: count('does_not_conform'),
      inconclusive: count('inconclusive'),
      openReinspections: reinspections.length,
    },
    classes,
    reinspections,
  };
}
