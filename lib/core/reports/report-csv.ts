// Per-boat figures of a published report as CSV (RFC 4180, formula cells neutralised).
import { csvCell } from '../entries/entries-csv';
import type { PublishedReportDto } from './report-dto';
import { CLOCK_CSV_COLUMNS, clockCsvCells } from './clock-report-lines';

export const REPORT_CSV_COLUMNS = [
  'race_number',
  'boat',
  'power_kw',
  'u_power_kw',
  'nozzle_mm',
  'u_nozzle_mm',
  'static_thrust_n',
  'u_static_thrust_n',
  'static_jet_velocity_ms',
  'u_static_jet_velocity_ms',
  'deviation_from_median_percent',
  'u_deviation_percent',
  'crossover_with_median_ms',
  'equalising_nozzle_mm',
] as const;

export function reportToCsv(report: PublishedReportDto): string {
  const boats = report.results.parity?.boats ?? [];
  const inputs = new Map(report.inputs.boats.map((b) => [b.entryId, b]));
  const speeds = report.inputs.assumptions.referenceSpeedsMs;
  const used = report.results.modelUsed;
  // The model each boat used and the speeds where its pump cavitates (its thrust there an upper bound) come last,
  // so the columns before them keep their places.
  const header = [
    ...REPORT_CSV_COLUMNS,
    ...speeds.flatMap((v) => [`thrust_at_${v}_ms_n`, `u_thrust_at_${v}_ms_n`]),
    'model',
    'cavitating_at_ms',
    ...CLOCK_CSV_COLUMNS,
  ];
  const lines = [header.join(',')];
  for (const b of boats) {
    const i = inputs.get(b.id)!;
    const cells: unknown[] = [
      i.raceNumber,
      i.boatName,
      b.powerKw,
      i.uPowerKw,
      b.nozzleDiameterMm,
      i.uNozzleDiameterMm,
      b.staticThrustN,
      b.uStaticThrustN,
      b.staticJetVelocityMs,
      b.uStaticJetVelocityMs,
      b.deviationFromMedianPercent,
      b.uDeviationFromMedianPercent,
      b.crossoverWithMedianMs ?? '',
      b.equalisingNozzleDiameterMm,
      ...b.thrustAtReferenceSpeeds.flatMap((t) => [t.thrustN, t.uThrustN]),
      used?.[b.id]?.model ?? 'fixed_power',
      (used?.[b.id]?.points ?? [])
        .filter((p) => p.cavitating)
        .map((p) => p.speedMs)
        .join(' '),
      ...clockCsvCells(report.results.clock, b.id),
    ];
    lines.push(cells.map(csvCell).join(','));
  }
  return lines.join('\r\n') + '\r\n';
}
