// An instrument row (model, view or raw SQL aliased to camelCase) as the figures a verdict's
// uncertainty is made from. One mapping for recording, the instrument list and the demo seed.
import type { InstrumentFigures } from './decide-inspection';

export type InstrumentRow = {
  id: string;
  name: string;
  quantity: 'length' | 'mass' | string;
  errorLimit?: number | string | null;
  resolution?: number | string | null;
  expandedUncertainty?: number | string | null;
};

// pg returns double precision as a number but numeric as a string; an absent figure stays null (not 0).
function toFigure(x: number | string | null | undefined): number | null {
  if (x == null || x === '') return null;
  const n = Number(x);
  if (!Number.isFinite(n)) throw new Error(`An instrument figure must be a number (got ${String(x)}).`);
  return n;
}

/** The figures of one instrument; a quantity other than length or mass is refused (a schema drift, not input). */
export function toInstrumentFigures(row: InstrumentRow): InstrumentFigures {
  if (row.quantity !== 'length' && row.quantity !== 'mass')
    throw new Error(`Instrument ${row.id} measures "${row.quantity}", neither length nor mass.`);
  return {
    id: row.id,
    name: row.name,
    quantity: row.quantity,
    errorLimit: toFigure(row.errorLimit),
    resolution: toFigure(row.resolution),
    expandedUncertainty: toFigure(row.expandedUncertainty),
  };
}
