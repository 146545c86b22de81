// Protest statuses in words, which steps each allows, and the defaults the product applies.
// Framework-free: shared by screens, data access and tests.
import type { ProtestStatus, RejectionCode } from '@/models/protest';
export type { ProtestStatus, RejectionCode };

export const PROTEST_STATUS_LABELS: Record<ProtestStatus, string> = {
  awaiting_fee: 'Awaiting the protest fee',
  lodged: 'Lodged',
  accepted: 'Accepted for hearing',
  rejected: 'Rejected as invalid',
  hearing_scheduled: 'Hearing scheduled',
  upheld: 'Upheld',
  dismissed: 'Dismissed',
  withdrawn: 'Withdrawn',
};

export const REJECTION_LABELS: Record<RejectionCode, string> = {
  out_of_time: 'Out of time',
  no_fee: 'Fee not paid',
  wrong_form: 'Not in the required form',
};

export const REQUESTED_CHECKS = {
  nozzle_diameter: 'Nozzle exit diameter',
  engine_power: 'Engine power',
  weight: 'Minimum weight',
  safety_items: 'Safety equipment',
  seals: 'Seals',
  other: 'Something else (say in the grounds)',
} as const;
export type RequestedCheck = keyof typeof REQUESTED_CHECKS;

/** The queue's order: what needs the stewards first. */
export const QUEUE_ORDER: ProtestStatus[] = [
  'lodged',
  'accepted',
  'hearing_scheduled',
  'awaiting_fee',
  'upheld',
  'dismissed',
  'withdrawn',
  'rejected',
];

/** Statuses in which the matter is still open: evidence may be added, a decision is still to come. */
export const OPEN_STATUSES: readonly ProtestStatus[] = ['awaiting_fee', 'lodged', 'accepted', 'hearing_scheduled'];
export const DECIDED_STATUSES: readonly ProtestStatus[] = ['upheld', 'dismissed', 'withdrawn', 'rejected'];
/** The stewards may decide once the protest is accepted, with or without a scheduled hearing. */
export const DECIDABLE_STATUSES: readonly ProtestStatus[] = ['accepted', 'hearing_scheduled'];

/**
 * Notice of appeal: each meeting sets it (events.appeal_notice_minutes, from the governing body's
 * rules); new meetings start at one hour (common practice, no single source; the FIA International
 * Sporting Code gives one hour to notify an intention to appeal [memory]).
 */
export const DEFAULT_APPEAL_NOTICE_MINUTES = 60;

/** Evidence files: photos, PDFs and short phone videos (the storage fake holds up to 50 MB). */
export const EVIDENCE_MAX_BYTES = 40 * 1024 * 1024;
