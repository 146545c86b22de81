// The note input of a boat's logbook: real calendar days only, never a day in the future anywhere on
// Earth, a note of 1 to 4000 characters after trimming, and nothing the schema does not name.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { AddLogNoteInput, isCalendarDate, isPlausibleNoteDate } from '../../../../lib/core/inputs/logbook';

const valid = {
  eventId: '0B0E0000-0000-4000-8000-000000000101',
  category: 'damage',
  notedOn: '2026-11-28',
  body: '  Ride plate bent on the port side.  ',
};

test('calendar days: the Gregorian leap-year rule decides 29 February (ISO 8601 uses the Gregorian calendar [memory])', () => {
  assert.equal(isCalendarDate('2028-02-29'), true, '2028 is divisible by 4');
  assert.equal(isCalendarDate('2100-02-29'), false, '2100 is a century not divisible by 400');
  assert.equal(isCalendarDate('2000-02-29'), true, '2000 is divisible by 400');
  assert.equal(isCalendarDate('2027-02-30'), false, 'never rolled over to March');
  assert.equal(isCalendarDate('2027-2-3'), false, 'two digits for month and day');
  assert.equal(isCalendarDate('03/12/2026'), false);
});

test('the latest allowed day is today at UTC+14, the easternmost offset in use (IANA tz database, Pacific/Kiritimati [memory])', () => {
  const now = new Date('2026-12-03T23:00:00Z'); // already 4 December, 13:00 at UTC+14
  assert.equal(isPlausibleNoteDate('2026-12-04', now), true);
  assert.equal(isPlausibleNoteDate('2026-12-05', now), false);
  assert.equal(isPlausibleNoteDate('1949-12-31', now), false, 'a typing slip, not a boat record');
});

test('a valid note is trimmed and its meeting id lower-cased', () => {
  const parsed = AddLogNoteInput.parse(valid);
  assert.equal(parsed.body, 'Ride plate bent on the port side.');
  assert.equal(parsed.eventId, valid.eventId.toLowerCase());
});

test('each bad field is named; unknown fields are refused', () => {
  const bad = AddLogNoteInput.safeParse({ eventId: 'x', category: 'scratch', notedOn: '2999-01-01', body: ' ' });
  assert.equal(bad.success, false);
  const fields = new Set(bad.error!.issues.map((i) => i.path.join('.')));
  assert.deepEqual([...fields].sort(), ['body', 'category', 'eventId', 'notedOn']);
  assert.equal(AddLogNoteInput.safeParse({ ...valid, body: 'x'.repeat(4000) }).success, true);
  assert.equal(AddLogNoteInput.safeParse({ ...valid, body: 'x'.repeat(4001) }).success, false);
  assert.equal(AddLogNoteInput.safeParse({ ...valid, authorId: valid.eventId }).success, false);
});
