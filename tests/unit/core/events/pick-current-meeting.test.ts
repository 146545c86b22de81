// The installed app's dock shortcut picks the meeting running today in its own time zone. Zone offsets are
// from the IANA tz database: Pacific/Kiritimati is UTC+14:00 and Pacific/Pago_Pago UTC−11:00 all year (no
// daylight saving time). Which meeting a scrutineer "most likely wants" is this project's choice (a running
// one, then the next, then the last to end): common practice, no source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { pickCurrentMeeting, type MeetingDates } from '../../../../lib/core/events/pick-current-meeting';

const m = (id: string, startsOn: string, endsOn: string, timeZone = 'UTC'): MeetingDates => ({
  id,
  startsOn,
  endsOn,
  timeZone,
});

test('no meetings: none', () => {
  assert.equal(pickCurrentMeeting([], new Date('2026-06-01T12:00:00Z')), null);
});

test('a meeting running today wins over one about to start and one just ended', () => {
  const list = [
    m('ended', '2026-05-20', '2026-05-31'),
    m('next', '2026-06-02', '2026-06-03'),
    m('now', '2026-06-01', '2026-06-01'),
  ];
  assert.equal(pickCurrentMeeting(list, new Date('2026-06-01T12:00:00Z'))?.id, 'now');
});

test('of two running today, the one that started last', () => {
  const list = [m('season', '2026-05-01', '2026-09-30'), m('weekend', '2026-06-01', '2026-06-02')];
  assert.equal(pickCurrentMeeting(list, new Date('2026-06-01T12:00:00Z'))?.id, 'weekend');
});

test('none running: the next to start, else the one that ended last', () => {
  const coming = [
    m('later', '2026-07-01', '2026-07-02'),
    m('sooner', '2026-06-10', '2026-06-11'),
    m('old', '2026-01-01', '2026-01-02'),
  ];
  assert.equal(pickCurrentMeeting(coming, new Date('2026-06-01T12:00:00Z'))?.id, 'sooner');
  const past = [m('older', '2026-01-01', '2026-01-02'), m('recent', '2026-05-01', '2026-05-03')];
  assert.equal(pickCurrentMeeting(past, new Date('2026-06-01T12:00:00Z'))?.id, 'recent');
});

test("today is the meeting's own day: the same instant is a different date at each end of the world", () => {
  // 2026-06-01T11:30Z is 2026-06-02 01:30 in Kiritimati (UTC+14) and 2026-06-01 00:30 in Pago Pago (UTC−11).
  const instant = new Date('2026-06-01T11:30:00Z');
  assert.equal(pickCurrentMeeting([m('k', '2026-06-02', '2026-06-02', 'Pacific/Kiritimati')], instant)?.id, 'k');
  const west = m('p', '2026-06-02', '2026-06-02', 'Pacific/Pago_Pago');
  const east = m('k', '2026-06-02', '2026-06-02', 'Pacific/Kiritimati');
  // Only the eastern one has begun: in Pago Pago the meeting is still tomorrow.
  assert.equal(pickCurrentMeeting([west, east], instant)?.id, 'k');
});
