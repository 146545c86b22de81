// The people on an entry and their dated gear on a meeting day. The day rule (an item is valid through
// the end of the date on it, in the meeting's time zone, and expired from the next calendar day there)
// is common practice, no source; so is 18 as the age under which a guardian's consent is needed (the
// local rulebook decides both). Zone offsets are from the IANA tz database: Pacific/Kiritimati is
// UTC+14:00 and Pacific/Pago_Pago UTC−11:00 all year (no daylight saving time), the two zones
// furthest from UTC on either side. Calendar arithmetic (leap years): ISO 8601 / the Gregorian calendar.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  ageOn,
  assessCrew,
  dayInZone,
  isMinorOn,
  isValidOn,
  meetingDayFor,
  type CrewMemberFacts,
  type CrewRequirements,
  type GearCheckFacts,
  type GearFacts,
  type MeetingDays,
} from '../../../../lib/core/crew/assess-crew';

const EAST: MeetingDays = { startsOn: '2027-05-01', endsOn: '2027-05-02', timeZone: 'Pacific/Kiritimati' };
const WEST: MeetingDays = { startsOn: '2027-05-01', endsOn: '2027-05-02', timeZone: 'Pacific/Pago_Pago' };

const helmet = (over: Partial<GearFacts> = {}): GearFacts => ({
  id: 'g-helmet',
  kind: 'helmet',
  standard: 'Invented Std 1',
  serial: 'H-1',
  dateKind: 'expires',
  dueOn: '2030-01-01',
  ...over,
});
const driver = (over: Partial<CrewMemberFacts> = {}): CrewMemberFacts => ({
  id: 'm-driver',
  role: 'driver',
  name: 'Ana Example',
  hasAccount: false,
  bornOn: '1990-06-15',
  licence: { issuedBy: 'Invented Body', grade: 'A', number: 'L-100', expiresOn: '2030-01-01' },
  medicalExpiresOn: '2030-01-01',
  guardian: null,
  gear: [helmet()],
  ...over,
});
const req = (over: Partial<CrewRequirements> = {}): CrewRequirements => ({
  acceptedLicenceGrades: [],
  navigatorRequired: false,
  requiredSafetyItems: ['helmet'],
  gradesFrom: 'none',
  ...over,
});
const codes = (a: ReturnType<typeof assessCrew>) => a.findings.map((f) => f.code);

test('the meeting day is today in the meeting’s zone, held within the meeting’s days', () => {
  // 2027-05-01 09:59 UTC is 23:59 on 1 May in Kiritimati (UTC+14); 10:00 UTC is 00:00 on 2 May there.
  assert.equal(dayInZone('2027-05-01T09:59:59Z', 'Pacific/Kiritimati'), '2027-05-01');
  assert.equal(dayInZone('2027-05-01T10:00:00Z', 'Pacific/Kiritimati'), '2027-05-02');
  // 2027-05-02 10:59 UTC is 23:59 on 1 May in Pago Pago (UTC−11); 11:00 UTC is 00:00 on 2 May there.
  assert.equal(dayInZone('2027-05-02T10:59:59Z', 'Pacific/Pago_Pago'), '2027-05-01');
  assert.equal(dayInZone('2027-05-02T11:00:00Z', 'Pacific/Pago_Pago'), '2027-05-02');
  assert.equal(meetingDayFor(EAST, '2027-04-20T00:00:00Z'), '2027-05-01', 'before the meeting: its first day');
  assert.equal(meetingDayFor(EAST, '2027-06-20T00:00:00Z'), '2027-05-02', 'after it: its last day');
  assert.equal(meetingDayFor(EAST, '2027-05-01T10:00:00Z'), '2027-05-02');
});

