import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { tableToCsv, tableToPdf, type ExportTable } from '@/lib/core/series/series-exports';
import { getSeries } from './get-series';
import { loadStandings } from './standings';

export const EXPORT_KINDS = ['standings', 'penalties', 'appeals'] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];

async function standingsTable(seriesId: string): Promise<ExportTable> {
  const series = await getSeries(seriesId);
  const rows: unknown[][] = [];
  const notes: string[] = [];
  for (const c of series.classes) {
    const s = await loadStandings(seriesId, c.id);
    const last = s.after.at(-1);
    if (!notes.length) notes.push(s.dropRule, s.tieRule);
    notes.push(
      `${c.code}: points by place ${c.pointsByPosition.join(', ')}; ${c.droppedRounds} dropped round(s); ${s.after.length} of ${s.rounds.length} round(s) held.`,
    );
    for (const r of last?.rows ?? []) {
      const who = s.competitors[r.competitorId];
      rows.push([
        c.code,
        `${r.position}${r.isTied ? '=' : ''}`,
        who.seasonNumber ?? '',
        who.boatName,
        r.total,
        r.grossPoints,
        r.droppedPoints,
        r.pointsDeducted,
        r.rounds
          .map((x) =>
            x.status ? x.status.toUpperCase() : x.position === null ? '-' : `${x.points}${x.isDropped ? '(d)' : ''}`,
          )
          .join(' '),
        (s.penaltiesByBoat[r.competitorId] ?? []).length,
      ]);
    }
  }
  return {
    title: `Standings: ${series.name} ${series.season}`,
    subtitle: 'Series standings after the rounds held',
    notes,
    columns: [
      'class',
      'position',
      'season_number',
      'boat',
      'total',
      'gross',
      'dropped',
      'deducted',
      'rounds',
      'penalties',
    ],
    rows,
  };
}

type PenaltyExportRow = {
  classCode: string;
  eventName: string;
  raceNumber: number;
  boatName: string;
  code: string;
  kind: string;
  amount: number | null;
  label: string;
  reason: string;
  decidedAt: Date;
  state: string;
};

async function penaltiesTable(seriesId: string): Promise<ExportTable> {
  const series = await getSeries(seriesId);
  const rows = await getDb().sequelize.query<PenaltyExportRow>(
    `select sc.code as "classCode", ev.name as "eventName", e.race_number as "raceNumber", b.name as "boatName",
            p.code, p.kind, p.amount, p.label, p.reason, p.decided_at as "decidedAt",
            coalesce((select a.status from appeals a where a.penalty_id = p.id and a.status in ('annulled', 'amended', 'confirmed')
                       order by a.decided_at desc limit 1), case when exists (select 1 from appeals a where a.penalty_id = p.id
                       and a.status in ('lodged', 'hearing_scheduled')) then 'under_appeal' else 'in_force' end) as state
       from penalties p join entries e on e.id = p.entry_id join boats b on b.id = e.boat_id
       join race_classes rc on rc.id = e.class_id join series_classes sc on sc.id = rc.series_class_id
       join events ev on ev.id = p.event_id
      where sc.series_id = :seriesId
      order by sc.code, ev.starts_on, p.decided_at, p.id`,
    { replacements: { seriesId }, type: QueryTypes.SELECT },
  );
  return {
    title: `Penalties: ${series.name} ${series.season}`,
    subtitle: "Stewards' and appeal body's penalties at the series' rounds",
    notes: ['state: in_force, under_appeal, or the appeal decision (confirmed, amended, annulled).'],
    columns: [
      'class',
      'meeting',
      'race_number',
      'boat',
      'code',
      'kind',
      'amount',
      'label',
      'reason',
      'decided_at',
      'state',
    ],
    rows: rows.map((r) => [
      r.classCode,
      r.eventName,
      r.raceNumber,
      r.boatName,
      r.code,
      r.kind,
      r.amount,
      r.label,
      r.reason,
      new Date(r.decidedAt).toISOString(),
      r.state,
    ]),
  };
}

async function appealsTable(seriesId: string): Promise<ExportTable> {
  const series = await getSeries(seriesId);
  const rows = await getDb().sequelize.query<Record<string, unknown>>(
    `select sc.code as "classCode", ev.name as "eventName", e.race_number as "raceNumber", b.name as "boatName",
            p.code as "penaltyCode", a.status, a.grounds, a.created_at as "lodgedAt", a.hearing_at as "hearingAt",
            a.decided_at as "decidedAt", a.decision_reasons as "decisionReasons"
       from appeals a join penalties p on p.id = a.penalty_id join entries e on e.id = p.entry_id
       join boats b on b.id = e.boat_id join race_classes rc on rc.id = e.class_id
       join series_classes sc on sc.id = rc.series_class_id join events ev on ev.id = a.event_id
      where sc.series_id = :seriesId and a.status <> 'awaiting_fee'
      order by sc.code, ev.starts_on, a.created_at, a.id`,
    { replacements: { seriesId }, type: QueryTypes.SELECT },
  );
  const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : '');
  return {
    title: `Appeals: ${series.name} ${series.season}`,
    subtitle: "Appeals to the governing body's appeal body against penalties at the series' rounds",
    notes: ['Appeals whose fee is not paid are not lodged and are left out.'],
    columns: [
      'class',
      'meeting',
      'race_number',
      'boat',
      'penalty',
      'status',
      'grounds',
      'lodged_at',
      'hearing_at',
      'decided_at',
      'reasons',
    ],
    rows: rows.map((r) => [
      r.classCode,
      r.eventName,
      r.raceNumber,
      r.boatName,
      r.penaltyCode,
      r.status,
      r.grounds,
      iso(r.lodgedAt),
      iso(r.hearingAt),
      iso(r.decidedAt),
      r.decisionReasons ?? '',
    ]),
  };
}

/** One export of the series for the governing body, as CSV or PDF. */
export async function exportSeries(
  actor: Actor | null,
  seriesId: string,
  kind: string,
  format: string,
): Promise<{ body: string | Uint8Array; contentType: string; filename: string }> {
  assertCan(actor, 'series.export', { seriesId });
  if (!(EXPORT_KINDS as readonly string[]).includes(kind))
    throw new AppError('not_found', 404, 'Exports are standings, penalties or appeals.');
  if (format !== 'csv' && format !== 'pdf') throw new AppError('not_found', 404, 'Exports are CSV or PDF.');
  const table =
    kind === 'standings'
      ? await standingsTable(seriesId)
      : kind === 'penalties'
        ? await penaltiesTable(seriesId)
        : await appealsTable(seriesId);
  const filename = `series-${kind}.${format}`;
  return format === 'csv'
    ? { body: tableToCsv(table), contentType: 'text/csv; charset=utf-8', filename }
    : { body: await tableToPdf(table, new Date()), contentType: 'application/pdf', filename };
}
