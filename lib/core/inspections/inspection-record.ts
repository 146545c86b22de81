// One builder for the stored inspection record (recording and the demo seed both call it) and one
// reader of what the parity report takes from it. The shape itself lives in
// models/shapes/inspection-record.ts (pure zod), so the model's JSONB columns are typed from it;
// lib/core/stored-shapes.ts checks it against the decision's own types.
import { z } from 'zod';
import {
  StoredInspectionRecord,
  StoredMeasurements,
  StoredNozzleMeasurement,
  StoredPowerMeasurement,
  StoredResults,
  StoredRuleResult,
  StoredWeightMeasurement,
  type StoredSealAction,
} from '../../../models/shapes/inspection-record';
import type { ClassRules } from '../inputs/class-rules';
import { ownValue } from '../inputs/measured-item-rules';
import type { RecordInspectionInput } from '../inputs/inspections';
import type { DecideInput, InspectionDecision, InstrumentFigures } from './decide-inspection';

export { StoredInspectionRecord, StoredMeasurements, StoredResults, StoredRuleResult };

export type BuildInspectionRecordInput = {
  input: Pick<RecordInspectionInput, 'weight' | 'safety'> &
    Partial<Pick<RecordInspectionInput, 'measuredItems' | 'gaugeChecks'>> & {
      nozzle: DecideInput['input']['nozzle'];
      power: Pick<RecordInspectionInput['power'], 'declaredKw' | 'evidenceSeen' | 'note'> &
        Partial<Pick<RecordInspectionInput['power'], 'evidenceKind'>>;
    };
  /** The register's seal actions at this inspection, in the order written (none: an empty list). */
  sealActions?: StoredSealAction[];
  /** The boat's document named as the dyno sheet (checked to be this boat's by the server). */
  dynoDocument?: { id: string; fileName: string } | null;
  decision: InspectionDecision;
  rules: Pick<ClassRules, 'decisionRule'>;
  ruleVersion: number;
  nozzleInstrument: InstrumentFigures | null;
  weightInstrument: InstrumentFigures | null;
  /** The instruments named for measured items (by item key) and the nozzle's gauge, when on the list. */
  itemInstruments?: Readonly<Record<string, InstrumentFigures | null>>;
  gaugeInstrument?: InstrumentFigures | null;
  /** The boat's declared power and its evidence at the time of the inspection. */
  boat: { declaredKw: number; powerEvidence: string };
};

/** The record's two documents, checked against the stored shape (a mismatch is a programming error: 500, not 400). */
export function buildInspectionRecord(b: BuildInspectionRecordInput): StoredInspectionRecord {
  const { input, decision } = b;
  const record: StoredInspectionRecord = {
    measurements: {
      nozzle: {
        readings: input.nozzle.readings.map((r) => ({ diameterMm: r.diameterMm, angleDeg: r.angleDeg })),
        instrumentId: input.nozzle.instrumentId,
        instrumentName: b.nozzleInstrument?.name ?? null,
        typedExpandedUncertaintyMm: input.nozzle.expandedUncertaintyMm,
        temperatureC: input.nozzle.temperatureC,
        material: input.nozzle.material,
        correctedReadingsMm: decision.nozzle.correctedReadingsMm,
        temperatureCorrected: decision.nozzle.temperatureCorrected,
        appliedExpandedUncertaintyMm: decision.nozzle.expandedUncertaintyMm,
        uncertaintyBasis: decision.nozzle.uncertaintyBasis,
        // Written only with a temperature correction, so a record without one keeps the shape migration
        // 20261203003000 brought every older row to (as evidenceKind and sealActions do below). The
        // nozzle rule in results carries its budget in every new record.
        ...(decision.nozzle.thermal
          ? {
              instrumentTemperatureC: decision.nozzle.thermal.instrumentTemperatureC,
              instrumentTemperatureSource: decision.nozzle.thermal.instrumentTemperatureSource,
              instrumentMaterial: decision.nozzle.thermal.instrumentMaterial,
              instrumentMaterialSource: decision.nozzle.thermal.instrumentMaterialSource,
              uncertaintyBudget: decision.nozzle.budget,
            }
          : {}),
      },
      weight: input.weight
        ? {
            readingsKg: input.weight.readingsKg,
            instrumentId: input.weight.instrumentId,
            instrumentName: b.weightInstrument?.name ?? null,
            meanKg: decision.weight?.meanKg ?? null,
            expandedUncertaintyKg: decision.weight?.expandedUncertaintyKg ?? null,
            uncertaintyBasis: decision.weight?.uncertaintyBasis ?? null,
          }
        : null,
      power: {
        declaredKw: input.power.declaredKw,
        evidenceSeen: input.power.evidenceSeen,
        note: input.power.note,
        boatDeclaredKw: b.boat.declaredKw,
        boatPowerEvidence: b.boat.powerEvidence,
        // Written only when there is something to say, so a record without them keeps the shape
        // migration 20261203003000 brought every older row to (its backfill leaves such rows alone).
        ...(input.power.evidenceKind ? { evidenceKind: input.power.evidenceKind } : {}),
        ...(b.dynoDocument ? { dynoDocument: b.dynoDocument } : {}),
      },
      seals: [],
      ...(b.sealActions?.length ? { sealActions: b.sealActions } : {}),
      safety: input.safety as Record<string, boolean>,
      // Written only when there is something, so records without items keep their shape.
      ...(decision.items.length
        ? {
            measuredItems: decision.items.map((d) => {
              const m = input.measuredItems?.find((x) => x.key === d.key);
              const instrument = ownValue(b.itemInstruments, d.key) ?? null;
              return {
                key: d.key,
                label: d.label,
                unit: d.unit,
                readings: (m?.readings ?? []).map((r) => ({ ...r }) as Record<string, number>),
                instrumentId: m?.instrumentId ?? null,
                instrumentName: instrument?.name ?? null,
                value: d.value,
                expandedUncertainty: d.expandedUncertainty,
                uncertaintyBasis: d.uncertaintyBasis,
              };
            }),
          }
        : {}),
      ...(input.gaugeChecks?.length
        ? {
            gaugeChecks: input.gaugeChecks.map((g) => ({
              rule: g.rule,
              gauge: g.gauge,
              instrumentId: g.instrumentId,
              instrumentName: b.gaugeInstrument?.name ?? null,
              passed: g.passed,
            })),
          }
        : {}),
    },
    results: {
      rules: decision.rules,
      decisionRule: b.rules.decisionRule,
      ruleVersion: b.ruleVersion,
      scope: decision.scope,
    },
  };
  const checked = StoredInspectionRecord.safeParse(record);
  if (!checked.success)
    throw new Error(`The inspection record does not match its stored shape: ${z.prettifyError(checked.error)}`);
  return checked.data;
}

