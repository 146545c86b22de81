// Whether an instrument may be used at a given moment of a meeting: its calibration certificate's due
// date and the meeting day's checks against a reference, with dates in the meeting's time zone.
// Pure: runs on the server (the refusal at recording), on the instruments screen and at the dock.
import { format } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { formatCalendarDate, safeTimeZone } from '../format/time';

export type CertificateFacts = {
  id: string;
  number: string;
  laboratory: string;
  /** Calendar dates "yyyy-mm-dd". */
  calibratedOn: string;
  dueOn: string;
  expandedUncertainty: number | null;
  coverageFactor: number;
  /** Whether the certificate's file is stored (the demo's certificates have none). */
  hasFile?: boolean;
};

export type CheckFacts = {
  /** Calendar day "yyyy-mm-dd" in the meeting's time zone. */
  meetingDay: string;
  passed: boolean;
  checkedAt: Date | string;
};

export type CalibrationStatus = 'valid' | 'overdue' | 'no_certificate' | 'failed_check';

export type CalibrationState = {
  status: CalibrationStatus;
  /** False when the dock must not offer it and the server refuses a record naming it. */
  usable: boolean;
  /** One line for people: "valid until Mon 1 Mar 2027", "overdue since …", "no certificate on file", … */
  reason: string;
  /** The certificate that governs on that day (the latest calibration on or before it), if any. */
  certificate: CertificateFacts | null;
  /** The meeting day the state is for. */
  day: string;
};

/** The calendar day ("yyyy-mm-dd") of an instant in the meeting's time zone. */
export function meetingDayOf(instant: Date | string | number, timeZone: string): string {
  return format(new TZDate(new Date(instant).getTime(), safeTimeZone(timeZone)), 'yyyy-MM-dd');
}

/**
 * The instrument's calibration state at `at` (for a record: its capture time, so a record taken
 * offline before the due date or before a failed check stays valid when it arrives later).
 * - The governing certificate is the one with the latest calibration date on or before that day.
 * - It is overdue on any day after its due date (the due date itself is still valid).
 * - The latest check of that meeting day made at or before `at` decides: a failed one takes the
 *   instrument out of use for the rest of the day, unless a later check that day passes again.
 * - No certificate at all is today's behaviour: usable, and said so ("no certificate on file").
 */
export function calibrationState(
  certificates: readonly CertificateFacts[],
  checks: readonly CheckFacts[],
  at: Date | string | number,
  timeZone: string,
): CalibrationState {
  const day = meetingDayOf(at, timeZone);
  const atMs = new Date(at).getTime();
  const certificate =
    [...certificates]
      .filter((c) => c.calibratedOn <= day)
      .sort((a, b) =>
        a.calibratedOn === b.calibratedOn
          ? b.dueOn.localeCompare(a.dueOn)
          : b.calibratedOn.localeCompare(a.calibratedOn),
      )[0] ?? null;
  const todays = checks
    .filter((c) => c.meetingDay === day && new Date(c.checkedAt).getTime() <= atMs)
    .sort((a, b) => new Date(b.checkedAt).getTime() - new Date(a.checkedAt).getTime());
  const lastCheck = todays[0] ?? null;
  if (certificate && certificate.dueOn < day) {
    return {
      status: 'overdue',
      usable: false,
      reason: `calibration overdue since ${formatCalendarDate(certificate.dueOn)} (certificate ${certificate.number})`,
      certificate,
      day,
    };
  }
  if (lastCheck && !lastCheck.passed) {
    return {
      status: 'failed_check',
      usable: false,
      reason: `out of use: failed its check against the reference on ${formatCalendarDate(day)}`,
      certificate,
      day,
    };
  }
  if (!certificate)
    return { status: 'no_certificate', usable: true, reason: 'no certificate on file', certificate, day };
  return {
    status: 'valid',
    usable: true,
    reason: `valid until ${formatCalendarDate(certificate.dueOn)} (certificate ${certificate.number})`,
    certificate,
    day,
  };
}

// Kept apart (no date library): the dock's client code imports it.
export { usableAlternatives } from './usable-alternatives';
