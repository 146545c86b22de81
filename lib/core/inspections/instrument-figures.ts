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

/**
 * The instrument's figures with its calibration certificate's stated U when the certificate gives
 * one: U is restated at k = 2 (u = U/k, JCGM 100:2008, 6.2.1 and 6.3.3) and its source is named, so
 * the record's uncertainty basis says which certificate the verdict used. Without a certificate U
 * the figures are returned unchanged.
 */
export function withCertificateFigures(
  figures: InstrumentFigures,
  certificate: {
    number: string;
    laboratory: string;
    expandedUncertainty: number | null;
    coverageFactor: number;
  } | null,
): InstrumentFigures {
  if (!certificate || certificate.expandedUncertainty == null) return figures;
  const k = certificate.coverageFactor > 0 ? certificate.coverageFactor : 2;
  const u2 = (certificate.expandedUncertainty / k) * 2;
  return {
    ...figures,
    expandedUncertainty: u2,
    uncertaintySource: `certificate ${certificate.number}, ${certificate.laboratory}, stated U ${certificate.expandedUncertainty} with k = ${k}`,
  };
}
