import 'server-only';

/**
 * The SQL twin of `sealNumberKey` (lib/core/inputs/seals.ts): capitals, the trailing number without
 * its leading zeros. Batches are checked against it under a per-organisation lock; the unique index
 * holds exact numbers (migrations/20261203007600-seal-numbers-per-organisation.js).
 */
export const sealKeySql = (column: string) => `regexp_replace(upper(${column}), '0*([0-9]+)$', '\\1')`;
