import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import type { StoredReportResults } from '@/models/shapes/parity-report';
import { buildParityHistory, type ParityHistory, type ParityRoundInput } from '@/lib/core/series/parity-history';
import { findSeriesClass, listRounds } from './series-access';

export type ParityHistoryView = ParityHistory & {
  seriesId: string;
  seriesClass: { id: string; code: string; name: string };
  // what each round's figures come from: the latest published parity report of the meeting's class
  reports: { roundId: string; publicId: string; number: number }[];
};

/**
 * Each round's published parity figures side by side (the latest published report of each meeting's class
 * that follows the series class), each boat's deviation round by round (a boat is one competitor across
 * meetings), and the series rule versions placed between the rounds they came between.
 */
export async function loadParityHistory(
  actor: Actor | null,
  seriesId: string,
  seriesClassId: string,
): Promise<ParityHistoryView> {
  assertCan(actor, 'series.parity_view', { seriesId });
  const cls = await findSeriesClass(seriesId, seriesClassId);
  const { sequelize } = getDb();
  const rounds = await listRounds(seriesClassId, { withDrafts: true });
  const classIds = rounds.map((r) => r.classId);
  const [reports, changes] = await Promise.all([
    classIds.length
      ? sequelize.query<{ classId: string; publicId: string; number: number; results: StoredReportResults }>(
          `select distinct on (class_id) class_id as "classId", public_id as "publicId", number, results
             from parity_reports where class_id in (:classIds) order by class_id, number desc`,
          { replacements: { classIds }, type: QueryTypes.SELECT },
        )
      : [],
    sequelize.query<{ version: number; effectiveFrom: string; note: string }>(
      `select version, effective_from::text as "effectiveFrom", change_note as note from series_rule_versions
        where series_class_id = :seriesClassId and version > 1 order by version`,
      { replacements: { seriesClassId }, type: QueryTypes.SELECT },
    ),
  ]);
  const entryIds = reports.flatMap((r) => r.results.parity?.boats.map((b) => b.id) ?? []);
  const boats = entryIds.length
    ? await sequelize.query<{ id: string; boatId: string; boatName: string; seasonNumber: number | null }>(
        `select e.id, e.boat_id as "boatId", b.name as "boatName", n.race_number as "seasonNumber"
           from entries e join boats b on b.id = e.boat_id
           left join series_race_numbers n on n.boat_id = e.boat_id and n.series_class_id = :seriesClassId
          where e.id in (:entryIds)`,
        { replacements: { entryIds, seriesClassId }, type: QueryTypes.SELECT },
      )
    : [];
  const boatOf = new Map(boats.map((b) => [b.id, b]));
  const byClass = new Map(reports.map((r) => [r.classId, r]));
  const inputs: ParityRoundInput[] = rounds.flatMap((r) => {
    const rep = byClass.get(r.classId);
    if (!rep?.results.parity) return [];
    return [
      {
        roundId: r.classId,
        label: r.eventName,
        date: r.startsOn,
        boats: rep.results.parity.boats.flatMap((b) => {
          const boat = boatOf.get(b.id);
          if (!boat) return [];
          return [
            {
              competitorId: boat.boatId,
              label: boat.seasonNumber ? `#${boat.seasonNumber} ${boat.boatName}` : boat.boatName,
              staticThrustN: b.staticThrustN,
            },
          ];
        }),
      },
    ];
  });
  return {
    ...buildParityHistory(inputs, changes),
    seriesId,
    seriesClass: { id: cls.id, code: cls.code, name: cls.name },
    reports: reports.map((r) => ({ roundId: r.classId, publicId: r.publicId, number: r.number })),
  };
}
