import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';

export type RunTimeView = {
  id: string;
  classId: string;
  raceNumber: number;
  boatName: string;
  runLabel: string;
  courseLengthM: number;
  elapsedS: number;
  trapSpeedMs: number | null;
  gpsTopSpeedMs: number | null;
  rpm: number | null;
  conditions: string;
  source: 'csv' | 'form';
  isCorrection: boolean;
  recordedAt: string;
};

export type ClassRunsView = { classId: string; classCode: string; className: string; runs: RunTimeView[] };

/** A meeting's current runs per class (corrections in place of what they supersede), for its organisers. */
export async function listRunTimes(actor: Actor | null, eventId: string): Promise<ClassRunsView[]> {
  assertCan(actor, 'results.publish', { eventId });
  const { sequelize, models } = getDb();
  const [classes, runs] = await Promise.all([
    models.RaceClass.findAll({ where: { eventId }, order: [['code', 'ASC']] }),
    sequelize.query<RunTimeView & { recordedAt: Date }>(
      `select r.id, r.class_id as "classId", r.race_number as "raceNumber", b.name as "boatName", r.run_label as "runLabel",
              r.course_length_m as "courseLengthM", r.elapsed_s as "elapsedS", r.trap_speed_ms as "trapSpeedMs",
              r.gps_top_speed_ms as "gpsTopSpeedMs", r.rpm, r.conditions, r.source,
              r.supersedes_id is not null as "isCorrection", r.recorded_at as "recordedAt"
         from run_times r join entries e on e.id = r.entry_id join boats b on b.id = e.boat_id
        where r.event_id = :eventId and not exists (select 1 from run_times c where c.supersedes_id = r.id)
        order by r.race_number, r.run_label`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  return classes.map((c) => ({
    classId: c.id,
    classCode: c.code,
    className: c.name,
    runs: runs
      .filter((r) => r.classId === c.id)
      .map((r) => ({ ...r, recordedAt: new Date(r.recordedAt).toISOString() })),
  }));
}
