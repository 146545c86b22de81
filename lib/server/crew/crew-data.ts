import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { formatCalendarDate } from '@/lib/core/format/time';
import {
  assessCrew,
  dayInZone,
  isMinorOn,
  type CrewAssessment,
  type CrewMemberFacts,
  type CrewRequirements,
  type GearCheckFacts,
  type GearFacts,
  type SignOnFacts,
} from '@/lib/core/crew/assess-crew';

// Reads shared by the entrant's screen, the dock and the board: an entry with its meeting's days, its
// people and gear, the class's requirements and the dock's gear checks, in few statements.

export type EntryContext = {
  id: string;
  eventId: string;
  classId: string;
  entrantId: string;
  boatOwnerId: string;
  status: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  className: string;
  startsOn: string;
  endsOn: string;
  timeZone: string;
};

const ENTRY_COLUMNS = `e.id, e.event_id as "eventId", e.class_id as "classId", e.entrant_id as "entrantId", b.owner_id as "boatOwnerId",
  e.status, e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode", c.name as "className",
  to_char(ev.starts_on, 'YYYY-MM-DD') as "startsOn", to_char(ev.ends_on, 'YYYY-MM-DD') as "endsOn", ev.time_zone as "timeZone"
  from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id join events ev on ev.id = e.event_id`;

export async function loadEntryContext(entryId: string): Promise<EntryContext | undefined> {
  const [row] = await getDb().sequelize.query<EntryContext>(`select ${ENTRY_COLUMNS} where e.id = :entryId`, {
    replacements: { entryId },
    type: QueryTypes.SELECT,
  });
  return row;
}

export async function loadEventEntryContexts(eventId: string): Promise<EntryContext[]> {
  return getDb().sequelize.query<EntryContext>(
    `select ${ENTRY_COLUMNS} where e.event_id = :eventId and e.status in ('awaiting_payment', 'entered') order by e.race_number`,
    { replacements: { eventId }, type: QueryTypes.SELECT },
  );
}

/** The entrant, or an official of the entry's meeting who may see its entries or its board. */
export function mayReadCrew(actor: Actor, entry: EntryContext): boolean {
  const scope = { eventId: entry.eventId };
  return entry.entrantId === actor.id || can(actor, 'entry.view_all', scope) || can(actor, 'inspection.board', scope);
}

export type CrewFacts = {
  members: CrewMemberFacts[];
  boatGear: GearFacts[];
  checks: GearCheckFacts[];
  signOns: SignOnFacts[];
};

const day = (col: string) => `to_char(${col}, 'YYYY-MM-DD')`;

/** People, gear and gear checks of several entries, in one statement. */
export async function loadCrewFacts(entryIds: readonly string[]): Promise<Map<string, CrewFacts>> {
  const out = new Map<string, CrewFacts>();
  if (entryIds.length === 0) return out;
  const rows = await getDb().sequelize.query<{
    entryId: string;
    members: (Omit<CrewMemberFacts, 'gear'> & { licence: CrewMemberFacts['licence'] })[];
    gear: (GearFacts & { crewMemberId: string | null })[];
    checks: GearCheckFacts[];
    signOns: SignOnFacts[];
  }>(
    `select e.id as "entryId",
       coalesce((select json_agg(json_build_object('id', m.id, 'role', m.role, 'name', m.name, 'hasAccount', m.user_id is not null,
           'bornOn', ${day('m.born_on')},
           'licence', case when m.licence_number is null then null else json_build_object('issuedBy', m.licence_issued_by,
              'grade', m.licence_grade, 'number', m.licence_number, 'expiresOn', ${day('m.licence_expires_on')}) end,
           'medicalExpiresOn', ${day('m.medical_expires_on')},
           'guardian', case when m.guardian_name is null then null else json_build_object('name', m.guardian_name,
              'consentOn', ${day('m.guardian_consent_on')}) end) order by m.position)
         from entry_crew_members m where m.entry_id = e.id), '[]') as members,
       coalesce((select json_agg(json_build_object('id', g.id, 'crewMemberId', g.crew_member_id, 'kind', g.kind,
           'standard', g.standard, 'serial', g.serial, 'dateKind', g.date_kind, 'dueOn', ${day('g.due_on')}) order by g.position)
         from entry_gear_items g where g.entry_id = e.id), '[]') as gear,
       coalesce((select json_agg(json_build_object('gearItemId', k.gear_item_id, 'meetingDay', ${day('k.meeting_day')},
           'outcome', k.outcome, 'kind', k.kind, 'serial', k.serial, 'standard', k.standard, 'dueOn', ${day('k.due_on')},
           'checkedAt', k.checked_at, 'note', k.note) order by k.checked_at)
         from gear_checks k where k.entry_id = e.id), '[]') as checks,
       coalesce((select json_agg(json_build_object('crewMemberId', s.crew_member_id, 'meetingDay', ${day('s.meeting_day')},
           'name', s.name, 'licenceNumber', s.licence_number))
         from crew_sign_ons s where s.entry_id = e.id), '[]') as "signOns"
     from entries e where e.id in (:entryIds)`,
    { replacements: { entryIds }, type: QueryTypes.SELECT },
  );
  for (const r of rows) {
    const personal = (memberId: string) =>
      r.gear.filter((g) => g.crewMemberId === memberId).map(({ crewMemberId: _m, ...g }) => g);
    out.set(r.entryId, {
      members: r.members.map((m) => ({ ...m, gear: personal(m.id) })),
      boatGear: r.gear.filter((g) => g.crewMemberId === null).map(({ crewMemberId: _m, ...g }) => g),
      checks: r.checks,
      signOns: r.signOns,
    });
  }
  return out;
}

