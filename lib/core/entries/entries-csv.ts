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

/**
 * One CSV cell (RFC 4180 quoting). A text cell a spreadsheet would read as a formula (first character = + - @,
 * tab, carriage return or NUL: OWASP ASVS 5.0 requirement 1.2.10) gets a leading apostrophe. A cell holding a
 * semicolon or tab is quoted too: a spreadsheet set to split on those (Excel where the list separator is ";")
 * would otherwise start a new cell inside the value, with the formula character first (OWASP "CSV Injection",
 * from memory: take care of the field separator, not only of the first character).
 */
export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return '';
  let s = String(value);
  if (typeof value === 'string' && /^[=+\-@\t\r\0]/.test(s)) s = `'${s}`;
  return /[",;\t\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
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
