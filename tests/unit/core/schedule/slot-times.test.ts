// Slot times typed in the meeting's zone, and where a booked boat stands in the dock queue.
// Zone rules: New Zealand daylight time starts at 02:00 on the last Sunday of September and ends at
// 03:00 on the first Sunday of April (New Zealand Daylight Time Order 2007; IANA tz database,
// "Pacific/Auckland"); Auckland is UTC+12:00 standard, UTC+13:00 in daylight time.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { isOnMeetingDays, meetingDayOf, slotInstant, wallClockOf } from '../../../../lib/core/schedule/slot-times';
import { queueStatus } from '../../../../lib/core/schedule/queue-status';

const AKL = 'Pacific/Auckland';

test('a wall-clock time is read in the meeting zone (NZDT is UTC+13:00)', () => {
  assert.equal(slotInstant('2027-03-13T09:30', AKL)?.toISOString(), '2027-03-12T20:30:00.000Z');
  assert.equal(slotInstant('2027-06-13T09:30', AKL)?.toISOString(), '2027-06-12T21:30:00.000Z', 'NZST is UTC+12:00');
  assert.equal(wallClockOf('2027-03-12T20:30:00Z', AKL), '2027-03-13T09:30');
});

test('a time the clocks skip is refused; malformed values too', () => {
  // 2027-09-26 02:00 NZST becomes 03:00 NZDT: 02:30 does not happen that night.
  assert.equal(slotInstant('2027-09-26T02:30', AKL), null);
  assert.notEqual(slotInstant('2027-09-26T03:30', AKL), null);
  for (const bad of ['2027-09-26 02:30', '2027-13-01T10:00', '2027-02-30T10:00', '', 'T10:00', '2027-01-01T25:00'])
    assert.equal(slotInstant(bad, AKL), null, bad);
});

test("meeting days are judged in the meeting's zone, first and last day included", () => {
  const meeting = { startsOn: '2027-03-13', endsOn: '2027-03-14', timeZone: AKL };
  // 2027-03-12T11:00Z is 00:00 on the 13th in Auckland (UTC+13:00): the first minute of the meeting.
  assert.equal(meetingDayOf('2027-03-12T11:00:00Z', AKL), '2027-03-13');
  assert.equal(isOnMeetingDays(new Date('2027-03-12T11:00:00Z'), meeting), true);
  assert.equal(isOnMeetingDays(new Date('2027-03-12T10:59:00Z'), meeting), false, '23:59 on the 12th');
  assert.equal(isOnMeetingDays(new Date('2027-03-14T10:59:00Z'), meeting), true, '23:59 on the 14th');
  assert.equal(isOnMeetingDays(new Date('2027-03-14T11:00:00Z'), meeting), false, '00:00 on the 15th');
});

test('queue status: upcoming before the start, due within the grace period, late after it, arrived once checked in', () => {
  const row = { startsAt: '2027-03-13T09:00:00Z', graceMinutes: 10, arrivedAt: null };
  assert.equal(queueStatus(row, new Date('2027-03-13T08:59:59Z')), 'upcoming');
  assert.equal(queueStatus(row, new Date('2027-03-13T09:00:00Z')), 'due');
  assert.equal(queueStatus(row, new Date('2027-03-13T09:10:00Z')), 'due', 'the last instant of the grace period');
  assert.equal(queueStatus(row, new Date('2027-03-13T09:10:01Z')), 'late');
  assert.equal(queueStatus({ ...row, graceMinutes: 0 }, new Date('2027-03-13T09:00:01Z')), 'late');
  assert.equal(queueStatus({ ...row, arrivedAt: '2027-03-13T09:30:00Z' }, new Date('2027-03-13T10:00:00Z')), 'arrived');
});

test('late is decided on instants: the hour repeated when daylight time ends changes nothing', () => {
  // 2027-04-04 03:00 NZDT becomes 02:00 NZST: 02:30 happens twice. A slot at the first 02:30 (13:30Z on
  // the 3rd) with 10 minutes' grace is late 10 minutes and a second after it, whatever the wall clock says.
  const startsAt = slotInstant('2027-04-04T02:30', AKL)!;
  assert.equal(startsAt.toISOString(), '2027-04-03T13:30:00.000Z', 'the first pass of 02:30 (NZDT)');
  const row = { startsAt, graceMinutes: 10, arrivedAt: null };
  assert.equal(queueStatus(row, new Date('2027-04-03T13:40:01Z')), 'late');
  assert.equal(queueStatus(row, new Date('2027-04-03T13:39:59Z')), 'due');
});