// What the report takes from a record, as slices of the stored shape: rows brought to the one
// shape carry every field; a hand-written row (tests, benchmarks) may carry only these.
const ReportMeasurements = z.object({
  nozzle: StoredNozzleMeasurement.pick({ correctedReadingsMm: true, temperatureC: true, material: true })
    .extend({ readings: z.array(StoredNozzleMeasurement.shape.readings.element.pick({ diameterMm: true })) })
    .partial()
    .nullish(),
  power: StoredPowerMeasurement.pick({ evidenceSeen: true, declaredKw: true, evidenceKind: true }).partial().nullish(),
  weight: StoredWeightMeasurement.pick({ readingsKg: true, meanKg: true }).partial().nullish(),
});
const ReportResults = z.object({ rules: z.array(StoredRuleResult.pick({ rule: true, expandedUncertainty: true })) });

export type RecordForReport = {
  /** The readings the verdict used (corrected to 20 °C when it recorded a temperature and material); null if the record lacks them. */
  correctedReadingsMm: number[] | null;
  /** The nozzle U the verdict decided with, or null when the record has no nozzle verdict. */
  nozzleExpandedUncertaintyMm: number | null;
  evidenceSeen: boolean;
  /** The kind of power evidence seen; older records say only whether evidence was seen (null then). */
  evidenceKind: 'dyno_sheet' | 'maker_rating' | 'declaration_only' | null;
  /** The power the scrutineer confirmed at this inspection (kW), or null when the record lacks it. */
  confirmedPowerKw: number | null;
  /** The boat's weight measured at this inspection (mean of the weighings, kg), or null when not weighed. */
  measuredWeightKg: number | null;
};

/** Reads a stored record for the parity report: the stored corrected readings, never a recomputation. */
export function readRecordForReport(measurements: unknown, results: unknown): RecordForReport {
  const m = ReportMeasurements.safeParse(measurements ?? {});
  const r = ReportResults.safeParse(results);
  const nozzle = m.success ? m.data.nozzle : null;
  const readings = (nozzle?.readings ?? []).map((x) => x.diameterMm);
  // Without a temperature and material no correction applies, so a row lacking the stored list used its readings as read.
  const hadCorrection = nozzle?.temperatureC != null && nozzle?.material != null;
  const corrected = nozzle?.correctedReadingsMm ?? (hadCorrection ? null : readings);
  const nozzleRule = r.success
    ? r.data.rules.find((x) => x.rule.startsWith('nozzle') && x.expandedUncertainty != null)
    : undefined;
  return {
    correctedReadingsMm: corrected ? corrected.filter((x) => x > 0) : null,
    nozzleExpandedUncertaintyMm: nozzleRule?.expandedUncertainty ?? null,
    evidenceSeen: (m.success && m.data.power?.evidenceSeen) === true,
    evidenceKind: (m.success && m.data.power?.evidenceKind) || null,
    confirmedPowerKw: m.success && typeof m.data.power?.declaredKw === 'number' ? m.data.power.declaredKw : null,
    measuredWeightKg: m.success ? weighedMeanKg(m.data.weight) : null,
  };
}

/** The stored mean of the weighings, or their arithmetic mean when the class had no minimum to decide. */
function weighedMeanKg(w: { meanKg?: number | null; readingsKg?: number[] } | null | undefined): number | null {
  if (!w) return null;
  if (typeof w.meanKg === 'number') return w.meanKg;
  const kg = (w.readingsKg ?? []).filter((x) => x > 0);
  return kg.length ? kg.reduce((a, b) => a + b, 0) / kg.length : null;
}
