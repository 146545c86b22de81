import Link from '@/components/link';

/** The parity report's pointer to its time view: predicted runs, the clock, and balance levers in seconds. */
export function ClockLink({ eventId, classId }: { eventId: string; classId: string }) {
  return (
    <p className="card" data-testid="clock-link">
      Predicted times over the course, how far they agree with the run times, and balance levers in seconds:{' '}
      <Link href={`/organise/events/${eventId}/clock?class=${classId}`}>Model against the clock</Link>.
    </p>
  );
}
