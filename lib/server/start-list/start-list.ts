import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { StartDecisionInput } from '@/lib/core/inputs/start-list';
import { TZDate } from '@date-fns/tz';
import { assessCrew, meetingDayFor, type MeetingDays } from '@/lib/core/crew/assess-crew';
import { loadCrewFacts, loadRequirements } from '@/lib/server/crew/crew-data';
import {
  decideStart,
  meetingDays,
  type StartDecisionRecord,
  type StartFacts,
  type StartVerdict,
} from '@/lib/core/start-list/decide-start';
import { currentInspectionCte } from '@/lib/server/inspections/inspection-view';

export type StartListRow = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  classId: string;
  classCode: string;
  entrant: string;
  verdict: StartVerdict;
};

export type StartList = {
  eventId: string;
  eventName: string;
  timeZone: string;
  day: string;
  days: string[];
  classes: { id: string; code: string; name: string }[];
  classId: string | null;
  generatedAt: string;
  rows: StartListRow[];
  counts: { total: number; mayStart: number; held: number; byOrganiser: number };
};

type Row = {
  ownerId: string;
  entrantId: string;
  entryId: string;
  raceNumber: number;
  status: string;
  isPaid: boolean;
  boatName: string;
  classId: string;
  classCode: string;
  entrant: string;
  latestResult: string | null;
  openReinspections: string;
  reinspectionReason: string | null;
  decision: StartDecisionRecord | null;
};

