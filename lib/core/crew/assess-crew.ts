// Whether the people on an entry and their dated safety gear are in order on a meeting day. Pure: the
// server (entrant screen, board, dock) and the tests run the same rules.
//
// The day rule: a licence, medical certificate or gear item is valid through the end of the date on it,
// in the meeting's time zone; it is expired from the next calendar day there (common practice, no
// source: many licences and service labels read "valid until" a date; the local rulebook decides).
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { formatCalendarDate, safeTimeZone } from '../format/time';
import {
  ADULT_AGE_YEARS,
  BOAT_GEAR_KINDS,
  CREW_ROLE_LABELS,
  GEAR_DATE_KIND_LABELS,
  GEAR_KIND_LABELS,
  GEAR_KINDS,
  ON_BOARD_ROLES,
  PERSONAL_GEAR_KINDS,
  type CrewRole,
  type GearCheckOutcome,
  type GearDateKind,
  type GearKind,
} from './crew-terms';

export type MeetingDays = { startsOn: string; endsOn: string; timeZone: string };

export type GearFacts = {
  id: string;
  kind: GearKind;
  standard: string;
  serial: string;
  dateKind: GearDateKind;
  dueOn: string;
};

export type CrewMemberFacts = {
  id: string;
  role: CrewRole;
  name: string;
  hasAccount: boolean;
  bornOn: string;
  licence: { issuedBy: string; grade: string; number: string; expiresOn: string } | null;
  medicalExpiresOn: string | null;
  guardian: { name: string; consentOn: string } | null;
  gear: GearFacts[];
};

export type CrewRequirements = {
  /** Empty: any grade is accepted. Compared without regard to case or surrounding spaces. */
  acceptedLicenceGrades: string[];
  navigatorRequired: boolean;
  /** The class's required safety items (its published rules); only the dated kinds are judged here. */
  requiredSafetyItems: string[];
  /** Where the grades come from, for people: "class", "meeting" or "none". */
  gradesFrom: 'class' | 'meeting' | 'none';
};

/** A dock confirmation, with the item as it was declared when confirmed. */
export type GearCheckFacts = {
  gearItemId: string;
  meetingDay: string;
  outcome: GearCheckOutcome;
  kind: string;
  serial: string;
  standard: string;
  dueOn: string;
  checkedAt: string;
  note: string;
};

export type CrewFindingCode =
  | 'no_driver'
  | 'no_navigator'
  | 'licence_missing'
  | 'licence_expired'
  | 'licence_grade'
  | 'medical_missing'
  | 'medical_expired'
  | 'consent_missing'
  | 'gear_missing'
  | 'gear_expired'
  | 'gear_not_presented'
  | 'gear_not_as_declared'
  | 'expires_during_meeting';

/** Findings about a person's own papers: they keep that person from signing on. */
export const PERSON_FINDINGS: readonly CrewFindingCode[] = [
  'licence_missing',
  'licence_expired',
  'licence_grade',
  'medical_missing',
  'medical_expired',
  'consent_missing',
];

export type CrewFinding = {
  code: CrewFindingCode;
  /** The person it is about, if any. */
  memberId?: string;
  /** 'finding': the item is not in order on the day; 'warning': in order today, not for the whole meeting. */
  severity: 'finding' | 'warning';
  text: string;
};

export type GearDockState = 'confirmed' | 'not_presented' | 'not_as_declared' | 'unchecked' | 'changed_since_check';

export type GearState = GearFacts & {
  label: string;
  wornBy: string | null;
  isValidOnDay: boolean;
  dock: GearDockState;
  checkedAt: string | null;
  note: string;
};

export type CrewAssessment = {
  /** The meeting day judged ("yyyy-mm-dd"): today in the meeting's zone, held within the meeting's days. */
  day: string;
  findings: CrewFinding[];
  gear: GearState[];
  /** No finding (warnings allowed). */
  isInOrder: boolean;
  /** The people signed on with the officials on the day (checks repeated each meeting day). */
  signedOn: string[];
};

/** A day's sign-on, with the person as they read when signed on (name, licence number). */
export type SignOnFacts = { crewMemberId: string; meetingDay: string; name?: string; licenceNumber?: string | null };

/** A sign-on counts for the person signed on: the same record, still reading the same name and licence. */
export const signOnMatches = (s: SignOnFacts, m: CrewMemberFacts, day: string) =>
  s.crewMemberId === m.id &&
  s.meetingDay === day &&
  (s.name === undefined || s.name === m.name) &&
  (s.licenceNumber === undefined || s.licenceNumber === (m.licence?.number ?? null));

