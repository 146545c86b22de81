// The protest window (lib/core/protests/protest-window.ts) across New Zealand's daylight-saving changes.
// Reference: New Zealand daylight time ends on the first Sunday in April at 03:00 NZDT (clocks go
// back to 02:00 NZST) and starts on the last Sunday in September at 02:00 NZST (clocks go forward
// to 03:00 NZDT), per the New Zealand Daylight Time Order 2007 under the Time Act 1974 [memory].
// Every offset used below is checked here against the IANA time zone database as Node's Intl
// implements it, so the test fails loudly if that memory or the database disagree.
// The 30-minute window is common practice (FIA International Sporting Code), no single source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  describeWindow,
  formatInZone,
  instantFromWallClock,
  isWithinWindow,
  protestDeadline,
  relevantVersionForEntry,
} from '../../../../lib/core/protests/protest-window';
import { diffResultsRows } from '../../../../lib/core/results/diff-results-rows';
import { parseResultsCsv, readCsvRecords } from '../../../../lib/core/results/parse-results-csv';

const NZ = 'Pacific/Auckland';
const at = (iso: string) => new Date(iso);
const minutes = (n: number) => n * 60_000;

/** The zone's UTC offset at an instant, straight from Intl ("GMT+13:00" -> "+13:00"). */
function intlOffset(instant: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-GB', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(instant)
    .find((p) => p.type === 'timeZoneName')!.value;
  return part === 'GMT' ? '+00:00' : part.replace('GMT', '');
}

test('reference check: the first Sunday of April 2027 is 4 April, and the last Sunday of September is 26 September', () => {
  const sundays = (month: number) =>
    Array.from({ length: 30 }, (_, i) => new Date(Date.UTC(2027, month, i + 1)))
      .filter((d) => d.getUTCMonth() === month && d.getUTCDay() === 0)
      .map((d) => d.getUTCDate());
  assert.equal(sundays(3)[0], 4);
  assert.equal(sundays(8).at(-1), 26);
});

test('reference check (Intl/IANA): NZDT ends at 03:00 NZDT on 4 April 2027 (14:00 UTC on 3 April) and starts at 02:00 NZST on 26 September 2027 (14:00 UTC on 25 September)', () => {
  assert.equal(intlOffset(at('2027-04-03T13:59:59Z'), NZ), '+13:00');
  assert.equal(intlOffset(at('2027-04-03T14:00:00Z'), NZ), '+12:00');
  assert.equal(intlOffset(at('2027-09-25T13:59:59Z'), NZ), '+12:00');
  assert.equal(intlOffset(at('2027-09-25T14:00:00Z'), NZ), '+13:00');
});

test('results at 01:45 NZDT on the night NZDT ends, window 30 min: deadline 02:15 NZDT (the first 02:15 of that night), shown with its offset', () => {
  const published = at('2027-04-03T12:45:00Z');
  assert.equal(intlOffset(published, NZ), '+13:00');
  assert.equal(formatInZone(published, NZ), 'Sun 4 Apr 2027, 01:45 UTC+13:00 (Pacific/Auckland)');
  const deadline = protestDeadline(published, 30);
  assert.equal(deadline.toISOString(), '2027-04-03T13:15:00.000Z');
  assert.equal(intlOffset(deadline, NZ), '+13:00');
  // 02:15 happens twice that night; the offset says which one.
  assert.equal(formatInZone(deadline, NZ), 'Sun 4 Apr 2027, 02:15 UTC+13:00 (Pacific/Auckland)');
  assert.equal(
    isWithinWindow(deadline, new Date(deadline.getTime() - minutes(1))),
    true,
    'one minute before the deadline is in time',
  );
  assert.equal(isWithinWindow(deadline, deadline), true, 'the deadline instant itself is in time');
  assert.equal(isWithinWindow(deadline, new Date(deadline.getTime() + minutes(1))), false, 'one minute after is late');
});

test('a window that spans the change: published 02:45 NZDT, the deadline is 02:15 NZST — the clock reads earlier, yet 30 minutes have passed', () => {
  const published = at('2027-04-03T13:45:00Z');
  assert.equal(formatInZone(published, NZ), 'Sun 4 Apr 2027, 02:45 UTC+13:00 (Pacific/Auckland)');
  const deadline = protestDeadline(published, 30);
  assert.equal(deadline.getTime() - published.getTime(), minutes(30), 'thirty minutes of elapsed time');
  assert.equal(intlOffset(deadline, NZ), '+12:00');
  assert.equal(formatInZone(deadline, NZ), 'Sun 4 Apr 2027, 02:15 UTC+12:00 (Pacific/Auckland)');
  const oneBefore = new Date(deadline.getTime() - minutes(1));
  const oneAfter = new Date(deadline.getTime() + minutes(1));
  assert.equal(isWithinWindow(deadline, oneBefore), true);
  assert.equal(formatInZone(oneBefore, NZ), 'Sun 4 Apr 2027, 02:14 UTC+12:00 (Pacific/Auckland)');
  assert.equal(isWithinWindow(deadline, oneAfter), false);
  // Naive wall-clock arithmetic (02:45 + 30 min = 03:15 local) would give a whole extra hour.
  assert.notEqual(formatInZone(deadline, NZ).slice(17, 22), '03:15');
});

