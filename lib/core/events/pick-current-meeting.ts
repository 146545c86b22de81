// Which meeting's dock the installed app's shortcut opens (/inspect/current): the meeting a scrutineer is
// most likely standing at now. Plain TypeScript: the page calls it, and it is unit-tested.
import { dayInZone } from '../crew/assess-crew';

export type MeetingDates = { id: string; startsOn: string; endsOn: string; timeZone: string };

/**
 * One running today in its own time zone (of several, the one that started last: a one-day meeting inside a
 * long one is the more specific), else the next to start, else the one that ended last; null for none.
 * Dates are ISO days (yyyy-MM-dd), compared as text.
 */
export function pickCurrentMeeting<T extends MeetingDates>(meetings: readonly T[], now: Date): T | null {
  const withToday = meetings.map((m) => ({ m, today: dayInZone(now, m.timeZone) }));
  const running = withToday.filter(({ m, today }) => m.startsOn <= today && today <= m.endsOn);
  if (running.length) return running.reduce((a, b) => (b.m.startsOn > a.m.startsOn ? b : a)).m;
  const coming = withToday.filter(({ m, today }) => m.startsOn > today);
  if (coming.length) return coming.reduce((a, b) => (b.m.startsOn < a.m.startsOn ? b : a)).m;
  if (!meetings.length) return null;
  return meetings.reduce((a, b) => (b.endsOn > a.endsOn ? b : a));
}