/** The requirements of each class of a meeting: accepted grades (the class's row, else the meeting's) and the class's safety items. */
export async function loadRequirements(eventId: string): Promise<{
  forClass: (classId: string) => CrewRequirements;
  meeting: { acceptedLicenceGrades: string[]; navigatorRequired: boolean } | null;
  classes: { classId: string; acceptedLicenceGrades: string[]; navigatorRequired: boolean }[];
}> {
  const { sequelize } = getDb();
  const [rows, safety] = await Promise.all([
    sequelize.query<{ classId: string | null; acceptedLicenceGrades: string[]; navigatorRequired: boolean }>(
      `select class_id as "classId", accepted_licence_grades as "acceptedLicenceGrades", navigator_required as "navigatorRequired"
         from crew_requirements where event_id = :eventId`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    // The class's rules in force now: the latest published version already effective.
    sequelize.query<{ classId: string; safetyItems: string[] | null }>(
      `select distinct on (c.id) c.id as "classId", v.rules->'safetyItems' as "safetyItems"
         from race_classes c
         left join class_rule_versions v on v.class_id = c.id and v.status = 'published' and v.effective_from <= now()
        where c.event_id = :eventId
        order by c.id, v.effective_from desc nulls last, v.version desc`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
  ]);
  const meeting = rows.find((r) => r.classId === null) ?? null;
  const classes = rows.filter((r): r is typeof r & { classId: string } => r.classId !== null);
  return {
    meeting,
    classes,
    forClass: (classId) => {
      const own = classes.find((r) => r.classId === classId);
      const from = own ?? meeting;
      const items = safety.find((s) => s.classId === classId)?.safetyItems;
      return {
        acceptedLicenceGrades: from?.acceptedLicenceGrades ?? [],
        navigatorRequired: from?.navigatorRequired ?? false,
        requiredSafetyItems: Array.isArray(items) ? items : [],
        gradesFrom: own ? 'class' : meeting ? 'meeting' : 'none',
      };
    },
  };
}

/** A person as a reader sees them: an official reads whether they are a minor on the day, not their date of birth. */
export type CrewMemberView = Omit<CrewMemberFacts, 'bornOn'> & { bornOn: string | null; isMinor: boolean };

export type EntryCrewView = {
  entry: EntryContext;
  members: CrewMemberView[];
  boatGear: GearFacts[];
  requirements: CrewRequirements;
  assessment: CrewAssessment;
};

/**
 * One entry's people, gear and their assessment on the meeting day of `now` (the caller checked access).
 * `readerId`: the person who reads it; anyone but the entrant and the boat's owner (the meeting's officials)
 * gets no date of birth (data minimisation: the officials need "minor on the day", not the date), while licence
 * numbers stay for the dock's sign-on. Without it (the server's own use) the view is whole.
 */
export async function buildEntryCrewView(
  entry: EntryContext,
  now = new Date(),
  readerId?: string,
): Promise<EntryCrewView> {
  const [facts, reqs] = await Promise.all([loadCrewFacts([entry.id]), loadRequirements(entry.eventId)]);
  const f = facts.get(entry.id) ?? { members: [], boatGear: [], checks: [], signOns: [] };
  const requirements = reqs.forClass(entry.classId);
  const assessment = assessCrew(f.members, f.boatGear, requirements, entry, now, f.checks, f.signOns);
  const isOwnEntry = readerId === undefined || readerId === entry.entrantId || readerId === entry.boatOwnerId;
  return {
    entry,
    members: f.members.map((m) => ({
      ...m,
      bornOn: isOwnEntry ? m.bornOn : null,
      isMinor: isMinorOn(m.bornOn, assessment.day),
    })),
    boatGear: f.boatGear,
    requirements,
    assessment,
  };
}

export const notFoundEntry = () => new AppError('not_found', 404, 'No such entry.');

/**
 * The entry a dock official acts on today (gear checks, crew sign-on): it must be at this meeting, not
 * entered or owned by the official, and today (in the meeting's zone) must be one of the meeting's days.
 */
export async function entryForDockToday(
  actor: Actor,
  eventId: string,
  entryId: string,
  now: Date,
  words: { ownBoat: string; notMeetingDay: string },
): Promise<{ entry: EntryContext; day: string }> {
  const entry = await loadEntryContext(entryId.toLowerCase());
  if (!entry || entry.eventId !== eventId) throw new AppError('not_found', 404, 'No such boat at this meeting.');
  if (entry.entrantId === actor.id || entry.boatOwnerId === actor.id)
    throw new AppError('forbidden', 403, words.ownBoat);
  const day = dayInZone(now, entry.timeZone);
  if (day < entry.startsOn || day > entry.endsOn)
    throw new AppError(
      'not_a_meeting_day',
      409,
      `${words.notMeetingDay}: this meeting runs ${formatCalendarDate(entry.startsOn)} to ${formatCalendarDate(entry.endsOn)} (${entry.timeZone}).`,
    );
  return { entry, day };
}
