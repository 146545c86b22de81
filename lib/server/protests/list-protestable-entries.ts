import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import type { Actor } from '@/lib/server/auth/actor';
import { loadResultsVersions } from '@/lib/server/results/load-results-versions';
import { describeWindow, relevantVersionForEntry, type WindowView } from '../../core/protests/protest-window';

export type ProtestableEvent = {
  eventId: string;
  eventName: string;
  timeZone: string;
  feeMinor: number;
  currency: string;
  windowMinutes: number;
  entries: { entryId: string; raceNumber: number; boatName: string; classCode: string; window: WindowView }[];
  results: { resultId: string; classCode: string; version: number; window: WindowView }[];
};

/**
 * For the lodge form: meetings where the person has a confirmed entry and some class has published
 * results, with every other entry of a class with results and the deadline that applies to it.
 */
export async function listProtestableEntries(actor: Actor | null, now = new Date()): Promise<ProtestableEvent[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const { sequelize, models } = getDb();
  const events = await sequelize.query<{
    id: string;
    name: string;
    timeZone: string;
    feeMinor: number;
    currency: string;
    windowMinutes: number;
  }>(
    `select ev.id, ev.name, ev.time_zone as "timeZone", ev.protest_fee_minor as "feeMinor", ev.currency, ev.protest_window_minutes as "windowMinutes"
       from events ev
      where exists (select 1 from entries e where e.event_id = ev.id and e.entrant_id = :uid and e.status = 'entered')
        and exists (select 1 from provisional_results r where r.event_id = ev.id)
      order by ev.starts_on desc`,
    { replacements: { uid: actor.id }, type: QueryTypes.SELECT },
  );
  return Promise.all(
    events.map(async (ev) => {
      const versions = await loadResultsVersions(ev.id);
      const classIds = [...new Set(versions.map((v) => v.classId))];
      const [entries, classes] = await Promise.all([
        sequelize.query<{ id: string; raceNumber: number; boatName: string; classCode: string; classId: string }>(
          `select e.id, e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode", c.id as "classId"
           from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
          where e.event_id = :eventId and e.entrant_id <> :uid and e.status = 'entered' and e.class_id = any(array[:classIds]::uuid[])
          order by c.code, e.race_number`,
          { replacements: { eventId: ev.id, uid: actor.id, classIds }, type: QueryTypes.SELECT },
        ),
        models.RaceClass.findAll({ where: { eventId: ev.id }, attributes: ['id', 'code'] }),
      ]);
      const code = new Map(classes.map((c) => [c.id, c.code]));
      const win = (publishedAt: Date) =>
        describeWindow({ publishedAt, windowMinutes: ev.windowMinutes, timeZone: ev.timeZone, now });
      const latestPerClass = classIds.map((cid) => versions.filter((v) => v.classId === cid).at(-1)!);
      return {
        eventId: ev.id,
        eventName: ev.name,
        timeZone: ev.timeZone,
        feeMinor: ev.feeMinor,
        currency: ev.currency,
        windowMinutes: ev.windowMinutes,
        entries: entries.map((e) => ({
          entryId: e.id,
          raceNumber: e.raceNumber,
          boatName: e.boatName,
          classCode: e.classCode,
          window: win(
            relevantVersionForEntry(
              versions.filter((v) => v.classId === e.classId),
              e.id,
            )!.publishedAt,
          ),
        })),
        results: latestPerClass.map((v) => ({
          resultId: v.id,
          classCode: code.get(v.classId) ?? '?',
          version: v.version,
          window: win(v.publishedAt),
        })),
      };
    }),
  );
}
