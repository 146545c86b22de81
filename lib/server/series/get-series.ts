import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';

export type SeriesView = {
  id: string;
  name: string;
  season: number;
  organisations: { id: string; name: string }[];
  classes: {
    id: string;
    code: string;
    name: string;
    pointsByPosition: number[];
    droppedRounds: number;
    rounds: { classId: string; eventId: string; eventName: string; startsOn: string }[];
    ruleVersions: { version: number; effectiveFrom: string; changeNote: string }[];
  }[];
};

/**
 * A series with its classes, their rounds and rule versions (public: the season's calendar and rules). A round
 * at a meeting still in draft is left out until its organiser opens the meeting: a draft is not announced.
 */
export async function getSeries(seriesId: string): Promise<SeriesView> {
  const [row] = await getDb().sequelize.query<SeriesView>(
    `select s.id, s.name, s.season,
            coalesce((select json_agg(json_build_object('id', o.id, 'name', o.name) order by o.name)
                        from series_organisations so join organisations o on o.id = so.organisation_id
                       where so.series_id = s.id), '[]') as organisations,
            coalesce((select json_agg(json_build_object(
                        'id', c.id, 'code', c.code, 'name', c.name, 'pointsByPosition', c.points_by_position,
                        'droppedRounds', c.dropped_rounds,
                        'rounds', coalesce((select json_agg(json_build_object('classId', rc.id, 'eventId', ev.id,
                                    'eventName', ev.name, 'startsOn', ev.starts_on) order by ev.starts_on, ev.name)
                                   from race_classes rc join events ev on ev.id = rc.event_id
                                  where rc.series_class_id = c.id and ev.status <> 'draft'), '[]'),
                        'ruleVersions', coalesce((select json_agg(json_build_object('version', v.version,
                                    'effectiveFrom', v.effective_from, 'changeNote', v.change_note) order by v.version)
                                   from series_rule_versions v where v.series_class_id = c.id), '[]'))
                        order by c.code)
                        from series_classes c where c.series_id = s.id), '[]') as classes
       from series s where s.id = :seriesId`,
    { replacements: { seriesId }, type: QueryTypes.SELECT },
  );
  if (!row) throw new AppError('not_found', 404, 'No such series.');
  return row;
}
