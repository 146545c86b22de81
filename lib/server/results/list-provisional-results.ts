import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { describeWindow, formatInZone, type WindowView } from '@/lib/core/protests/protest-window';
import type { ResultsSource } from '@/models/provisional-results';
import { loadResultsVersions } from './load-results-versions';

export type ResultsRowView = {
  position: number;
  raceNumber: number;
  entryId: string;
  boatName: string;
  isChanged: boolean;
  /** Set when the stewards or the appeal body disqualified or excluded the boat (listed after the classified). */
  status: 'dsq' | 'excluded' | null;
  /** The penalties in force on this row, each with its reason (shown beside the row). */
  amendments: { penaltyId: string; code: string; label: string; reason: string; byAppeal: boolean }[];
  /** A notice of appeal against a penalty on this boat is lodged and not yet decided. */
  underAppeal: boolean;
  window: WindowView;
  /** The boat's best current run time at this meeting (run_times, corrections applied); null: no run stored. */
  bestRun: { elapsedS: number; courseLengthM: number; runLabel: string; runs: number } | null;
};
export type ClassResultsView = {
  classId: string;
  classCode: string;
  className: string;
  latest: null | {
    id: string;
    version: number;
    publishedAt: string;
    publishedAtLabel: string;
    source: ResultsSource;
    note: string;
    window: WindowView; // the window this version opened (for the rows it changed)
    rows: ResultsRowView[];
  };
  versionCount: number;
};

/**
 * A meeting's provisional results, per class: the latest version with each row's own protest
 * window (a row keeps the deadline of the version that last changed it). Published results are
 * public at a meeting, so anyone signed in may read them.
 */
export async function listProvisionalResults(
  actor: Actor | null,
  eventId: string,
  now = new Date(),
): Promise<ClassResultsView[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const [classes, versions, boats, bestRuns, pendingAppeals] = await Promise.all([
    models.RaceClass.findAll({ where: { eventId }, order: [['code', 'ASC']] }),
    loadResultsVersions(eventId),
    sequelize.query<{ id: string; boatName: string }>(
      'select e.id, b.name as "boatName" from entries e join boats b on b.id = e.boat_id where e.event_id = :eventId',
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    // Each entry's fastest current run (a run nothing supersedes), and how many current runs it has.
    sequelize.query<{ entryId: string; elapsedS: number; courseLengthM: number; runLabel: string; runs: string }>(
      `select distinct on (r.entry_id) r.entry_id as "entryId", r.elapsed_s as "elapsedS",
              r.course_length_m as "courseLengthM", r.run_label as "runLabel",
              count(*) over (partition by r.entry_id) as runs
         from run_times r
        where r.event_id = :eventId and not exists (select 1 from run_times c where c.supersedes_id = r.id)
        order by r.entry_id, r.elapsed_s asc, r.run_label asc`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    // Entries with an appeal lodged (fee paid, or none due) and not yet decided: their rows show "under appeal".
    sequelize.query<{ entryId: string }>(
      `select distinct p.entry_id as "entryId" from appeals a join penalties p on p.id = a.penalty_id
        where a.event_id = :eventId and a.status in ('lodged', 'hearing_scheduled')
          and not exists (select 1 from appeals x where x.penalty_id = p.id and x.status in ('annulled', 'amended'))`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  const underAppeal = new Set(pendingAppeals.map((a) => a.entryId));
  const boatName = new Map(boats.map((b) => [b.id, b.boatName]));
  const bestRun = new Map(
    bestRuns.map((r) => [
      r.entryId,
      { elapsedS: r.elapsedS, courseLengthM: r.courseLengthM, runLabel: r.runLabel, runs: Number(r.runs) },
    ]),
  );
  const win = (publishedAt: Date) =>
    describeWindow({ publishedAt, windowMinutes: event.protestWindowMinutes, timeZone: event.timeZone, now });
  return classes.map((c) => {
    const mine = versions.filter((v) => v.classId === c.id);
    const latest = mine[mine.length - 1];
    if (!latest) return { classId: c.id, classCode: c.code, className: c.name, latest: null, versionCount: 0 };
    const lastChange = (entryId: string) =>
      [...mine].reverse().find((v) => v.changedEntryIds.includes(entryId)) ?? mine[0];
    return {
      classId: c.id,
      classCode: c.code,
      className: c.name,
      versionCount: mine.length,
      latest: {
        id: latest.id,
        version: latest.version,
        publishedAt: latest.publishedAt.toISOString(),
        publishedAtLabel: formatInZone(latest.publishedAt, event.timeZone),
        source: latest.source,
        note: latest.note,
        window: win(latest.publishedAt),
        rows: latest.rows.map((r) => ({
          position: r.position,
          raceNumber: r.raceNumber,
          entryId: r.entryId,
          status: r.status ?? null,
          amendments: latest.amendments
            .filter((a) => a.entryId === r.entryId)
            .map((a) => ({
              penaltyId: a.penaltyId,
              code: a.code,
              label: a.label,
              reason: a.reason,
              byAppeal: a.appealId !== null,
            })),
          underAppeal: underAppeal.has(r.entryId),
          boatName: boatName.get(r.entryId) ?? '?',
          isChanged: latest.changedEntryIds.includes(r.entryId),
          window: win(lastChange(r.entryId).publishedAt),
          bestRun: bestRun.get(r.entryId) ?? null,
        })),
      },
    };
  });
}
