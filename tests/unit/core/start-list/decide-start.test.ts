// No pass, no start: every hold named, the organiser's recorded decision settling a row, the meeting's
// days in its own time zone, and the CSV for the timing system (RFC 4180; formula-like cells neutralised
// as the OWASP "CSV Injection" page advises). "An inconclusive pre-race check is not accepted" follows
// ISO 14253-1:2017 (conformity must be proven by the supplier, here the entrant); the rest is common
// practice at race meetings, no source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { decideStart, holdsFor, meetingDays, startListCsv, type StartFacts } from '@/lib/core/start-list/decide-start';
import { meetingDayFor } from '@/lib/core/crew/assess-crew';

const clear: StartFacts = {
  status: 'entered',
  isPaid: true,
  inspection: 'conforms',
  openReinspections: 0,
  reinspectionReason: null,
  otherHolds: [],
};

test('a paid entry whose current inspection conforms, with nothing open, may start', () => {
  assert.deepEqual(decideStart(clear, null), {
    mayStart: true,
    holds: [],
    basis: 'clear',
    decision: null,
    newSinceDecision: [],
  });
});

test('each hold is named, all of them at once', () => {
  const v = decideStart(
    {
      status: 'awaiting_payment',
      isPaid: false,
      inspection: 'inconclusive',
      openReinspections: 1,
      reinspectionReason: 'Damage after the incident at the first buoy',
      otherHolds: ['Driver’s licence expired on 2027-04-30.'],
    },
    null,
  );
  assert.equal(v.mayStart, false);
  assert.equal(v.basis, 'held');
  assert.deepEqual(v.holds, [
    'Entry fee not paid.',
    'Inspection: inconclusive, so conformity is not proven (not accepted before a race).',
    'Re-inspection required: Damage after the incident at the first buoy.',
    'Driver’s licence expired on 2027-04-30.',
  ]);
  assert.match(holdsFor({ ...clear, inspection: 'waiting' })[0], /Not inspected/);
  assert.match(holdsFor({ ...clear, inspection: 'does_not_conform' })[0], /does not conform/);
});

test('the organiser’s recorded decision settles the row either way, and the holds stay shown', () => {
  const decision = {
    mayStart: true,
    reason: 'Helmet replaced, seen at the start',
    decidedBy: 'Org',
    decidedAt: 'x',
    holdsSeen: ['Helmet expired.'],
  };
  const allowed = decideStart({ ...clear, otherHolds: ['Helmet expired.'] }, decision);
  assert.equal(allowed.mayStart, true);
  assert.equal(allowed.basis, 'organiser');
  assert.deepEqual(allowed.holds, ['Helmet expired.']);
  assert.deepEqual(allowed.newSinceDecision, []);
  const held = decideStart(clear, { ...decision, mayStart: false, reason: 'Hull seen leaking at the crane' });
  assert.equal(held.mayStart, false);
  assert.equal(held.basis, 'organiser');
});

test('a “may start” covers the holds the organiser saw, not one that arises after it; a “held” stands', () => {
  const decision = {
    mayStart: true,
    reason: 'Helmet replaced, seen at the start',
    decidedBy: 'Org',
    decidedAt: 'x',
    holdsSeen: ['Helmet expired.'],
  };
  const later = decideStart(
    {
      ...clear,
      otherHolds: ['Helmet expired.'],
      openReinspections: 1,
      reinspectionReason: 'Re-inspection required: hull split',
    },
    decision,
  );
  assert.equal(later.mayStart, false);
  assert.equal(later.basis, 'held');
  assert.deepEqual(later.newSinceDecision, ['Re-inspection required: hull split.']);
  const cleared = decideStart(clear, { ...decision, mayStart: false, reason: 'Hull seen leaking', holdsSeen: [] });
  assert.equal(cleared.mayStart, false);
});

test('the meeting days are inclusive and cross month ends; the list opens on today in the meeting’s zone', () => {
  assert.deepEqual(meetingDays('2027-04-30', '2027-05-02'), ['2027-04-30', '2027-05-01', '2027-05-02']);
  assert.deepEqual(meetingDays('2027-05-01', '2027-05-01'), ['2027-05-01']);
  const m = { startsOn: '2027-05-01', endsOn: '2027-05-02', timeZone: 'Pacific/Auckland' };
  // 2027-05-01 11:30 UTC is 23:30 on 1 May in Auckland (NZST, UTC+12 in May [memory: NZ daylight time ends in April]),
  // and 12:30 UTC is 00:30 on 2 May there.
  assert.equal(meetingDayFor(m, new Date('2027-05-01T11:30:00Z')), '2027-05-01');
  assert.equal(meetingDayFor(m, new Date('2027-05-01T12:30:00Z')), '2027-05-02');
  // Before the meeting: its first day; after it: its last.
  assert.equal(meetingDayFor(m, new Date('2026-12-03T12:00:00Z')), '2027-05-01');
  assert.equal(meetingDayFor(m, new Date('2027-06-01T12:00:00Z')), '2027-05-02');
});

test('the CSV: one header, CRLF lines, quoted cells and no formula in a spreadsheet', () => {
  const csv = startListCsv('2027-05-01', [
    {
      raceNumber: 7,
      boatName: 'Kestrel, "the fast one"',
      classCode: 'J1',
      entrant: '=HYPERLINK("x")',
      verdict: decideStart(clear, null),
    },
    {
      raceNumber: 12,
      boatName: 'Tern',
      classCode: 'J1',
      entrant: 'Ana',
      verdict: decideStart({ ...clear, isPaid: false }, null),
    },
  ]);
  assert.equal(
    csv,
    'day,race_number,boat,class,entrant,may_start,held_for,organiser_decision\r\n' +
      '2027-05-01,7,"Kestrel, ""the fast one""",J1,"\'=HYPERLINK(""x"")",yes,,\r\n' +
      '2027-05-01,12,Tern,J1,Ana,no,Entry fee not paid.,\r\n',
  );
});
