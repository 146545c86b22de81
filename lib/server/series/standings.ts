import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { ResultAmendment, ResultRow } from '@/models/provisional-results';
import {
  DROP_RULE_TEXT,
  TIE_RULE_TEXT,
  standingsAfterEachRound,
  type SeriesRound,
  type StandingRow,
} from '@/lib/core/series/points';
import { findSeriesClass, listRounds } from './series-access';

export type CompetitorView = { boatId: string; boatName: string; seasonNumber: number | null; label: string };
export type StandingsView = {
  seriesId: string;
  seriesName: string;
  season: number;
  seriesClass: { id: string; code: string; name: string; pointsByPosition: number[]; droppedRounds: number };
  tieRule: string;
  dropRule: string;
  rounds: { classId: string; eventId: string; eventName: string; startsOn: string; resultsVersion: number | null }[];
  competitors: Record<string, CompetitorView>;
  // after[i]: the standings after the i-th round with published results (rounds held, in date order)
  after: { roundLabel: string; rows: StandingRow[] }[];
  // penalties in force across the season's rounds, by boat (cumulative)
  penaltiesByBoat: Record<
    string,
    { eventName: string; code: string; kind: string; amount: number | null; label: string }[]
  >;
};

type LatestResults = { classId: string; version: number; rows: ResultRow[]; amendments: ResultAmendment[] };

/**
 * The standings of a series class after each round, from each round's latest published results version
 * (which carries the stewards' and the appeal body's amendments): places from its rows, points deducted
 * from its amendments. A round with no results yet is listed but not held. Public, as results are.
 */
export async function loadStandings(seriesId: string, seriesClassId: string): Promise<StandingsView> {
  const cls = await findSeriesClass(seriesId, seriesClassId);
  const { sequelize } = getDb();
  const [[series], rounds] = await Promise.all([
    sequelize.query<{ name: string; season: number }>(`select name, season from series where id = :seriesId`, {
      replacements: { seriesId },
      type: QueryTypes.SELECT,
    }),
    listRounds(seriesClassId),
  ]);
  const classIds = rounds.map((r) => r.classId);
  const latest = classIds.length
    ? await sequelize.query<LatestResults>(
        `select distinct on (class_id) class_id as "classId", version, rows, amendments
           from provisional_results where class_id in (:classIds) order by class_id, version desc`,
        { replacements: { classIds }, type: QueryTypes.SELECT },
      )
    : [];
  const byClass = new Map(latest.map((l) => [l.classId, l]));
  const entryIds = latest.flatMap((l) => l.rows.map((r) => r.entryId));
  const [entries, numbers, penalties] = await Promise.all([
    entryIds.length
      ? sequelize.query<{ id: string; boatId: string; boatName: string; raceNumber: number }>(
          `select e.id, e.boat_id as "boatId", b.name as "boatName", e.race_number as "raceNumber"
             from entries e join boats b on b.id = e.boat_id where e.id in (:entryIds)`,
          { replacements: { entryIds }, type: QueryTypes.SELECT },
        )
      : [],
    sequelize.query<{ boatId: string; raceNumber: number }>(
      `select boat_id as "boatId", race_number as "raceNumber" from series_race_numbers where series_class_id = :seriesClassId`,
      { replacements: { seriesClassId }, type: QueryTypes.SELECT },
    ),
    classIds.length
      ? sequelize.query<{
          boatId: string;
          eventName: string;
          code: string;
          kind: string;
          amount: number | null;
          label: string;
        }>(
          `select e.boat_id as "boatId", ev.name as "eventName", p.code, p.kind, p.amount, p.label
             from penalties p join entries e on e.id = p.entry_id join events ev on ev.id = p.event_id
            where e.class_id in (:classIds)
              and not exists (select 1 from appeals x where x.penalty_id = p.id and x.status in ('annulled', 'amended'))
            order by ev.starts_on, p.decided_at`,
          { replacements: { classIds }, type: QueryTypes.SELECT },
        )
      : [],
  ]);
  const entryById = new Map(entries.map((e) => [e.id, e]));
  const seasonNumber = new Map(numbers.map((n) => [n.boatId, n.raceNumber]));
  const competitors: Record<string, CompetitorView> = {};
  const held: SeriesRound[] = [];
  for (const r of rounds) {
    const res = byClass.get(r.classId);
    if (!res) continue;
    const deducted = new Map<string, number>();
    for (const a of res.amendments)
      if (a.kind === 'points_deducted') deducted.set(a.entryId, (deducted.get(a.entryId) ?? 0) + (a.amount ?? 0));
    held.push({
      roundId: r.classId,
      label: r.eventName,
      entries: res.rows.flatMap((row) => {
        const e = entryById.get(row.entryId);
        if (!e) return [];
        const n = seasonNumber.get(e.boatId) ?? null;
        competitors[e.boatId] ??= {
          boatId: e.boatId,
          boatName: e.boatName,
          seasonNumber: n,
          label: `#${n ?? e.raceNumber} ${e.boatName}`,
        };
        return [
          {
            competitorId: e.boatId,
            position: row.position,
            ...(row.status && { status: row.status }),
            pointsDeducted: deducted.get(row.entryId) ?? 0,
          },
        ];
      }),
    });
  }
  const scheme = { pointsByPosition: cls.pointsByPosition, droppedRounds: cls.droppedRounds };
  const tables = standingsAfterEachRound(held, scheme);
  const penaltiesByBoat: StandingsView['penaltiesByBoat'] = {};
  for (const p of penalties) (penaltiesByBoat[p.boatId] ??= []).push(p);
  return {
    seriesId,
    seriesName: series.name,
    season: series.season,
    seriesClass: { id: cls.id, code: cls.code, name: cls.name, ...scheme },
    tieRule: TIE_RULE_TEXT,
    dropRule: DROP_RULE_TEXT,
    rounds: rounds.map((r) => ({
      classId: r.classId,
      eventId: r.eventId,
      eventName: r.eventName,
      startsOn: r.startsOn,
      resultsVersion: byClass.get(r.classId)?.version ?? null,
    })),
    competitors,
    after: tables.map((rows, i) => ({ roundLabel: held[i].label, rows })),
    penaltiesByBoat,
  };
}
