import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { findRulesInForce } from '@/lib/server/classes/rule-versions';
import { gatherReportInputs } from '@/lib/server/reports/gather-report-inputs';
import type { ReportInputs } from '@/lib/core/reports/parity-figures';
import { computeMatchedBoat, type BoatModelUsed } from '@/lib/core/reports/matched-figures';
import { computeClockSection, type ClockRun, type ClockSection } from '@/lib/core/timing/clock-section';
import type { CatalogueImpeller } from '@/lib/core/timing/balance-levers';
import { readClassDeclaredMasses } from './declared-masses';

export type ClockSectionView = ClockSection & {
  classId: string;
  classCode: string;
  className: string;
  /** The meeting's pump catalogue, for the sandbox's impeller change (not stored with a report). */
  pumpCatalogue: CatalogueImpeller[];
};

/**
 * A class's model against the clock, for the meeting's organisers: each boat's figures exactly as the parity
 * report reads them (the current conforming inspection: power confirmed, nozzle measured, weight weighed),
 * its current runs, and the comparison. A class without rules in force has no model: 409, as the report.
 */
export async function gatherClockSection(
  actor: Actor | null,
  eventId: string,
  classId: string,
): Promise<ClockSectionView> {
  assertCan(actor, 'results.publish', { eventId });
  const inputs = await gatherReportInputs(eventId, classId);
  const [section, catalogue] = await Promise.all([
    computeClockFromReportInputs(eventId, classId, inputs),
    getDb().sequelize.query<Omit<CatalogueImpeller, 'label'> & { maker: string; model: string; trimCode: string }>(
      `select p.id, p.maker, p.model, p.trim_code as "trimCode", p.impeller_diameter_mm as "impellerDiameterMm", p.curve
         from pump_catalogue_entries p where p.event_id = :eventId order by p.maker, p.model, p.trim_code, p.created_at limit 200`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  const pumpCatalogue = catalogue.map((c) => ({
    id: c.id,
    label: `${c.maker} ${c.model}${c.trimCode ? ` trim ${c.trimCode}` : ''}`,
    impellerDiameterMm: c.impellerDiameterMm,
    curve: c.curve,
  }));
  return { ...section, classId, classCode: inputs.classCode, className: inputs.className, pumpCatalogue };
}

/**
 * The clock section from a report's gathered inputs and the class's current runs (no permission check: the caller
 * has made it). The parity report stores what this returns in its results, so a published version keeps it.
 */
export async function computeClockFromReportInputs(
  eventId: string,
  classId: string,
  inputs: ReportInputs,
): Promise<ClockSection> {
  const rules = await findRulesInForce(classId);
  if (!rules) throw new AppError('conflict', 409, 'This class has no published rules in force.');
  const runs = await getDb().sequelize.query<ClockRun>(
    `select r.entry_id as "entryId", r.run_label as "runLabel", r.course_length_m as "courseLengthM", r.elapsed_s as "elapsedS",
            r.trap_speed_ms as "trapSpeedMs", r.gps_top_speed_ms as "gpsTopSpeedMs"
       from run_times r
      where r.event_id = :eventId and r.class_id = :classId
        and not exists (select 1 from run_times c where c.supersedes_id = r.id)`,
    { replacements: { eventId, classId }, type: QueryTypes.SELECT },
  );
  // The entrants' crew and fuel declarations as they are now: a published report keeps the ones it was computed with.
  const declared = await readClassDeclaredMasses(eventId, classId);
  const model = {
    densityKgM3: inputs.density.densityKgM3,
    pumpEfficiency: inputs.assumptions.pumpEfficiency,
    nozzleLossCoefficient: inputs.assumptions.nozzleLossCoefficient,
    inletLossCoefficient: inputs.assumptions.inletLossCoefficient,
    wakeFraction: inputs.assumptions.wakeFraction,
  };
  const reportModel = inputs.assumptions.reportModel ?? 'fixed_power';
  // The boats the parity report figures on the matched model (results.modelUsed, the same call) run on it here.
  const used = (b: ReportInputs['boats'][number]): BoatModelUsed | null =>
    reportModel !== 'matched'
      ? null
      : b.curves
        ? computeMatchedBoat(
            { ...b, curves: b.curves, suction: b.suction },
            model,
            inputs.assumptions.referenceSpeedsMs,
          )
        : { model: 'fixed_power', reason: 'No engine curve and pump curve both declared' };
  return computeClockSection({
    reportModel,
    boats: inputs.boats.map((b) => {
      const u = used(b);
      return {
        entryId: b.entryId,
        raceNumber: b.raceNumber,
        boatName: b.boatName,
        powerKw: b.powerKw,
        nozzleDiameterMm: b.nozzleDiameterMm,
        measuredWeightKg: b.measuredWeightKg ?? null,
        uPowerKw: b.uPowerKw,
        uNozzleDiameterMm: b.uNozzleDiameterMm,
        curves: u?.model === 'matched' ? b.curves : null,
        fixedPowerReason: u?.reason ?? null,
        declaredCrewKg: declared.get(b.entryId)?.crewKg ?? null,
        declaredFuelKg: declared.get(b.entryId)?.fuelKg ?? null,
      };
    }),
    excluded: inputs.excluded,
    runs,
    minimumWeightKg: rules.rules.weight.minKg,
    uWeightKg: rules.rules.weight.defaultUncertaintyKg / 2, // the class default is an expanded U (k = 2)
    model,
  });
}
