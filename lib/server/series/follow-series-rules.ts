import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { publishRules, saveDraftRules } from '@/lib/server/classes/rule-versions';
import type { RuleVersionDto } from '@/lib/server/classes/class-dto';

/**
 * The meeting's organiser makes a class that is a round of a series class follow the series rules in force
 * on the meeting's first day: they become the class's next published rules version (in force from now), with
 * a change note naming the series version. A draft the organiser has not published is never overwritten.
 */
export async function followSeriesRules(
  actor: Actor | null,
  eventId: string,
  classId: string,
): Promise<RuleVersionDto> {
  assertCan(actor, 'class.edit', { eventId });
  const { sequelize } = getDb();
  const [row] = await sequelize.query<{
    linked: boolean;
    hasDraft: boolean;
    version: number | null;
    effectiveFrom: string | null;
    rules: unknown;
    seriesName: string | null;
    classCode: string | null;
  }>(
    `select rc.series_class_id is not null as linked,
            exists (select 1 from class_rule_versions d where d.class_id = rc.id and d.status = 'draft') as "hasDraft",
            v.version, v.effective_from::text as "effectiveFrom", v.rules, s.name || ' ' || s.season as "seriesName",
            sc.code as "classCode"
       from race_classes rc join events ev on ev.id = rc.event_id
       left join series_classes sc on sc.id = rc.series_class_id
       left join series s on s.id = sc.series_id
       left join lateral (select version, effective_from, rules from series_rule_versions x
                           where x.series_class_id = rc.series_class_id and x.effective_from <= ev.starts_on
                           order by x.version desc limit 1) v on true
      where rc.id = :classId and rc.event_id = :eventId`,
    { replacements: { classId, eventId }, type: QueryTypes.SELECT },
  );
  if (!row) throw new AppError('not_found', 404, 'No such class at this meeting.');
  if (!row.linked) throw new AppError('conflict', 409, 'This class is not a round of a series class.');
  if (row.version === null)
    throw new AppError('conflict', 409, "The series has no rules in force on this meeting's first day.");
  if (row.hasDraft)
    throw new AppError('conflict', 409, 'This class has unpublished draft rules: publish or finish them first.');
  await saveDraftRules(actor, eventId, classId, { powerUnit: 'kW', rules: row.rules });
  return publishRules(actor, eventId, classId, {
    changeNote: `Follows ${row.seriesName} class ${row.classCode} rules version ${row.version} (in force from ${row.effectiveFrom}).`,
  });
}
