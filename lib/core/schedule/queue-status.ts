// Where a booked boat stands in the dock queue at a moment: not yet due, due (inside the slot's start
// and its grace period), late (start plus grace passed with no check-in), or arrived. Decided from
// instants, so a daylight-saving change never moves it; the dock shows the times in the meeting's zone.
// A grace period after the booked time is common practice, no source. Pure: the phone recomputes it
// offline from the last queue it was sent.

export type QueueStatus = 'upcoming' | 'due' | 'late' | 'arrived';

export const QUEUE_STATUS_LABELS: Record<QueueStatus, string> = {
  upcoming: 'Not yet due',
  due: 'Due now',
  late: 'Late',
  arrived: 'Arrived',
};

/** How long before its start a booked slot's reminder is e-mailed (common practice, no source). */
export const SLOT_REMINDER_LEAD_MINUTES = 60;

export function queueStatus(
  row: { startsAt: string | Date; graceMinutes: number; arrivedAt: string | Date | null },
  now: Date,
): QueueStatus {
  if (row.arrivedAt) return 'arrived';
  const start = new Date(row.startsAt).getTime();
  if (now.getTime() < start) return 'upcoming';
  return now.getTime() <= start + row.graceMinutes * 60_000 ? 'due' : 'late';
}