test('the night NZDT starts: results at 01:45 NZST, the deadline is 03:15 NZDT (02:00–03:00 never happens)', () => {
  const published = at('2027-09-25T13:45:00Z');
  assert.equal(intlOffset(published, NZ), '+12:00');
  const deadline = protestDeadline(published, 30);
  assert.equal(formatInZone(deadline, NZ), 'Sun 26 Sep 2027, 03:15 UTC+13:00 (Pacific/Auckland)');
  const w = describeWindow({
    publishedAt: published,
    windowMinutes: 30,
    timeZone: NZ,
    now: new Date(deadline.getTime() - minutes(1)),
  });
  assert.equal(w.isOpen, true);
  assert.equal(w.secondsLeft, 60);
  assert.equal(w.deadlineLabel, 'Sun 26 Sep 2027, 03:15 UTC+13:00 (Pacific/Auckland)');
  const late = describeWindow({
    publishedAt: published,
    windowMinutes: 30,
    timeZone: NZ,
    now: new Date(deadline.getTime() + minutes(1)),
  });
  assert.equal(late.isOpen, false);
  assert.equal(late.secondsLeft, 0);
});

test('a hearing time typed in the meeting zone becomes the right instant (March is NZDT, checked with Intl)', () => {
  const instant = instantFromWallClock('2027-03-13T14:30', NZ)!;
  assert.equal(intlOffset(instant, NZ), '+13:00');
  assert.equal(instant.toISOString(), '2027-03-13T01:30:00.000Z');
  assert.equal(instantFromWallClock('13/03/2027 14:30', NZ), null);
});

test('a later results version restarts the window only for the entries it changed', () => {
  const v1 = [
    { position: 1, raceNumber: 10, entryId: 'a' },
    { position: 2, raceNumber: 13, entryId: 'b' },
    { position: 3, raceNumber: 16, entryId: 'c' },
  ];
  const v2 = [
    { position: 1, raceNumber: 10, entryId: 'a' },
    { position: 2, raceNumber: 16, entryId: 'c' },
    { position: 3, raceNumber: 19, entryId: 'd' },
  ];
  assert.deepEqual(diffResultsRows(null, v1), ['a', 'b', 'c']);
  assert.deepEqual(diffResultsRows(v1, v2), ['b', 'c', 'd'], 'b went away, c moved, d appeared; a kept its place');
  const versions = [
    { id: 'r1', version: 1, publishedAt: at('2027-03-13T03:00:00Z'), changedEntryIds: diffResultsRows(null, v1) },
    { id: 'r2', version: 2, publishedAt: at('2027-03-13T03:40:00Z'), changedEntryIds: diffResultsRows(v1, v2) },
  ];
  assert.equal(relevantVersionForEntry(versions, 'a')!.id, 'r1', 'a unchanged: its window still runs from version 1');
  assert.equal(relevantVersionForEntry(versions, 'c')!.id, 'r2');
  assert.equal(relevantVersionForEntry(versions, 'b')!.id, 'r2', 'removed from the results: a change');
  assert.equal(relevantVersionForEntry(versions, 'z')!.id, 'r1', 'never classified: from the first version');
  assert.equal(relevantVersionForEntry([], 'a'), null);
});

test('results CSV (RFC 4180): quoted fields, doubled quotes, CRLF and a BOM; a bad line is named', () => {
  assert.deepEqual(readCsvRecords('\uFEFFa,"b ""q"", c"\r\n1,2\n'), [
    ['a', 'b "q", c'],
    ['1', '2'],
  ]);
  assert.deepEqual(parseResultsCsv('position,race_number\r\n1,13\r\n2,"10"\r\n'), [
    { position: 1, raceNumber: 13 },
    { position: 2, raceNumber: 10 },
  ]);
  assert.throws(() => parseResultsCsv('position,race_number\n1,13\nsecond,10\n'), /Line 3: the position "second"/);
  assert.throws(() => parseResultsCsv('place,boat\n1,13\n'), /must name the columns/);
  assert.throws(() => readCsvRecords('a,"b\n'), /not closed/);
});
