import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { fieldError } from '@/lib/core/errors';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import type { RecordInspectionInput } from '@/lib/core/inputs/inspections';
import { INSTRUMENT_TYPE_LABELS, type InstrumentType } from '@/lib/core/inputs/instrument-calibration';
import type { InstrumentFigures } from '../../core/inspections/decide-inspection';
import { toInstrumentFigures, withCertificateFigures } from '../../core/inspections/instrument-figures';
import { calibrationState } from '../../core/inspections/calibration-state';
import { eventTimeZone, loadCalibrationFacts } from './instrument-calibration';

const typeWords = (t: string | null) => (t ? (INSTRUMENT_TYPE_LABELS[t as InstrumentType] ?? t) : 'no stated type');

/**
 * The instruments a record names for the class's measured items and the nozzle's gauge check, checked
 * against the rules in force: each on this meeting's list and not retired, of a type the item allows
 * (the gauge: a plug gauge), and usable at the capture time (calibration due date and the day's check,
 * as for the nozzle's instrument: 409 when not). An item the rules do not have is refused here too
 * (400), before any instrument is read. Two queries for all of them, plus the calibration facts.
 */
export async function resolveItemInstruments(
  eventId: string,
  input: Pick<RecordInspectionInput, 'measuredItems' | 'gaugeChecks'>,
  rules: ClassRules,
  measuredAt: Date,
): Promise<{ itemInstruments: Record<string, InstrumentFigures | null>; gaugeInstrument: InstrumentFigures | null }> {
  const defined = rules.measuredItems ?? [];
  const wanted: { field: string; id: string; allowed: readonly string[]; what: string; key: string | null }[] = [];
  input.measuredItems.forEach((m, i) => {
    const rule = defined.find((d) => d.key === m.key);
    if (!rule)
      throw fieldError(
        `measuredItems.${i}.key`,
        `The class rules in force have no measured item “${m.key}”: it cannot be recorded for this boat.`,
      );
    if (m.instrumentId)
      wanted.push({
        field: `measuredItems.${i}.instrumentId`,
        id: m.instrumentId.toLowerCase(),
        allowed: rule.instrumentTypes,
        what: rule.label,
        key: m.key,
      });
  });
  input.gaugeChecks.forEach((g, i) => {
    if (g.instrumentId)
      wanted.push({
        field: `gaugeChecks.${i}.instrumentId`,
        id: g.instrumentId.toLowerCase(),
        allowed: ['plug_gauge'],
        what: 'the nozzle’s gauge check',
        key: null,
      });
  });
  const itemInstruments: Record<string, InstrumentFigures | null> = {};
  if (wanted.length === 0) return { itemInstruments, gaugeInstrument: null };
  const ids = [...new Set(wanted.map((w) => w.id))];
  const { models } = getDb();
  const [found, facts, timeZone] = await Promise.all([
    models.Instrument.findAll({ where: { id: { [Op.in]: ids }, eventId, retiredAt: null } }),
    loadCalibrationFacts(ids),
    eventTimeZone(eventId),
  ]);
  let gaugeInstrument: InstrumentFigures | null = null;
  for (const w of wanted) {
    const i = found.find((x) => x.id === w.id);
    if (!i) throw fieldError(w.field, 'This instrument is not on this meeting’s list.');
    if (!w.allowed.includes(i.instrumentType ?? ''))
      throw fieldError(
        w.field,
        `${i.name} is a ${typeWords(i.instrumentType).toLowerCase()}; the class rules allow only ${w.allowed.map((t) => typeWords(t).toLowerCase()).join(', ')} for ${w.what}.`,
      );
    const f = facts.get(i.id) ?? { certificates: [], checks: [] };
    const calibration = calibrationState(f.certificates, f.checks, measuredAt, timeZone ?? 'UTC');
    if (!calibration.usable)
      throw fieldError(w.field, `${i.name} cannot be used: ${calibration.reason}. Choose another instrument.`, 409);
    const figures = withCertificateFigures(toInstrumentFigures(i), calibration.certificate);
    if (w.key) itemInstruments[w.key] = figures;
    else gaugeInstrument = figures;
  }
  return { itemInstruments, gaugeInstrument };
}