/** The calendar day of an instant in a time zone. */
export function dayInZone(instant: Date | string | number, timeZone: string): string {
  return format(new TZDate(new Date(instant).getTime(), safeTimeZone(timeZone)), 'yyyy-MM-dd');
}

/** The meeting day to judge at `now`: today in the meeting's zone, or its first day before it starts, its last after. */
export function meetingDayFor(meeting: MeetingDays, now: Date | string | number): string {
  const today = dayInZone(now, meeting.timeZone);
  if (today < meeting.startsOn) return meeting.startsOn;
  if (today > meeting.endsOn) return meeting.endsOn;
  return today;
}

/** Valid through the end of its date (see the day rule above). */
export const isValidOn = (dueOn: string, day: string) => dueOn >= day;

/** Whole years of age on a calendar day (a birthday on 29 Feb counts from 1 Mar in other years). */
export function ageOn(bornOn: string, day: string): number {
  const [by, bm, bd] = bornOn.split('-').map(Number);
  const [y, m, d] = day.split('-').map(Number);
  return y - by - (m < bm || (m === bm && d < bd) ? 1 : 0);
}

export const isMinorOn = (bornOn: string, day: string) => ageOn(bornOn, day) < ADULT_AGE_YEARS;

const normGrade = (g: string) => g.trim().toLocaleUpperCase('en');

/** The latest check of an item on the day, and whether the item still reads as it did then. */
function dockState(item: GearFacts, checks: readonly GearCheckFacts[], day: string) {
  const latest = checks
    .filter((c) => c.gearItemId === item.id && c.meetingDay === day)
    .sort((a, b) => b.checkedAt.localeCompare(a.checkedAt))[0];
  if (!latest) return { dock: 'unchecked' as const, checkedAt: null, note: '' };
  const same =
    latest.kind === item.kind &&
    latest.serial === item.serial &&
    latest.standard === item.standard &&
    latest.dueOn === item.dueOn;
  return {
    dock: same ? latest.outcome : ('changed_since_check' as const),
    checkedAt: latest.checkedAt,
    note: latest.note,
  };
}

/**
 * Everything not in order for the entry on the meeting day: people (driver, navigator when required,
 * licences with an accepted grade, medicals, a guardian's consent for a minor) and gear (each dated
 * kind the class requires, worn by each person on board or carried by the boat; expired items; what
 * the dock found that day). Something valid today that runs out before the meeting's last day is a warning.
 */
