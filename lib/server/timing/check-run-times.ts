import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import type { RunTimeRow } from '@/lib/core/inputs/run-times';

export type RunLineStatus = 'new' | 'unchanged' | 'correction' | 'error';

/** One line of a preview or an import: what was read, what happens to it, and why. */
export type RunLineView = {
  line: number;
  raceNumber: string;
  run: string;
  elapsed: string;
  boatName: string | null;
  status: RunLineStatus;
  message: string;
};

export type CheckedLine = {
  line: number;
  cells: { raceNumber: string; run: string; elapsed: string };
  row: RunTimeRow | null;
  problems: string[];
};

export type StoredRun = {
  id: string;
  raceNumber: number;
  runLabel: string;
  courseLengthM: number;
  elapsedS: number;
  trapSpeedMs: number | null;
  gpsTopSpeedMs: number | null;
  rpm: number | null;
  conditions: string;
};

/** The current runs of a class: the rows no correction supersedes. */
export async function loadCurrentRuns(classId: string, transaction?: Transaction): Promise<StoredRun[]> {
  return getDb().sequelize.query<StoredRun>(
    `select r.id, r.race_number as "raceNumber", r.run_label as "runLabel", r.course_length_m as "courseLengthM",
            r.elapsed_s as "elapsedS", r.trap_speed_ms as "trapSpeedMs", r.gps_top_speed_ms as "gpsTopSpeedMs",
            r.rpm, r.conditions
       from run_times r
      where r.class_id = :classId and not exists (select 1 from run_times c where c.supersedes_id = r.id)
      order by r.race_number, r.run_label`,
    { replacements: { classId }, type: QueryTypes.SELECT, transaction },
  );
}

const keyOf = (raceNumber: number, runLabel: string) => `${raceNumber}\u0000${runLabel.toLowerCase()}`;
const same = (a: number | null, b: number | null) =>
  a === null || b === null ? a === b : Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
const seconds = (s: number) => `${s.toFixed(3).replace(/\.?0+$/, '')} s`;

/**
 * What an import or a preview would do with each line: refused (with every reason), new, already stored
 * with the same figures (skipped, so a re-import stores nothing twice), or a correction that supersedes the
 * stored run. Every race number must be a confirmed entry of this class at this meeting. Read-only.
 */
export async function checkRunLines(
  eventId: string,
  classId: string,
  courseLengthM: number,
  lines: CheckedLine[],
  transaction?: Transaction,
): Promise<{ views: RunLineView[]; plan: { line: CheckedLine; entryId: string; supersedes: StoredRun | null }[] }> {
  const { models } = getDb();
  const cls = await models.RaceClass.findOne({ where: { id: classId, eventId }, transaction });
  if (!cls)
    throw new AppError('invalid_input', 400, 'classId: choose a class of this meeting.', [
      { field: 'classId', message: 'Choose a class of this meeting.' },
    ]);
  const numbers = [...new Set(lines.flatMap((l) => (l.row ? [l.row.raceNumber] : [])))];
  const [entries, stored] = await Promise.all([
    numbers.length
      ? getDb().sequelize.query<{
          id: string;
          raceNumber: number;
          classId: string;
          classCode: string;
          status: string;
          boatName: string;
        }>(
          `select e.id, e.race_number as "raceNumber", e.class_id as "classId", c.code as "classCode", e.status, b.name as "boatName"
             from entries e join race_classes c on c.id = e.class_id join boats b on b.id = e.boat_id
            where e.event_id = :eventId and e.race_number in (:numbers)`,
          { replacements: { eventId, numbers }, type: QueryTypes.SELECT, transaction },
        )
      : Promise.resolve([]),
    loadCurrentRuns(classId, transaction),
  ]);
  // A boat in several classes keeps one number: the entry in this class (a confirmed one first) is the one meant.
  const rank = (e: (typeof entries)[number]) => (e.classId === classId ? 0 : 2) + (e.status === 'entered' ? 0 : 1);
  const byNumber = new Map<number, (typeof entries)[number]>();
  for (const e of [...entries].sort((a, b) => rank(a) - rank(b)))
    if (!byNumber.has(e.raceNumber)) byNumber.set(e.raceNumber, e);
  const storedByKey = new Map(stored.map((s) => [keyOf(s.raceNumber, s.runLabel), s]));
  const firstLine = new Map<string, number>();
  const views: RunLineView[] = [];
  const plan: { line: CheckedLine; entryId: string; supersedes: StoredRun | null }[] = [];
  for (const l of lines) {
    const base = { line: l.line, raceNumber: l.cells.raceNumber, run: l.cells.run, elapsed: l.cells.elapsed };
    const problems = [...l.problems];
    const e = l.row ? byNumber.get(l.row.raceNumber) : undefined;
    if (l.row) {
      if (!e) problems.push(`No entry has race number ${l.row.raceNumber} at this meeting.`);
      else if (e.classId !== classId)
        problems.push(`Race number ${l.row.raceNumber} is entered in ${e.classCode}, not ${cls.code}.`);
      else if (e.status !== 'entered')
        problems.push(`Race number ${l.row.raceNumber} is not a confirmed entry (${e.status.replace('_', ' ')}).`);
      const key = keyOf(l.row.raceNumber, l.row.runLabel);
      if (firstLine.has(key))
        problems.push(
          `Race number ${l.row.raceNumber}, run ${l.row.runLabel} is already on line ${firstLine.get(key)}: a run appears once.`,
        );
      else firstLine.set(key, l.line);
    }
    if (problems.length || !l.row || !e) {
      views.push({ ...base, boatName: e?.boatName ?? null, status: 'error', message: problems.join(' ') });
      continue;
    }
    const r = l.row;
    const prior = storedByKey.get(keyOf(r.raceNumber, r.runLabel)) ?? null;
    const unchanged =
      prior &&
      same(prior.elapsedS, r.elapsedS) &&
      same(prior.courseLengthM, courseLengthM) &&
      same(prior.trapSpeedMs, r.trapSpeedMs) &&
      same(prior.gpsTopSpeedMs, r.gpsTopSpeedMs) &&
      same(prior.rpm, r.rpm) &&
      prior.conditions === r.conditions;
    if (unchanged) {
      views.push({
        ...base,
        boatName: e.boatName,
        status: 'unchanged',
        message: 'Already stored with the same figures: skipped.',
      });
      continue;
    }
    views.push({
      ...base,
      boatName: e.boatName,
      status: prior ? 'correction' : 'new',
      message: prior
        ? `Stored as ${seconds(prior.elapsedS)} over ${prior.courseLengthM} m; this corrects it (the stored run stays in the history).`
        : 'New run: will be stored.',
    });
    plan.push({ line: l, entryId: e.id, supersedes: prior });
  }
  return { views, plan };
}
