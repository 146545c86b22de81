// Slot times are typed as wall-clock times in the meeting's time zone and stored as instants; which
// meeting day a slot or an arrival belongs to is read in that zone too. Pure: server, browser, tests.
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { instantFromWallClock } from '../protests/protest-window';
import { meetingDayOf } from '../inspections/calibration-state';
import { safeTimeZone } from '../format/time';

export { meetingDayOf };

/** The wall clock of an instant in the zone, as "yyyy-MM-ddTHH:mm" (a datetime-local value). */
export function wallClockOf(instant: Date | string | number, timeZone: string): string {
  return format(new TZDate(new Date(instant).getTime(), safeTimeZone(timeZone)), "yyyy-MM-dd'T'HH:mm");
}

/**
 * A datetime-local value read in the meeting's zone, or null when it is malformed or names a time the
 * zone's clocks skip (the hour lost when daylight saving starts): such a slot would start at another time
 * than the one typed. A time the clocks pass twice (when daylight saving ends) is read as its first pass.
 */
export function slotInstant(value: string, timeZone: string): Date | null {
  const zone = safeTimeZone(timeZone);
  const at = instantFromWallClock(value, zone);
  if (!at) return null;
  if (wallClockOf(at, zone) !== value) return null;
  // A repeated hour: take the earlier pass (shifts are an hour, or half an hour on Lord Howe Island).
  for (const backMinutes of [60, 30]) {
    const earlier = new Date(at.getTime() - backMinutes * 60_000);
    if (wallClockOf(earlier, zone) === value) return earlier;
  }
  return at;
}

/** Whether an instant falls on one of the meeting's days (first and last day inclusive) in its zone. */
export function isOnMeetingDays(instant: Date, meeting: { startsOn: string; endsOn: string; timeZone: string }) {
  const day = meetingDayOf(instant, meeting.timeZone);
  return day >= meeting.startsOn && day <= meeting.endsOn;
}
