import 'server-only';
import { QueryTypes } from 'sequelize';
import { FROM_REPLICA, getDb } from '@/lib/server/db';
import { POWER_EVIDENCE_SHARE, evidenceOf, powerExpandedUncertaintyKw } from '@/lib/core/reports/power-uncertainty';
import { matchedCurvesOf, type StoredBoatPerformance } from '@/lib/core/boats/declared-performance';
import { AppError } from '@/lib/core/errors';
import { findRulesInForce } from '@/lib/server/classes/rule-versions';
import { computeAreaEquivalentDiameterFromReadingsMm } from '@/lib/core/engine/measurement';
import { readRecordForReport } from '@/lib/core/inspections/inspection-record';
import { currentInspectionCte } from '@/lib/server/inspections/inspection-view';
import { resolveEventDensity } from '../../core/reports/event-density';
import type { ReportBoatInput, ReportExcluded, ReportInputs } from '../../core/reports/parity-figures';

type Row = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  /** The power of the declaration version the inspection checked (never the live boat row). */
  checkedPowerKw: number | null;
  /** The engine and pump curves of the declaration version the inspection checked. */
  checkedPerformance: StoredBoatPerformance | null;
  /** The open re-inspection task's reason when the owner changed the declaration after the inspection. */
  declarationChange: string | null;
  inspectionId: string | null;
  receivedAt: Date | null;
  overallResult: string | null;
  // The stored record's documents (models/shapes/inspection-record.ts), read through readRecordForReport.
  measurements: unknown;
  results: unknown;
};

/** The task's reason cut to what a public report may say: that the declaration changed, and between which versions. */
function publicChangeNotice(reason: string): string {
  const versions = /\(version \d+ → \d+\)/.exec(reason)?.[0];
  return `Re-inspection required: the declaration changed after inspection${versions ? ` ${versions}` : ''}; the figures are those inspected`;
}

const RESULT_WORDS: Record<string, string> = { does_not_conform: 'does not conform', inconclusive: 'inconclusive' };

/**
 * Inputs of a class's parity report: every entered boat with its current inspection record. A boat is used
 * only when its latest record conforms; the others are listed with the reason. When the owner changed the
 * declaration after that record, the report keeps the inspected figures (never what the owner typed since)
 * and marks the boat as awaiting re-inspection. Four queries, whatever the number of boats.
 */
