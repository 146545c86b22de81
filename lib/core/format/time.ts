// The one way Boreline shows a moment to people: the wall clock in the meeting's time zone, with the
// offset from UTC and the zone's IANA name, so a time read aloud or printed is never ambiguous.
// Framework-free (date-fns + @date-fns/tz): runs on the server, in the browser, in PDFs and e-mails.
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { MONTHS } from './device-time';

// Each zone name is tried once per process: building an Intl.DateTimeFormat is the costly part of showing a time
// (tens of milliseconds for the first on a phone), and pages and PDFs ask about the same few zones again and again.
const zoneChecks = new Map<string, string>();

/** A valid IANA zone name, or UTC: a bad stored zone must not break a page. */
export function safeTimeZone(timeZone: string | null | undefined): string {
  if (!timeZone) return 'UTC';
  let zone = zoneChecks.get(timeZone);
  if (zone === undefined) {
    try {
      new Intl.DateTimeFormat('en-GB', { timeZone }).format(0);
      zone = timeZone;
    } catch {
      zone = 'UTC';
    }
    // Bounded: zone names come from stored meetings, but a page must not grow this without limit.
    if (zoneChecks.size < 1000) zoneChecks.set(timeZone, zone);
  }
  return zone;
}

function inZone(instant: Date | string | number, timeZone: string): TZDate {
  return new TZDate(new Date(instant).getTime(), safeTimeZone(timeZone));
}

/** "Sun 4 Apr 2027, 02:15 UTC+13:00 (Pacific/Auckland)". */
export function formatTime(instant: Date | string | number, timeZone: string): string {
  const zone = safeTimeZone(timeZone);
  const local = inZone(instant, zone);
  return `${format(local, 'EEE d MMM yyyy, HH:mm')} UTC${format(local, 'xxx')} (${zone})`;
}

/** "Sun 4 Apr 2027" in the zone: the calendar day of an instant, for lists where the hour does not matter. */
export function formatDay(instant: Date | string | number, timeZone: string): string {
  return format(inZone(instant, timeZone), 'EEE d MMM yyyy');
}

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];

/** A calendar date stored without a time ("2027-04-04", e.g. a meeting's first day): no zone applies. */
export function formatCalendarDate(isoDate: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(isoDate);
  if (!m) return isoDate;
  // Read from the UTC fields of UTC noon, so no zone can move it to another day ("EEE d MMM yyyy"; no Intl
  // needed, which keeps lists of gear and licences cheap to draw on a phone).
  const d = new Date(Date.UTC(+m[1], +m[2] - 1, +m[3], 12));
  if (Number.isNaN(d.getTime())) return isoDate;
  return `${WEEKDAYS[d.getUTCDay()]} ${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

/** The offset of a zone at an instant, in minutes east of UTC (for checks and tests). */
export function zoneOffsetMinutes(instant: Date | string | number, timeZone: string): number {
  return -inZone(instant, timeZone).getTimezoneOffset();
}
