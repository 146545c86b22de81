import 'server-only';
import { literal } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import type { Instrument } from '@/models';
import { instrumentUncertainty } from '../../core/inspections/decide-inspection';
import { toInstrumentFigures, withCertificateFigures } from '../../core/inspections/instrument-figures';
import { calibrationState, type CalibrationState } from '../../core/inspections/calibration-state';
import { eventTimeZone, loadCalibrationFacts, type CalibrationFacts } from './instrument-calibration';

export type InstrumentView = {
  id: string;
  name: string;
  quantity: 'length' | 'mass';
  errorLimit: number | null;
  resolution: number | null;
  expandedUncertainty: number | null;
  /** U the verdicts will use (k = 2), from the certificate or the budget of a and δ. */
  appliedExpandedUncertainty: number;
  basis: string;
  /** What kind of instrument, its serial, measuring range and material (null when not given). */
  instrumentType: string | null;
  serial: string | null;
  rangeMin: number | null;
  rangeMax: number | null;
  material: string | null;
  /** Its calibration state now, in the meeting's time zone (certificate due date, today's check). */
  calibration: CalibrationState;
  /** When it was taken out of service (null while in service). */
  retiredAt: string | null;
};

async function withCalibration(eventId: string, rows: Instrument[]): Promise<InstrumentView[]> {
  const [facts, timeZone] = await Promise.all([loadCalibrationFacts(rows.map((r) => r.id)), eventTimeZone(eventId)]);
  const now = new Date();
  return rows.map((r) => toInstrumentView(r, facts.get(r.id), timeZone ?? 'UTC', now));
}

/** The meeting's instruments in service, with the U each brings to a decision and its calibration state. */
export async function listInstruments(actor: Actor | null, eventId: string): Promise<InstrumentView[]> {
  assertCan(actor, 'inspection.board', { eventId });
  const rows = await getDb().models.Instrument.findAll({
    where: { eventId, retiredAt: null },
    order: [
      ['quantity', 'ASC'],
      ['name', 'ASC'],
    ],
  });
  return withCalibration(eventId, rows);
}

/** All of the meeting's instruments, retired ones too (in service first), for the screen that manages them. */
export async function listAllInstruments(actor: Actor | null, eventId: string): Promise<InstrumentView[]> {
  assertCan(actor, 'inspection.board', { eventId });
  const rows = await getDb().models.Instrument.findAll({
    where: { eventId },
    order: [
      [literal('retired_at is not null'), 'ASC'],
      ['quantity', 'ASC'],
      ['name', 'ASC'],
    ],
  });
  return withCalibration(eventId, rows);
}

/** One instrument's view, with its certificates and checks (none given: no certificate on file). */
export function toInstrumentView(
  i: Instrument,
  facts: CalibrationFacts = { certificates: [], checks: [] },
  timeZone = 'UTC',
  at: Date = new Date(),
): InstrumentView {
  const calibration = calibrationState(facts.certificates, facts.checks, at, timeZone);
  const figures = withCertificateFigures(toInstrumentFigures(i), calibration.certificate);
  const u = instrumentUncertainty(figures, i.quantity === 'length' ? 'mm' : 'kg');
  return {
    id: figures.id,
    name: figures.name,
    quantity: figures.quantity,
    errorLimit: figures.errorLimit,
    resolution: figures.resolution,
    expandedUncertainty: toInstrumentFigures(i).expandedUncertainty,
    appliedExpandedUncertainty: u.expandedUncertainty,
    basis: u.basis,
    instrumentType: i.instrumentType ?? null,
    serial: i.serial ?? null,
    rangeMin: i.rangeMin ?? null,
    rangeMax: i.rangeMax ?? null,
    material: i.material ?? null,
    calibration,
    retiredAt: i.retiredAt ? new Date(i.retiredAt).toISOString() : null,
  };
}