export async function gatherReportInputs(eventId: string, classId: string, at = new Date()): Promise<ReportInputs> {
  const { sequelize, models } = getDb();
  const [event, raceClass] = await Promise.all([
    models.Event.findByPk(eventId),
    models.RaceClass.findOne({ where: { id: classId, eventId } }),
  ]);
  if (!event || !raceClass) throw new AppError('not_found', 404, 'No such class at this meeting.');
  const rules = await findRulesInForce(classId, at);
  if (!rules)
    throw new AppError(
      'conflict',
      409,
      'This class has no published rules in force, so there is nothing to report against.',
    );
  // From a replica when there is one: a report may lag the last record by a moment (lib/server/db).
  const rows = await sequelize.query(
    // The current record of each entry: corrections replace what they supersede, and a record that
    // waited offline does not overtake a newer capture (the same rule the dock and the board use).
    `with ${currentInspectionCte('event', { acrossVersions: true })}
     select e.id as "entryId", e.race_number as "raceNumber", b.name as "boatName", dv.declared_power_kw as "checkedPowerKw",
            dv.declared_performance as "checkedPerformance",
            i.id as "inspectionId", i.received_at as "receivedAt", i.overall_result as "overallResult", i.measurements, i.results,
            (select r.reason from reinspections r where r.entry_id = e.id and r.done_at is null and r.declaration_version_id is not null
              order by r.created_at desc limit 1) as "declarationChange"
       from entries e
       join boats b on b.id = e.boat_id
       left join current_inspection ci on ci.entry_id = e.id
       left join inspections i on i.id = ci.id
       left join boat_declaration_versions dv on dv.id = i.declaration_version_id
      where e.event_id = :eventId and e.class_id = :classId and e.status = 'entered'
      order by e.race_number`,
    { replacements: { eventId, classId }, type: QueryTypes.SELECT, ...FROM_REPLICA },
  );
  const r = rules.rules;
  // Class defaults are expanded uncertainties (k = 2); the engine takes standard ones (U / 2). The
  // power's follows the evidence seen at the inspection (lib/core/reports/power-uncertainty.ts).
  const boats: ReportBoatInput[] = [];
  const excluded: ReportExcluded[] = [];
  for (const row of rows as unknown as Row[]) {
    const base = { entryId: row.entryId, raceNumber: row.raceNumber, boatName: row.boatName };
    if (!row.inspectionId) {
      excluded.push({ ...base, reason: 'Not inspected yet' });
      continue;
    }
    if (row.overallResult !== 'conforms') {
      excluded.push({
        ...base,
        reason: `Latest inspection ${RESULT_WORDS[row.overallResult ?? ''] ?? row.overallResult}`,
      });
      continue;
    }
    const record = readRecordForReport(row.measurements, row.results);
    if (record.correctedReadingsMm === null) {
      excluded.push({ ...base, reason: 'Latest inspection does not store its temperature-corrected readings' });
      continue;
    }
    if (record.correctedReadingsMm.length === 0) {
      excluded.push({ ...base, reason: 'Latest inspection has no nozzle readings' });
      continue;
    }
    // The readings the verdict used, as the record stores them (corrected to 20 °C when a temperature was given).
    const corrected = record.correctedReadingsMm;
    const U = record.nozzleExpandedUncertaintyMm ?? r.nozzle.defaultUncertaintyMm;
    // What the scrutineer confirmed, else the declaration version the inspection checked: never the live boat row.
    const powerKw = record.confirmedPowerKw ?? row.checkedPowerKw!;
    const powerEvidence = evidenceOf(record.evidenceKind, record.evidenceSeen);
    boats.push({
      ...base,
      powerKw,
      uPowerKw:
        powerExpandedUncertaintyKw(powerKw, powerEvidence, r.power.defaultUncertaintyKw, r.power.evidenceShares) / 2,
      powerEvidence,
      powerSource: record.evidenceSeen ? 'verified' : 'declared',
      measuredWeightKg: record.measuredWeightKg,
      nozzleDiameterMm: computeAreaEquivalentDiameterFromReadingsMm(corrected),
      uNozzleDiameterMm: U / 2,
      inspectionId: row.inspectionId,
      inspectedAt: row.receivedAt ? new Date(row.receivedAt).toISOString() : null,
      // The figures stay those inspected; the reader is told the declaration changed since, but not what
      // changed: a report is published to anyone and frozen, and the details (component serials, makers,
      // declared figures) are for the officials and the owner only.
      ...(row.declarationChange ? { awaitingReinspection: publicChangeNotice(row.declarationChange) } : {}),
      // The curves of the version inspected (never what the owner typed since), for a class on the matched model.
      ...curvesFor(row.checkedPerformance, event.waterTemperatureC, r.parity.reportModel),
    });
  }
  const density = resolveEventDensity(event);
  return {
    eventName: event.name,
    classCode: raceClass.code,
    className: raceClass.name,
    ruleVersion: { id: rules.id, version: rules.version },
    assumptions: {
      pumpEfficiency: r.parity.pumpEfficiency,
      nozzleLossCoefficient: r.parity.nozzleLossCoefficient,
      inletLossCoefficient: r.parity.inletLossCoefficient,
      wakeFraction: r.parity.wakeFraction,
      referenceSpeedsMs: r.parity.referenceSpeedsMs,
      reportModel: r.parity.reportModel ?? 'fixed_power',
      powerEvidenceShares: r.power.evidenceShares
        ? { ...r.power.evidenceShares, source: 'class' }
        : { ...POWER_EVIDENCE_SHARE, source: 'common_practice' },
    },
    density: { densityKgM3: density.densityKgM3, description: density.description },
    boats,
    excluded,
    computedAt: at.toISOString(),
  };
}

/** A boat's curves and suction data for the report, only where the class reports on the matched model. */
function curvesFor(
  declared: StoredBoatPerformance | null,
  meetingWaterC: number,
  reportModel: 'fixed_power' | 'matched' | undefined,
): Pick<ReportBoatInput, 'curves' | 'suction'> {
  if (reportModel !== 'matched') return {};
  const curves = matchedCurvesOf(declared);
  if (!curves) return {};
  const s = declared?.suction;
  return {
    curves: {
      engine: { ...curves.engine, curve: [...curves.engine.curve] },
      pump: { ...curves.pump, curve: [...curves.pump.curve] },
    },
    ...(s && { suction: { ...s, waterTemperatureC: s.waterTemperatureC ?? meetingWaterC } }),
  };
}
