import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';

export type SeriesClassRow = {
  id: string;
  seriesId: string;
  code: string;
  name: string;
  pointsByPosition: number[];
  droppedRounds: number;
};

/** The series class, of this series only: 404 otherwise (a path id that names nothing here). */
export async function findSeriesClass(
  seriesId: string,
  seriesClassId: string,
  transaction?: Transaction,
): Promise<SeriesClassRow> {
  const [row] = await getDb().sequelize.query<SeriesClassRow>(
    `select id, series_id as "seriesId", code, name, points_by_position as "pointsByPosition",
            dropped_rounds as "droppedRounds"
       from series_classes where id = :seriesClassId and series_id = :seriesId`,
    { replacements: { seriesId, seriesClassId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new AppError('not_found', 404, 'No such class in this series.');
  return row;
}

export async function assertSeriesExists(seriesId: string, transaction?: Transaction) {
  const [row] = await getDb().sequelize.query(`select 1 from series where id = :seriesId`, {
    replacements: { seriesId },
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!row) throw new AppError('not_found', 404, 'No such series.');
}

export type RoundRow = {
  classId: string;
  eventId: string;
  eventName: string;
  startsOn: string;
  classCode: string;
};

/**
 * The rounds of a series class: the meetings' classes that follow it, in date order. A meeting still in
 * draft is not announced yet: it is left out unless `withDrafts` (the series' officials' own views).
 */
export async function listRounds(seriesClassId: string, opts: { withDrafts?: boolean } = {}): Promise<RoundRow[]> {
  return getDb().sequelize.query<RoundRow>(
    `select rc.id as "classId", ev.id as "eventId", ev.name as "eventName", ev.starts_on::text as "startsOn",
            rc.code as "classCode"
       from race_classes rc join events ev on ev.id = rc.event_id
      where rc.series_class_id = :seriesClassId and (:withDrafts or ev.status <> 'draft')
      order by ev.starts_on, ev.name, rc.id`,
    { replacements: { seriesClassId, withDrafts: !!opts.withDrafts }, type: QueryTypes.SELECT },
  );
}