async function loadMeeting(eventId: string) {
  const { models } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['id', 'name', 'startsOn', 'endsOn', 'timeZone'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const meeting = { startsOn: event.startsOn, endsOn: event.endsOn, timeZone: event.timeZone };
  return { event, meeting, days: meetingDays(event.startsOn, event.endsOn) };
}

/** The rows of a day's start list (one class, one entry, or all), with who entered and owns each boat. */
async function startRows(
  eventId: string,
  meeting: MeetingDays,
  day: string,
  only: { classId?: string | null; entryId?: string | null },
): Promise<(StartListRow & { ownerIds: string[] })[]> {
  const { sequelize } = getDb();
  const rows = await sequelize.query<Row>(
    `with ${currentInspectionCte('event')}
     select e.id as "entryId", e.race_number as "raceNumber", e.status, (e.paid_at is not null and e.refunded_at is null) as "isPaid",
            b.name as "boatName", c.id as "classId", c.code as "classCode", coalesce(u.name, u.email) as entrant,
            i.overall_result as "latestResult",
            (select count(*) from reinspections r where r.entry_id = e.id and r.done_at is null) as "openReinspections",
            (select r.reason from reinspections r where r.entry_id = e.id and r.done_at is null
              order by r.created_at desc limit 1) as "reinspectionReason",
            b.owner_id as "ownerId", e.entrant_id as "entrantId",
            (select json_build_object('mayStart', d.may_start, 'reason', d.reason, 'decidedAt', d.decided_at, 'holdsSeen', d.holds_seen,
                                      'decidedBy', coalesce(du.name, du.email))
               from start_decisions d join users du on du.id = d.decided_by_id
              where d.entry_id = e.id and d.day = cast(:day as date)
              order by d.decided_at desc, d.id desc limit 1) as decision
       from entries e
       join boats b on b.id = e.boat_id
       join race_classes c on c.id = e.class_id
       join users u on u.id = e.entrant_id
       left join current_inspection ci on ci.entry_id = e.id
       left join inspections i on i.id = ci.id
      where e.event_id = :eventId and e.status in ('awaiting_payment', 'entered')
        and (cast(:classId as uuid) is null or e.class_id = cast(:classId as uuid))
        and (cast(:entryId as uuid) is null or e.id = cast(:entryId as uuid))
      order by c.code, e.race_number`,
    {
      replacements: { eventId, classId: only.classId ?? null, entryId: only.entryId ?? null, day },
      type: QueryTypes.SELECT,
    },
  );
  // People and gear judged on that day (noon in the meeting's zone is inside it whatever the offset).
  const [crew, requirements] = await Promise.all([
    loadCrewFacts(rows.map((r) => r.entryId)),
    loadRequirements(eventId),
  ]);
  const [y, m, d] = day.split('-').map(Number);
  const onDay = new TZDate(y, m - 1, d, 12, 0, 0, meeting.timeZone);
  const crewHolds = (r: Row): string[] => {
    const f = crew.get(r.entryId);
    if (!f || (f.members.length === 0 && f.boatGear.length === 0))
      return ['No crew or gear declared: the driver, their licence and the safety gear cannot be checked.'];
    return assessCrew(f.members, f.boatGear, requirements.forClass(r.classId), meeting, onDay, f.checks, f.signOns)
      .findings.filter((x) => x.severity === 'finding')
      .map((x) => x.text);
  };
  return rows.map((r) => ({
    entryId: r.entryId,
    raceNumber: r.raceNumber,
    boatName: r.boatName,
    classId: r.classId,
    classCode: r.classCode,
    entrant: r.entrant,
    verdict: decideStart(
      {
        status: r.status,
        isPaid: r.isPaid,
        inspection: (r.latestResult ?? 'waiting') as StartFacts['inspection'],
        openReinspections: Number(r.openReinspections),
        reinspectionReason: r.reinspectionReason,
        otherHolds: crewHolds(r),
      },
      r.decision && { ...r.decision, decidedAt: new Date(r.decision.decidedAt).toISOString() },
    ),
    ownerIds: [r.ownerId, r.entrantId],
  }));
}

/**
 * The start list of a meeting day (optionally one class): every live entry with whether it may start and
 * every reason that holds it back, from the state of its entry now (payment, the current inspection, open
 * re-inspections, the crew's papers and the gear on that day), and the organiser's latest decision for that day.
 */
export async function loadStartList(
  actor: Actor | null,
  eventId: string,
  filters: { classFilter?: string | null; day?: string | null } = {},
  now = new Date(),
): Promise<StartList> {
  assertCan(actor, 'start_list.view', { eventId });
  const { event, meeting, days } = await loadMeeting(eventId);
  const day = filters.day?.trim() || meetingDayFor(meeting, now);
  if (!day || !days.includes(day))
    throw new AppError('invalid_input', 400, `day: choose a day of the meeting (${days[0]} to ${days.at(-1)}).`, [
      { field: 'day', message: 'Choose a day of the meeting.' },
    ]);
  const { models } = getDb();
  const classes = await models.RaceClass.findAll({
    where: { eventId },
    attributes: ['id', 'code', 'name'],
    order: [['code', 'ASC']],
  });
  const wanted = filters.classFilter?.trim() || null;
  const chosen = wanted ? classes.find((c) => c.id === wanted.toLowerCase() || c.code === wanted.toUpperCase()) : null;
  if (wanted && !chosen)
    throw new AppError('invalid_input', 400, 'class: no such class at this meeting.', [
      { field: 'class', message: 'No such class at this meeting.' },
    ]);
  const list = await startRows(eventId, meeting, day, { classId: chosen?.id ?? null });
  const mayStart = list.filter((r) => r.verdict.mayStart).length;
  return {
    eventId,
    eventName: event.name,
    timeZone: event.timeZone,
    day,
    days,
    classes: classes.map((c) => ({ id: c.id, code: c.code, name: c.name })),
    classId: chosen?.id ?? null,
    generatedAt: now.toISOString(),
    rows: list.map(({ ownerIds: _ownerIds, ...row }) => row),
    counts: {
      total: list.length,
      mayStart,
      held: list.length - mayStart,
      byOrganiser: list.filter((r) => r.verdict.basis === 'organiser').length,
    },
  };
}

/** Records the organiser's decision on one entry's start on one meeting day (append-only; the latest counts). */
export async function recordStartDecision(actor: Actor | null, eventId: string, raw: unknown) {
  assertCan(actor, 'start_list.decide', { eventId });
  const input = StartDecisionInput.parse(raw);
  const { meeting, days } = await loadMeeting(eventId);
  if (!days.includes(input.day)) throw fieldError('day', `Choose a day of the meeting (${days[0]} to ${days.at(-1)}).`);
  const { models, sequelize } = getDb();
  const entry = await models.Entry.findOne({
    where: { id: input.entryId.toLowerCase(), eventId },
    attributes: ['id', 'status', 'raceNumber'],
  });
  if (!entry) throw fieldError('entryId', 'No such entry at this meeting.');
  if (entry.status === 'withdrawn' || entry.status === 'cancelled')
    throw new AppError(
      'entry_not_live',
      409,
      `Race number ${entry.raceNumber} is ${entry.status}: it is not on a start list.`,
    );
  // What holds the boat now is kept with the decision: a "may start" covers those holds, not later ones.
  const [row] = await startRows(eventId, meeting, input.day, { entryId: entry.id });
  if (!row) throw fieldError('entryId', 'No such entry at this meeting.');
  // Nobody decides on a boat they entered or own, whatever their roles (as at the dock and in protests).
  if (row.ownerIds.includes(actor.id))
    throw new AppError('own_boat', 403, 'You entered or own this boat: another official must decide on its start.');
  const [stored] = await sequelize.query<{ id: string; decidedAt: Date }>(
    `insert into start_decisions (event_id, entry_id, day, may_start, reason, decided_by_id, holds_seen)
     values (:eventId, :entryId, :day, :mayStart, :reason, :actorId, cast(:holdsSeen as jsonb))
     returning id, decided_at as "decidedAt"`,
    {
      replacements: {
        eventId,
        entryId: entry.id,
        day: input.day,
        mayStart: input.mayStart,
        reason: input.reason,
        actorId: actor.id,
        holdsSeen: JSON.stringify(row.verdict.holds),
      },
      type: QueryTypes.SELECT,
    },
  );
  return {
    id: stored.id,
    entryId: entry.id,
    day: input.day,
    mayStart: input.mayStart,
    reason: input.reason,
    holdsSeen: row.verdict.holds,
    decidedAt: new Date(stored.decidedAt).toISOString(),
  };
}
