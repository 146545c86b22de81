// The one time formatter (lib/core/format/time.ts): a moment shown in the meeting's zone with the offset and
// the zone named. Offsets and switch instants are those of the IANA time zone database (tzdata,
// zones Pacific/Auckland and Europe/London); the European switch rule (last Sunday of March and of
// October at 01:00 UTC) is Directive 2000/84/EC of the European Parliament and of the Council,
// Articles 2 and 3 (the UK kept the same rule: Summer Time Order 2002 [memory]).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  formatCalendarDate,
  formatDay,
  formatTime,
  safeTimeZone,
  zoneOffsetMinutes,
} from '../../../../lib/core/format/time';
import { windowDeadlineTerm } from '../../../../lib/core/protests/protest-window';
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';

test('New Zealand in December is on NZDT, UTC+13 (IANA tz database, Pacific/Auckland)', () => {
  const at = new Date('2026-12-05T01:30:00Z');
  assert.equal(zoneOffsetMinutes(at, 'Pacific/Auckland'), 13 * 60);
  assert.equal(formatTime(at, 'Pacific/Auckland'), 'Sat 5 Dec 2026, 14:30 UTC+13:00 (Pacific/Auckland)');
});

test('New Zealand in July is on NZST, UTC+12 (IANA tz database, Pacific/Auckland)', () => {
  const at = new Date('2027-07-10T00:00:00Z');
  assert.equal(zoneOffsetMinutes(at, 'Pacific/Auckland'), 12 * 60);
  assert.equal(formatTime(at, 'Pacific/Auckland'), 'Sat 10 Jul 2027, 12:00 UTC+12:00 (Pacific/Auckland)');
});

test('London goes from GMT to BST at 01:00 UTC on the last Sunday of March (Directive 2000/84/EC, Art. 2; IANA Europe/London)', () => {
  // 28 March 2027 is the last Sunday of March 2027.
  const before = new Date('2027-03-28T00:59:00Z');
  const after = new Date('2027-03-28T01:00:00Z');
  assert.equal(zoneOffsetMinutes(before, 'Europe/London'), 0);
  assert.equal(zoneOffsetMinutes(after, 'Europe/London'), 60);
  assert.equal(formatTime(before, 'Europe/London'), 'Sun 28 Mar 2027, 00:59 UTC+00:00 (Europe/London)');
  // The wall clock jumps from 01:00 GMT to 02:00 BST: 01:xx never appears that day.
  assert.equal(formatTime(after, 'Europe/London'), 'Sun 28 Mar 2027, 02:00 UTC+01:00 (Europe/London)');
});

test('London goes back to GMT at 01:00 UTC on the last Sunday of October (Directive 2000/84/EC, Art. 3): the repeated hour stays distinct', () => {
  // 31 October 2027 is the last Sunday of October 2027; 01:30 local happens twice.
  const first = formatTime(new Date('2027-10-31T00:30:00Z'), 'Europe/London');
  const second = formatTime(new Date('2027-10-31T01:30:00Z'), 'Europe/London');
  assert.equal(first, 'Sun 31 Oct 2027, 01:30 UTC+01:00 (Europe/London)');
  assert.equal(second, 'Sun 31 Oct 2027, 01:30 UTC+00:00 (Europe/London)');
  assert.notEqual(first, second, 'the offset tells the two 01:30s apart');
});

test('UTC is named as a zone too, and an unknown zone falls back to UTC instead of failing', () => {
  assert.equal(formatTime('2027-01-02T03:04:05Z', 'UTC'), 'Sat 2 Jan 2027, 03:04 UTC+00:00 (UTC)');
  assert.equal(safeTimeZone('Mars/Olympus_Mons'), 'UTC');
  assert.equal(formatTime('2027-01-02T03:04:05Z', 'Mars/Olympus_Mons'), 'Sat 2 Jan 2027, 03:04 UTC+00:00 (UTC)');
});

test('the calendar day follows the zone: 11:30 UTC on 5 Dec is already 6 Dec in Auckland (UTC+13)', () => {
  assert.equal(formatDay('2026-12-05T11:30:00Z', 'Pacific/Auckland'), 'Sun 6 Dec 2026');
  assert.equal(formatDay('2026-12-05T11:30:00Z', 'Europe/London'), 'Sat 5 Dec 2026');
});

test('a stored calendar date never moves to another day, whatever the process zone', () => {
  assert.equal(formatCalendarDate('2027-03-13'), 'Sat 13 Mar 2027');
  assert.equal(formatCalendarDate('not a date'), 'not a date');
});

test('stored calendar dates read as date-fns reads them (every day of 2027 and the leap day of 2028)', () => {
  // Reference: date-fns 4 format(…, 'EEE d MMM yyyy') on the same day at UTC noon read in UTC. Known weekdays:
  // 1 Jan 2000 was a Saturday, 29 Feb 2028 is a Tuesday (the Gregorian calendar) [memory].
  assert.equal(formatCalendarDate('2000-01-01'), 'Sat 1 Jan 2000');
  assert.equal(formatCalendarDate('2028-02-29'), 'Tue 29 Feb 2028');
  for (let day = 0; day < 365; day++) {
    const d = new Date(Date.UTC(2027, 0, 1 + day, 12));
    const iso = d.toISOString().slice(0, 10);
    assert.equal(formatCalendarDate(iso), format(new TZDate(d.getTime(), 'UTC'), 'EEE d MMM yyyy'), iso);
  }
});

test('a zone name checked once answers the same every time after', () => {
  for (let i = 0; i < 3; i++) {
    assert.equal(safeTimeZone('Pacific/Auckland'), 'Pacific/Auckland');
    assert.equal(safeTimeZone('Mars/Olympus_Mons'), 'UTC');
    assert.equal(safeTimeZone(''), 'UTC');
  }
});

test('the protest window term is computed from now and the deadline, never assumed', () => {
  const deadline = new Date('2027-01-01T12:00:00Z');
  assert.equal(windowDeadlineTerm(deadline, new Date('2027-01-01T11:59:59Z')), 'Window closes');
  assert.equal(windowDeadlineTerm(deadline, deadline), 'Window closes', 'in time up to and including the deadline');
  assert.equal(windowDeadlineTerm(deadline, new Date('2027-01-01T12:00:01Z')), 'Window closed');
});
