// Times on the phone's own clock (lib/core/format/device-time.ts), checked against date-fns 4's format()
// (a general-purpose reference library from the registry) with the patterns "d MMM, HH:mm" and "HH:mm",
// which read the same local fields of the Date (Unicode TR35 date field symbols: d day of month, MMM
// abbreviated month, HH hour 00-23, mm minute).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { format } from 'date-fns';
import { formatOnDevice } from '../../../../lib/core/format/device-time';

const MOMENTS = [
  '2027-04-04T02:15:00Z',
  '2026-12-31T23:59:59.999Z',
  '2027-06-21T12:00:00+12:45',
  '2027-01-01T00:00:00Z',
  '2027-03-28T01:30:00Z', // the hour European clocks go forward
];

test('day and time, and time alone, as date-fns formats them on the same clock', () => {
  for (const iso of MOMENTS) {
    const d = new Date(iso);
    assert.equal(formatOnDevice(iso, 'day-time'), format(d, 'd MMM, HH:mm'));
    assert.equal(formatOnDevice(iso, 'time'), format(d, 'HH:mm'));
  }
});

test('24-hour clock, two-digit hours and minutes, the day of month without a leading zero', () => {
  const d = new Date(2027, 3, 4, 9, 5); // 4 April 2027, 09:05 on this clock
  assert.equal(formatOnDevice(d, 'day-time'), '4 Apr, 09:05');
  assert.equal(formatOnDevice(new Date(2027, 11, 25, 23, 59), 'time'), '23:59');
});

test('a Date, an ISO string or epoch milliseconds for the same moment; nothing for a value that is not a date', () => {
  const ms = Date.UTC(2027, 3, 4, 2, 15);
  const want = formatOnDevice(ms, 'day-time');
  assert.equal(formatOnDevice(new Date(ms), 'day-time'), want);
  assert.equal(formatOnDevice(new Date(ms).toISOString(), 'day-time'), want);
  assert.equal(formatOnDevice('not a date', 'time'), '');
});
