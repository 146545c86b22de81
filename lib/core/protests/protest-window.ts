// The protest window: it opens when a class's provisional results version is published and stays
// open for the event's protest_window_minutes of elapsed time (30 by common practice, after the FIA
// International Sporting Code; no single source). The deadline is an instant, so a daylight-saving
// change inside the window neither stretches nor shortens it; it is only shown in the meeting's
// time zone. Framework-free: runs on the server, in the browser (live countdown) and in unit tests.
import { addMinutes, differenceInSeconds } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { formatTime } from '../format/time';

/** The last instant at which a protest is in time: published_at + window (elapsed minutes). */
export function protestDeadline(publishedAt: Date, windowMinutes: number): Date {
  return addMinutes(publishedAt, windowMinutes);
}

/** In time up to and including the deadline instant itself. */
export function isWithinWindow(deadline: Date, at: Date): boolean {
  return at.getTime() <= deadline.getTime();
}

/** "Sun 4 Apr 2027, 02:15 UTC+13:00 (Pacific/Auckland)": the wall clock with its offset, never ambiguous. */
export function formatInZone(instant: Date | string, timeZone: string): string {
  return formatTime(instant, timeZone);
}

/** "Window closes" before the deadline, "Window closed" from just after it: computed from now, never assumed. */
export function windowDeadlineTerm(deadline: Date | string, now: Date = new Date()): 'Window closes' | 'Window closed' {
  return isWithinWindow(new Date(deadline), now) ? 'Window closes' : 'Window closed';
}

/** A datetime-local value ("2027-03-13T14:30") read as wall-clock time in the meeting's zone. */
export function instantFromWallClock(value: string, timeZone: string): Date | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(value);
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  const local = new TZDate(y, mo - 1, d, h, mi, 0, timeZone);
  if (Number.isNaN(local.getTime())) return null;
  return new Date(local.getTime());
}

export type WindowView = {
  publishedAt: string;
  deadline: string;
  deadlineLabel: string;
  isOpen: boolean;
  secondsLeft: number; // 0 once closed
};

export function describeWindow(opts: {
  publishedAt: Date;
  windowMinutes: number;
  timeZone: string;
  now?: Date;
}): WindowView {
  const now = opts.now ?? new Date();
  const deadline = protestDeadline(opts.publishedAt, opts.windowMinutes);
  const isOpen = isWithinWindow(deadline, now);
  return {
    publishedAt: opts.publishedAt.toISOString(),
    deadline: deadline.toISOString(),
    deadlineLabel: formatInZone(deadline, opts.timeZone),
    isOpen,
    secondsLeft: isOpen ? Math.max(0, differenceInSeconds(deadline, now)) : 0,
  };
}

export type VersionForWindow = { id: string; version: number; publishedAt: Date; changedEntryIds: string[] };

/**
 * Which results version opened the window for a protest about one entry: the latest version that
 * changed that entry's row (it appeared, moved or went away). A later version that left the entry
 * alone does not restart its window. An entry never classified counts from the first version.
 */
export function relevantVersionForEntry<V extends VersionForWindow>(versions: V[], entryId: string): V | null {
  if (versions.length === 0) return null;
  const sorted = [...versions].sort((a, b) => a.version - b.version);
  const touching = sorted.filter((v) => v.changedEntryIds.includes(entryId));
  return touching.length ? touching[touching.length - 1] : sorted[0];
}
