// The reason a re-inspection task opened by an incident carries: when (in the meeting's zone) and what
// happened, cut short, so the board and the boat's logbook say why the boat must come back.
import { formatTime } from '../format/time';

const MAX_CHARS = 200;

export function incidentTaskReason(occurredAt: Date | string, timeZone: string, description: string): string {
  // One line, without a closing full stop of its own (the sentence below adds one).
  const oneLine = description.replace(/\s+/g, ' ').trim().replace(/\.+$/, '');
  const what = oneLine.length > MAX_CHARS ? `${oneLine.slice(0, MAX_CHARS - 1)}…` : oneLine;
  return `Incident with damage, ${formatTime(occurredAt, timeZone)}: ${what}. Re-inspect before the next run.`;
}