export function assessCrew(
  members: readonly CrewMemberFacts[],
  boatGear: readonly GearFacts[],
  req: CrewRequirements,
  meeting: MeetingDays,
  now: Date | string | number,
  checks: readonly GearCheckFacts[] = [],
  signOns: readonly SignOnFacts[] = [],
): CrewAssessment {
  const day = meetingDayFor(meeting, now);
  const findings: CrewFinding[] = [];
  const add = (code: CrewFindingCode, text: string, severity: CrewFinding['severity'] = 'finding', memberId?: string) =>
    findings.push({ code, severity, text, ...(memberId && { memberId }) });
  const dated = (what: string, dueOn: string, expired: CrewFindingCode, memberId: string) => {
    if (!isValidOn(dueOn, day)) add(expired, `${what} expired on ${formatCalendarDate(dueOn)}.`, 'finding', memberId);
    else if (dueOn < meeting.endsOn)
      add(
        'expires_during_meeting',
        `${what} runs out on ${formatCalendarDate(dueOn)}, before the meeting's last day.`,
        'warning',
        memberId,
      );
  };
  if (!members.some((m) => m.role === 'driver')) add('no_driver', 'No driver is named.');
  if (req.navigatorRequired && !members.some((m) => m.role === 'navigator'))
    add('no_navigator', 'The class requires a navigator and none is named.');
  const accepted = req.acceptedLicenceGrades.map(normGrade);
  for (const m of members) {
    const who = `${CREW_ROLE_LABELS[m.role]} ${m.name}`;
    if (!m.licence) add('licence_missing', `${who}: no licence recorded.`, 'finding', m.id);
    else {
      // The number stays off the finding: findings reach the start list and the timing system's CSV.
      dated(`${who}: licence`, m.licence.expiresOn, 'licence_expired', m.id);
      if (accepted.length > 0 && !accepted.includes(normGrade(m.licence.grade)))
        add(
          'licence_grade',
          `${who}: licence grade ${m.licence.grade} is not accepted here (accepted: ${req.acceptedLicenceGrades.join(', ')}).`,
          'finding',
          m.id,
        );
    }
    if (!m.medicalExpiresOn) add('medical_missing', `${who}: no medical certificate recorded.`, 'finding', m.id);
    else dated(`${who}: medical certificate`, m.medicalExpiresOn, 'medical_expired', m.id);
    if (isMinorOn(m.bornOn, day) && !m.guardian)
      add(
        'consent_missing',
        `${who} is under ${ADULT_AGE_YEARS}: no parent's or guardian's consent recorded.`,
        'finding',
        m.id,
      );
  }

  const gear: GearState[] = [];
  const judgeItem = (item: GearFacts, wornBy: string | null) => {
    const label = GEAR_KIND_LABELS[item.kind];
    const state: GearState = {
      ...item,
      label,
      wornBy,
      isValidOnDay: isValidOn(item.dueOn, day),
      ...dockState(item, checks, day),
    };
    gear.push(state);
    const what = `${wornBy ? `${wornBy}: ` : 'Boat: '}${label.toLowerCase()} ${item.serial}`;
    if (!state.isValidOnDay)
      add(
        'gear_expired',
        `${what}: ${GEAR_DATE_KIND_LABELS[item.dateKind].toLowerCase()} ${formatCalendarDate(item.dueOn)}, past.`,
      );
    else if (item.dueOn < meeting.endsOn)
      add(
        'expires_during_meeting',
        `${what}: ${GEAR_DATE_KIND_LABELS[item.dateKind].toLowerCase()} ${formatCalendarDate(item.dueOn)}, before the meeting's last day.`,
        'warning',
      );
    if (state.dock === 'not_presented') add('gear_not_presented', `${what}: not presented at the dock today.`);
    if (state.dock === 'not_as_declared') add('gear_not_as_declared', `${what}: not as declared at the dock today.`);
  };
  for (const m of members) for (const g of m.gear) judgeItem(g, `${CREW_ROLE_LABELS[m.role]} ${m.name}`);
  for (const g of boatGear) judgeItem(g, null);

  // What the dock found wrong today stands until the dock confirms that kind of item again: an item the
  // entrant edited, or removed and declared anew, after a "not presented" or "not as declared" check does
  // not clear the finding by itself (the officials must see it).
  const latestToday = new Map<string, GearCheckFacts>();
  for (const c of checks) {
    if (c.meetingDay !== day) continue;
    const known = latestToday.get(c.gearItemId);
    if (!known || known.checkedAt < c.checkedAt) latestToday.set(c.gearItemId, c);
  }
  for (const c of latestToday.values()) {
    if (c.outcome === 'confirmed') continue;
    const still = gear.find((g) => g.id === c.gearItemId);
    if (still && still.dock === c.outcome) continue; // the item reads the same: its finding is above
    const seenAgain = gear.some(
      (g) => g.kind === c.kind && g.dock === 'confirmed' && g.checkedAt !== null && g.checkedAt > c.checkedAt,
    );
    if (seenAgain) continue;
    const label = GEAR_KIND_LABELS[c.kind as keyof typeof GEAR_KIND_LABELS]?.toLowerCase() ?? c.kind;
    add(
      c.outcome === 'not_presented' ? 'gear_not_presented' : 'gear_not_as_declared',
      `${label} ${c.serial}: ${c.outcome === 'not_presented' ? 'not presented' : 'not as declared'} at the dock today, and changed on the entry since: present it to the dock again.`,
    );
  }

  const required = GEAR_KINDS.filter((k) => req.requiredSafetyItems.includes(k));
  for (const kind of required) {
    const label = GEAR_KIND_LABELS[kind].toLowerCase();
    if ((PERSONAL_GEAR_KINDS as readonly string[]).includes(kind)) {
      for (const m of members.filter((x) => ON_BOARD_ROLES.includes(x.role)))
        if (!m.gear.some((g) => g.kind === kind))
          add('gear_missing', `${CREW_ROLE_LABELS[m.role]} ${m.name}: no ${label} declared (the class requires one).`);
    } else if ((BOAT_GEAR_KINDS as readonly string[]).includes(kind) && !boatGear.some((g) => g.kind === kind))
      add('gear_missing', `Boat: no ${label} declared (the class requires one).`);
  }
  const signedOn = members.filter((m) => signOns.some((s) => signOnMatches(s, m, day))).map((m) => m.id);
  return { day, findings, gear, isInOrder: !findings.some((f) => f.severity === 'finding'), signedOn };
}