test('an item dated the meeting day is valid through that day’s end in the meeting’s zone, expired from midnight there', () => {
  assert.equal(isValidOn('2027-05-01', '2027-05-01'), true);
  assert.equal(isValidOn('2027-05-01', '2027-05-02'), false);
  const members = [driver({ gear: [helmet({ dueOn: '2027-05-01' })] })];
  // Kiritimati: the last second of 1 May local is 09:59:59 UTC on 1 May.
  const lastSecond = assessCrew(members, [], req(), EAST, '2027-05-01T09:59:59Z');
  assert.equal(lastSecond.day, '2027-05-01');
  assert.equal(lastSecond.gear[0].isValidOnDay, true);
  assert.ok(!codes(lastSecond).includes('gear_expired'));
  // It runs out before the meeting's last day: a warning, not a finding.
  assert.deepEqual(codes(lastSecond), ['expires_during_meeting']);
  assert.equal(lastSecond.isInOrder, true);
  const midnight = assessCrew(members, [], req(), EAST, '2027-05-01T10:00:00Z');
  assert.equal(midnight.day, '2027-05-02');
  assert.equal(midnight.gear[0].isValidOnDay, false);
  assert.deepEqual(codes(midnight), ['gear_expired']);
  assert.equal(midnight.isInOrder, false);
  // The same instant in UTC would still be 1 May: the zone, not UTC, decides.
  assert.equal(dayInZone('2027-05-01T10:00:00Z', 'UTC'), '2027-05-01');
  // Pago Pago: 1 May local lasts until 10:59:59 UTC on 2 May.
  assert.equal(assessCrew(members, [], req(), WEST, '2027-05-02T10:59:59Z').gear[0].isValidOnDay, true);
  assert.equal(assessCrew(members, [], req(), WEST, '2027-05-02T11:00:00Z').gear[0].isValidOnDay, false);
});

test('licences and medicals follow the same day rule; a grade outside the accepted list is a finding', () => {
  const m = driver({
    licence: { issuedBy: 'Invented Body', grade: 'c', number: 'L-9', expiresOn: '2027-04-30' },
    medicalExpiresOn: '2027-05-01',
  });
  const a = assessCrew([m], [], req({ acceptedLicenceGrades: ['A', 'B'] }), EAST, '2027-05-01T09:00:00Z');
  assert.deepEqual(codes(a), ['licence_expired', 'licence_grade', 'expires_during_meeting']);
  assert.match(a.findings[1].text, /grade c is not accepted here \(accepted: A, B\)/);
  // Grades compare without regard to case; an empty list accepts any grade.
  assert.ok(
    !codes(assessCrew([m], [], req({ acceptedLicenceGrades: ['C'] }), EAST, '2027-05-01T09:00:00Z')).includes(
      'licence_grade',
    ),
  );
  assert.ok(!codes(assessCrew([m], [], req(), EAST, '2027-05-01T09:00:00Z')).includes('licence_grade'));
});

test('missing people, licences, medicals and required gear are findings', () => {
  const a = assessCrew(
    [driver({ licence: null, medicalExpiresOn: null, gear: [] }), driver({ id: 'r', role: 'reserve', gear: [] })],
    [],
    req({ navigatorRequired: true, requiredSafetyItems: ['helmet', 'fire_extinguisher', 'kill_switch'] }),
    EAST,
    '2027-05-01T00:00:00Z',
  );
  assert.deepEqual(codes(a), ['no_navigator', 'licence_missing', 'medical_missing', 'gear_missing', 'gear_missing']);
  // A reserve is not on board: no helmet asked of them; an undated item (kill switch) is not judged here.
  assert.match(a.findings[3].text, /^Driver Ana Example: no helmet/);
  assert.match(a.findings[4].text, /^Boat: no fire extinguisher/);
  assert.deepEqual(codes(assessCrew([], [], req({ requiredSafetyItems: [] }), EAST, '2027-05-01T00:00:00Z')), [
    'no_driver',
  ]);
});

test('age in whole years on the day; under 18 without consent is a finding', () => {
  assert.equal(ageOn('2009-05-01', '2027-05-01'), 18);
  assert.equal(ageOn('2009-05-02', '2027-05-01'), 17);
  assert.equal(ageOn('2008-02-29', '2026-02-28'), 17, 'a 29 February birthday counts from 1 March in a common year');
  assert.equal(ageOn('2008-02-29', '2026-03-01'), 18);
  assert.equal(isMinorOn('2009-05-02', '2027-05-01'), true);
  const minor = driver({ bornOn: '2012-01-01' });
  assert.deepEqual(codes(assessCrew([minor], [], req(), EAST, '2027-05-01T00:00:00Z')), ['consent_missing']);
  const consented = driver({ bornOn: '2012-01-01', guardian: { name: 'Guardian Example', consentOn: '2027-04-01' } });
  assert.deepEqual(codes(assessCrew([consented], [], req(), EAST, '2027-05-01T00:00:00Z')), []);
});

