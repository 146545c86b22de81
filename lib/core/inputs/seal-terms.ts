// The seal register's limits and words, without zod (the dock's client code imports these).

/** Most seals one batch may carry (the register's own limit, also a check in the database). */
export const SEAL_BATCH_MAX = 1000;
/** A seal number: letters, digits and dashes, 1 to 40 characters (stored in capitals, compared without case). */
export const SEAL_NUMBER_PATTERN = /^[A-Za-z0-9-]{1,40}$/;
export const SEAL_CHECK_STATES = ['intact', 'broken', 'missing'] as const;
export type SealCheckState = (typeof SEAL_CHECK_STATES)[number];
export const SEAL_CHECK_WORDS: Record<SealCheckState, string> = {
  intact: 'Intact',
  broken: 'Broken',
  missing: 'Missing',
};
