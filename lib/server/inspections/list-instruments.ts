import 'server-only';
import { literal } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import type { Instrument } from '@/models';
import { instrumentUncertainty } from '../../core/inspections/decide-inspection';
import { toInstrumentFigures } from '../../core/inspections/instrument-figures';

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
  /** When it was taken out of service (null while in service). */
  retiredAt: string | null;
};

/** The meeting's instruments in service, with the U each brings to a decision. */
export async function listInstruments(actor: Actor | null, eventId: string): Promise<InstrumentView[]> {
  assertCan(actor, 'inspection.board', { eventId });
  const rows = await getDb().models.Instrument.findAll({
    where: { eventId, retiredAt: null },
    order: [
      ['quantity', 'ASC'],
      ['name', 'ASC'],
    ],
  });
  return rows.map(toInstrumentView);
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
  return rows.map(toInstrumentView);
}

export function toInstrumentView(i: Instrument): InstrumentView {
  const figures = toInstrumentFigures(i);
  const u = instrumentUncertainty(figures, i.quantity === 'length' ? 'mm' : 'kg');
  return {
    ...figures,
    appliedExpandedUncertainty: u.expandedUncertainty,
    basis: u.basis,
    retiredAt: i.retiredAt ? new Date(i.retiredAt).toISOString() : null,
  };
}
