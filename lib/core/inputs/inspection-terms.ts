// Inspection kinds, evidence words and the capture-time window, without zod: the dock's client code
// imports these (lib/core/inputs/inspections.ts holds the schema and re-exports them).

export const INSPECTION_KINDS = ['pre_race', 'post_race', 'protest', 'spot_check'] as const;
export type InspectionKind = (typeof INSPECTION_KINDS)[number];
/** The kind of evidence the scrutineer saw for the power figure. */
export const POWER_EVIDENCE_KINDS = ['dyno_sheet', 'maker_rating', 'declaration_only'] as const;
export type PowerEvidenceKind = (typeof POWER_EVIDENCE_KINDS)[number];
export const POWER_EVIDENCE_KIND_WORDS: Record<PowerEvidenceKind, string> = {
  dyno_sheet: 'Sealed dyno sheet',
  maker_rating: 'Maker’s rating',
  declaration_only: 'Declaration only (no evidence seen)',
};

export const INSPECTION_KIND_LABELS: Record<InspectionKind, string> = {
  pre_race: 'Pre-race',
  post_race: 'Post-race',
  protest: 'Protest',
  spot_check: 'Spot check',
};

/** A record may be captured offline and sent later, but not from the future or from long ago. */
export const MAX_FUTURE_MS = 5 * 60 * 1000;
export const MAX_AGE_MS = 14 * 24 * 60 * 60 * 1000;
/** One photo of an inspection (bytes); how many one upload may carry (small ones; the dock sends one each). */
export const INSPECTION_PHOTO_MAX_BYTES = 8 * 1024 * 1024;
export const INSPECTION_PHOTOS_PER_UPLOAD = 4;

/**
 * The capture time must lie between 14 days ago and 5 minutes ahead of the checking clock (a
 * record may wait offline, but not for weeks). A retry of a stored record is answered from its
 * key before this check runs, so it is never refused for its age.
 */
export function checkCapturedAt(capturedAtIso: string, now = Date.now()): string | null {
  const t = Date.parse(capturedAtIso);
  if (Number.isNaN(t)) return 'Give the time of the inspection as an ISO date and time.';
  if (t > now + MAX_FUTURE_MS) return 'The time is more than 5 minutes in the future: check the phone’s clock.';
  if (t < now - MAX_AGE_MS) return 'The time is more than 14 days ago: such a record cannot be sent now.';
  return null;
}