test('a dock check counts on its own day while the item reads as it did; a changed item is unchecked again', () => {
  const check = (over: Partial<GearCheckFacts> = {}): GearCheckFacts => ({
    gearItemId: 'g-helmet',
    meetingDay: '2027-05-01',
    outcome: 'confirmed',
    kind: 'helmet',
    serial: 'H-1',
    standard: 'Invented Std 1',
    dueOn: '2030-01-01',
    checkedAt: '2027-04-30T20:00:00.000Z',
    note: '',
    ...over,
  });
  const at = '2027-05-01T00:00:00Z'; // 1 May, 14:00 in Kiritimati
  assert.equal(assessCrew([driver()], [], req(), EAST, at, [check()]).gear[0].dock, 'confirmed');
  // The next day asks again (checks are per meeting day).
  assert.equal(assessCrew([driver()], [], req(), EAST, '2027-05-01T12:00:00Z', [check()]).gear[0].dock, 'unchecked');
  // The latest check of the day wins; "not presented" is a finding.
  const later = check({ outcome: 'not_presented', checkedAt: '2027-04-30T21:00:00.000Z' });
  const a = assessCrew([driver()], [], req(), EAST, at, [check(), later]);
  assert.equal(a.gear[0].dock, 'not_presented');
  assert.deepEqual(codes(a), ['gear_not_presented']);
  // The entrant changed the serial after the check: the confirmation no longer counts.
  const swapped = driver({ gear: [helmet({ serial: 'H-2' })] });
  assert.equal(assessCrew([swapped], [], req(), EAST, at, [check()]).gear[0].dock, 'changed_since_check');
  // But what the dock found wrong stands: editing the item, or removing it and declaring a new one, does not
  // clear "not presented" by itself; a later confirmation of that kind of item that day does.
  assert.deepEqual(codes(assessCrew([swapped], [], req(), EAST, at, [check(), later])), ['gear_not_presented']);
  const replaced = driver({ gear: [helmet({ id: 'g-helmet-new', serial: 'H-3' })] });
  const stillHeld = assessCrew([replaced], [], req(), EAST, at, [check(), later]);
  assert.deepEqual(codes(stillHeld), ['gear_not_presented']);
  assert.match(
    stillHeld.findings[0].text,
    /helmet H-1: not presented at the dock today, and changed on the entry since/,
  );
  const seen = check({ gearItemId: 'g-helmet-new', serial: 'H-3', checkedAt: '2027-04-30T22:00:00.000Z' });
  assert.deepEqual(codes(assessCrew([replaced], [], req(), EAST, at, [check(), later, seen])), []);
});

test('sign-on counts on its own meeting day only; a person’s own findings name them', () => {
  const signOns = [{ crewMemberId: 'm-driver', meetingDay: '2027-05-01' }];
  assert.deepEqual(assessCrew([driver()], [], req(), EAST, '2027-05-01T00:00:00Z', [], signOns).signedOn, ['m-driver']);
  // 10:00 UTC is already 2 May in Kiritimati: the driver signs on again that day.
  assert.deepEqual(assessCrew([driver()], [], req(), EAST, '2027-05-01T10:00:00Z', [], signOns).signedOn, []);
  // The sign-on is the person's, not the record's: another person typed over the same record is not signed on.
  const asSigned = [
    { crewMemberId: 'm-driver', meetingDay: '2027-05-01', name: 'Ana Example', licenceNumber: 'L-100' },
  ];
  const at = '2027-05-01T00:00:00Z';
  assert.deepEqual(assessCrew([driver()], [], req(), EAST, at, [], asSigned).signedOn, ['m-driver']);
  assert.deepEqual(assessCrew([driver({ name: 'Somebody Else' })], [], req(), EAST, at, [], asSigned).signedOn, []);
  const otherLicence = driver({
    licence: { issuedBy: 'Invented Body', grade: 'A', number: 'L-999', expiresOn: '2030-01-01' },
  });
  assert.deepEqual(assessCrew([otherLicence], [], req(), EAST, at, [], asSigned).signedOn, []);
  const lapsed = driver({ medicalExpiresOn: '2027-04-30' });
  const [f] = assessCrew([lapsed], [], req(), EAST, '2027-05-01T00:00:00Z').findings;
  assert.equal(f.code, 'medical_expired');
  assert.equal(f.memberId, 'm-driver');
});
