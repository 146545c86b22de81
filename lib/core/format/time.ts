// The one way Boreline shows a moment to people: the wall clock in the meeting's time zone, with the
// offset from UTC and the zone's IANA name, so a time read aloud or printed is never ambiguous.
// Framework-free (date-fns + @date-fns/tz): runs on the server, in the browser, in PDFs and e-mails.
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';

/** A valid IANA zone name, or UTC: a bad stored zone must not break a page. */
export function safeTimeZone(timeZone: string | null | undefined): string {
  if (!timeZone) return 'UTC';
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone }).format(0);
    return timeZone;
  } catch {
    return 'UTC';
  }
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

/** A calendar date stored without a time ("2027-04-04", e.g. a meeting's first day): no zone applies. */
export function formatCalendarDate(isoDate: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(isoDate);
  if (!m) return isoDate;
  // Built at UTC noon and read in UTC so no zone can move it to another day.
  return format(new TZDate(Date.UTC(+m[1], +m[2] - 1, +m[3], 12), 'UTC'), 'EEE d MMM yyyy');
}

/** The offset of a zone at an instant, in minutes east of UTC (for checks and tests). */
export function zoneOffsetMinutes(instant: Date | string | number, timeZone: string): number {
  return -inZone(instant, timeZone).getTimezoneOffset();
}
