// CSV of an event's entries (RFC 4180 quoting), with spreadsheet formula injection neutralised
// (cells starting with = + - @ are prefixed with an apostrophe, as OWASP advises for CSV export).
import type { EventEntryRow } from '../../server/entries/list-event-entries';
import { roundFigure, type FigureKind } from '../format/figures';

// Figures leave rounded as on the screens (lib/core/format/figures.ts), still as numbers so a
// spreadsheet reads them as numbers; the database keeps the full precision.
const ROUNDED: Partial<Record<keyof EventEntryRow, FigureKind>> = {
  declaredNozzleMm: 'nozzleMm',
  declaredPowerKw: 'powerKw',
};

const COLUMNS: [keyof EventEntryRow, string][] = [
  ['raceNumber', 'race_number'],
  ['boatName', 'boat'],
  ['hullNumber', 'hull_number'],
  ['classCode', 'class_code'],
  ['className', 'class'],
  ['entrantName', 'entrant'],
  ['entrantEmail', 'entrant_email'],
  ['status', 'status'],
  ['inspectionResult', 'inspection_result'],
  ['declaredNozzleMm', 'declared_nozzle_mm'],
  ['declaredPowerKw', 'declared_power_kw'],
  ['feeMinor', 'fee_minor'],
  ['currency', 'currency'],
  ['paidAt', 'paid_at'],
];

export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return '';
  let s = String(value);
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function entriesToCsv(rows: EventEntryRow[]): string {
  const lines = [COLUMNS.map(([, h]) => h).join(',')];
  for (const r of rows) {
    lines.push(
      COLUMNS.map(([k]) => {
        const kind = ROUNDED[k];
        const v = r[k];
        return csvCell(kind && typeof v === 'number' ? roundFigure(v, kind) : v);
      }).join(','),
    );
  }
  return lines.join('\r\n') + '\r\n';
}
